import type { Ladder } from '../circuit/ladder.js';
import type { DcTransfer } from './types.js';
import { averageOutput } from './averageOutput.js';
import { averageOutputByExpm } from './averageOutputByExpm.js';
import { checkRange } from './checkArguments.js';
import { endpointFit } from './endpointFit.js';
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
 * averageOutputByExpm.ts), errors and their search by endpointFit.ts.
 *
 * Syntax: dcTransfer(ladder, dutyMin, dutyMax[, method])
 * Example: dcTransfer(loadedLadder, 0.05, 0.95).droop  // { duty: 0.95, error: 0.03 }
 */
export function dcTransfer(ladder: Ladder, dutyMin: number, dutyMax: number, method: SteadyMethod = 'auto'): DcTransfer {
  checkRange(dutyMin, dutyMax);
  const p = prepare(ladder);
  const span = ladder.high - ladder.low;
  const average = method === 'expm' ? (d: number) => averageOutputByExpm(p, d) : (d: number) => averageOutput(ladder, p, d);
  return endpointFit({ average, ideal: (d) => ladder.low + d * span, quantize: (d) => d, span, low: ladder.low }, dutyMin, dutyMax);
}
