import type { Project } from '../project/types.js';
import { designProblem } from './designProblem.js';
import { paretoSearch } from './paretoSearch.js';
import { relaxProject } from './relaxProject.js';
import type { AnyCandidateStage, Candidate, CandidateStage } from './types.js';

/** One point of a trade-off curve (RC stages for the passive search; any stages for a version 1.1 circuit). */
export interface TradeoffPoint<S extends AnyCandidateStage = CandidateStage> {
  /** Ripple limit, V. */
  ripple: number;
  /** Best exact settling time under that limit (other limits as specified, no time limit), s; null: no design. */
  settlingTime: number | null;
  best: Candidate<S> | null;
}

export interface TradeoffCurve<S extends AnyCandidateStage = CandidateStage> {
  stages: number;
  /** One per ripple limit; none when the curve was not drawn (`effortExceeded`). */
  points: TradeoffPoint<S>[];
  /** Its proof needed more fast evaluations than TradeoffOptions.effort allows: not drawn. */
  effortExceeded?: boolean;
}

export interface TradeoffOptions {
  /** Ripple limits to try, V (default: `points` values log-spaced over spec ripple / 8 .. spec ripple * 8). */
  ripples?: number[];
  points?: number;
  /** Resolution to draw the curves at (with a search over bits), default the project's. */
  bits?: number;
  onProgress?: (fraction: number) => void;
  /** performance.now() in ms after which the curves are given up: the answer is then [] (no point proven). */
  deadline?: number;
  /**
   * Most fast-model evaluations one stage count's curve may take (default: no limit): a curve that
   * needs more is given up and returned without points, `effortExceeded` set; the others are drawn.
   * Unlike the deadline, the same on every machine.
   */
  effort?: number;
}

/**
 * Best achievable settling time against the allowed ripple, one curve per stage count: for each
 * ripple limit the best design (bestDesigns.ts, top 1, engine-verified) with that ripple limit,
 * the other limits as the project states them and no settling-time limit of the project's; like
 * the search, every point keeps search.margin below each limit (the ripple limit included).
 *
 * Method: one Pareto walk per stage count (paretoSearch.ts) for all the ripple limits, log-spaced
 * around the spec's (or `center`): it keeps the best design per limit and prunes a candidate only
 * when a lower bound on its settling time shows it dominated under every limit it could meet.
 * Same answers as one search per limit (tested against them and against exhaustive search).
 *
 * With `deadline` a walk still running then stops, and the answer is [] (no curves). With
 * `effort` a curve whose walk passes that many fast evaluations is given up alone (no points,
 * `effortExceeded`).
 *
 * Syntax: tradeoffCurves(project, stageCounts, center[, { ripples, points, bits, onProgress, deadline, effort }])
 * Example: tradeoffCurves(p, [1, 2], p.spec.ripple)[1].points[4].settlingTime   // s at the spec's ripple
 */
export function tradeoffCurves(project: Project, stageCounts: number[], center: number, options: TradeoffOptions = {}): TradeoffCurve[] {
  const count = options.points ?? 9;
  const ripples =
    options.ripples ?? Array.from({ length: count }, (_, i) => center * 8 ** ((2 * i) / Math.max(1, count - 1) - 1));
  // A limit in V here: drop the LSB record of the ripple so a resolution change keeps the value.
  const free = relaxProject(project, ['settling'], Infinity);
  const inLsb = free.specInLsb ? { ...free.specInLsb } : undefined;
  if (inLsb) delete inLsb.ripple;
  const problems = ripples.map((ripple) => {
    const at: Project = { ...free, spec: { ...free.spec, ripple }, ...(inLsb && { specInLsb: inLsb }) };
    return designProblem(at, options.bits);
  });
  let done = 0;
  const curves: TradeoffCurve[] = [];
  for (const n of stageCounts) {
    const best = paretoSearch(problems, n, undefined, options.deadline, options.effort);
    // Out of time: no curves at all rather than some (a missing curve would read as a missing stage count).
    if (best === null && (options.effort === undefined || (options.deadline !== undefined && performance.now() > options.deadline))) return [];
    options.onProgress?.(++done / stageCounts.length);
    // Beyond the effort limit: this curve alone is not drawn, and says so.
    if (best === null) {
      curves.push({ stages: n, points: [], effortExceeded: true });
      continue;
    }
    curves.push({ stages: n, points: ripples.map((ripple, i) => ({ ripple, settlingTime: best[i]?.settlingTime ?? null, best: best[i] })) });
  }
  return curves;
}
