import { ladderMetrics } from './ladderMetrics.js';
import type { MetricPlan } from './metricPlan.js';
import type { CircuitMetrics } from './metrics.js';
import { networkMetrics } from './networkMetrics.js';
import { isNetwork, type ToleranceCircuit } from './toleranceCircuit.js';

/**
 * The tolerance figures of a ladder (ladderMetrics: modal fast path, engine fallback) or of a
 * network (networkMetrics: the general periodic engine).
 *
 * Syntax: circuitMetrics(circuit, plan[, { engineOnly }])
 * Example: circuitMetrics(circuit, metricPlan(p, circuit)).droop.error  // V
 */
export function circuitMetrics(circuit: ToleranceCircuit, plan: MetricPlan, options: { engineOnly?: boolean } = {}): CircuitMetrics {
  return isNetwork(circuit) ? networkMetrics(circuit, plan, options) : ladderMetrics(circuit, plan, options);
}
