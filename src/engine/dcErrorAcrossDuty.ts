import type { Ladder } from '../circuit/ladder.js';
import type { DcErrorSeries } from './types.js';
import { averageOutput } from './averageOutput.js';
import { checkCount, checkRange } from './checkArguments.js';
import { prepare } from './prepare.js';

/**
 * The DC error ideal - average (V) at `points` evenly spaced duties from `dutyMin` to `dutyMax`
 * (both included), ideal = low + D (high - low). Signed as README "Sign convention" and model.md
 * define it: positive when the output falls short of the ideal.
 *
 * Method: exact steady-state averages (averageOutput.ts), the same the DC transfer uses.
 *
 * Syntax: dcErrorAcrossDuty(ladder, dutyMin, dutyMax, points)
 * Example: dcErrorAcrossDuty(loaded, 0.05, 0.95, 72).error.at(-1)   // > 0: a load pulls the output down
 */
export function dcErrorAcrossDuty(ladder: Ladder, dutyMin: number, dutyMax: number, points: number): DcErrorSeries {
  checkRange(dutyMin, dutyMax);
  checkCount(points, 'points', true);
  const p = prepare(ladder);
  const span = ladder.high - ladder.low;
  const duty = Array.from({ length: points }, (_, i) => (points === 1 ? dutyMin : dutyMin + ((dutyMax - dutyMin) * i) / (points - 1)));
  return { duty, error: duty.map((d) => ladder.low + d * span - averageOutput(ladder, p, d)) };
}
