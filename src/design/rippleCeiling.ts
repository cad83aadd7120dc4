import type { DesignProblem } from './designProblem.js';
import { ladderDeterminant } from './ladderDeterminant.js';
import { largestPinDriveStep } from './pinDriveStep.js';
import { mismatchShare, rippleFloor, rippleFloorPlan, type RippleFloorPlan } from './rippleFloor.js';

/**
 * The resistor-only part of the ripple ceiling of one resistor choice (rippleCeilingPlan): the
 * ripple floor's (the fast ladder, the mismatch) and the largest drive step.
 */
export interface RippleCeilingPlan {
  /** The ripple floor's plan of the same resistors (the fast ladder, the mismatch). */
  readonly floor: RippleFloorPlan;
  /** Largest size of the pin's drive step over node-1 averages in the nodes' range, A (largestPinDriveStep). */
  readonly driveMax: number;
  /** The harmonics beyond HARMONICS through det(C) (see rippleCeiling): driveMax / pi sum k^-(n+1) / w^n, and sum k^-n / w^n (the mismatch's factor). */
  readonly tailDrive: number;
  readonly tailLost: number;
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
  const floor = rippleFloorPlan(problem, r);
  const driveMax = largestPinDriveStep(problem.circuit, r[0]);
  // sum over k > K of k^-p <= K^(1 - p) / (p - 1)
  const tail = (p: number) => HARMONICS ** (1 - p) / (p - 1);
  const wn = floor.omega ** n;
  // (the floor's plan held, not spread into this one: a spread cost about 2 us a plan before V8
  // optimized the walk, measured, and the walk makes one plan per resistor tuple)
  return { floor, driveMax, tailDrive: ((driveMax / Math.PI) * tail(n + 1)) / wn, tailLost: tail(n) / wn };
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
  const lost = mismatchShare(plan.floor, duty);
  let sum = 0;
  // sin(k x) by the recurrence sin((k + 1) x) = 2 cos(x) sin(k x) - sin((k - 1) x): one sine and
  // one cosine per call, not one sine per harmonic
  const twoCos = 2 * Math.cos(Math.PI * duty);
  let before = 0;
  let sinK = Math.sin(Math.PI * duty);
  for (let k = 1; k <= HARMONICS; k++) {
    sum += harmonicCeiling(plan, c, k, sinK, lost);
    const next = twoCos * sinK - before;
    before = sinK;
    sinK = next;
  }
  return 4 * plan.floor.couplings * (sum + tailCeiling(plan, c, lost));
}

/**
 * A lower bound on the ripple (V) at duty `duty` of the ladder of `plan` (rippleCeilingPlan) with
 * capacitors `c`, at least the ripple floor (rippleFloor.ts) and close to the ripple where the
 * ladder passes little but the fundamental: there the floor's pi |c1| is pi/4 of a sine's
 * peak-to-peak (4 |c1|), and a search's ripple checks near a limit need a model (measured: 28 882
 * of the 30 841 models of the three-stage E12 bench search were for ripple checks).
 *
 * Method (derived here). With c_k the output's complex Fourier coefficients, let t1 be where the
 * fundamental's term 2 Re(c1 e^(j w t)) peaks (2 |c1|) and t2 = t1 + T/2 (-2 |c1|). Each even
 * harmonic's term is the same at t1 and t2, each odd one's changes sign, so peak-to-peak >= x(t1)
 * - x(t2) >= 4 (|c1| - sum over odd k >= 3 of |c_k|). |c1| is at least the ripple floor / pi
 * (rippleFloor.ts); each |c_k| is at most its term of rippleCeiling, k = 3 and 5 with their
 * determinants and k >= 7 through the ceiling's det(C) tail (over every k > 6, odd or not:
 * larger). The better of this and the floor is returned; with `enough`, the floor alone as soon as
 * it passes `enough` (a lower bound either way, and over `enough` whenever the sharper one is: the
 * harmonics are then not needed).
 *
 * Syntax: rippleFloorSharp(plan, c, duty[, enough])
 * Example: rippleFloorSharp(rippleCeilingPlan(problem, [470, 3300, 12e3])!, [390e-9, 39e-9, 10e-9], 0.5)   // V, at most the ripple
 *
 * See also: rippleFloor, rippleCeiling
 */
export function rippleFloorSharp(plan: RippleCeilingPlan, c: ArrayLike<number>, duty: number, enough = Infinity): number {
  const floor = rippleFloor(plan.floor, c, duty);
  if (!(floor > 0) || floor > enough) return floor;
  const lost = mismatchShare(plan.floor, duty);
  // |sin(3x)| and |sin(5x)| from s = sin(x) (multiple-angle formulas)
  const s = Math.sin(Math.PI * duty);
  const s2 = s * s;
  const odd =
    harmonicCeiling(plan, c, 3, s * (3 - 4 * s2), lost) + harmonicCeiling(plan, c, 5, s * (5 - 20 * s2 + 16 * s2 * s2), lost) + tailCeiling(plan, c, lost);
  const { couplings } = plan.floor;
  return Math.max(floor, 4 * couplings * (floor / (Math.PI * couplings) - odd));
}

/** Upper bound on |c_k| of the output over couplings (rippleCeiling's Method), sinK = sin(pi k D), lost = mismatchShare. */
function harmonicCeiling(plan: RippleCeilingPlan, c: ArrayLike<number>, k: number, sinK: number, lost: number): number {
  const { g, loadC, omega } = plan.floor;
  return ((plan.driveMax * Math.abs(sinK)) / (Math.PI * k) + lost) / ladderDeterminant(g, c, loadC, k * omega);
}

/** Upper bound on the sum of |c_k| over k > HARMONICS over couplings, through det(C) (rippleCeiling's Method). */
function tailCeiling(plan: RippleCeilingPlan, c: ArrayLike<number>, lost: number): number {
  const { g, loadC } = plan.floor;
  const n = g.length - 1;
  let detC = 1;
  for (let i = 0; i < n; i++) detC *= i === n - 1 ? c[i] + loadC : c[i];
  return (plan.tailDrive + lost * plan.tailLost) / detC;
}
