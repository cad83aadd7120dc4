import type { Ladder } from '../circuit/ladder.js';
import type { DcTransfer } from './types.js';
import { averageOutput } from './averageOutput.js';
import { averageOutputByExpm } from './averageOutputByExpm.js';
import { checkRange } from './checkArguments.js';
import { maximizeOnInterval } from '../numeric/maximizeOnInterval.js';
import { prepare } from './prepare.js';
import type { SteadyMethod } from './steadyState.js';

/**
 * DC transfer errors of the PWM DAC over the used range [dutyMin, dutyMax], all in V, every one
 * signed as ideal minus actual (README "Sign convention"; model.md defines DC error so):
 * - droop: the DC error ideal - average with the largest magnitude (sign kept) and its duty,
 *   ideal = low + D (high - low);
 * - endpoint fit: the line through average(dutyMin) and average(dutyMax); offsetError =
 *   ideal(0) - fit(0), gainError = (high - low) - (fit(1) - fit(0));
 * - inl: the largest deviation fit - average (sign kept) and its duty.
 * A positive value means the output falls short of the ideal (or of the endpoint line).
 * With a single duty (dutyMin = dutyMax) the fit takes the ideal slope.
 *
 * Method: exact averages (averageOutput.ts; with method 'expm' always by matrix exponentials,
 * averageOutputByExpm.ts). With unequal high and low driver resistances average(D)
 * is not affine, so the extremes are searched: 16-cell grid plus Brent refinement
 * (maximizeOnInterval.ts). Endpoint-fit terms as DAC data sheets define them (common practice).
 *
 * Syntax: dcTransfer(ladder, dutyMin, dutyMax[, method])
 * Example: dcTransfer(loadedLadder, 0.05, 0.95).droop  // { duty: 0.95, error: 0.03 }
 */
export function dcTransfer(ladder: Ladder, dutyMin: number, dutyMax: number, method: SteadyMethod = 'auto'): DcTransfer {
  checkRange(dutyMin, dutyMax);
  const p = prepare(ladder);
  const span = ladder.high - ladder.low;
  const ideal = (d: number) => ladder.low + d * span;
  const average = method === 'expm' ? (d: number) => averageOutputByExpm(p, d) : (d: number) => averageOutput(ladder, p, d);
  const error = (d: number) => ideal(d) - average(d);

  const droopAt = maximizeOnInterval((d) => Math.abs(error(d)), dutyMin, dutyMax).x;
  const yMin = average(dutyMin);
  const yMax = average(dutyMax);
  const slope = dutyMax > dutyMin ? (yMax - yMin) / (dutyMax - dutyMin) : span;
  const fit = (d: number) => yMin + slope * (d - dutyMin);
  const deviation = (d: number) => fit(d) - average(d);
  const inlAt = maximizeOnInterval((d) => Math.abs(deviation(d)), dutyMin, dutyMax).x;
  return {
    droop: { duty: droopAt, error: error(droopAt) },
    offsetError: ideal(0) - fit(0),
    gainError: span - slope,
    inl: { duty: inlAt, error: deviation(inlAt) },
  };
}
