import type { DesignProblem } from './designProblem.js';
import { ladderDeterminant } from './ladderDeterminant.js';
import { largestPinDriveStep } from './pinDriveStep.js';
import { rippleFloorPlan, type RippleFloorPlan } from './rippleFloor.js';

/**
 * The resistor-only part of the ripple ceiling of one resistor choice (rippleCeilingPlan): the
 * ripple floor's (the fast ladder, the mismatch) and the largest drive step.
 */
export interface RippleCeilingPlan extends RippleFloorPlan {
  /** Largest size of the pin's drive step over node-1 averages in the nodes' range, A (largestPinDriveStep). */
  readonly driveMax: number;
}

/** Harmonics summed one by one; the rest are bounded through det(C) (see rippleCeiling). */
const HARMONICS = 6;

/**
 * The resistor-only part of an upper bound on the ripple of every ladder of two or more stages
 * with series resistors `r` (pin side first) in the problem's circuit, equal or unequal drivers;
 * rippleCeiling finishes it for given capacitors and a duty. Null for one stage (the bound's tail
 * needs two poles).
 *
 * Syntax: rippleCeilingPlan(problem, r)
 * Example: rippleCeiling(rippleCeilingPlan(problem, [470, 3300, 12e3])!, [390e-9, 39e-9, 10e-9], 0.5)   // V, at least the ripple at 50 %
 */
export function rippleCeilingPlan(problem: DesignProblem, r: ArrayLike<number>): RippleCeilingPlan | null {
  const n = r.length;
  if (n < 2) return null;
  return { ...rippleFloorPlan(problem, r), driveMax: largestPinDriveStep(problem.circuit, r[0]) };
}

/**
 * An upper bound on the ripple (V, peak-to-peak output in periodic steady state) at duty `duty` of
 * the ladder of `plan` (rippleCeilingPlan) with capacitors `c`: a ripple check it passes is one the
 * exact check passes too, so a search may skip the model there. Close to the ripple where the
 * ladder passes little but the fundamental (a few per cent above it for three stages).
 *
 * Method (derived here, the companion of rippleFloor.ts). With c_k the output's complex Fourier
 * coefficients, |x(t) - mean| <= sum_(k != 0) |c_k|, so peak-to-peak <= 4 sum_(k >= 1) |c_k|
 * (equality for a sine). As in rippleFloor.ts, c_k = (g2 ... gn / det(G + j k w C)) (c_k[g (u -
 * m)] - c_k[(g - g0)(v1 - m)]) with the fast ladder's G: the first term is a two-level pulse train,
 * |c_k| = |g_H (high - m) - g_L (low - m)| |sin(pi k D)| / (pi k) <= driveMax |sin(pi k D)| /
 * (pi k); the second is at most |g_H - g_L| D' (hi - lo) ((1/T) int |.|, v1 and m in [lo, hi]),
 * D' the duty of the phase whose conductance is not g0. The first HARMONICS terms are summed with
 * |det(G + j k w C)| (ladderDeterminant.ts); beyond them |det(G + j s C)| = det(C) prod |j s +
 * 1 / tau_i| >= det(C) s^n (real poles), so the rest is at most couplings / (det(C) w^n) times
 * driveMax / pi sum k^-(n+1) + mismatch D' sum k^-n over k > HARMONICS, each sum at most its
 * integral from HARMONICS (n >= 2).
 *
 * Syntax: rippleCeiling(plan, c, duty)
 * Example: rippleCeiling(rippleCeilingPlan(problem, [470, 3300, 12e3])!, [390e-9, 39e-9, 10e-9], 0.5)   // V
 */
export function rippleCeiling(plan: RippleCeilingPlan, c: ArrayLike<number>, duty: number): number {
  const { g, omega } = plan;
  const n = g.length - 1;
  const lost = plan.mismatch * (plan.highDiffers ? duty : 1 - duty);
  let sum = 0;
  for (let k = 1; k <= HARMONICS; k++) {
    sum += ((plan.driveMax * Math.abs(Math.sin(Math.PI * k * duty))) / (Math.PI * k) + lost) / ladderDeterminant(g, c, plan.loadC, k * omega);
  }
  let detC = 1;
  for (let i = 0; i < n; i++) detC *= i === n - 1 ? c[i] + plan.loadC : c[i];
  // sum over k > K of k^-p <= K^(1 - p) / (p - 1)
  const tail = (p: number) => HARMONICS ** (1 - p) / (p - 1);
  sum += ((plan.driveMax / Math.PI) * tail(n + 1) + lost * tail(n)) / (detC * omega ** n);
  return 4 * plan.couplings * sum;
}
