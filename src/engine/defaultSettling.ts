import type { Ladder } from '../circuit/ladder.js';
import type { Settling } from './types.js';
import { checkRange } from './checkArguments.js';
import { settlingTime } from './settlingTime.js';

/**
 * Settling over the full used range: the slower of the rising step dutyMin -> dutyMax and the
 * falling step dutyMax -> dutyMin (a step that never settles, time null, is the slowest).
 *
 * Method: two calls of settlingTime.ts.
 *
 * Syntax: defaultSettling(ladder, dutyMin, dutyMax, band)
 * Example: defaultSettling(ladder, 0.05, 0.95, 1.6e-3).time  // s, or null
 */
export function defaultSettling(ladder: Ladder, dutyMin: number, dutyMax: number, band: number): Settling {
  checkRange(dutyMin, dutyMax);
  return slowerSettling(settlingTime(ladder, dutyMin, dutyMax, band), settlingTime(ladder, dutyMax, dutyMin, band));
}

/**
 * The slower of two settling results; one that never settles (time null) is the slowest.
 *
 * Syntax: slowerSettling(rising, falling)
 * Example: slowerSettling({ ...s, time: 1e-3 }, { ...s, time: null }).time  // null
 */
export function slowerSettling(rising: Settling, falling: Settling): Settling {
  if (rising.time === null) return rising;
  if (falling.time === null) return falling;
  return falling.time > rising.time ? falling : rising;
}
