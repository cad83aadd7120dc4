import type { ModalLadder } from './modalLadder.js';
import { periodicState } from './periodicState.js';
import { smallState, type SmallState } from './smallState.js';

/**
 * Time-average output (V) of the periodic steady state at one duty: periodicState(m, duty).average,
 * through the allocation-free smallState for one or two stages (the DC-error searches need
 * thousands of averages per ladder).
 *
 * Syntax: averageOutput(modal, duty)
 * Example: averageOutput(modalLadder(ladder)!, 0.5)  // V
 */
export function averageOutput(m: ModalLadder, duty: number): number {
  return m.n <= 2 ? smallState(m, duty, SMALL).average : periodicState(m, duty).average;
}

/** Scratch for smallState (read at once). */
const SMALL: SmallState = { t1: 0.5, t2: 0.5, yStart: 0.5, meanOffset: 0.5, average: 0.5, yEnd: 0.5, aHigh0: 0.5, aHigh1: 0.5, aLow0: 0.5, aLow1: 0.5, rh0: 0.5, rh1: 0.5, rl0: 0.5, rl1: 0.5 };
