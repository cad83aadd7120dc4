import type { Project } from '../project/types.js';
import { designProblem } from './designProblem.js';
import { relaxProject } from './relaxProject.js';
import { solveProblem } from './solveProblem.js';
import type { Candidate } from './types.js';

/** One point of a trade-off curve. */
export interface TradeoffPoint {
  /** Ripple limit, V. */
  ripple: number;
  /** Best exact settling time under that limit (other limits as specified, no time limit), s; null: no design. */
  settlingTime: number | null;
  best: Candidate | null;
}

export interface TradeoffCurve {
  stages: number;
  points: TradeoffPoint[];
}

export interface TradeoffOptions {
  /** Ripple limits to try, V (default: `points` values log-spaced over spec ripple / 8 .. spec ripple * 8). */
  ripples?: number[];
  points?: number;
  /** Resolution to draw the curves at (with a search over bits), default the project's. */
  bits?: number;
  onProgress?: (fraction: number) => void;
}

/**
 * Best achievable settling time against the allowed ripple, one curve per stage count: for each
 * ripple limit the design search (solveProblem.ts, top 1, engine-verified) with that ripple limit,
 * the other limits as the project states them and no settling-time limit.
 *
 * Method: repeated exact searches; ripple limits log-spaced around the spec's (or `center`).
 *
 * Syntax: tradeoffCurves(project, stageCounts, center[, { ripples, points, bits, onProgress }])
 * Example: tradeoffCurves(p, [1, 2], p.spec.ripple)[1].points[4].settlingTime   // s at the spec's ripple
 */
export function tradeoffCurves(project: Project, stageCounts: number[], center: number, options: TradeoffOptions = {}): TradeoffCurve[] {
  const count = options.points ?? 9;
  const ripples =
    options.ripples ?? Array.from({ length: count }, (_, i) => center * 8 ** ((2 * i) / Math.max(1, count - 1) - 1));
  // A limit in V here: drop the LSB record of the ripple so a resolution change keeps the value.
  const free = relaxProject(project, ['settling'], Infinity);
  const total = ripples.length * stageCounts.length;
  let done = 0;
  return stageCounts.map((n) => ({
    stages: n,
    points: ripples.map((ripple) => {
      const spec = { ...free.spec, ripple };
      const inLsb = free.specInLsb ? { ...free.specInLsb } : undefined;
      if (inLsb) delete inLsb.ripple;
      const at: Project = { ...free, spec, ...(inLsb && { specInLsb: inLsb }) };
      const best = solveProblem(designProblem(at, options.bits), 1, [n]).feasible[0] ?? null;
      options.onProgress?.(++done / total);
      return { ripple, settlingTime: best?.settlingTime ?? null, best };
    }),
  }));
}
