import { brentRoot } from '../brentRoot.js';

/**
 * The roots of h(s) = sum_i coef[i] exp(rate[i] s) inside the open interval (0, length), sorted.
 * Rates must be distinct. A root where h touches zero without changing sign may be missed; callers
 * use the roots as candidate extrema or as ends of monotone pieces, where such a touch is harmless.
 *
 * Method: divide by the term with the largest rate (the sign pattern is unchanged), so that
 * g(s) = 1 + sum c_i exp(r_i s) with every r_i < 0 (nothing can overflow). By Rolle's theorem the
 * roots of g are separated by those of g', itself an exponential sum with one term fewer, found
 * recursively; on each piece between them g is monotone, so it has a root only if it changes sign,
 * and Brent's method (brentRoot) finds it. Two terms have the closed form s = ln(-1/c) / r. An
 * exponential sum of m terms has at most m - 1 real roots (Polya & Szego, "Problems and Theorems
 * in Analysis II", 1976, Part V, problem 75: the generalized Descartes rule of signs), which this
 * recursion meets exactly.
 *
 * Syntax: expSumRoots(coef, rate, length[, xtol])
 * Example: expSumRoots([1, -2], [-1, -2], 5)  // [ln 2] since e^-s = 2 e^-2s at s = ln 2
 */
export function expSumRoots(
  coef: ArrayLike<number>,
  rate: ArrayLike<number>,
  length: number,
  xtol = 1e-13 * length,
): number[] {
  const c: number[] = [];
  const r: number[] = [];
  let top = -1;
  // Terms below 1e-200 of the largest are dropped: dividing by them would overflow, and where they
  // could matter the whole sum is below 1e-200 of its scale, far under what callers can resolve.
  let largest = 0;
  for (let i = 0; i < coef.length; i++) largest = Math.max(largest, Math.abs(coef[i]));
  for (let i = 0; i < coef.length; i++) {
    if (!(Math.abs(coef[i]) > 1e-200 * largest) || !Number.isFinite(coef[i])) continue;
    c.push(coef[i]);
    r.push(rate[i]);
    if (top < 0 || rate[i] > r[top]) top = c.length - 1;
  }
  if (c.length < 2 || !(length > 0)) return [];
  // g(s) = 1 + sum_{i != top} cs[i] exp(rs[i] s), rs < 0.
  const cs: number[] = [];
  const rs: number[] = [];
  for (let i = 0; i < c.length; i++) {
    if (i === top) continue;
    cs.push(c[i] / c[top]);
    rs.push(r[i] - r[top]);
  }
  const g = (s: number) => {
    let v = 1;
    for (let i = 0; i < cs.length; i++) v += cs[i] * Math.exp(rs[i] * s);
    return v;
  };
  if (cs.length === 1) {
    if (!(cs[0] < 0)) return [];
    const s = Math.log(-1 / cs[0]) / rs[0];
    return s > 0 && s < length ? [s] : [];
  }
  const slopes = cs.map((ci, i) => ci * rs[i]);
  const ends = [0, ...expSumRoots(slopes, rs, length, xtol), length];
  const roots: number[] = [];
  let ga = g(ends[0]);
  for (let k = 1; k < ends.length; k++) {
    const b = ends[k];
    const gb = g(b);
    if (ga === 0 && k > 1) roots.push(ends[k - 1]);
    else if ((ga < 0 && gb > 0) || (ga > 0 && gb < 0)) {
      roots.push(brentRoot(g, ends[k - 1], b, xtol, ga, gb));
    }
    ga = gb;
  }
  return roots.filter((s) => s > 0 && s < length);
}
