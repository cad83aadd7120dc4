/** p50, p99 and p99.9 of a sample. */
export interface Percentiles {
  p50: number;
  p99: number;
  p999: number;
}

/**
 * The q-quantile (0..1) of a sorted sample; +Infinity entries (never settles) count as largest.
 *
 * Method: linear interpolation between order statistics, definition 7 of Hyndman & Fan
 * ("Sample quantiles in statistical packages", The American Statistician 50(4), 1996), the
 * default of R and NumPy: h = (n - 1) q, x[floor h] + (h - floor h)(x[floor h + 1] - x[floor h]).
 *
 * Syntax: quantileSorted(sorted, q)
 * Example: quantileSorted([1, 2, 3, 4], 0.5)  // 2.5
 */
export function quantileSorted(sorted: ArrayLike<number>, q: number): number {
  const n = sorted.length;
  if (n === 0) return Number.NaN;
  const h = (n - 1) * q;
  const lo = Math.floor(h);
  const hi = Math.min(lo + 1, n - 1);
  const a = sorted[lo];
  const b = sorted[hi];
  if (a === b || h === lo) return a;
  if (!Number.isFinite(b)) return h - lo > 0 ? b : a;
  return a + (h - lo) * (b - a);
}

/**
 * p50, p99 and p99.9 of a sample (quantileSorted on a sorted copy).
 *
 * Syntax: percentiles(values)
 * Example: percentiles(Float64Array.from({ length: 1001 }, (_, i) => i)).p99  // 990
 */
export function percentiles(values: ArrayLike<number>): Percentiles {
  const sorted = Float64Array.from(values).sort();
  return {
    p50: quantileSorted(sorted, 0.5),
    p99: quantileSorted(sorted, 0.99),
    p999: quantileSorted(sorted, 0.999),
  };
}

/**
 * Two-sided confidence interval of a binomial proportion (a yield) from `passed` of `n` trials.
 *
 * Method: Wilson score interval (E. B. Wilson, "Probable inference, the law of succession, and
 * statistical inference", JASA 22(158), 1927), which stays inside [0, 1] and behaves at yields
 * near 100 %, where the normal (Wald) interval collapses. z = 1.959964 gives 95 %.
 *
 * Syntax: wilsonInterval(passed, n[, z])
 * Example: wilsonInterval(9990, 10000)  // [0.99816, 0.99946]
 */
export function wilsonInterval(passed: number, n: number, z = 1.959963984540054): [number, number] {
  if (n === 0) return [0, 1];
  const p = passed / n;
  const z2 = z * z;
  const centre = (p + z2 / (2 * n)) / (1 + z2 / n);
  const half = (z / (1 + z2 / n)) * Math.sqrt((p * (1 - p)) / n + z2 / (4 * n * n));
  return [Math.max(0, centre - half), Math.min(1, centre + half)];
}

/** Equal-width bins over [lo, hi]. */
export interface Histogram {
  lo: number;
  hi: number;
  counts: number[];
  /** Entries that are not finite numbers (a step that never settles). */
  notFinite: number;
}

/**
 * Histogram of the finite values with `bins` equal-width bins spanning the data and, when given,
 * the marks (spec limits), so a limit always falls inside the chart.
 *
 * Syntax: histogram(values, bins[, marks])
 * Example: histogram([1, 2, 2, 3], 2).counts  // [1, 3]
 */
export function histogram(values: ArrayLike<number>, bins: number, marks: number[] = []): Histogram {
  let lo = Infinity;
  let hi = -Infinity;
  let notFinite = 0;
  for (let i = 0; i < values.length; i++) {
    const v = values[i];
    if (!Number.isFinite(v)) {
      notFinite++;
      continue;
    }
    if (v < lo) lo = v;
    if (v > hi) hi = v;
  }
  for (const m of marks) {
    if (!Number.isFinite(m)) continue;
    lo = Math.min(lo, m);
    hi = Math.max(hi, m);
  }
  const counts = new Array<number>(bins).fill(0);
  if (!(hi >= lo)) return { lo: 0, hi: 0, counts, notFinite };
  if (hi === lo) {
    const pad = lo === 0 ? 1e-12 : Math.abs(lo) * 1e-6;
    lo -= pad;
    hi += pad;
  }
  const width = (hi - lo) / bins;
  for (let i = 0; i < values.length; i++) {
    const v = values[i];
    if (!Number.isFinite(v)) continue;
    counts[Math.min(bins - 1, Math.max(0, Math.floor((v - lo) / width)))]++;
  }
  return { lo, hi, counts, notFinite };
}
