/** Types of the design search (`dacsmith design`). SI base units throughout (V, s, Hz, ohm, F, A). */
import type { Check, CheckName, Warning } from '../engine/index.js';

/** One stage of a proposed filter. */
export interface CandidateStage {
  /** ohm */
  r: number;
  /** F */
  c: number;
  /**
   * An ideal unity-gain follower after this stage: the search proposes one only after the last
   * stage (search.buffered), the project's own design may have one anywhere.
   */
  buffered?: boolean;
}

/**
 * A unity-gain Sallen-Key stage of a proposed filter (version 1.1 circuits, model.md): c1 to the
 * op-amp output, c2 to ground.
 */
export interface SallenKeyCandidateStage {
  active: 'sallen-key';
  /** ohm */
  r1: number;
  r2: number;
  /** F */
  c1: number;
  c2: number;
}

/** Any stage of a proposed filter: RC, or (in a file with an active stage) Sallen-Key. */
export type AnyCandidateStage = CandidateStage | SallenKeyCandidateStage;

/** The parts of the second PWM output's path (second_pwm.into) a design chose. */
export interface SecondPwmParts {
  /** ohm */
  r: number;
  /** F; null when the path has no series capacitor. */
  c: number | null;
}

/**
 * A proposed filter with the engine's exact figures. `S` is the kind of stage: RC stages for the
 * passive search (the default), RC or Sallen-Key stages for a version 1.1 circuit (design/network).
 */
export interface Candidate<S extends AnyCandidateStage = CandidateStage> {
  /** The stages, pin side first. */
  stages: S[];
  /** The second output's parts, for a project with second_pwm (design/network); else absent. */
  secondPwm?: SecondPwmParts;
  /** Natural frequency f0 (Hz) and Q of each Sallen-Key stage (0-based index), when there is one. */
  activeStages?: Array<{ stage: number; f0: number; q: number }>;
  /** Resolution the figures belong to (null when the project gives none). */
  bits: number | null;
  /** PWM frequency, Hz. */
  frequency: number;
  /** V peak-to-peak, and the duty where it happens. */
  worstRipple: number;
  rippleDuty: number;
  /** Largest |ideal - average| over the used range, V, and its duty. */
  droop: number;
  droopDuty: number;
  /** Largest |INL| (endpoint fit), V. */
  inl: number;
  /** Endpoint-fit gain error (fit(1) - fit(0)) - (high - low), V, sign kept (engine/dcTransfer.ts). */
  gainError: number;
  /** s; null when the output never settles into the band. */
  settlingTime: number | null;
  /** A. */
  pinCurrent: number;
  /** Sum of the stage capacitors, F. */
  totalCapacitance: number;
  /** The project's spec checks for this design (engine/checks.ts), limits at this resolution. */
  checks: Check[];
  /** Every check passes and the output settles. */
  pass: boolean;
  /**
   * Headroom to each limit the project states, (limit - value) / limit: 0.1 is 10 % inside the
   * limit, negative a miss, null when the output never settles. Keys as the checks' names.
   */
  margins: Partial<Record<CheckName, number | null>>;
  /** Every check meets its limit scaled by (1 - search.margin) and the output settles: recommendable. */
  keepsMargin: boolean;
  /** The design needs an op-amp follower after its last stage (search.buffered). */
  needsFollower: boolean;
}

/** How the search went. */
export interface SearchStats {
  /** Candidates in the discrete space (all stage counts and resolutions). */
  space: number;
  /** Candidates the fast model evaluated (ripple or settling). */
  evaluated: number;
  /** Candidates the exact engine evaluated. */
  verified: number;
  /** Wall time, s. */
  elapsed: number;
}

/** Best design at one resolution (search over pwm bits). */
export interface ResolutionRow {
  bits: number;
  frequency: number;
  /** V */
  lsb: number;
  best: Candidate | null;
}

export interface DesignResult<S extends AnyCandidateStage = CandidateStage> {
  /**
   * Feasible designs (every limit met with search.margin to spare), best first; when none is
   * feasible, the closest ones (keepsMargin false; pass true when they meet the limits only
   * without the margin).
   */
  candidates: Candidate<S>[];
  feasible: boolean;
  stats: SearchStats;
  /** The project's own `filter:` design at the project's resolution, when there is one. */
  current: Candidate<S> | null;
  /** One row per resolution when the search chose the resolution, else empty. */
  resolutions: ResolutionRow[];
  /** When nothing is feasible: what binds, in words, one line each. */
  diagnosis: string[];
  /** Plausibility warnings on the file's parts and load (model.md 1.1; engine partValueWarnings). */
  warnings: Warning[];
  /**
   * False when the search stopped at its deadline (`--max-time`): the designs listed meet the spec
   * (exact figures) but are the best found so far, not proven the best of the space.
   */
  complete: boolean;
  /** When nothing is feasible: changes verified to make the project feasible (nearestFix.ts). */
  fixes?: NearestFix[];
  /** Limits proven out of reach before the search, per stage count (infeasibilityBounds.ts). */
  proven?: ProvenMiss[];
  /** Limits and settings the search used (at the project's resolution). */
  basis: DesignBasis;
}

