import type { Ladder } from '../circuit/ladder.js';

/**
 * Peak current out of (or into) the PWM pin, A: |high - low| / (driver + R1) with the smaller of
 * the two driver resistances, i.e. the edge at which the first capacitor still sits at the
 * opposite level (the worse edge). Ohm's law; the first capacitor holds its voltage across the edge.
 *
 * Syntax: pinPeakCurrent(ladder)
 * Example: pinPeakCurrent({ ...ladder, high: 3.3, low: 0, driverHigh: 40, driverLow: 25 })  // 3.3 / (25 + R1)
 */
export function pinPeakCurrent(ladder: Ladder): number {
  const driver = Math.min(ladder.driverHigh, ladder.driverLow);
  return Math.abs(ladder.high - ladder.low) / (driver + ladder.stages[0].r);
}
