import type { ModalLadder } from './modalLadder.js';
import { modalOperatingPoint } from './operatingPoint.js';
import { smallRipple, smallState } from './smallState.js';

/**
 * Peak-to-peak steady-state ripple (V) at one duty: modalOperatingPoint(m, duty).ripple, through
 * the allocation-free smallState/smallRipple for one or two stages.
 *
 * Syntax: rippleAt(modal, duty)
 * Example: rippleAt(modalLadder(ladder)!, 0.5)  // V
 */
export function rippleAt(m: ModalLadder, duty: number): number {
  return m.n <= 2 ? smallRipple(smallState(m, duty)) : modalOperatingPoint(m, duty).ripple;
}
