import type { Ladder } from '../circuit/ladder.js';
import type { OperatingPoint } from './types.js';
import { checkDuty } from './checkArguments.js';
import { modalOperatingPoint } from './modal/operatingPoint.js';
import { modalRoute } from './modalRoute.js';
import { oneStageSteadyState } from './oneStage.js';
import { steadyStateByExpm } from './steadyStateByExpm.js';

/**
 * How the engine evaluates steady states: 'auto' takes the fastest exact route for the ladder
 * (steadyState), 'expm' always the matrix exponentials (steadyStateByExpm), the independent method
 * the others are held to.
 */
export type SteadyMethod = 'auto' | 'expm';

/**
 * Periodic steady state of the filter output at a duty D (0..1): average, extremes, ripple and
 * where in the period (s from the rising edge) the extremes occur.
 *
 * Method: three exact routes, all in deviations so that a ripple of 1e-9 of the level keeps its
 * digits: the closed form for one stage (oneStage.ts); the modal form (modal/operatingPoint.ts:
 * sums of decaying exponentials with closed or bracketed turning points) when the ladder has one
 * (modalRoute.ts: follower-free ladders, cascades whose sections have well separated modes);
 * otherwise matrix exponentials (steadyStateByExpm.ts). The ripple is computed from the deviations,
 * never as max - min of the levels.
 *
 * Syntax: steadyState(ladder, duty)
 * Example: steadyState(ladder, 0.5)  // { duty: 0.5, average: 1.65, min, max, ripple, tMin, tMax }
 */
export function steadyState(ladder: Ladder, duty: number): OperatingPoint {
  checkDuty(duty, 'duty');
  if (ladder.stages.length === 1) return oneStageSteadyState(ladder, duty);
  const m = modalRoute(ladder);
  return m ? modalOperatingPoint(m, duty) : steadyStateByExpm(ladder, duty);
}
