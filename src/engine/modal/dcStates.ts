import type { Ladder } from '../../circuit/ladder.js';
import { dcGain } from '../../circuit/dcGain.js';

/** DC node voltages of both pin states and their difference, V. */
export interface DcStates {
  high: number[];
  low: number[];
  /** high - low, formed without subtracting nearly equal states when the drivers are equal. */
  delta: number[];
}

/**
 * The DC states x_h, x_l of a ladder (each phase held forever) and Delta = x_h - x_l.
 *
 * Method: the per-volt gains of the resistive chain (circuit/dcGain.ts: sums of positive terms, so
 * full relative precision when resistances differ by decades, where a tridiagonal or LU solve loses
 * digits); Delta = (V_h - V_l) g with equal drivers, else V_h g_h - V_l g_l (as engine/prepare.ts).
 *
 * Syntax: dcStates(ladder)
 * Example: dcStates(twoStageOpen).delta  // [3.3, 3.3] for 3.3 V / 0 V and an open output
 */
export function dcStates(ladder: Ladder): DcStates {
  const gHigh = dcGain(ladder, ladder.driverHigh);
  const equal = ladder.driverHigh === ladder.driverLow;
  const gLow = equal ? gHigh : dcGain(ladder, ladder.driverLow);
  const span = ladder.high - ladder.low;
  return {
    high: gHigh.map((g) => g * ladder.high),
    low: gLow.map((g) => g * ladder.low),
    delta: equal ? gHigh.map((g) => g * span) : gHigh.map((g, i) => g * ladder.high - gLow[i] * ladder.low),
  };
}
