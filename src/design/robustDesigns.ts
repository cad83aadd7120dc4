import { ladderFromProject } from '../circuit/fromProject.js';
import type { Ladder } from '../circuit/ladder.js';
import { pinPeakCurrent } from '../engine/pinPeakCurrent.js';
import type { Project, ToleranceSettings } from '../project/types.js';
import { ladderAt, monteCarlo, toleranceParameters, worstCase } from '../tolerance/index.js';
import { DesignInputError } from './designInputError.js';
import { designSearch } from './designSearch.js';
import { projectAtResolution } from './projectAtResolution.js';
import type { Candidate, DesignOptions, DesignResult } from './types.js';

export type RobustMode = 'worst-case' | 'yield';

/** Figures of one design at the worst case over the tolerance box, SI units. */
export interface WorstCaseFigures {
  /** s; null when some corner never settles. */
  settlingTime: number | null;
  /** V peak-to-peak. */
  worstRipple: number;
  /** Largest |DC error|, V. */
  droop: number;
  /** Largest |INL|, V (null when the spec does not limit INL). */
  inl: number | null;
  /** Pin peak current with R1 and the driver at their minimum and the supply at its worst, A. */
  pinCurrent: number;
}

/** Monte Carlo outcome of one design. */
export interface YieldFigures {
  /** Share of samples meeting every limit, 0..1. */
  yield: number;
  samples: number;
  target: number;
  /** Pin peak current at its worst corner of the tolerance box, A (as in WorstCaseFigures). */
  pinCurrent: number;
}

/** What a robust check says about one design. */
export interface RobustVerdict {
  pass: boolean;
  worstCase?: WorstCaseFigures;
  yield?: YieldFigures;
}

/**
 * Checks one design; `project` is the project at the design's resolution, `ladder` the design's
 * circuit in it.
 */
export type RobustCheck = (project: Project, ladder: Ladder, candidate: Candidate) => RobustVerdict;

export interface RobustCandidate {
  /** The design with its nominal (exact engine) figures. */
  candidate: Candidate;
  /** 1-based place in the nominal ranking. */
  nominalRank: number;
  verdict: RobustVerdict;
}

export interface RobustResult {
  mode: RobustMode;
  /** Robust designs in nominal ranking order (at most `top`). */
  candidates: RobustCandidate[];
  /** Nominally feasible designs checked. */
  scanned: number;
  /** Every nominally feasible design was scanned (none left beyond the list). */
  exhausted: boolean;
  /** Largest `top` asked of the nominal search. */
  asked: number;
  /** Monte Carlo samples per design (yield mode), else null. */
  samples: number | null;
  /** The last nominal search (basis, stats, resolutions, comparison). */
  nominal: DesignResult;
}

export interface RobustOptions {
  /** Robust designs wanted (default 10). */
  top?: number;
  /** Largest nominal list to scan (default 2000). */
  cap?: number;
  /** Override the check (tests); default worstCaseCheck or yieldCheck from the project. */
  check?: RobustCheck;
  /** Override the nominal search (tests); default designSearch. */
  search?: (project: Project, options: DesignOptions) => DesignResult;
  /** Monte Carlo samples per design in yield mode (default min(tolerance.samples, 2000)). */
  samples?: number;
  /** Passed to the nominal search. */
  stageCounts?: number[];
  onProgress?: (fraction: number) => void;
}

/** Largest Monte Carlo run per design by default: yield mode runs one per scanned design. */
export const ROBUST_SAMPLES_CAP = 2000;

/**
 * The best standard-value designs that stay within the spec under part tolerances: at the worst
 * case over the tolerance box (`worst-case`), or with a Monte Carlo yield of at least
 * tolerance.yield (`yield`), in the nominal ranking order (settling time, fewer stages, smaller
 * total capacitance).
 *
 * Method: the nominal point lies inside the tolerance box, so a design that passes at the worst
 * case is among the nominally feasible ones (yield mode, too, recommends only designs that pass
 * with their nominal values). Walk that ranked list from the top, checking each design, asking the
 * nominal search (designSearch) for a list 4 times longer (4N, 16N, ... up to `cap`) until N
 * robust designs are found or the list is exhausted; the first N robust ones of the ranked list
 * are then exactly the robust optimum within the scanned prefix. Checks are memoized across
 * rounds. Worst case: tolerance/worstCase.ts plus the pin peak current at its worst corner
 * (Ohm's law); yield: tolerance/monteCarlo.ts with the project's seed for every design (common
 * random numbers, so designs are compared on the same draws).
 *
 * Syntax: robustDesigns(project, mode[, { top, cap, check, search, samples, stageCounts }])
 * Example: robustDesigns(p, 'worst-case', { top: 3 }).candidates[0].verdict.worstCase.worstRipple  // V
 */
