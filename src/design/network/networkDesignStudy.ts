import type { Project } from '../../project/types.js';
import type { TradeoffCurve } from '../tradeoffCurves.js';
import type { AnyCandidateStage, AnyDesignResult, DesignProgress } from '../types.js';
import { networkDesignSearch } from './networkDesignSearch.js';
import { networkProblem } from './networkProblem.js';
import { networkTradeoffCurves } from './networkTradeoffCurves.js';
import { walkDeadline, walkNetworkSpace } from './solveNetwork.js';

export interface NetworkStudyOptions {
  top?: number;
  /** Also compute the settling/ripple trade-off curve (default true). */
  tradeoff?: boolean;
  /** performance.now() in ms after which the search stops with what it has. */
  deadline?: number;
  onProgress?: (fraction: number, detail?: DesignProgress) => void;
}

/**
 * The search for a version 1.1 circuit and its trade-off curve from one walk of the space: the
 * walk (walkNetworkSpace) depends on neither the ripple nor the settling-time limit, so the curve's
 * passes reuse it and every candidate's bounds and exact figures (networkTradeoffCurves.ts). The
 * curve is centred on the ripple limit (else on design #1's ripple) and skipped when nothing is
 * feasible or the deadline has passed.
 *
 * Syntax: networkDesignStudy(project[, { top, tradeoff, deadline, onProgress }])
 * Example: networkDesignStudy(p, { top: 3 }).tradeoff?.[0].points.length   // 9
 */
export function networkDesignStudy(project: Project, options: NetworkStudyOptions = {}): { result: AnyDesignResult; tradeoff?: TradeoffCurve<AnyCandidateStage>[] } {
  const report = options.onProgress;
  const charts = options.tradeoff ?? true;
  const deadline = options.deadline !== undefined ? { deadline: options.deadline } : {};
  const cut = walkDeadline(options.deadline);
  const walk = walkNetworkSpace(networkProblem(project), {
    ...(cut !== undefined && { deadline: cut }),
    ...(report && { onProgress: (f: number) => report(0.7 * f, { phase: 'search' }) }),
  });
  const result = networkDesignSearch(project, {
    walk,
    ...(options.top !== undefined && { top: options.top }),
    ...deadline,
    ...(report && { onProgress: (f: number, d?: DesignProgress) => report(0.7 + (charts ? 0.15 : 0.3) * f, d) }),
  });
  const inTime = options.deadline === undefined || (result.complete !== false && performance.now() < options.deadline);
  const center = result.basis.limits.ripple ?? result.candidates[0]?.worstRipple;
  if (!(charts && result.feasible && inTime && center !== undefined && center > 0)) return { result };
  const tradeoff = networkTradeoffCurves(project, center, {
    walk,
    ...deadline,
    ...(report && { onProgress: (f: number) => report(0.85 + 0.15 * f, { phase: 'curves' }) }),
  });
  return { result, ...(tradeoff && { tradeoff }) };
}
