import type { Ladder } from '../../circuit/ladder.js';
import { cascadeLadder } from './cascadeLadder.js';
import { modalLadderOf } from './modalLadderOf.js';
import type { ModalLadder } from './modalTypes.js';

export type { ModalLadder, PhaseModes } from './modalTypes.js';

/**
 * The modal form of a ladder, or null when it does not apply. A follower-free ladder goes to
 * modalLadderOf; a follower after the last stage only disconnects the load (as in the engine's
 * state equations), so that ladder is the same one unloaded; followers inside the ladder make a
 * cascade of sections, handed to cascadeLadder (null when two sections share a mode: a Jordan
 * block, for the engine's matrix-exponential path). The engine decides with modalRoute.ts whether
 * it uses the form; the tolerance module uses it directly.
 *
 * With `into`, the modal form of an earlier call, a follower-free ladder of one or two stages is
 * written into it (modalLadderOf's `into`: the same numbers) and it is returned: a caller that is
 * done with each form before asking for the next allocates nothing for it.
 *
 * Syntax: modalLadder(ladder[, into])
 * Example: modalLadder(oneStage).hi.rate  // [-1 / ((R + Rd) C)]
 */
export function modalLadder(ladder: Ladder, into?: ModalLadder): ModalLadder | null {
  const { stages } = ladder;
  const n = stages.length;
  for (let k = 0; k < n - 1; k++) if (stages[k].buffered) return cascadeLadder(ladder);
  const circuit = stages[n - 1].buffered ? { ...ladder, loadResistance: null, loadCapacitance: 0 } : ladder;
  return modalLadderOf(
    circuit,
    stages.map((s) => s.r),
    stages.map((s) => s.c),
    into,
  );
}
