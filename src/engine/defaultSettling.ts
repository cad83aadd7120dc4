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
  const rising = settlingTime(ladder, dutyMin, dutyMax, band);
  const falling = settlingTime(ladder, dutyMax, dutyMin, band);
  if (rising.time === null) return rising;
  if (falling.time === null) return falling;
  return falling.time > rising.time ? falling : rising;
}
