import type { Prepared } from './prepare.js';
import { dutyPlan } from './dutyPlan.js';

/**
 * Time-average output in periodic steady state at a duty, V, by matrix exponentials for any ladder
 * (one stage included): the general route of averageOutput and the independent method the faster
 * routes are tested against.
 *
 * Method: the average of dutyPlan.ts, y_s + c^T [J_h v + t2 w + J_l (-u - w)] / T, from the exact
 * flows of both phases.
 *
 * Syntax: averageOutputByExpm(prepared, duty)
 * Example: averageOutputByExpm(prepare(ladder), 0.25)  // 0.825 for 3.3 V, no load, equal drivers
 */
export function averageOutputByExpm(p: Prepared, duty: number): number {
  return dutyPlan(p, duty).average;
}
