import type { Ladder } from '../circuit/ladder.js';
import { checkLadder } from '../circuit/checkLadder.js';
import { modalLadder, type ModalLadder } from './modal/modalLadder.js';
import { rememberRecentLadders } from './recentLadders.js';

/**
 * Largest condition number of a cascade's modal basis (ModalLadder.condition) for which the engine
 * takes the modal route. Sections with nearly equal modes make the modal sums lose digits that the
 * matrix exponentials keep. Measured against 80-digit references over ~300 random cascades: up to a
 * condition of 30 the modal route was as accurate as the exponentials or better; from 30 to 1e3 its
 * ripple was up to 70 times worse (1.8e-11 against 6e-13 relative); sections 1 % apart (condition
 * 1e4) gave 3e-12 relative error in the average where the exponentials gave 2e-14.
 */
export const MAX_MODAL_CONDITION = 30;

/**
 * The modal form the engine's steady state and averages use for a ladder, or null when they use
 * another route: one stage (its closed form, oneStage.ts), a cascade whose sections share a mode
 * (a Jordan block) or nearly do (condition above MAX_MODAL_CONDITION): the matrix exponentials.
 * Cached for the few most recently used ladder objects, a null result too; ladders are treated as
 * immutable (as in prepare.ts).
 *
 * Method: modal/modalLadder.ts (follower-free ladders: symmetric eigenproblem; followers inside:
 * modal/cascadeLadder.ts).
 *
 * Syntax: modalRoute(ladder)
 * Example: modalRoute(twoStage)?.hi.rate  // the two modal rates of the high phase, 1/s
 */
export const modalRoute: (ladder: Ladder) => ModalLadder | null = rememberRecentLadders(chooseModalRoute);

function chooseModalRoute(ladder: Ladder): ModalLadder | null {
  checkLadder(ladder);
  if (ladder.stages.length < 2) return null;
  const m = modalLadder(ladder);
  return m && m.condition <= MAX_MODAL_CONDITION ? m : null;
}
