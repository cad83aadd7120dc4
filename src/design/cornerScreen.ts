import type { Ladder } from '../circuit/ladder.js';
import type { Project } from '../project/types.js';
import type { DesignProblem } from './designProblem.js';
import { modalAverageOutput, modalLadder, periodicState, rippleAt, settlingLowerBound } from '../engine/index.js';
import { maximizeOverDuty } from './maximizeOverDuty.js';

/** Whether the search may recommend a candidate (resistors and capacitors, pin side first). */
export type Admit = (problem: DesignProblem, r: readonly number[], c: readonly number[]) => boolean;

/** Relative allowance between the fast model and the engine (both exact; rounding differs). */
const REL = 1e-6;

/**
 * A screen for `design --robust worst-case`: admits a candidate unless one corner of the tolerance
 * box (`corners`, from the tolerance layer: tolerance/cornerMiss.ts boxCorners) already takes its
 * worst ripple, droop or settling time beyond the file's limit, in which case the worst-case check
 * would fail it (it evaluates those corners exactly and keeps the worst). Run before the engine
 * verifies a nominal design, so that the nominal list the robust search walks holds only designs
 * the check could pass.
 *
 * Method: the engine's modal form at each corner (engine/modal) gives lower bounds of that
 * corner's figures: the ripple and droop maximised over a duty grid (maximizeOverDuty.ts, from
 * rippleAt and modalAverageOutput) and the settling lower bound (settlingLowerBound, Infinity
 * when the output never settles); a bound beyond its limit by more than ten search-versus-check
 * rounding allowances proves the miss. Designs with a follower are admitted unscreened (the bound takes follower-free
 * ladders).
 *
 * Syntax: cornerScreen(corners)(problem, r, c)
 * Example: cornerScreen(robustChecks.corners!)(problem, [1e3, 10e3], [1e-6, 1e-7])   // false: a corner misses
 */
export function cornerScreen(corners: (project: Project, ladder: Ladder) => Ladder[]): Admit {
  return (problem, r, c) => {
    const ladder = problem.ladderOf(r, c);
    if (ladder.stages.some((s) => s.buffered)) return true;
    const { limits, dutyMin, dutyMax } = problem;
    for (const corner of corners(problem.project, ladder)) {
      const fullScale = Math.abs(corner.high - corner.low);
      const beyond = (value: number, limit: number | undefined, floor: number) =>
        limit !== undefined && value - 10 * Math.max(REL * Math.abs(value), floor) > limit;
      const model = modalLadder(corner);
      if (model === null) continue;
      // steadySwing's ripple and average, each alone (rippleAt, modalAverageOutput: same numbers, less work)
      if (limits.ripple !== undefined && beyond(maximizeOverDuty((d) => rippleAt(model, d), dutyMin, dutyMax), limits.ripple, 1e-12 * fullScale)) return false;
      if (limits.droop !== undefined) {
        const droop = maximizeOverDuty((d) => Math.abs(corner.low + d * (corner.high - corner.low) - modalAverageOutput(model, d)), dutyMin, dutyMax);
        if (beyond(droop, limits.droop, 1e-12 * fullScale)) return false;
      }
      if (limits.settlingTime !== undefined) {
        for (const [from, to] of problem.steps) {
          const t = settlingLowerBound(model, from, to, problem.band, periodicState(model, from), periodicState(model, to), limits.settlingTime * 2);
          if (t === Infinity || beyond(t, limits.settlingTime, 1e-9 * corner.period)) return false;
        }
      }
    }
    return true;
  };
}
