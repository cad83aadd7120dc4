import { ladderPasses } from './ladderMetrics.js';
import type { MetricPlan } from './metricPlan.js';
import { networkMetrics } from './networkMetrics.js';
import type { ToleranceParameter } from './parameters.js';
import { passesLimits } from './passesLimits.js';
import { circuitAt, isNetwork, type ToleranceCircuit } from './toleranceCircuit.js';

/**
 * How many of samples first..last-1 of a deviate table meet every limit of the plan:
 * summarizeSamples(evaluateSamples(...), plan).passed, for callers that need the count alone (the
 * yield check of the robust design search, sequentialYield.ts).
 *
 * Method: circuitAt turns each row into a ladder or network, as evaluateSamples does; a ladder is
 * judged by ladderPasses (the same figures, computed only as far as the verdict needs them), a
 * network by passesLimits on its full figures (networkMetrics).
 *
 * Syntax: countPassing(circuit, parameters, plan, z, first, last)
 * Example: countPassing(ladder, params, plan, z, 0, 250)  // 248
 */
export function countPassing(
  circuit: ToleranceCircuit,
  parameters: ToleranceParameter[],
  plan: MetricPlan,
  z: Float64Array,
  first: number,
  last: number,
): number {
  const width = parameters.length;
  let passed = 0;
  for (let i = first; i < last; i++) {
    const c = circuitAt(circuit, parameters, z, i * width);
    if (isNetwork(c) ? passesLimits(networkMetrics(c, plan), plan) : ladderPasses(c, plan)) passed++;
  }
  return passed;
}
