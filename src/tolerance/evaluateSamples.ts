import { circuitMetrics } from './circuitMetrics.js';
import type { MetricPlan } from './metricPlan.js';
import type { ToleranceParameter } from './parameters.js';
import { circuitAt, type ToleranceCircuit } from './toleranceCircuit.js';

/** Per-sample figures, one entry per sample (SI: V, s). */
export interface SampleTable {
  worstRipple: Float64Array;
  /** Signed DC error of largest magnitude (ideal - average). */
  droop: Float64Array;
  /** Signed INL, or null when the plan does not ask for it. */
  inl: Float64Array | null;
  /** Signed gain error as a fraction of full scale, or null when the plan does not ask for it. */
  gain: Float64Array | null;
  /** Slowest settling time; +Infinity when a step never settles. */
  settlingTime: Float64Array;
  /** Samples for which some figure needed the engine's slower path. */
  engineSamples: number;
}

/**
 * Evaluate samples first..last-1 of a deviate table (rows of z in [-1, 1], one column per
 * parameter) and return their figures. The same code runs in-process and in worker threads, so
 * both give identical numbers.
 *
 * Method: circuitAt turns each row into a ladder or network; circuitMetrics computes its exact
 * figures.
 *
 * Syntax: evaluateSamples(circuit, parameters, plan, z, first, last[, onProgress])
 * Example: evaluateSamples(ladder, params, plan, z, 0, 100).worstRipple[0]  // V
 */
export function evaluateSamples(
  circuit: ToleranceCircuit,
  parameters: ToleranceParameter[],
  plan: MetricPlan,
  z: Float64Array,
  first: number,
  last: number,
  onProgress?: (done: number) => void,
): SampleTable {
  const count = last - first;
  const width = parameters.length;
  const table: SampleTable = {
    worstRipple: new Float64Array(count),
    droop: new Float64Array(count),
    inl: plan.inl ? new Float64Array(count) : null,
    gain: plan.gain ? new Float64Array(count) : null,
    settlingTime: new Float64Array(count),
    engineSamples: 0,
  };
  for (let i = 0; i < count; i++) {
    const m = circuitMetrics(circuitAt(circuit, parameters, z, (first + i) * width), plan);
    table.worstRipple[i] = m.worstRipple.ripple;
    table.droop[i] = m.droop.error;
    if (table.inl) table.inl[i] = m.inl?.error ?? 0;
    if (table.gain) table.gain[i] = m.gain ?? 0;
    table.settlingTime[i] = m.settlingTime ?? Infinity;
    if (m.usedEngine) table.engineSamples++;
    if (onProgress && (i + 1) % 256 === 0) onProgress(i + 1);
  }
  onProgress?.(count);
  return table;
}