export function robustDesigns(project: Project, mode: RobustMode, options: RobustOptions = {}): RobustResult {
  const top = options.top ?? 10;
  const cap = Math.max(options.cap ?? 2000, top);
  if (!Number.isInteger(top) || top < 1) throw new DesignInputError(`top must be a whole number >= 1, got ${top}`);
  const settings = requireRobustTolerance(project, mode);
  const samples = mode === 'yield' ? (options.samples ?? Math.min(settings.samples, ROBUST_SAMPLES_CAP)) : null;
  const search = options.search ?? designSearch;
  const check = options.check ?? (mode === 'worst-case' ? worstCaseCheck : yieldCheck(samples!));

  const verdicts = new Map<string, RobustVerdict>();
  let asked = Math.min(4 * top, cap);
  for (;;) {
    const nominal = search(project, {
      top: asked,
      compare: true,
      diagnose: false,
      ...(options.stageCounts && { stageCounts: options.stageCounts }),
    });
    const list = nominal.feasible ? nominal.candidates : [];
    const exhausted = list.length < asked;
    const found: RobustCandidate[] = [];
    let scanned = 0;
    for (let i = 0; i < list.length && found.length < top; i++) {
      const c = list[i];
      const key = designKey(c);
      let verdict = verdicts.get(key);
      if (!verdict) {
        const at = projectFor(project, nominal, c);
        verdict = check(at, ladderFromProject(at, c.stages.map((s) => ({ r: s.r, c: s.c, buffered: s.buffered ?? false }))), c);
        verdicts.set(key, verdict);
      }
      scanned = i + 1;
      if (verdict.pass) found.push({ candidate: c, nominalRank: i + 1, verdict });
      options.onProgress?.(Math.min(1, verdicts.size / cap));
    }
    if (found.length >= top || exhausted || asked >= cap) {
      options.onProgress?.(1);
      return { mode, candidates: found, scanned, exhausted, asked, samples, nominal };
    }
    asked = Math.min(asked * 4, cap);
  }
}

/**
 * The tolerance block a robust mode needs, or a DesignInputError naming what is missing.
 *
 * Syntax: requireRobustTolerance(project, mode)
 * Example: requireRobustTolerance(p, 'yield').yield   // 0.99
 */
export function requireRobustTolerance(project: Project, mode: RobustMode): ToleranceSettings {
  const t = project.tolerance;
  if (!t) throw new DesignInputError(`--robust ${mode} needs a tolerance block (resistor, capacitor, ...)`, 'tolerance', project.file);
  if (mode === 'yield' && t.yield === undefined) {
    throw new DesignInputError(`--robust yield needs a yield target (e.g. yield: 99 %)`, 'tolerance.yield', project.file);
  }
  return t;
}

/**
 * Worst-case check of one design: worst ripple, droop, INL (when limited) and settling time at
 * their worst points of the tolerance box (tolerance/worstCase.ts), and the pin peak current with
 * R1 and both driver resistances at their minimum and the supply at the end that raises it (the
 * current |high - low| / (driver + R1) falls with R1 and the driver, rises with the swing; Ohm's
 * law). Passes when every limited figure is within its limit.
 *
 * Syntax: worstCaseCheck(project, ladder[, candidate])
 * Example: worstCaseCheck(p, ladder).worstCase.settlingTime   // s at the slowest corner
 */
export function worstCaseCheck(project: Project, ladder: Ladder): RobustVerdict {
  const w = worstCase(project, ladder);
  const pinCurrent = worstPinCurrent(project, ladder);
  const pinLimit = project.search?.pinCurrent;
  const pass = w.pass && (pinLimit === undefined || pinCurrent <= pinLimit);
  return {
    pass,
    worstCase: {
      settlingTime: w.settlingTime.value,
      worstRipple: w.worstRipple.value ?? Infinity,
      droop: Math.abs(w.droop.value ?? Infinity),
      inl: w.inl ? Math.abs(w.inl.value ?? Infinity) : null,
      pinCurrent,
    },
  };
}

/**
 * Yield check of one design with a given sample count: Monte Carlo yield (tolerance/monteCarlo.ts,
 * the project's seed and distribution) against tolerance.yield, and the pin peak current at its
 * worst corner against search.pin_current. The pin limit protects the part, so it holds for every
 * unit, not for a share of them: absolute maximum ratings are checked at the worst case (common
 * practice; the data sheet's absolute maximum ratings table).
 *
 * Syntax: yieldCheck(samples)(project, ladder[, candidate])
 * Example: yieldCheck(2000)(p, ladder).yield.yield   // 0.9985
 */
export function yieldCheck(samples: number): RobustCheck {
  return (project, ladder) => {
    const target = requireRobustTolerance(project, 'yield').yield!;
    const pinCurrent = worstPinCurrent(project, ladder);
    const pinLimit = project.search?.pinCurrent;
    const pinOk = pinLimit === undefined || pinCurrent <= pinLimit;
    // A design over the pin limit fails whatever its yield: skip the Monte Carlo run.
    if (!pinOk) return { pass: false, yield: { yield: Number.NaN, samples: 0, target, pinCurrent } };
    const m = monteCarlo(project, ladder, { samples });
    return { pass: m.yield >= target, yield: { yield: m.yield, samples: m.samples, target, pinCurrent } };
  };
}

/** Pin peak current at its worst corner of the tolerance box, A. */
function worstPinCurrent(project: Project, ladder: Ladder): number {
  const parameters = toleranceParameters(project.tolerance!, ladder);
  let worst = pinPeakCurrent(ladder);
  for (const supply of [-1, 1]) {
    const z = parameters.map((q) => {
      const t = q.target;
      if ((t.kind === 'resistor' && t.stage === 0) || t.kind === 'driverHigh' || t.kind === 'driverLow') return -1;
      return t.kind === 'supply' ? supply : 0;
    });
    worst = Math.max(worst, pinPeakCurrent(ladderAt(ladder, parameters, z)));
  }
  return worst;
}

/** The project at a candidate's resolution when the search varied it. */
function projectFor(project: Project, nominal: DesignResult, c: Candidate): Project {
  return nominal.resolutions.length > 0 && c.bits !== null && c.bits !== project.pwm.bits ? projectAtResolution(project, c.bits) : project;
}

function designKey(c: Candidate): string {
  return `${c.bits ?? '-'}:${c.stages.map((s) => `${s.r}/${s.c}`).join('+')}`;
}
