import type { DesignProblem } from './designProblem.js';
import { ladderDeterminant } from './ladderDeterminant.js';
import { pinDriveStep } from './pinDriveStep.js';

/** The resistor-only part of the ripple floor of one resistor choice (rippleFloorPlan). */
export interface RippleFloorPlan {
  /**
   * Conductances of the fast ladder, S: [pin side (the larger of the two phases'), 1 / r2, ...,
   * 1 / rn, load (0 without one)].
   */
  readonly g: readonly number[];
  /** Load capacitance at the last node, F. */
  readonly loadC: number;
  /** PWM angular frequency, rad/s. */
  readonly omega: number;
  /** Product of the couplings 1 / r2 ... 1 / rn (1 for one stage). */
  readonly couplings: number;
  /** Least size of the pin's drive step over node-1 averages in the nodes' range, A (pinDriveStep.ts). */
  readonly drive: number;
  /** |g_H - g_L| (hi - lo), A: the most the driver mismatch adds to (or, times pi, takes off the drive of) any coefficient, per unit duty. */
  readonly mismatch: number;
  /** The high phase's conductance is the smaller one (the mismatch acts during the high phase). */
  readonly highDiffers: boolean;
}

/**
 * The resistor-only part of a lower bound on the ripple (peak-to-peak output in periodic steady
 * state, model.md) of every ladder with series resistors `r` (pin side first) in the problem's
 * circuit, for equal or unequal driver resistances; rippleFloor finishes it for given capacitors
 * and a duty.
 *
 * Method (derived here). Peak-to-peak >= pi |c1| for any periodic signal, c1 its first complex
 * Fourier coefficient: with w the signal less its mid-range, |c1| <= (1/T) int |w| |cos(wt - a)|
 * <= (ptp / 2)(2 / pi). Node 1 obeys C_1 v1' = g(t)(u(t) - v1) - i_rest, where the pin conductance
 * g(t) and level u(t) switch with the phase and i_rest, the current into the rest of the ladder,
 * is a linear time-invariant function of v1. With g0 = g_F the larger pin conductance, taking
 * first coefficients (c1[.], V1 that of v1, Y the rest's admittance at w): (j w C_1 + Y + g0) V1 =
 * c1[g (u - mean v1)] - c1[(g - g0)(v1 - mean v1)].
 * The first term is a two-level pulse train, |c1| = |g_H (high - m) - g_L (low - m)| sin(pi D) / pi
 * >= f sin(pi D) / pi, m = mean v1 in the node range [lo, hi] and f its least drive step
 * (pinDriveStep.ts); the second is at most |g_H - g_L| D' (hi - lo), D' the duty of the
 * phase whose conductance is not g0. The output is V1 through the rest of the ladder, so
 * |c1(out)| = |H_F(j w)| / g0 |(j w C_1 + Y + g0) V1|, H_F the transfer of the fast ladder (pin
 * conductance g0), g0 g2 ... gn / det(G + j w C) for a ladder (tridiagonal: continuant). Hence
 * ripple(D) >= (g2 ... gn / |det(G + j w C)|) (f sin(pi D) - pi |g_H - g_L| D' (hi - lo)). For equal
 * drivers this is (high - low) sin(pi D) |H(j w)|, the fundamental bound the tuple bounds use
 * (settlingBounds.ts). test/design/rippleFloor.test.ts holds it to the engine's ripple.
 *
 * Syntax: rippleFloorPlan(problem, r)
 * Example: rippleFloor(rippleFloorPlan(problem, [470, 16e3]), [1e-6, 33e-9], 0.5)   // V, at most the ripple at 50 %
 */
export function rippleFloorPlan(problem: DesignProblem, r: ArrayLike<number>): RippleFloorPlan {
  const k = problem.circuit;
  const n = r.length;
  const gH = 1 / (k.driverHigh + r[0]);
  const gL = 1 / (k.driverLow + r[0]);
  const gF = Math.max(gH, gL);
  // Node voltages stay between the levels and ground (pinDriveStep.ts).
  const nodeSpan = Math.max(k.low, k.high, 0) - Math.min(k.low, k.high, 0);
  const g = [gF];
  let couplings = 1;
  for (let i = 1; i < n; i++) {
    g.push(1 / r[i]);
    couplings /= r[i];
  }
  g.push(k.loadResistance === null ? 0 : 1 / k.loadResistance);
  return {
    g,
    loadC: k.loadCapacitance,
    omega: (2 * Math.PI) / problem.period,
    couplings,
    drive: pinDriveStep(k, r[0]),
    mismatch: Math.abs(gH - gL) * nodeSpan,
    highDiffers: gH < gF,
  };
}

/**
 * A lower bound on the ripple (V) at duty `duty` of the ladder of `plan` (rippleFloorPlan) with
 * capacitors `c`: it never exceeds the engine's ripple there, so a ripple check it fails is one
 * the exact check fails too. Not monotone in the capacitors as a search walks them (it falls as
 * they grow, like the ripple).
 *
 * Method: rippleFloorPlan; |det(G + j w C)| by ladderDeterminant.ts.
 *
 * Syntax: rippleFloor(plan, c, duty)
 * Example: rippleFloor(rippleFloorPlan(problem, [1e3]), [1e-6], 0.5)   // V
 */
export function rippleFloor(plan: RippleFloorPlan, c: ArrayLike<number>, duty: number): number {
  const drive = floorDrive(plan, duty);
  if (!(drive > 0)) return 0;
  return (plan.couplings * drive) / ladderDeterminant(plan.g, c, plan.loadC, plan.omega);
}

/**
 * The drive the ripple floor starts from at duty `duty`, A: pi times the least first Fourier
 * coefficient of the pin's current into node 1, f sin(pi D) - pi mismatch D' (rippleFloorPlan's
 * Method); at most 0 where the mismatch may cancel it. Shared by rippleFloor (and through it
 * rippleFloorSharp) and requiredAttenuation.
 *
 * Syntax: floorDrive(plan, duty)
 * Example: floorDrive(rippleFloorPlan(problem, [1e3]), 0.5)   // A
 */
export function floorDrive(plan: RippleFloorPlan, duty: number): number {
  return plan.drive * Math.sin(Math.PI * duty) - Math.PI * mismatchShare(plan, duty);
}

/**
 * The most the driver mismatch adds to any Fourier coefficient of the pin's current at duty
 * `duty`, A: |g_H - g_L| (hi - lo) D', D' the duty of the phase whose conductance is not the
 * larger (rippleFloorPlan's Method); 0 for equal drivers.
 *
 * Syntax: mismatchShare(plan, duty)
 * Example: mismatchShare(rippleFloorPlan(problem, [1e3]), 0.5)   // A
 */
export function mismatchShare(plan: RippleFloorPlan, duty: number): number {
  return plan.mismatch * (plan.highDiffers ? duty : 1 - duty);
}
