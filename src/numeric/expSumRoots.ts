import { brentRoot } from './brentRoot.js';

/**
 * The roots of h(s) = sum_i coef[i] exp(rate[i] s) inside the open interval (0, length), ascending.
 * Sign convention: the rates are the exponents as written, so a decaying term has rate < 0 and a
 * constant term rate 0. Rates must be distinct; their order does not matter. A root where h
 * touches zero without changing sign may be missed; callers use the roots as candidate extrema,
 * band crossings or ends of monotone pieces, where such a touch is harmless.
 *
 * Method: divide by the term with the largest rate (the sign pattern is unchanged), so that
 * g(s) = 1 + sum c_i exp(r_i s) with every r_i < 0 (nothing can overflow). By Rolle's theorem the
 * roots of g are separated by those of g', itself an exponential sum with one term fewer, found
 * recursively; on each piece between them g is monotone, so it has a root only if it changes sign,
 * and Brent's method (brentRoot.ts) finds it. Two terms have the closed form s = ln(-1/c) / r. An
 * exponential sum of m terms has at most m - 1 real roots (Polya & Szego, "Problems and Theorems
 * in Analysis II", 1976, Part V, problem 75: the generalized Descartes rule of signs), which this
 * recursion meets exactly.
 *
 * Syntax: expSumRoots(coef, rate, length[, xtol])
 * Example: expSumRoots([1, -2], [-1, -2], 5)    // [ln 2] since e^-s = 2 e^-2s at s = ln 2
 *          expSumRoots([-0.5, 1], [0, -1], 10)  // [ln 2] since e^-s = 1/2 at s = ln 2
 */
export function expSumRoots(
  coef: ArrayLike<number>,
  rate: ArrayLike<number>,
  length: number,
  xtol = 1e-13 * length,
): number[] {
  if (coef.length < 2 || !(length > 0)) return [];
  if (coef.length === 2) return twoTermRoot(coef[0], rate[0], coef[1], rate[1], length);
  // Terms below 1e-200 of the largest are dropped: dividing by them would overflow, and where they
  // could matter the whole sum is below 1e-200 of its scale, far under what callers can resolve.
  let largest = 0;
  for (let i = 0; i < coef.length; i++) largest = Math.max(largest, Math.abs(coef[i]));
  let top = -1;
  let kept = 0;
  for (let i = 0; i < coef.length; i++) {
    if (!keep(coef[i], largest)) continue;
    kept++;
    if (top < 0 || rate[i] > rate[top]) top = i;
  }
  if (kept < 2) return [];
  // g(s) = 1 + sum_{i != top} cs[i] exp(rs[i] s), rs < 0.
  const cs: number[] = [];
  const rs: number[] = [];
  for (let i = 0; i < coef.length; i++) {
    if (i === top || !keep(coef[i], largest)) continue;
    cs.push(coef[i] / coef[top]);
    rs.push(rate[i] - rate[top]);
  }
  return normalizedRoots(cs, rs, length, xtol);
}

/**
 * The closed form for two terms, without the general path's arrays (the design search calls this
 * millions of times): c0 e^(r0 s) + c1 e^(r1 s) = 0 at s = ln(-c0/c1) / (r1 - r0).
 */
function twoTermRoot(c0: number, r0: number, c1: number, r1: number, length: number): number[] {
  const largest = Math.max(Math.abs(c0), Math.abs(c1));
  if (!keep(c0, largest) || !keep(c1, largest) || !(r0 !== r1)) return [];
  const ratio = -c0 / c1;
  if (!(ratio > 0)) return [];
  const s = Math.log(ratio) / (r1 - r0);
  return s > 0 && s < length ? [s] : [];
}

function keep(c: number, largest: number): boolean {
  return Math.abs(c) > 1e-200 * largest && Number.isFinite(c);
}

/** Roots in (0, length) of 1 + sum cs[i] exp(rs[i] s), every rs[i] < 0. */
function normalizedRoots(cs: number[], rs: number[], length: number, xtol: number): number[] {
  if (cs.length === 1) {
    if (!(cs[0] < 0)) return [];
    const s = Math.log(-1 / cs[0]) / rs[0];
    return s > 0 && s < length ? [s] : [];
  }
  const slopes: number[] = [];
  for (let i = 0; i < cs.length; i++) slopes.push(cs[i] * rs[i]);
  const turns = expSumRoots(slopes, rs, length, xtol);
  const roots: number[] = [];
  let a = 0;
  let ga = sumAt(cs, rs, 0);
  for (let k = 0; k <= turns.length; k++) {
    const b = k < turns.length ? turns[k] : length;
    const gb = sumAt(cs, rs, b);
    if (ga === 0 && k > 0) roots.push(a);
    else if ((ga < 0 && gb > 0) || (ga > 0 && gb < 0)) {
      BRENT_CS = cs;
      BRENT_RS = rs;
      roots.push(brentRoot(brentTarget, a, b, xtol, ga, gb));
    }
    a = b;
    ga = gb;
  }
  const inside: number[] = [];
  for (const s of roots) if (s > 0 && s < length) inside.push(s);
  return inside;
}

/** 1 + sum cs[i] exp(rs[i] s). */
function sumAt(cs: number[], rs: number[], s: number): number {
  let v = 1;
  for (let i = 0; i < cs.length; i++) v += cs[i] * Math.exp(rs[i] * s);
  return v;
}

// The sum brentRoot is refining, set just before each call: one module-level function instead of a
// closure per call, which the design search's millions of calls would pay for in allocation.
// brentRoot never re-enters expSumRoots, so one slot is enough.
let BRENT_CS: number[] = [];
let BRENT_RS: number[] = [];
function brentTarget(s: number): number {
  return sumAt(BRENT_CS, BRENT_RS, s);
}
