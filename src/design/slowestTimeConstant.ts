import { symmetricEigen } from '../numeric/symmetricEigen.js';

/**
 * Slowest time constant (s) of an unbuffered RC ladder driven through `driver` ohm, with an
 * optional load resistance and a load capacitance at the last node (averaged model, one driver).
 *
 * Method: tau_max = 1 / lambda_min of S = C^(-1/2) G C^(-1/2) (nodal conductance matrix G,
 * capacitances C), the first of twoSlowestTimeConstants below: closed form for one and two stages
 * (lambda_min = det / lambda_max, the determinant written without cancellation), the largest root
 * of the time constants' cubic for three (slowestOfThree), cyclic Jacobi beyond
 * (numeric/symmetricEigen.ts).
 * By the Rayleigh quotient tau_max = max_v (v^T C v) / (v^T G v), it never falls when any C or
 * any R grows (common practice; Courant-Fischer, Golub & Van Loan, Theorem 8.1.2), which the search
 * relies on for its windows.
 *
 * Syntax: slowestTimeConstant(r, c, driver, loadResistance, loadCapacitance)
 * Example: slowestTimeConstant([1e3], [1e-6], 0, null, 0)   // 1e-3
 */
export function slowestTimeConstant(
  r: ArrayLike<number>,
  c: ArrayLike<number>,
  driver: number,
  loadResistance: number | null,
  loadCapacitance: number,
): number {
  // the first of the two (the same expressions: one division or root more for the second)
  return twoSlowestTimeConstants(r, c, driver, loadResistance, loadCapacitance, SLOWEST)[0];
}

/** Scratch for slowestTimeConstant (read at once). */
const SLOWEST = [0, 0];

/** S = C^(-1/2) G C^(-1/2) of the ladder (row-major), whose eigenvalues are 1 / the time constants. */
function scaledConductance(r: ArrayLike<number>, c: ArrayLike<number>, g1: number, gL: number, loadCapacitance: number): Float64Array {
  const n = r.length;
  const g = new Float64Array(n);
  const cap = new Float64Array(n);
  for (let k = 0; k < n; k++) {
    g[k] = k === 0 ? g1 : 1 / r[k];
    cap[k] = c[k] + (k === n - 1 ? loadCapacitance : 0);
  }
  const s = new Float64Array(n * n);
  for (let k = 0; k < n; k++) {
    s[k * n + k] = (g[k] + (k < n - 1 ? g[k + 1] : gL)) / cap[k];
    if (k < n - 1) {
      const v = -g[k + 1] / Math.sqrt(cap[k] * cap[k + 1]);
      s[k * n + k + 1] = v;
      s[(k + 1) * n + k] = v;
    }
  }
  return s;
}

/**
 * The two slowest time constants (s) of the ladder of slowestTimeConstant, written into
 * `out` as [tau_a, tau_b] with tau_a >= tau_b (tau_b = 0 for one stage); returns `out`. Both never
 * fall when any C or any R grows (Courant-Fischer min-max for the pencil (G, C), Golub & Van Loan,
 * Theorem 8.1.2; common practice).
 *
 * Method: one stage tau = (C1 + C_load) / (g1 + g_load); two stages in closed form (tau_a = lambda_max
 * / det, tau_b = 1 / lambda_max: twoNode); three from the cubic (tau_a its largest root by
 * slowestOfThree, tau_b the larger root of the quadratic left after dividing out tau_a); Jacobi
 * beyond.
 *
 * Syntax: twoSlowestTimeConstants(r, c, driver, loadResistance, loadCapacitance, out)
 * Example: twoSlowestTimeConstants([1e3, 1e3], [1e-6, 1e-6], 0, null, 0, [0, 0])   // [2.618e-3, 3.82e-4]
 */
export function twoSlowestTimeConstants(
  r: ArrayLike<number>,
  c: ArrayLike<number>,
  driver: number,
  loadResistance: number | null,
  loadCapacitance: number,
  out: number[],
): number[] {
  const n = r.length;
  const gL = loadResistance === null ? 0 : 1 / loadResistance;
  const g1 = 1 / (r[0] + driver);
  if (n === 1) {
    out[0] = (c[0] + loadCapacitance) / (g1 + gL);
    out[1] = 0;
    return out;
  }
  if (n === 2) {
    const m = twoNode(g1, 1 / r[1], gL, c[0], c[1] + loadCapacitance);
    out[0] = m[0] / m[1];
    out[1] = 1 / m[0];
    return out;
  }
  if (n === 3) {
    const g2 = 1 / r[1];
    const g3 = 1 / r[2];
    const c1 = c[0];
    const c2 = c[1];
    const c3 = c[2] + loadCapacitance;
    const k = cubicOfThree(g1, g2, g3, gL, c1, c2, c3);
    const b1 = k[0];
    const b3 = k[2];
    const tauA = slowestOfThree(b1, k[1], b3);
    // The other two roots: tau^2 - (b1 - tau_a) tau + b3 / tau_a = 0 (sum and product of the roots).
    const sum = Math.max(0, b1 - tauA);
    const disc = Math.max(0, sum * sum - (4 * b3) / tauA);
    out[0] = tauA;
    out[1] = Math.min(tauA, 0.5 * (sum + Math.sqrt(disc)));
    return out;
  }
  const { values } = symmetricEigen(scaledConductance(r, c, g1, gL, loadCapacitance), n);
  out[0] = 1 / values[0];
  out[1] = 1 / values[1];
  return out;
}

