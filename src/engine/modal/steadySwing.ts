import './doubleFields.js';
import type { ModalLadder } from './modalLadder.js';
import { periodicState, type PeriodicState } from './periodicState.js';
import { curveExtrema } from './phaseCurve.js';
import { smallExtrema, smallState, type SmallState } from './smallState.js';

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

/** Scratch for smallExtrema and smallState (read at once). */
const EXT = { max: 0.5, min: 0.5 };
const SMALL: SmallState = { t1: 0.5, t2: 0.5, yStart: 0.5, meanOffset: 0.5, average: 0.5, yEnd: 0.5, aHigh0: 0.5, aHigh1: 0.5, aLow0: 0.5, aLow1: 0.5, rh0: 0.5, rh1: 0.5, rl0: 0.5, rl1: 0.5 };

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
 * With `into` (an earlier result) the figures are written there and it is returned; one and two
 * stages then allocate nothing.
 *
 * Syntax: steadySwing(modal, duty[, state[, into]])
 * Example: steadySwing(modalLadderOf(circuit, [1e3, 10e3], [1e-6, 100e-9]), 0.5).ripple  // V
 */
export function steadySwing(m: ModalLadder, duty: number, state?: PeriodicState, into?: SteadySwing): SteadySwing {
  if (m.n <= 2 && state === undefined) {
    const s = smallState(m, duty, SMALL);
    smallExtrema(s, EXT);
    return swingOf(EXT.max - EXT.min, s.average, s.yStart, EXT.max - s.meanOffset, s.meanOffset - EXT.min, into);
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
  return swingOf(max - min, s.average, s.yStart, max - s.meanOffset, s.meanOffset - min, into);
}

function swingOf(ripple: number, average: number, yStart: number, above: number, below: number, into?: SteadySwing): SteadySwing {
  if (into === undefined) return { ripple, average, yStart, above, below };
  into.ripple = ripple;
  into.average = average;
  into.yStart = yStart;
  into.above = above;
  into.below = below;
  return into;
}