/** Any design result: of the passive search, or of a version 1.1 circuit (design/network). */
export type AnyDesignResult = DesignResult<AnyCandidateStage>;

/** What the search optimised against (for the report). */
export interface DesignBasis {
  stageCounts: number[];
  /** 'E24', or 'E24 resistors, E12 capacitors' when the series differ. */
  series: string;
  /** IEC 60063 series of the resistors and of the capacitors. */
  resistorSeries: string;
  capacitorSeries: string;
  /** Headroom every recommended design keeps below each limit (search.margin), fraction. */
  margin: number;
  /** Follower options tried after the last stage (search.buffered). */
  buffered: boolean[];
  resistance: { min: number; max: number };
  capacitance: { min: number; max: number };
  limits: DesignLimits;
  /** Settling band, V, and the step(s): [from, to] duty pairs; the slower counts. */
  band: number;
  steps: Array<[number, number]>;
  /** LSB at the project's resolution, V, or null. */
  lsb: number | null;
  /** A version 1.1 circuit (design/network): its topology and the extra ranges searched. */
  network?: NetworkBasis;
}

/** The design space of a version 1.1 circuit beyond the series and ranges of the passive search. */
export interface NetworkBasis {
  /** The file's circuit in words ('RC + Sallen-Key'). */
  topology: string;
  /** Q window of the Sallen-Key stages (search.q). */
  q?: { min: number; max: number };
  /** The second output's path: its role, where its resistor values come from, its capacitor range. */
  secondPwm?: { role: 'fine' | 'complement'; r: string; c?: { min: number; max: number } };
}

/** Spec limits in SI units; undefined = no limit. */
export interface DesignLimits {
  ripple?: number;
  droop?: number;
  inl?: number;
  /** |endpoint-fit gain error| / (high - low), fraction of full scale. */
  gain?: number;
  settlingTime?: number;
  pinCurrent?: number;
}

export interface DesignOptions {
  /** Candidates to return (default 10). */
  top?: number;
  /** Stage counts to try instead of `search.stages`. */
  stageCounts?: number[];
  /** Called now and then with the share of the work done (0..1) and what is being done, for a progress line. */
  onProgress?: (fraction: number, detail?: DesignProgress) => void;
  /** Also compare with the project's `filter:` design (default true). */
  compare?: boolean;
  /** Explain and show the closest designs when nothing is feasible (default true). */
  diagnose?: boolean;
  /**
   * performance.now() in ms after which the search stops with the designs found so far
   * (`design --max-time`); the result then says `complete: false`.
   */
  deadline?: number;
}

/** What the search is doing, for a progress line. */
export interface DesignProgress {
  /** 'search': the ranked search; 'explain': side searches behind an explanation of an empty result; 'curves': trade-off curves. */
  phase: 'search' | 'explain' | 'curves';
  /** Stage count being walked (search phase). */
  stages?: number;
  /** Resolution being searched, when the search chooses it. */
  bits?: number | null;
  /** PWM frequency of that problem, Hz. */
  frequency?: number;
  /** Best settling time found so far (fast estimate of a design passing every fast check), s; null: none yet. */
  best?: number | null;
}

/** One limit that no design with `stages` stages of the space can meet, with the proof's numbers. */
export interface ProvenMiss {
  stages: number;
  limit: 'pin_current' | 'droop' | 'gain' | 'ripple' | 'settling';
  /** The best value any design of the space can reach (a proven bound: floor, or for R caps, the cap). */
  reach: number;
  /** The limit's value (SI). */
  limitValue: number;
  /** One line: what was compared, in words. */
  reason: string;
  /** In an explanation: the miss holds for designs with (true) or without (false) an ideal follower after the last stage (search.buffered). */
  follower?: boolean;
}

/** Kinds of change an explanation may suggest. */
export type FixKind = 'resolution' | 'frequency' | 'stages' | 'follower' | 'resistance' | 'capacitance';

/** A change of the project that makes the search feasible, verified by a search. */
export interface NearestFix {
  kind: FixKind;
  /** What changes, in words ("7 bits (125 kHz)"). */
  change: string;
  /** The best design the search found after the change (meets every limit of the changed project). */
  best: Candidate;
  /** The line for the report. */
  line: string;
}
