import type { Ladder } from '../circuit/ladder.js';
import type { Prepared } from './prepare.js';
import { averageOutput as modalAverage } from './modal/averageOutput.js';
import { modalRoute } from './modalRoute.js';
import { oneStageSteadyState } from './oneStage.js';
import { averageOutputByExpm } from './averageOutputByExpm.js';

/**
 * Time-average output in periodic steady state at a duty, V, without computing extremes.
 *
 * Method: the routes of steadyState.ts: closed form for one stage (oneStage.ts), the modal form when
 * the ladder has one (modal/averageOutput.ts, modalRoute.ts), else the average of dutyPlan.ts
 * (averageOutputByExpm.ts, which uses the preparation `p`).
 *
 * Syntax: averageOutput(ladder, prepared, duty)
 * Example: averageOutput(ladder, prepare(ladder), 0.25)  // 0.825 for 3.3 V, no load, equal drivers
 */
export function averageOutput(ladder: Ladder, p: Prepared, duty: number): number {
  if (p.n === 1) return oneStageSteadyState(ladder, duty).average;
  const m = modalRoute(ladder);
  return m ? modalAverage(m, duty) : averageOutputByExpm(p, duty);
}
