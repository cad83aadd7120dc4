import { zeros } from '../../engine/dense.js';

/**
 * All zeros in [0, length] of an exponential sum f(t) = sum_i a_i exp(-r_i t), rates r_i >= 0
 * distinct and ascending (a rate of 0 is a constant term), in ascending order.
 *
 * Method: multiplying by exp(r_0 t) keeps the zeros and turns f into h(t) = a_0 +
 * sum_{i>0} a_i exp(-(r_i - r_0) t), whose derivative is again an exponential sum with one term
 * fewer; its zeros (recursively) cut [0, length] into pieces on which h is monotone, so each
 * piece holds at most one zero (the generalised rule of signs: a sum of m exponentials has at most
 * m - 1 real zeros, Polya & Szego, Problems and Theorems in Analysis II, part V, problem 75).
 * Two terms: closed form. Zeros inside a piece: Illinois regula falsi (Dowell & Jarratt, BIT 11,
 * 1971) to about 1e-14 of the interval.
 *
 * Syntax: expSumRoots(a, r, length)
 * Example: expSumRoots([-0.5, 1], [0, 1], 10)   // [ln 2] = [0.6931...]
 */
export function expSumRoots(a: ArrayLike<number>, r: ArrayLike<number>, length: number): number[] {
  const m = a.length;
  if (m < 2 || !(length > 0)) return [];
  const r0 = r[0];
  if (m === 2) {
    // a0 + a1 exp(-d t) = 0  =>  t = ln(-a1 / a0) / d
    const ratio = -a[1] / a[0];
    const d = r[1] - r0;
    if (!(ratio > 0) || !(d > 0)) return [];
    const t = Math.log(ratio) / d;
    return t >= 0 && t <= length ? [t] : [];
  }
  const da = zeros(m - 1);
  const dr = zeros(m - 1);
  for (let i = 1; i < m; i++) {
    dr[i - 1] = r[i] - r0;
    da[i - 1] = -a[i] * dr[i - 1];
  }
  const turns = expSumRoots(da, dr, length);
  const roots: number[] = [];
  let ta = 0;
  let fa = shifted(a, r, m, ta);
  if (fa === 0) roots.push(ta);
  for (let k = 0; k <= turns.length; k++) {
    const tb = k < turns.length ? turns[k] : length;
    const fb = shifted(a, r, m, tb);
    if (fb === 0) {
      if (roots[roots.length - 1] !== tb) roots.push(tb);
    } else if (fa !== 0 && (fa < 0) !== (fb < 0)) {
      roots.push(illinoisShifted(a, r, m, ta, tb, fa, fb));
    }
    ta = tb;
    fa = fb;
  }
  return roots;
}

/** exp(r_0 t) f(t): the sum with rates shifted so that the first term is constant. */
function shifted(a: ArrayLike<number>, r: ArrayLike<number>, m: number, t: number): number {
  let s = a[0];
  for (let i = 1; i < m; i++) s += a[i] * Math.exp(-(r[i] - r[0]) * t);
  return s;
}

/** Illinois regula falsi on `shifted` (no closure in the hot path). */
function illinoisShifted(
  a: ArrayLike<number>,
  r: ArrayLike<number>,
  m: number,
  lo: number,
  hi: number,
  flo: number,
  fhi: number,
): number {
  const tol = 1e-14 * Math.abs(hi - lo) + 1e-300;
  let side = 0;
  let c = lo;
  for (let i = 0; i < 200; i++) {
    const next = (lo * fhi - hi * flo) / (fhi - flo);
    if (next === c && i > 0) return c;
    c = next;
    const fc = shifted(a, r, m, c);
    if (fc === 0 || Math.abs(hi - lo) <= tol) return c;
    if ((fc < 0) === (fhi < 0)) {
      hi = c;
      fhi = fc;
      if (side === -1) flo /= 2;
      side = -1;
    } else {
      lo = c;
      flo = fc;
      if (side === 1) fhi /= 2;
      side = 1;
    }
  }
  return c;
}
