import type { MetricPlan } from './metricPlan.js';
import type { CircuitMetrics } from './metrics.js';

/**
 * Whether one circuit's figures meet every limit of the plan: the rule by which summarizeSamples
 * counts a sample as passed, for one sample.
 *
 * Method: as summarizeSamples (and analyze's checks): worst ripple <= limit, |droop| <= limit,
 * |INL| <= limit and |gain error| <= limit when the plan computes them (a missing figure counts
 * as 0, as in the sample table), slowest settling <= limit (never settling fails); a limit the
 * plan does not set is not checked, and NaN fails every comparison.
 *
 * Syntax: passesLimits(figures, plan)
 * Example: passesLimits(ladderMetrics(ladder, plan), plan)  // true
 */
export function passesLimits(figures: CircuitMetrics, plan: MetricPlan): boolean {
  const { limits } = plan;
  if (limits.ripple !== undefined && !(figures.worstRipple.ripple <= limits.ripple)) return false;
  if (limits.droop !== undefined && !(Math.abs(figures.droop.error) <= limits.droop)) return false;
  if (limits.inl !== undefined && plan.inl && !(Math.abs(figures.inl?.error ?? 0) <= limits.inl)) return false;
  if (limits.gain !== undefined && plan.gain && !(Math.abs(figures.gain ?? 0) <= limits.gain)) return false;
  if (limits.settling !== undefined && !((figures.settlingTime ?? Infinity) <= limits.settling)) return false;
  return true;
}
