import type { Ladder } from '../circuit/ladder.js';
import type { Project } from '../project/types.js';
import { ladderMetrics, type LadderMetrics } from './ladderMetrics.js';
import { metricPlan, type MetricPlan } from './metricPlan.js';
import { requireTolerance } from './monteCarlo.js';
import { ladderAt, toleranceParameters } from './parameters.js';

/** Largest parameter count for which worstCase sweeps every corner by default (worstCase.ts). */
const SWEPT = 10;

/**
 * Cheap proof that a ladder fails the worst-case check: the figure that misses its limit at one of
 * two corners of the tolerance box (every parameter at its minimum; every one at its maximum),
 * or null when neither corner proves anything (or the box is too large for the proof).
 *
 * Why it is a proof of worstCase's own verdict: worstCase evaluates every corner with the same
 * ladderMetrics and keeps the worst (its corner sweep, on by default for at most 10 parameters), so
 * its worst value is at least each corner's less its rounding tie (1e-9 relative, or the figure's
 * floor: worstCase.ts compare); a corner value beyond the limit by more than ten times that tie
 * fails there too. The all-low corner has the smallest time constants (largest ripple), the
 * all-high one the largest (slowest settling, most droop through the series resistors).
 *
 * Syntax: cornerMiss(project, ladder)
 * Example: cornerMiss(p, ladder)   // 'ripple' | 'droop' | 'inl' | 'settling' | null
 */
export function cornerMiss(project: Project, ladder: Ladder): 'ripple' | 'droop' | 'inl' | 'settling' | null {
  const corners = boxCorners(project, ladder);
  if (corners.length === 0) return null;
  const plan = metricPlan(project, ladder);
  const fullScale = Math.abs(ladder.high - ladder.low);
  for (const corner of corners) {
    const miss = missAt(ladderMetrics(corner, plan), plan, fullScale, ladder.period);
    if (miss) return miss;
  }
  return null;
}

/**
 * The two corners of the tolerance box cornerMiss looks at (every parameter at its minimum, then
 * every one at its maximum) as ladders, or none when worstCase does not sweep every corner of
 * this box (more than SWEPT parameters): only then is a corner's figure a floor of worstCase's.
 *
 * Syntax: boxCorners(project, ladder)
 * Example: boxCorners(p, ladder)[0].stages[0].r   // R1 at the bottom of its tolerance
 */
export function boxCorners(project: Project, ladder: Ladder): Ladder[] {
  const parameters = toleranceParameters(requireTolerance(project), ladder);
  if (parameters.length > SWEPT) return [];
  return [-1, 1].map((level) => ladderAt(ladder, parameters, new Array<number>(parameters.length).fill(level)));
}

function missAt(m: LadderMetrics, plan: MetricPlan, fullScale: number, period: number): 'ripple' | 'droop' | 'inl' | 'settling' | null {
  const { limits } = plan;
  // Beyond the limit by more than ten rounding ties of worstCase's comparison.
  const beyond = (value: number, limit: number | undefined, floor: number) =>
    limit !== undefined && value - 10 * Math.max(1e-9 * Math.abs(value), floor) > limit;
  if (beyond(m.worstRipple.ripple, limits.ripple, 1e-12 * fullScale)) return 'ripple';
  if (beyond(Math.abs(m.droop.error), limits.droop, 1e-12 * fullScale)) return 'droop';
  if (plan.inl && m.inl && beyond(Math.abs(m.inl.error), limits.inl, 1e-12 * fullScale)) return 'inl';
  if (limits.settling !== undefined && (m.settlingTime === null || beyond(m.settlingTime, limits.settling, 1e-9 * period))) return 'settling';
  return null;
}
