import { brentMaximize, brentMaximizeBracketed, maximizeOnInterval, type Maximum } from '../numeric/maximizeOnInterval.js';

/** Grid cells of the duty searches, as in the engine (maximizeOnInterval). */
export const DUTY_CELLS = 16;

/**
 * Brent's tolerance on the duty for a sample's searches (ripple, droop, INL; ladders and
 * networks): near a smooth maximum the value is then within about f'' (1e-6)^2 / 2, 1e-11 of it
 * for ripple and DC errors (both vary on the scale of the whole duty range). Measured against a
 * 1e-9 search over 2 000 samples of four projects: worst ripple within 7e-12 relative, droop within
 * 2e-13, settling identical; a yield check's Brent searches take 4.2 evaluations instead of 8.9.
 */
export const DUTY_XTOL = 1e-6;

/**
 * The duties of the local maxima of f over [a, b] that lie inside the range.
 *
 * Method: f on the engine's 16-cell grid; each interior grid local maximum refined by Brent's
 * method from the three grid values around it (brentMaximizeBracketed, Brent 1973 ch. 5).
 *
 * Syntax: gridPeaks(f, a, b)
 * Example: gridPeaks((d) => d * (1 - d), 0, 1)  // [0.5]
 */
export function gridPeaks(f: (d: number) => number, a: number, b: number): number[] {
  if (!(b > a)) return [];
  const xs = Array.from({ length: DUTY_CELLS + 1 }, (_, i) =>
    i === DUTY_CELLS ? b : a + ((b - a) * i) / DUTY_CELLS,
  );
  const fs = xs.map(f);
  const peaks: number[] = [];
  for (let i = 1; i < DUTY_CELLS; i++) {
    if (fs[i] >= fs[i - 1] && fs[i] >= fs[i + 1]) peaks.push(brentMaximizeBracketed(f, xs[i - 1], xs[i], xs[i + 1], fs[i - 1], fs[i], fs[i + 1], 1e-9).x);
  }
  return peaks;
}

/**
 * The largest value of f over [a, b], searched from known peak positions (hints) of a similar f.
 *
 * Method: both ends, then from each hint a bracket walk (three points one grid cell apart,
 * stepped uphill until the middle one is highest or a range end is reached: the bracketing phase
 * of Brent-type minimizers, Press et al., "Numerical Recipes", 3rd ed., 2007, section 10.1) and
 * Brent's maximization inside the bracket, from its three values (brentMaximizeBracketed), or
 * inside the last cell when the walk ran into a range end (brentMaximize). A walk longer than the
 * whole range gives up and the engine's full search decides (16-cell grid plus Brent refinement
 * of the two best grid peaks, maximizeOnInterval). With no hints (the similar f peaked only at the
 * ends) f is also checked at the three inner points of a 4-cell grid, and the full search runs if
 * one of them beats both ends; hints = null always runs the full search. When an end wins but f rises just inside it,
 * that end's grid cell is searched by Brent too (a peak just inside the range). `xtol` is Brent's
 * absolute tolerance (default DUTY_XTOL); near a smooth maximum the value's error is of order f'' xtol^2.
 * A caller that already holds f(a) and f(b) (exactly the values f gives) passes them as `ends`:
 * the same search, two evaluations fewer.
 *
 * Syntax: maximizeFromHints(f, a, b, hints[, xtol, ends])
 * Example: maximizeFromHints((d) => d * (1 - d), 0, 1, [0.48]).x  // 0.5
 */
export function maximizeFromHints(
  f: (d: number) => number,
  a: number,
  b: number,
  hints: readonly number[] | null,
  xtol = DUTY_XTOL,
  ends?: { readonly fa: number; readonly fb: number },
): Maximum {
  if (!(b > a)) return { x: a, value: f(a) };
  if (hints === null) return maximizeOnInterval(f, a, b, DUTY_CELLS, 2, xtol);
  // The best point so far as two numbers, the brackets as scalars: no objects, arrays or closures
  // per call (a tolerance study makes thousands of these searches).
  let bestX = a;
  let bestV = ends ? ends.fa : f(a);
  const atB = ends ? ends.fb : f(b);
  if (atB > bestV) {
    bestX = b;
    bestV = atB;
  }
  const step = (b - a) / DUTY_CELLS;
  if (hints.length === 0) {
    for (let i = 1; i < 4; i++) if (f(a + ((b - a) * i) / 4) > bestV) return maximizeOnInterval(f, a, b, DUTY_CELLS, 2, xtol);
    return refineEnd(f, a, b, step, xtol, bestX, bestV);
  }
  for (let h = 0; h < hints.length; h++) {
    let x2 = Math.min(b - step, Math.max(a + step, hints[h]));
    let x1 = x2 - step;
    let x3 = x2 + step;
    let f1 = f(x1);
    let f2 = f(x2);
    let f3 = f(x3);
    let walked = 0;
    // Uphill into a range end: the peak may still lie inside that last cell, so search it too.
    let lo = Number.NaN;
    let hi = Number.NaN;
    while (!(f2 >= f1 && f2 >= f3)) {
      if (++walked > DUTY_CELLS) return maximizeOnInterval(f, a, b, DUTY_CELLS, 2, xtol);
      if (f1 > f3) {
        if (x1 - a < 0.5 * step) {
          lo = a;
          hi = x2;
          break;
        }
        x3 = x2;
        f3 = f2;
        x2 = x1;
        f2 = f1;
        x1 = Math.max(a, x1 - step);
        f1 = f(x1);
      } else {
        if (b - x3 < 0.5 * step) {
          lo = x2;
          hi = b;
          break;
        }
        x1 = x2;
        f1 = f2;
        x2 = x3;
        f2 = f3;
        x3 = Math.min(b, x3 + step);
        f3 = f(x3);
      }
    }
    const top = Number.isNaN(lo) ? brentMaximizeBracketed(f, x1, x2, x3, f1, f2, f3, xtol) : brentMaximize(f, lo, hi, xtol);
    // the best of Brent's point and the bracket's ends, in that order (ties keep the earlier)
    let bx = top.x;
    let bv = top.value;
    if (f1 > bv) {
      bx = x1;
      bv = f1;
    }
    if (f3 > bv) {
      bx = x3;
      bv = f3;
    }
    if (bv > bestV) {
      bestX = bx;
      bestV = bv;
    }
  }
  return refineEnd(f, a, b, step, xtol, bestX, bestV);
}

/**
 * An end that wins may hide a slightly higher peak just inside the range: when f falls toward
 * that end, its grid cell is searched (the engine's search refines that cell too).
 */
function refineEnd(f: (d: number) => number, a: number, b: number, step: number, xtol: number, x: number, value: number): Maximum {
  if (x !== a && x !== b) return { x, value };
  const inside = x === a ? a + 1e-7 * step : b - 1e-7 * step;
  if (!(f(inside) > value)) return { x, value };
  const inCell = x === a ? brentMaximize(f, a, a + step, xtol) : brentMaximize(f, b - step, b, xtol);
  return inCell.value > value ? inCell : { x, value };
}
