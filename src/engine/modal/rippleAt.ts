import type { ModalLadder } from './modalLadder.js';
import { steadySwing } from './steadySwing.js';

/**
 * Peak-to-peak steady-state ripple (V) at one duty: modalOperatingPoint(m, duty).ripple, through
 * the allocation-free smallState for one or two stages (steadySwing.ts).
 *
 * Syntax: rippleAt(modal, duty)
 * Example: rippleAt(modalLadder(ladder)!, 0.5)  // V
 */
export function rippleAt(m: ModalLadder, duty: number): number {
  return steadySwing(m, duty).ripple;
}
