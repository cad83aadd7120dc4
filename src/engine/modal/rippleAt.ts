import type { ModalLadder } from './modalLadder.js';
import { smallExtrema, smallState, type SmallState } from './smallState.js';
import { steadySwing } from './steadySwing.js';

/**
 * Peak-to-peak steady-state ripple (V) at one duty: modalOperatingPoint(m, duty).ripple, the
 * ripple steadySwing gives. For one or two stages through smallState without its time average
 * (the ripple does not use it: same numbers, four phi-function evaluations fewer) and
 * smallExtrema, allocating nothing.
 *
 * Syntax: rippleAt(modal, duty)
 * Example: rippleAt(modalLadder(ladder)!, 0.5)  // V
 */
export function rippleAt(m: ModalLadder, duty: number): number {
  if (m.n > 2) return steadySwing(m, duty).ripple;
  smallExtrema(smallState(m, duty, SMALL, false), EXT);
  return EXT.max - EXT.min;
}

/** Scratch for smallState and smallExtrema (read at once). */
const EXT = { max: 0.5, min: 0.5 };
const SMALL: SmallState = { t1: 0.5, t2: 0.5, yStart: 0.5, meanOffset: 0.5, average: 0.5, yEnd: 0.5, aHigh0: 0.5, aHigh1: 0.5, aLow0: 0.5, aLow1: 0.5, rh0: 0.5, rh1: 0.5, rl0: 0.5, rl1: 0.5 };