/**
 * Slowest time constant of a three-node ladder from its cubic's coefficients (cubicOfThree: from
 * conductances g1 (pin to node 1, driver included), g2 (1-2), g3 (2-3), gL (node 3 to ground) and
 * node capacitances c1..c3).
 *
 * Method: the time constants are the roots of tau^3 - b1 tau^2 + b2 tau - b3 with b1 = E2 / E3,
 * b2 = E1 / E3, b3 = 1 / E3, where E1, E2, E3 are the sums of the 1x1, 2x2 and 3x3 principal
 * minors of C^-1 G, each written as a sum of positive terms (spanning forests of the ladder, so no
 * cancellation): E3 = (g1 g2 g3 + g1 g2 gL + g1 g3 gL + g2 g3 gL) / (c1 c2 c3). The roots are real
 * and positive, and the cubic is convex and rising to the right of its largest root, so Newton's
 * method from any point at or above that root falls to it monotonically (Acton, Numerical Methods
 * That Work, chapter 7, from memory; common practice). The start is the Laguerre-Samuelson bound
 * on the largest of real roots, mean + sqrt(n - 1) standard deviations: b1 / 3 + (2 / 3)
 * sqrt(b1^2 - 3 b2) (P. A. Samuelson, "How deviant can you be?", JASA 63, 1968; from memory),
 * raised by 1e-12 against rounding and at most b1 (their sum). It is the root itself when the
 * three are equal, where Newton's method from b1 converged only linearly: 5.6 steps on average
 * in a three-stage E12 search (1.6 million calls), measured.
 */
function slowestOfThree(b1: number, b2: number, b3: number): number {
  let t = Math.min(b1, (b1 / 3 + (2 / 3) * Math.sqrt(Math.max(0, b1 * b1 - 3 * b2))) * (1 + 1e-12));
  for (let i = 0; i < 200; i++) {
    const q = ((t - b1) * t + b2) * t - b3;
    const slope = (3 * t - 2 * b1) * t + b2;
    if (!(q > 0 && slope > 0)) break;
    const step = q / slope;
    t -= step;
    if (step <= 1e-15 * t) break;
  }
  return t;
}

/** Scratch for twoNode (read at once by its callers). */
const eigenPair = new Float64Array(2);

/**
 * [lambda_max, det] of C^-1 G of a two-node ladder (conductances g1 pin to node 1, g2 1-2, gL node
 * 2 to ground; node capacitances c1, c2): lambda_max in closed form, the determinant written
 * without cancellation, so lambda_min = det / lambda_max keeps its digits.
 */
function twoNode(g1: number, g2: number, gL: number, c1: number, c2: number): Float64Array {
  const a = (g1 + g2) / c1;
  const d = (g2 + gL) / c2;
  const b2 = (g2 * g2) / (c1 * c2);
  const half = 0.5 * (a - d);
  eigenPair[0] = 0.5 * (a + d) + Math.sqrt(half * half + b2);
  eigenPair[1] = (g1 * g2 + g1 * gL + g2 * gL) / (c1 * c2);
  return eigenPair;
}

/** Scratch for cubicOfThree (read at once by its callers). */
const cubic = new Float64Array(3);

/**
 * [b1, b2, b3] of the time constants' cubic tau^3 - b1 tau^2 + b2 tau - b3 (slowestOfThree): E2 / E3,
 * E1 / E3 and 1 / E3 with numerator and denominator multiplied by c1 c2 c3, so one division
 * (every term stays a sum of positive products: no cancellation).
 */
function cubicOfThree(g1: number, g2: number, g3: number, gL: number, c1: number, c2: number, c3: number): Float64Array {
  const pairs = g1 * g2 + g1 * g3 + g2 * g3;
  const q = 1 / (g1 * g2 * g3 + gL * pairs);
  cubic[0] = (pairs * c3 + (g1 + g2) * (g3 + gL) * c2 + (g2 * g3 + g2 * gL + g3 * gL) * c1) * q;
  cubic[1] = ((g1 + g2) * c2 * c3 + (g2 + g3) * c1 * c3 + (g3 + gL) * c1 * c2) * q;
  cubic[2] = c1 * c2 * c3 * q;
  return cubic;
}
