import { brentMaximize, type Maximum } from './brentMaximize.js';

/**
 * The largest value of f on [a, b], found by search: a uniform grid, then Brent refinement around
 * the best grid maxima (the end points count as candidates too).
 *
 * Method: grid scan followed by Brent's golden-section/parabolic search (brentMaximize.ts) on the
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
