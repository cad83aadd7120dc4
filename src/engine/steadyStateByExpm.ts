import type { Ladder } from '../circuit/ladder.js';
import type { OperatingPoint } from './types.js';
import { operatingPointFrom } from './operatingPointFrom.js';
import { checkDuty } from './checkArguments.js';
import { dutyPlan } from './dutyPlan.js';
import { periodTrajectory } from './periodTrajectory.js';
import { prepare } from './prepare.js';

/**
 * Periodic steady state of the filter output at a duty D (0..1) by matrix exponentials, for any
 * ladder (one stage included): the general route of steadyState and the independent method the
 * faster routes are tested against.
 *
 * Method: exact per-phase matrix exponentials and the fixed point of the one-period map, in
 * deviations from the DC states so that a ripple of 1e-9 of the level keeps its digits (dutyPlan.ts);
 * extremes from phase boundaries and the refined zeros of the output's derivative
 * (periodTrajectory.ts). The ripple is computed from the deviations, never as max - min of the levels.
 *
 * Syntax: steadyStateByExpm(ladder, duty)
 * Example: steadyStateByExpm(ladder, 0.5)  // { duty: 0.5, average: 1.65, min, max, ripple, tMin, tMax }
 */
export function steadyStateByExpm(ladder: Ladder, duty: number): OperatingPoint {
  checkDuty(duty, 'duty');
  const p = prepare(ladder);
  const plan = dutyPlan(p, duty);
  plan.extrema ??= periodTrajectory(p, plan);
  return operatingPointFrom(duty, plan.average, plan.yStart, plan.extrema);
}
