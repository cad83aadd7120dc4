/**
 * The one bounded one-dimensional maximiser: Brent's local search (brentMaximize) and the global
 * search over an interval built on it (maximizeOnInterval). Every other search for a largest value
 * over a duty or a tolerance coordinate calls these.
 */

/**
 * The largest value of f on [a, b], found by search: a uniform grid, then Brent refinement around
 * the best grid maxima (the end points count as candidates too).
 *
 * Method: grid scan followed by Brent's golden-section/parabolic search on the two grid cells
 * either side of each of the `refine` best local maxima of the grid (brentMaximizeBracketed from
 * the three grid values around an inner peak, brentMaximize in the cell beside an end).
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
    // an inner grid peak brackets a maximum with three known values; an end peak does not
    const m =
      i > 0 && i < intervals
        ? brentMaximizeBracketed(f, xs[i - 1], xs[i], xs[i + 1], fs[i - 1], fs[i], fs[i + 1], xtol)
        : brentMaximize(f, xs[Math.max(i - 1, 0)], xs[Math.min(i + 1, intervals)], xtol);
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
 *
 * See also: brentMaximizeBracketed (the same search from a known bracket of the peak)
 */
export function brentMaximize(f: (x: number) => number, a: number, b: number, xtol = 1e-10): Maximum {
  const x = a + GOLDEN * (b - a);
  const fx = -f(x);
  return localMin(f, a, b, x, fx, x, fx, x, fx, 0, 0, xtol);
}

/**
 * A local maximum of f inside [a, b] from a known bracket of it: a < x < b with f(x) >= f(a) and
 * f(x) >= f(b), and those three values (no end is evaluated again). The same search as
 * brentMaximize, which starts from one golden-section point; here the first step is the parabola
 * through the three known points, so the search needs fewer evaluations of f (a tolerance study
 * runs two such searches per sample).
 *
 * Method: Brent's localmin (brentMaximize) with its state set from the bracket: x the best point,
 * w the better end and v the other, and the last two steps taken as the bracket's width and half
 * of it, so that the first two steps may be parabolic. The state keeps localmin's invariants
 * (Brent 1973, ch. 5: a <= x, w, v <= b, and g(x) <= g(w) <= g(v) for the minimised g = -f), and
 * the loop, its steps and its stopping rule are brentMaximize's. A bracketing triple is also the
 * input of Press et al.'s `brent` ("Numerical Recipes", 3rd ed., 2007, section 10.3).
 *
 * Syntax: brentMaximizeBracketed(f, a, x, b, fa, fx, fb[, xtol])
 * Example: brentMaximizeBracketed((x) => -(x - 1) ** 2, 0, 1.5, 3, -1, -0.25, -4).x  // 1
 *
 * See also: brentMaximize
 */
export function brentMaximizeBracketed(
  f: (x: number) => number,
  a: number,
  x: number,
  b: number,
  fa: number,
  fx: number,
  fb: number,
  xtol = 1e-10,
): Maximum {
  // w: the better end (the second-best point), v: the other
  const aBetter = fa >= fb;
  return localMin(f, a, b, x, -fx, aBetter ? a : b, -(aBetter ? fa : fb), aBetter ? b : a, -(aBetter ? fb : fa), 0.5 * (b - a), b - a, xtol);
}

const GOLDEN = 0.5 * (3 - Math.sqrt(5));

/**
 * Brent's localmin on g = -f from a given state (x best, w second best, v the previous w; e and d
 * the last two steps); the negation is written at each call (no wrapper: a call boundary boxes
 * its double argument and result, thousands of times per tolerance study).
 */
function localMin(
  f: (x: number) => number,
  a: number,
  b: number,
  x: number,
  fx: number,
  w: number,
  fw: number,
  v: number,
  fv: number,
  d: number,
  e: number,
  xtol: number,
): Maximum {
  const golden = GOLDEN;
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
