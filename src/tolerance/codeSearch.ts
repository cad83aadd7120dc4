import type { Maximum } from '../numeric/maximizeOnInterval.js';
import { maximizeFromHints } from './dutySearch.js';

/** Most rounds of the coordinate search (coarse line, then fine line). */
const ROUNDS = 3;

/**
 * The code of largest g over the codes lo..hi of a two-channel DAC, code N = coarse * 2^b + fine
 * (model.md 1.1), searched from hints (codes where a similar g peaks).
 *
 * Method: coordinate search from each hint: along the coarse codes with the fine code held, then
 * along the fine codes with the coarse code held, repeated while the code moves (at most 3 rounds).
 * Each line is searched by maximizeFromHints (dutySearch.ts: bracket walk and Brent's method,
 * falling back to the 16-cell grid search) on the piecewise-linear interpolant of g between
 * neighbouring codes, whose maxima sit on codes, starting from the current code; lo and hi always
 * count. g is evaluated once per code. This suits functions that are smooth along each
 * coordinate, as ripple and DC errors are (the coarse duty and the fine duty each move them
 * smoothly); the largest value seen wins. Without hints the search starts at lo and at hi.
 *
 * With `fineCodes` only the coarse lines at those fine codes are searched, each once from the
 * hints' coarse codes: for a function whose extremes along each coarse code's fine codes sit at
 * known fine codes (the DC errors at fine 0, half and full: networkFigures.ts, networkDcTransfer).
 *
 * Syntax: maximizeOverCodes(g, lo, hi, fineBits, hints[, fineCodes])
 * Example: maximizeOverCodes((n) => -Math.abs(n - 1000), 0, 65535, 8, [0]).x  // 1000
 */
export function maximizeOverCodes(
  g: (code: number) => number,
  lo: number,
  hi: number,
  fineBits: number,
  hints: readonly number[],
  fineCodes?: readonly number[],
): Maximum {
  const seen = new Map<number, number>();
  const at = (code: number): number => {
    let v = seen.get(code);
    if (v === undefined) {
      v = g(code);
      seen.set(code, v);
    }
    return v;
  };
  const step = 2 ** fineBits;
  let best: Maximum = { x: lo, value: at(lo) };
  const consider = (code: number) => {
    const v = at(code);
    if (v > best.value) best = { x: code, value: v };
  };
  consider(hi);
  // Largest g along codes first + k * stride, k = 0..count-1, from position k0.
  const line = (first: number, stride: number, count: number, k0: number): number => {
    if (count <= 1) return first;
    const node = (k: number) => at(first + k * stride);
    const interpolant = (x: number) => {
      const k = Math.min(Math.floor(x), count - 2);
      const t = x - k;
      return t === 0 ? node(k) : (1 - t) * node(k) + t * node(k + 1);
    };
    // The interpolant peaks on a code: a bracket narrower than a code settles which one.
    const m = maximizeFromHints(interpolant, 0, count - 1, [k0], 0.01);
    const k = Math.min(Math.floor(m.x), count - 2);
    return node(k + 1) > node(k) ? first + (k + 1) * stride : first + k * stride;
  };
  const clamp = (code: number) => Math.min(Math.max(Math.round(code), lo), hi);
  // Along the coarse codes with fine part f held, from the first to the last code in range.
  const coarseLine = (f: number, from: number) => {
    const cFirst = Math.ceil((lo - f) / step);
    const cLast = Math.floor((hi - f) / step);
    if (cLast < cFirst) return from;
    const k0 = Math.min(Math.max(Math.floor(from / step) - cFirst, 0), cLast - cFirst);
    return line(cFirst * step + f, step, cLast - cFirst + 1, k0);
  };
  const starts = hints.length > 0 ? hints : [lo, hi];
  if (fineCodes) {
    for (const hint of starts) for (const f of fineCodes) consider(coarseLine(f, clamp(hint)));
    return best;
  }
  for (const hint of starts) {
    let code = clamp(hint);
    for (let round = 0; round < ROUNDS; round++) {
      const start = code;
      code = coarseLine(code % step, code);
      consider(code);
      // Along the fine codes: coarse part held, fine codes in range.
      const base = code - (code % step);
      const fFirst = Math.max(0, lo - base);
      const fLast = Math.min(step - 1, hi - base);
      code = line(base + fFirst, 1, fLast - fFirst + 1, code - base - fFirst);
      consider(code);
      if (code === start) break;
    }
  }
  return best;
}
