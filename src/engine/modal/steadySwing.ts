import './doubleFields.js';
import type { ModalLadder } from './modalLadder.js';
import { periodicState, type PeriodicState } from './periodicState.js';
import { curveExtrema } from './phaseCurve.js';
import { smallExtrema, smallState } from './smallState.js';

/** The figures of one periodic steady state a search asks for, deviations kept apart from the level. */
export interface SteadySwing {
  /** Peak-to-peak ripple, V. */
  ripple: number;
  /** Time-average output, V. */
  average: number;
  /** Output at the rising edge, V. */
  yStart: number;
  /** Largest excursion of the output above its average and below it, V (both >= 0). */
  above: number;
  below: number;
}

/** Scratch for smallExtrema (read at once). */
const EXT = { max: 0, min: 0 };

/**
 * Ripple, average, output at the rising edge and the excursions about the average of the
 * periodic steady state at one duty, from the modal form: through the allocation-free smallState
 * for one or two stages, else periodicState (or the state given, at this duty) and the exact
 * extremes of its phase curves.
 *
 * Method: the extremes of the deviation from the rising edge, as modalOperatingPoint takes them
 * (phase ends and turning points: phaseCurve.ts, smallState.ts); ripple = max - min and
 * above = max - meanOffset, below = meanOffset - min, all differences of deviations, so each keeps
 * its digits however small the ripple is next to the level.
 *
 * Syntax: steadySwing(modal, duty[, state])
 * Example: steadySwing(modalLadderOf(circuit, [1e3, 10e3], [1e-6, 100e-9]), 0.5).ripple  // V
 */
export function steadySwing(m: ModalLadder, duty: number, state?: PeriodicState): SteadySwing {
  if (m.n <= 2 && state === undefined) {
    const s = smallState(m, duty);
    smallExtrema(s, EXT);
    return { ripple: EXT.max - EXT.min, average: s.average, yStart: s.yStart, above: EXT.max - s.meanOffset, below: s.meanOffset - EXT.min };
  }
  const s = state ?? periodicState(m, duty);
  const h = curveExtrema(s.high);
  const l = curveExtrema(s.low);
  let max = 0;
  let min = 0;
  if (h.max > max) max = h.max;
  if (h.min < min) min = h.min;
  if (l.max > max) max = l.max;
  if (l.min < min) min = l.min;
  return { ripple: max - min, average: s.average, yStart: s.yStart, above: max - s.meanOffset, below: s.meanOffset - min };
}
