import { maximizeOnInterval } from '../numeric/maximizeOnInterval.js';

/** Grid cells and duty tolerance of the pruning search: coarse, since only a bound is needed. */
const GRID = 8;
const DUTY_TOL = 1e-7;

/**
 * The largest value of f(duty) found over [dutyMin, dutyMax], e.g. the ripple or the |DC error| of
 * a candidate's steady state: a lower bound on the maximum (every value returned is f at some duty
 * of the range), equal to it when the maximum lies in the bracket found on the grid.
 *
 * Method: the program's bounded maximiser (numeric/maximizeOnInterval.ts: a grid scan, then
 * Brent's golden-section/parabolic search) with a coarse grid of GRID cells, refining only the
 * best grid peak to DUTY_TOL in duty.
 *
 * Syntax: maximizeOverDuty(f, dutyMin, dutyMax)
 * Example: maximizeOverDuty((d) => rippleAt(model, d), 0.05, 0.95)   // worst ripple, V (a lower bound)
 */
export function maximizeOverDuty(f: (duty: number) => number, dutyMin: number, dutyMax: number): number {
  return maximizeOnInterval(f, dutyMin, dutyMax, GRID, 1, DUTY_TOL).value;
}
