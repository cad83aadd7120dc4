import type { OperatingPoint } from '../types.js';
import { operatingPointFrom } from '../operatingPointFrom.js';
import type { ModalLadder } from './modalLadder.js';
import { curveExtrema } from './phaseCurve.js';
import { periodicState, type PeriodicState } from './periodicState.js';

/**
 * Ripple, extremes and average of the periodic steady state at one duty (the engine's
 * OperatingPoint, computed in modal form). Pass a PeriodicState already at hand to reuse it.
 *
 * Method: exact extremes of each phase curve (curveExtrema); ripple = max - min of the deviations
 * from the rising edge, so it keeps its relative accuracy however small it is next to the level.
 *
 * Syntax: modalOperatingPoint(modal, duty[, state])
 * Example: modalOperatingPoint(modalLadder(ladder)!, 0.5).ripple  // V peak-to-peak
 */
export function modalOperatingPoint(m: ModalLadder, duty: number, state?: PeriodicState): OperatingPoint {
  const s = state ?? periodicState(m, duty);
  const h = curveExtrema(s.high);
  const l = curveExtrema(s.low);
  let max = 0;
  let tMax = 0;
  let min = 0;
  let tMin = 0;
  if (h.max > max) [max, tMax] = [h.max, h.tMax];
  if (h.min < min) [min, tMin] = [h.min, h.tMin];
  if (l.max > max) [max, tMax] = [l.max, s.t1 + l.tMax];
  if (l.min < min) [min, tMin] = [l.min, s.t1 + l.tMin];
  return operatingPointFrom(duty, s.average, s.yStart, { minW: min, maxW: max, tMin, tMax });
}
