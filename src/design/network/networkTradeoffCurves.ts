import type { Project } from '../../project/types.js';
import { relaxProject } from '../relaxProject.js';
import type { TradeoffCurve } from '../tradeoffCurves.js';
import type { AnyCandidateStage } from '../types.js';
import { networkProblem } from './networkProblem.js';
import { verifyInOrder, walkNetworkSpace, type NetworkWalk } from './solveNetwork.js';

export interface NetworkTradeoffOptions {
  /** The search's own walk of the space (walkNetworkSpace), reused: it depends on no ripple or settling limit. */
  walk?: NetworkWalk;
  /** Ripple limits to try, V (default: `points` values log-spaced over center / 8 .. center * 8). */
  ripples?: number[];
  points?: number;
  deadline?: number;
  onProgress?: (fraction: number) => void;
}

/**
 * Best achievable settling time against the allowed ripple for a version 1.1 circuit: one curve
 * (the file's topology), for each ripple limit the best design with that limit, the other limits as
 * the project states them and no settling-time limit; like the search, every point keeps
 * search.margin below each limit. Null when the deadline cut the walk (no curve is then drawn).
 *
 * Method: one walk of the space without the settling-time limit (walkNetworkSpace: every candidate
 * within the pin-current limit, with its settling bound), then verifyInOrder once per ripple limit
 * over the same entries: the bounds and exact figures an entry earns under one limit are kept and
 * reused under the others, so each candidate is evaluated by the exact engine at most once. Same
 * answers as one search per limit (the per-limit pass is the search's own step 2).
 *
 * Syntax: networkTradeoffCurves(project, center[, { ripples, points, walk, deadline, onProgress }])
 * Example: networkTradeoffCurves(p, p.spec.ripple!)[0].points[4].settlingTime   // s at the spec's ripple
 */
export function networkTradeoffCurves(project: Project, center: number, options: NetworkTradeoffOptions = {}): TradeoffCurve<AnyCandidateStage>[] | null {
  const count = options.points ?? 9;
  const ripples = options.ripples ?? Array.from({ length: count }, (_, i) => center * 8 ** ((2 * i) / Math.max(1, count - 1) - 1));
  const free = relaxProject(project, ['settling'], Infinity);
  // A limit in V here: drop the LSB record of the ripple (it would rescale nothing, but keep them apart).
  const inLsb = free.specInLsb ? { ...free.specInLsb } : undefined;
  if (inLsb) delete inLsb.ripple;
  const problems = ripples.map((ripple) => networkProblem({ ...free, spec: { ...free.spec, ripple }, ...(inLsb && { specInLsb: inLsb }) }));
  const deadline = options.deadline !== undefined ? { deadline: options.deadline } : {};
  // The walk depends on neither the ripple limit nor the settling one (removed): one for all.
  const walk = options.walk ?? walkNetworkSpace(problems[0], { ...deadline, ...(options.onProgress && { onProgress: (f: number) => options.onProgress!(0.5 * f) }) });
  if (!walk.complete) return null;
  const points = problems.map((problem, i) => {
    const best = verifyInOrder(problem, walk, 1, deadline);
    options.onProgress?.(0.5 + (0.5 * (i + 1)) / problems.length);
    return { ripple: ripples[i], settlingTime: best.feasible[0]?.settlingTime ?? null, best: best.feasible[0] ?? null, complete: best.complete };
  });
  if (points.some((p) => !p.complete)) return null;
  return [{ stages: problems[0].template.stages.length, points: points.map(({ ripple, settlingTime, best }) => ({ ripple, settlingTime, best })) }];
}
