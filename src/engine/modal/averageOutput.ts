import type { ModalLadder } from './modalLadder.js';
import { periodicState } from './periodicState.js';
import { smallState } from './smallState.js';

/**
 * Time-average output (V) of the periodic steady state at one duty: periodicState(m, duty).average,
 * through the allocation-free smallState for one or two stages (the DC-error searches need
 * thousands of averages per ladder).
 *
 * Syntax: averageOutput(modal, duty)
 * Example: averageOutput(modalLadder(ladder)!, 0.5)  // V
 */
export function averageOutput(m: ModalLadder, duty: number): number {
  return m.n <= 2 ? smallState(m, duty).average : periodicState(m, duty).average;
}
