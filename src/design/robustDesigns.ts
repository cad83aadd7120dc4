import { ladderFromProject } from '../project/ladderFromProject.js';
import type { Project, ToleranceSettings } from '../project/types.js';
import type { RobustCheck, RobustChecks, RobustVerdict } from '../engine/index.js';
import { DesignInputError } from './designInputError.js';
import { cornerScreen } from './cornerScreen.js';
import { designSearch, type DesignSearchOptions } from './designSearch.js';
import { projectAtResolution } from './projectAtResolution.js';
import type { Candidate, DesignResult } from './types.js';

export type RobustMode = 'worst-case' | 'yield';
export type { RobustCheck, RobustChecks, RobustVerdict, WorstCaseFigures, YieldFigures } from '../engine/index.js';

export interface RobustCandidate {
  /** The design with its nominal (exact engine) figures. */
  candidate: Candidate;
  /** 1-based place in the nominal ranking (worst-case mode: among the designs that pass the corner screen). */
  nominalRank: number;
  verdict: RobustVerdict;
}

export interface RobustResult {
  mode: RobustMode;
  /** Robust designs in nominal ranking order (at most `top`). */
  candidates: RobustCandidate[];
  /** Nominally feasible designs checked. */
  scanned: number;
  /**
   * The nominal list left out designs that a corner of the tolerance box already fails
   * (worst-case mode, cornerScreen.ts): `scanned` and `nominalRank` count the designs that pass.
   */
  screened: boolean;
  /** Some design of the space meets every limit with nominal parts (the list was not empty before any screen). */
  nominalFeasible: boolean;
  /** Every nominally feasible design was scanned (none left beyond the list). */
  exhausted: boolean;
  /** Largest `top` asked of the nominal search. */
  asked: number;
  /** Largest Monte Carlo sample count per design (yield mode; sampling stops earlier once the yield interval clears the target), else null. */
  samples: number | null;
  /** The last nominal search (basis, stats, resolutions, comparison). */
  nominal: DesignResult;
}

