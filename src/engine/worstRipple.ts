import type { Ladder } from '../circuit/ladder.js';
import type { WorstRipple } from './types.js';
import { checkRange } from './checkArguments.js';
import { maximizeOnInterval } from '../numeric/maximizeOnInterval.js';
import { steadyState, type SteadyMethod } from './steadyState.js';
import { steadyStateByExpm } from './steadyStateByExpm.js';

/**
 * The largest steady-state ripple (peak-to-peak, V) over the duty range [dutyMin, dutyMax], and
 * the duty where it occurs.
 *
 * Method: exact ripple at each duty (steadyState.ts; with method 'expm' always by matrix
 * exponentials, steadyStateByExpm.ts) on a 16-cell grid, then Brent's golden-section/parabolic
 * refinement around the two best grid maxima (maximizeOnInterval.ts), so a maximum between grid
 * points is found to about 1e-9 in duty.
 *
 * Syntax: worstRipple(ladder, dutyMin, dutyMax[, method])
 * Example: worstRipple(ladder, 0.05, 0.95)  // { duty: 0.5, ripple: 0.0123 } for one stage
 */
export function worstRipple(ladder: Ladder, dutyMin: number, dutyMax: number, method: SteadyMethod = 'auto'): WorstRipple {
  checkRange(dutyMin, dutyMax);
  const steady = method === 'expm' ? steadyStateByExpm : steadyState;
  const best = maximizeOnInterval((d) => steady(ladder, d).ripple, dutyMin, dutyMax);
  return { duty: best.x, ripple: best.value };
}
