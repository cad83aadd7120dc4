import type { Ladder } from '../circuit/ladder.js';
import { modalRoute } from './modalRoute.js';

/**
 * Whether steadyState and averageOutput evaluate this ladder in modal form (modalRoute.ts) rather
 * than by the one-stage closed form or the matrix exponentials.
 *
 * Syntax: hasModalForm(ladder)
 * Example: hasModalForm(twoStage)  // true; false for one stage or two identical buffered sections
 */
export function hasModalForm(ladder: Ladder): boolean {
  return modalRoute(ladder) !== null;
}
