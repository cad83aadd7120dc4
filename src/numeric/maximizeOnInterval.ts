/**
 * The one bounded one-dimensional maximiser: Brent's local search (brentMaximize) and the global
 * search over an interval built on it (maximizeOnInterval). Every other search for a largest value
 * over a duty or a tolerance coordinate calls these.
 */

/**
 * The largest value of f on [a, b], found by search: a uniform grid, then Brent refinement around
 * the best grid maxima (the end points count as candidates too).
 *
 * Method: grid scan followed by Brent's golden-section/parabolic search (brentMaximize, below) on the
 * two grid cells either side of each of the `refine` best interior local maxima of the grid.
 *
 * Syntax: maximizeOnInterval(f, a, b[, intervals, refine, xtol])
 * Example: maximizeOnInterval((d) => d * (1 - d), 0, 1).x  // 0.5
 */
export function maximizeOnInterval(
  f: (x: number) => number,
  a: number,
  b: number,
  intervals = 16,
  refine = 2,
  xtol = 1e-9,
): Maximum {
  if (!(b > a)) return { x: a, value: f(a) };
  const xs: number[] = [];
  const fs: number[] = [];
  for (let i = 0; i <= intervals; i++) {
    const x = i === intervals ? b : a + ((b - a) * i) / intervals;
    xs.push(x);
    fs.push(f(x));
  }
  let best: Maximum = { x: xs[0], value: fs[0] };
  for (let i = 1; i <= intervals; i++) if (fs[i] > best.value) best = { x: xs[i], value: fs[i] };
  const peaks: number[] = [];
  for (let i = 0; i <= intervals; i++) {
    const left = i === 0 ? -Infinity : fs[i - 1];
    const right = i === intervals ? -Infinity : fs[i + 1];
    if (fs[i] >= left && fs[i] >= right) peaks.push(i);
  }
  peaks.sort((i, j) => fs[j] - fs[i]);
  for (const i of peaks.slice(0, refine)) {
    const lo = xs[Math.max(i - 1, 0)];
    const hi = xs[Math.min(i + 1, intervals)];
    const m = brentMaximize(f, lo, hi, xtol);
    if (m.value > best.value) best = m;
  }
  return best;
}

/** A located maximum. */
export interface Maximum {
  x: number;
  value: number;
}

/**
 * A local maximum of f inside [a, b] (the end points themselves are not evaluated; callers
 * compare with them).
 *
 * Method: Brent's minimizer on -f, golden-section search with parabolic interpolation
 * (R. P. Brent, "Algorithms for Minimization without Derivatives", Prentice-Hall 1973, ch. 5,
 * procedure localmin). Stops when the bracket is within 2 (sqrt(eps) |x| + xtol/3).
 *
 * Syntax: brentMaximize(f, a, b[, xtol])
 * Example: brentMaximize((x) => -(x - 1) ** 2, 0, 3).x  // 1
 */
export function brentMaximize(f: (x: number) => number, a: number, b: number, xtol = 1e-10): Maximum {
  const golden = 0.5 * (3 - Math.sqrt(5));
  // Brent's minimizer on g = -f, the negation written at each call (no wrapper: a call boundary
  // boxes its double argument and result, thousands of times per tolerance study)
  let x = a + golden * (b - a);
  let w = x;
  let v = x;
  let fx = -f(x);
  let fw = fx;
  let fv = fx;
  let d = 0;
  let e = 0;
  for (let iter = 0; iter < 200; iter++) {
    const xm = 0.5 * (a + b);
    const tol1 = Math.sqrt(Number.EPSILON) * Math.abs(x) + xtol / 3;
    const tol2 = 2 * tol1;
    if (Math.abs(x - xm) <= tol2 - 0.5 * (b - a)) break;
    let useGolden = true;
    if (Math.abs(e) > tol1) {
      let r = (x - w) * (fx - fv);
      let q = (x - v) * (fx - fw);
      let p = (x - v) * q - (x - w) * r;
      q = 2 * (q - r);
      if (q > 0) p = -p;
      q = Math.abs(q);
      r = e;
      e = d;
      if (Math.abs(p) < Math.abs(0.5 * q * r) && p > q * (a - x) && p < q * (b - x)) {
        d = p / q;
        const u = x + d;
        if (u - a < tol2 || b - u < tol2) d = xm >= x ? tol1 : -tol1;
        useGolden = false;
      }
    }
    if (useGolden) {
      e = x >= xm ? a - x : b - x;
      d = golden * e;
    }
    const u = x + (Math.abs(d) >= tol1 ? d : d >= 0 ? tol1 : -tol1);
    const fu = -f(u);
    if (fu <= fx) {
      if (u >= x) a = x;
      else b = x;
      v = w;
      fv = fw;
      w = x;
      fw = fx;
      x = u;
      fx = fu;
    } else {
      if (u < x) a = u;
      else b = u;
      if (fu <= fw || w === x) {
        v = w;
        fv = fw;
        w = u;
        fw = fu;
      } else if (fu <= fv || v === x || v === w) {
        v = u;
        fv = fu;
      }
    }
  }
  return { x, value: -fx };
}
