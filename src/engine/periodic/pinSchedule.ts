import type { Duties, Network } from '../../circuit/network.js';
import { pinStateKey, type PinStateKey } from '../../circuit/networkEquations.js';

/** One interval of a PWM period in which both outputs keep their states. */
export interface ScheduledPhase {
  readonly key: PinStateKey;
  /** Length, s (> 0). */
  readonly duration: number;
}

/**
 * The pin states over one period, from the period start: each output is high for D T, from the
 * period start (edge alignment) or centred in the period (center alignment); a complement output
 * is high exactly when the first is low; without a second output its state is 'low' (unused).
 * Zero-length intervals are dropped and equal neighbours merged. Durations are formed from the
 * duties, not by subtracting nearby times, where that is possible (two phases).
 *
 * Syntax: pinSchedule(network, duties)
 * Example: pinSchedule(oneOutput, { first: 0.25, second: null })  // [{ key: 'hl', 0.25 T }, { key: 'll', 0.75 T }]
 */
export function pinSchedule(network: Network, duties: Duties): ScheduledPhase[] {
  const T = network.period;
  const d1 = duties.first;
  const role = network.second?.role ?? null;
  if (role !== 'fine') {
    const complement = role === 'complement';
    const high: ScheduledPhase = { key: pinStateKey(true, false), duration: d1 * T };
    const low: ScheduledPhase = { key: pinStateKey(false, complement), duration: (1 - d1) * T };
    if (network.alignment === 'edge') return [high, low].filter((p) => p.duration > 0);
    const half: ScheduledPhase = { key: low.key, duration: low.duration / 2 };
    return [half, high, half].filter((p) => p.duration > 0);
  }
  const d2 = duties.second ?? 0;
  const edge = network.alignment === 'edge';
  const a1 = edge ? 0 : (1 - d1) / 2;
  const b1 = edge ? d1 : (1 + d1) / 2;
  const a2 = edge ? 0 : (1 - d2) / 2;
  const b2 = edge ? d2 : (1 + d2) / 2;
  // The marks in ascending order (insertion sort in place); equal marks make empty intervals, which
  // the loop below skips.
  const marks = [0, 1, a1, b1, a2, b2];
  for (let i = 1; i < marks.length; i++) {
    const v = marks[i];
    let j = i;
    for (; j > 0 && marks[j - 1] > v; j--) marks[j] = marks[j - 1];
    marks[j] = v;
  }
  const phases: ScheduledPhase[] = [];
  for (let i = 0; i + 1 < marks.length; i++) {
    const lo = marks[i];
    const hi = marks[i + 1];
    if (!(hi > lo)) continue;
    const mid = (lo + hi) / 2;
    const key = pinStateKey(mid >= a1 && mid < b1, mid >= a2 && mid < b2);
    const prev = phases[phases.length - 1];
    if (prev && prev.key === key) phases[phases.length - 1] = { key, duration: prev.duration + (hi - lo) * T };
    else phases.push({ key, duration: (hi - lo) * T });
  }
  return phases;
}
