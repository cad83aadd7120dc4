import type { Ladder } from '../circuit/ladder.js';

/**
 * The largest voltage any filter capacitor can see, V: max(|high|, |low|).
 *
 * Why it is an upper bound: every capacitor of the ladder sits between a node and ground, and
 * every node of a passive RC network driven by sources at `high`, `low` and ground (the load) stays
 * inside the range of those sources for all time when it starts inside it (maximum principle for
 * RC networks: a node voltage is a weighted mean of its neighbours' while its capacitor charges).
 * Ideal unity-gain followers copy a node, so they do not widen the range. The bound is reached by
 * the first capacitor at 100 % duty, so it is also the working voltage to rate the parts for when
 * the duty may reach its ends (firmware faults, start-up).
 *
 * Syntax: capacitorWorkingVoltage(ladder)
 * Example: capacitorWorkingVoltage({ ...ladder, high: 3.3, low: 0 })   // 3.3
 */
export function capacitorWorkingVoltage(ladder: Pick<Ladder, 'high' | 'low'>): number {
  return Math.max(Math.abs(ladder.high), Math.abs(ladder.low));
}
