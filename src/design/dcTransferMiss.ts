import type { DesignProblem } from './designProblem.js';

/** Relative allowance between the search's averages and the engine's DC transfer (both exact; rounding differs). */
const REL = 1e-6;
/** Interior duties of the INL lower bound (the endpoints define the fit). */
const GRID = 8;
/** The interior grid points, middle first: a bent transfer deviates most near the middle (same set, found sooner). */
const MIDDLE_FIRST = [4, 2, 6, 1, 3, 5, 7];

/**
 * Which endpoint-fit limit of the DC transfer a candidate certainly misses, from exact averages of
 * the engine's modal form (`average(d)`, V; steadySwing or modalAverageOutput of engine/index.ts):
 * 'inl', 'gain', or null when neither is proven missed.
 *
 * Method: the engine's figures (engine/dcTransfer.ts) are fit = the line through average(dutyMin)
 * and average(dutyMax); gain error = slope - (high - low), as a fraction of full scale for the
 * gain limit; INL = the largest |average - fit| over the range. Both limits are the search's
 * (problem.searchLimits: the file's less search.margin). The gain error needs only the two
 * endpoints, so the value here is the engine's (to rounding). The INL here is the largest deviation
 * on GRID + 1 evenly spaced duties: the maximum over the range is at least the value at any duty
 * in it, so this is a true lower bound. With equal driver resistances the ladder is linear and
 * time-invariant, the average is affine in the duty and INL is zero: not evaluated. A value is a
 * miss only beyond the limit by the rounding allowance REL. Bound logic only: the physics is the engine's.
 *
 * Syntax: dcTransferMiss(problem, average)
 * Example: dcTransferMiss(problem, (d) => steadySwing(modalLadderOf(problem.circuit, r, c), d).average)   // 'inl'
 */
export function dcTransferMiss(problem: DesignProblem, average: (duty: number) => number): 'inl' | 'gain' | null {
  const { pwm } = problem.project;
  // The limits less search.margin, as every other check of the search: a design that meets the
  // file's limit but not the margin is not recommended, so it must not lower the walk's threshold.
  const inlLimit = problem.searchLimits.inl;
  const gainLimit = problem.searchLimits.gain;
  const checkInl = inlLimit !== undefined && pwm.driver.high !== pwm.driver.low;
  if (!checkInl && gainLimit === undefined) return null;
  const { dutyMin: a, dutyMax: b } = problem;
  const yA = average(a);
  const yB = average(b);
  const span = pwm.high - pwm.low;
  const slope = b > a ? (yB - yA) / (b - a) : span;
  if (gainLimit !== undefined && Math.abs(slope - span) / Math.abs(span) > gainLimit * (1 + REL) + 1e-12) return 'gain';
  if (checkInl && b > a) {
    for (const i of MIDDLE_FIRST) {
      const d = a + ((b - a) * i) / GRID;
      if (Math.abs(average(d) - (yA + slope * (d - a))) > inlLimit * (1 + REL) + 1e-15) return 'inl';
    }
  }
  return null;
}