export interface RobustOptions {
  /** Robust designs wanted (default 10). */
  top?: number;
  /** Largest nominal list to scan (default 2000). */
  cap?: number;
  /**
   * The checks of the tolerance layer (tolerance/robustChecks.ts), passed in by the caller: the
   * design layer does not import the tolerance layer. Either this or `check`.
   */
  checks?: RobustChecks;
  /** One check for every design (tests); overrides `checks`. */
  check?: RobustCheck;
  /** Override the nominal search (tests); default designSearch. */
  search?: (project: Project, options: DesignSearchOptions) => DesignResult;
  /** Monte Carlo samples per design in yield mode (default min(tolerance.samples, 2000)). */
  samples?: number;
  /** Passed to the nominal search. */
  stageCounts?: number[];
  onProgress?: (fraction: number) => void;
  /**
   * performance.now() in ms after which the nominal search stops and no further design is
   * checked (`design --max-time`): the answer is then the robust designs found by then, and
   * `nominal.complete` is false.
   */
  deadline?: number;
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
 * nominal search (designSearch) for a list 4 times longer (4N, 16N, ... up to `cap`; N, 4N, ...
 * behind the corner screen below, which leaves few designs the check fails: the first ten listed
 * all passed on each of six projects tried, and each design the search verifies costs an exact
 * evaluation and a screen; on the wide E24 bench project a first list of N instead of 2N took
 * 0.955 to 0.974 of the time in two 16-round comparisons, same designs) until N robust designs are found or the list is exhausted; the first
 * N robust ones of the ranked list are then exactly the robust optimum within the scanned prefix. Checks are memoized across
 * rounds. In worst-case mode the nominal search first screens out designs that a corner of the box
 * already takes beyond a limit (cornerScreen.ts, with the checks' `corners`): the check would fail
 * them, so the robust answer is the same, from a far shorter list (`nominalRank` then counts the
 * designs that pass the screen). The checks come from the caller (tolerance/robustChecks.ts: worst case over the
 * box plus the pin peak current at its worst corner, or Monte Carlo yield with the project's seed
 * for every design).
 *
 * With `deadline` the nominal search stops at it and no design is checked after it: the robust
 * designs found by then are the answer, marked incomplete (nominal.complete false).
 *
 * Syntax: robustDesigns(project, mode, { checks | check[, top, cap, search, samples, stageCounts, deadline] })
 * Example: robustDesigns(p, 'worst-case', { checks: robustChecks, top: 3 }).candidates[0].verdict.worstCase.worstRipple  // V
 */
export function robustDesigns(project: Project, mode: RobustMode, options: RobustOptions): RobustResult {
  const top = options.top ?? 10;
  const cap = Math.max(options.cap ?? 2000, top);
  if (!Number.isInteger(top) || top < 1) throw new DesignInputError(`top must be a whole number >= 1, got ${top}`);
  const settings = requireRobustTolerance(project, mode);
  const samples = mode === 'yield' ? (options.samples ?? Math.min(settings.samples, ROBUST_SAMPLES_CAP)) : null;
  const search = options.search ?? designSearch;
  const checks = options.checks;
  const check = options.check ?? (checks && (mode === 'worst-case' ? checks.worstCase : checks.yield(samples!)));
  if (!check) throw new TypeError('robustDesigns: pass options.checks (tolerance/robustChecks.ts) or options.check');

  // Worst case: designs a corner of the box already fails are screened out before the engine
  // verifies them (the check itself would fail them), so the nominal list holds candidates only.
  const admit = mode === 'worst-case' && !options.check && checks?.corners ? cornerScreen(checks.corners) : undefined;

  const verdicts = new Map<string, RobustVerdict>();
  // behind the corner screen most listed designs pass (see Method): a first list of N alone
  let asked = Math.min((admit ? 1 : 4) * top, cap);
  for (;;) {
    const nominal = search(project, {
      top: asked,
      compare: true,
      diagnose: false,
      ...(options.stageCounts && { stageCounts: options.stageCounts }),
      ...(admit && { admit }),
      ...(options.deadline !== undefined && { deadline: options.deadline }),
    });
    const list = nominal.feasible ? nominal.candidates : [];
    const outOfTime = () => options.deadline !== undefined && performance.now() > options.deadline;
    // A list cut by the deadline may be short without being the whole space.
    const exhausted = list.length < asked && nominal.complete !== false;
    const found: RobustCandidate[] = [];
    let scanned = 0;
    let cut = nominal.complete === false;
    for (let i = 0; i < list.length && found.length < top; i++) {
      const c = list[i];
      const key = designKey(c);
      let verdict = verdicts.get(key);
      if (!verdict) {
        // Out of time: no new check; the designs checked so far stand.
        if (outOfTime()) {
          cut = true;
          break;
        }
        const at = projectFor(project, nominal, c);
        verdict = check(at, ladderFromProject(at, c.stages.map((s) => ({ r: s.r, c: s.c, buffered: s.buffered ?? false }))));
        verdicts.set(key, verdict);
      }
      scanned = i + 1;
      if (verdict.pass) found.push({ candidate: c, nominalRank: i + 1, verdict });
      options.onProgress?.(Math.min(1, verdicts.size / cap));
    }
    if (found.length >= top || exhausted || asked >= cap || cut) {
      options.onProgress?.(1);
      // An empty screened list: were there nominal designs at all (for the verdict's wording)?
      const nominalFeasible =
        list.length > 0 ||
        (admit !== undefined &&
          !cut &&
          search(project, { top: 1, compare: false, diagnose: false, ...(options.stageCounts && { stageCounts: options.stageCounts }) }).feasible);
      // Out of time: the answer is incomplete (designStudy reports it so, from nominal.complete).
      const last = cut ? { ...nominal, complete: false } : nominal;
      return { mode, candidates: found, scanned, screened: admit !== undefined, nominalFeasible, exhausted, asked, samples, nominal: last };
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

/** The project at a candidate's resolution when the search varied it. */
function projectFor(project: Project, nominal: DesignResult, c: Candidate): Project {
  return nominal.resolutions.length > 0 && c.bits !== null && c.bits !== project.pwm.bits ? projectAtResolution(project, c.bits) : project;
}

function designKey(c: Candidate): string {
  return `${c.bits ?? '-'}:${c.stages.map((s) => `${s.r}/${s.c}`).join('+')}`;
}
