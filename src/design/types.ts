/** Types of the design search (`dacsmith design`). SI base units throughout (V, s, Hz, ohm, F, A). */
import type { Check } from '../engine/index.js';

/** One stage of a proposed filter (unbuffered: the search proposes plain RC ladders). */
export interface CandidateStage {
  /** ohm */
  r: number;
  /** F */
  c: number;
  /** Only for the project's own design: an ideal follower after this stage. */
  buffered?: boolean;
}

/** A proposed filter with the engine's exact figures. */
export interface Candidate {
  stages: CandidateStage[];
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

export interface DesignResult {
  /** Feasible designs, best first; when none is feasible, the closest ones (pass false). */
  candidates: Candidate[];
  feasible: boolean;
  stats: SearchStats;
  /** The project's own `filter:` design at the project's resolution, when there is one. */
  current: Candidate | null;
  /** One row per resolution when the search chose the resolution, else empty. */
  resolutions: ResolutionRow[];
  /** When nothing is feasible: what binds, in words, one line each. */
  diagnosis: string[];
  /** Limits and settings the search used (at the project's resolution). */
  basis: DesignBasis;
}

/** What the search optimised against (for the report). */
export interface DesignBasis {
  stageCounts: number[];
  series: string;
  resistance: { min: number; max: number };
  capacitance: { min: number; max: number };
  limits: DesignLimits;
  /** Settling band, V, and the step(s): [from, to] duty pairs; the slower counts. */
  band: number;
  steps: Array<[number, number]>;
  /** LSB at the project's resolution, V, or null. */
  lsb: number | null;
}

/** Spec limits in SI units; undefined = no limit. */
export interface DesignLimits {
  ripple?: number;
  droop?: number;
  inl?: number;
  settlingTime?: number;
  pinCurrent?: number;
}

export interface DesignOptions {
  /** Candidates to return (default 10). */
  top?: number;
  /** Stage counts to try instead of `search.stages`. */
  stageCounts?: number[];
  /** Called now and then with the share of the work done (0..1), for a progress bar. */
  onProgress?: (fraction: number) => void;
  /** Also compare with the project's `filter:` design (default true). */
  compare?: boolean;
  /** Explain and show the closest designs when nothing is feasible (default true). */
  diagnose?: boolean;
}
