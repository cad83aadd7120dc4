import type { DesignProblem } from './designProblem.js';
import { floorDrive, rippleFloorPlan, type RippleFloorPlan } from './rippleFloor.js';
import { REL } from './searchAllowance.js';
import { ladderDeterminant } from './ladderDeterminant.js';

/**
 * The least squared attenuation at the PWM frequency, prod(1 + w^2 tau_i^2) over the time
 * constants tau_i of the fast ladder (eigenvalues of G^-1 C, G with the larger pin conductance of
 * rippleFloorPlan, C with the load's), that any capacitor choice of resistors `r` needs to meet the
 * ripple limit at the duty nearest 50 % in range and to settle at all (ripple at most 2 band at
 * every step's target duty); 0 when nothing binds. Equal and unequal drivers alike.
 *
 * Method (derived here): G is symmetric positive definite, so G^-1 C has real positive eigenvalues
 * tau_i and det(G + j w C) = det(G) prod(1 + j w tau_i). The ripple floor (rippleFloor.ts) gives
 * ripple(D) >= couplings drive(D) / |det(G + j w C)|, drive(D) = f sin(pi D) - the mismatch's
 * share, so ripple(D) <= L needs prod(1 + w^2 tau_i^2) >= (couplings drive(D) / (det(G) L))^2.
 * det(G) by ladderDeterminant.ts (w = 0). For equal drivers
 * couplings f / det(G) is the ladder's DC gain times (high - low), and this is the fundamental
 * bound of settlingBounds.ts. Limits are taken with the search's allowance (searchAllowance.ts).
 *
 * Syntax: requiredAttenuation(problem, r[, limits[, plan]])
 * Example: requiredAttenuation(problem, [470, 16e3])   // prod(1 + w^2 tau_i^2) >= this
 *
 * See also: rippleFloor, tupleBounds
 */
export function requiredAttenuation(
  problem: DesignProblem,
  r: ArrayLike<number>,
  limits: DesignProblem['limits'] = problem.searchLimits,
  plan: RippleFloorPlan = rippleFloorPlan(problem, r),
): number {
  const perDrive = plan.couplings / ladderDeterminant(plan.g, [], 0, 0);
  // (plain loops, no closure or destructuring: this runs for every resistor tuple a search lists)
  let gamma = 0;
  const { steps } = problem;
  for (let j = -1; j < steps.length; j++) {
    let duty: number;
    let limit: number;
    if (j < 0) {
      if (limits.ripple === undefined) continue;
      duty = Math.min(problem.dutyMax, Math.max(problem.dutyMin, 0.5));
      limit = limits.ripple;
    } else {
      duty = steps[j][1];
      limit = 2 * problem.band;
    }
    const drive = floorDrive(plan, duty);
    if (drive > 0) gamma = Math.max(gamma, ((perDrive * drive) / (limit * (1 + REL))) ** 2);
  }
  return gamma;
}
