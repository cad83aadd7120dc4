/**
 * A root of f in [a, b] where f(a) and f(b) differ in sign (or one is zero).
 *
 * Method: Brent's method, inverse quadratic interpolation and secant steps safeguarded by
 * bisection (R. P. Brent, "Algorithms for Minimization without Derivatives", Prentice-Hall 1973,
 * ch. 4, procedure zero). Converges to within 2 eps |x| + xtol. The caller may pass f(a), f(b)
 * when already known.
 *
 * Syntax: brentRoot(f, a, b[, xtol, fa, fb])
 * Example: brentRoot((x) => x * x - 2, 0, 2)  // 1.4142135623730951
 */
export function brentRoot(
  f: (x: number) => number,
  a: number,
  b: number,
  xtol = 0,
  fa: number = f(a),
  fb: number = f(b),
): number {
  if (fa === 0) return a;
  if (fb === 0) return b;
  if (fa > 0 === fb > 0) throw new RangeError('brentRoot: f(a) and f(b) have the same sign');
  let c = a;
  let fc = fa;
  let d = b - a;
  let e = d;
  for (let iter = 0; iter < 200; iter++) {
    if (fb > 0 === fc > 0) {
      c = a;
      fc = fa;
      d = b - a;
      e = d;
    }
    if (Math.abs(fc) < Math.abs(fb)) {
      a = b;
      b = c;
      c = a;
      fa = fb;
      fb = fc;
      fc = fa;
    }
    const tol = 2 * Number.EPSILON * Math.abs(b) + 0.5 * xtol;
    const m = 0.5 * (c - b);
    if (Math.abs(m) <= tol || fb === 0) return b;
    if (Math.abs(e) >= tol && Math.abs(fa) > Math.abs(fb)) {
      let p: number;
      let q: number;
      const s = fb / fa;
      if (a === c) {
        p = 2 * m * s;
        q = 1 - s;
      } else {
        const qa = fa / fc;
        const r = fb / fc;
        p = s * (2 * m * qa * (qa - r) - (b - a) * (r - 1));
        q = (qa - 1) * (r - 1) * (s - 1);
      }
      if (p > 0) q = -q;
      else p = -p;
      if (2 * p < Math.min(3 * m * q - Math.abs(tol * q), Math.abs(e * q))) {
        e = d;
        d = p / q;
      } else {
        d = m;
        e = m;
      }
    } else {
      d = m;
      e = m;
    }
    a = b;
    fa = fb;
    b += Math.abs(d) > tol ? d : m > 0 ? tol : -tol;
    fb = f(b);
  }
  return b;
}
