import type { DesignProblem } from './designProblem.js';

/**
 * The least size of the pin's drive step, A: the least |g_H (high - m) - g_L (low - m)| over every
 * node-1 average m the ladder can have, g_H and g_L the pin conductances of the two phases
 * (1 / (driver + r1)). Node voltages stay between the levels and ground (a passive network, the
 * load's return at ground), so m lies in [lo, hi] = [min(low, high, 0), max(low, high, 0)]; the
 * expression is linear in m, so its least size is at an end, or 0 when it changes sign inside.
 * For equal drivers it is g (high - low). The settling floor (settlingFloor.ts) drives its fast
 * ladder with it, the ripple floor (rippleFloor.ts) bounds the pin's fundamental with it.
 *
 * Syntax: pinDriveStep(circuit, r1)
 * Example: pinDriveStep({ driverHigh: 25, driverLow: 25, high: 3.3, low: 0 }, 475)   // 3.3 / 500 A
 */
export function pinDriveStep(circuit: PinCircuit, r1: number): number {
  endSteps(circuit, r1);
  const [fLo, fHi] = ENDS;
  return fLo * fHi > 0 ? Math.min(Math.abs(fLo), Math.abs(fHi)) : 0;
}

/**
 * The largest size of the pin's drive step over the node averages m in [lo, hi] (see
 * pinDriveStep): linear in m, so the larger of its sizes at the two ends. The ripple ceiling
 * (rippleCeiling.ts) bounds the pin's harmonics with it.
 *
 * Syntax: largestPinDriveStep(circuit, r1)
 * Example: largestPinDriveStep({ driverHigh: 40, driverLow: 25, high: 3.3, low: 0 }, 460)   // 3.3 / 485 A
 */
export function largestPinDriveStep(circuit: PinCircuit, r1: number): number {
  endSteps(circuit, r1);
  return Math.max(Math.abs(ENDS[0]), Math.abs(ENDS[1]));
}

type PinCircuit = Pick<DesignProblem['circuit'], 'driverHigh' | 'driverLow' | 'high' | 'low'>;

/** The drive step g_H (high - m) - g_L (low - m) at m = lo and m = hi, written into ENDS. */
const ENDS = [0, 0];
function endSteps(circuit: PinCircuit, r1: number): void {
  const gH = 1 / (circuit.driverHigh + r1);
  const gL = 1 / (circuit.driverLow + r1);
  const lo = Math.min(circuit.low, circuit.high, 0);
  const hi = Math.max(circuit.low, circuit.high, 0);
  ENDS[0] = gH * (circuit.high - lo) + gL * (lo - circuit.low);
  ENDS[1] = gH * (circuit.high - hi) + gL * (hi - circuit.low);
}
