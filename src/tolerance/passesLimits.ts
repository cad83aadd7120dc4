import type { MetricPlan } from './metricPlan.js';
import type { CircuitMetrics } from './metrics.js';

/** A spec the yield is counted against. */
export type SpecName = 'ripple' | 'droop' | 'inl' | 'gain' | 'settling';

/**
 * Whether one figure meets its limit: the rule every yield count uses (summarizeSamples over a
 * sample table, passesLimits and ladderPasses per sample), as analyze's checks do: the figure is
 * at most the limit, droop, INL and gain error by magnitude; a step that never settles is given as
 * Infinity and fails; NaN fails every comparison.
 *
 * Syntax: meetsLimit(spec, figure, limit)
 * Example: meetsLimit('droop', -0.004, 0.005)   // true
 */
export function meetsLimit(spec: SpecName, figure: number, limit: number): boolean {
  return (spec === 'droop' || spec === 'inl' || spec === 'gain' ? Math.abs(figure) : figure) <= limit;
}

/**
 * Whether one circuit's figures meet every limit of the plan: the rule by which summarizeSamples
 * counts a sample as passed, for one sample.
 *
 * Method: meetsLimit for each limit the plan sets; INL and gain error only when the plan computes
 * them (a missing figure counts as 0, as in the sample table); the slowest settling time, never
 * settling as Infinity.
 *
 * Syntax: passesLimits(figures, plan)
 * Example: passesLimits(ladderMetrics(ladder, plan), plan)  // true
 */
export function passesLimits(figures: CircuitMetrics, plan: MetricPlan): boolean {
  const { limits } = plan;
  if (limits.ripple !== undefined && !meetsLimit('ripple', figures.worstRipple.ripple, limits.ripple)) return false;
  if (limits.droop !== undefined && !meetsLimit('droop', figures.droop.error, limits.droop)) return false;
  if (limits.inl !== undefined && plan.inl && !meetsLimit('inl', figures.inl?.error ?? 0, limits.inl)) return false;
  if (limits.gain !== undefined && plan.gain && !meetsLimit('gain', figures.gain ?? 0, limits.gain)) return false;
  if (limits.settling !== undefined && !meetsLimit('settling', figures.settlingTime ?? Infinity, limits.settling)) return false;
  return true;
}
