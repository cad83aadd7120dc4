import type { Ladder } from '../circuit/ladder.js';
import type { Prepared } from './prepare.js';
import { dutyPlan } from './dutyPlan.js';
import { oneStageSteadyState } from './oneStage.js';

/**
 * Time-average output in periodic steady state at a duty, V, without computing extremes.
 *
 * Method: the average of dutyPlan.ts (closed form for one stage, oneStage.ts).
 *
 * Syntax: averageOutput(ladder, prepared, duty)
 * Example: averageOutput(ladder, prepare(ladder), 0.25)  // 0.825 for 3.3 V, no load, equal drivers
 */
export function averageOutput(ladder: Ladder, p: Prepared, duty: number): number {
  return p.n === 1 ? oneStageSteadyState(ladder, duty).average : dutyPlan(p, duty).average;
}
