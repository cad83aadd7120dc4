import { describe, expect, it } from 'vitest';
import { drawDeviates } from '../../src/tolerance/deviates.js';
import { normalCdf, normalPdf } from './reference.js';

/**
 * Truncated normal N(0, s^2) cut at +-3s: variance s^2 (1 - 2 * 3 phi(3) / (2 Phi(3) - 1))
 * (Johnson, Kotz & Balakrishnan, "Continuous Univariate Distributions", vol. 1, 2nd ed., 1994,
 * section 10.1, the doubly truncated normal; formula from memory). Here s = 1/3.
 */
const truncatedVariance = (1 / 9) * (1 - (2 * 3 * normalPdf(3)) / (2 * normalCdf(3) - 1));
/** Its CDF on [-1, 1]: (Phi(3x) - Phi(-3)) / (Phi(3) - Phi(-3)). */
const truncatedCdf = (x: number) => (normalCdf(3 * x) - normalCdf(-3)) / (normalCdf(3) - normalCdf(-3));

function moments(z: Float64Array) {
  let mean = 0;
  for (const v of z) mean += v;
  mean /= z.length;
  let m2 = 0;
  let m4 = 0;
  for (const v of z) {
    m2 += (v - mean) ** 2;
    m4 += (v - mean) ** 4;
  }
  return { mean, variance: m2 / (z.length - 1), m4: m4 / z.length };
}

/**
 * Kolmogorov-Smirnov statistic sup |F_n - F| of a sample against a CDF. The critical value at
 * level alpha is about sqrt(-ln(alpha / 2) / (2 n)) for large n (Kolmogorov's limit law; e.g.
 * NIST/SEMATECH e-Handbook of Statistical Methods, section 1.3.5.16).
 */
function ks(z: Float64Array, cdf: (x: number) => number): number {
  const s = Float64Array.from(z).sort();
  let d = 0;
  for (let i = 0; i < s.length; i++) {
    const f = cdf(s[i]);
    d = Math.max(d, (i + 1) / s.length - f, f - i / s.length);
  }
  return d;
}

describe('drawDeviates', () => {
  const N = 100_000;

  it('is reproducible: the same seed gives the same numbers, another seed others', () => {
    const a = drawDeviates(1000, 3, 42, 'normal');
    expect(drawDeviates(1000, 3, 42, 'normal')).toEqual(a);
    const b = drawDeviates(1000, 3, 43, 'normal');
    let same = 0;
    for (let i = 0; i < a.length; i++) if (a[i] === b[i]) same++;
    expect(same).toBe(0);
  });

  it('normal: truncated at +-1 (3 sigma), variance and distribution of N(0, 1/9) cut at +-3 sigma', () => {
    const z = drawDeviates(N, 1, 7, 'normal');
    expect(Math.max(...z)).toBeLessThanOrEqual(1);
    expect(Math.min(...z)).toBeGreaterThanOrEqual(-1);
    const { mean, variance, m4 } = moments(z);
    // 5-sigma bounds on the sample mean and variance (var of s^2 ~ (mu4 - sigma^4) / n; common practice)
    expect(Math.abs(mean)).toBeLessThan(5 * Math.sqrt(truncatedVariance / N));
    expect(Math.abs(variance - truncatedVariance)).toBeLessThan(5 * Math.sqrt((m4 - truncatedVariance ** 2) / N));
    // KS at alpha = 1e-4: critical value sqrt(-ln(0.5e-4) / (2 N))
    expect(ks(z, truncatedCdf)).toBeLessThan(Math.sqrt(-Math.log(0.5e-4) / (2 * N)));
  });

  it('uniform: on [-1, 1) with variance 1/3, wider than the truncated normal', () => {
    const z = drawDeviates(N, 1, 7, 'uniform');
    const { mean, variance, m4 } = moments(z);
    expect(Math.abs(mean)).toBeLessThan(5 * Math.sqrt(1 / 3 / N));
    expect(Math.abs(variance - 1 / 3)).toBeLessThan(5 * Math.sqrt((m4 - 1 / 9) / N));
    expect(ks(z, (x) => (x + 1) / 2)).toBeLessThan(Math.sqrt(-Math.log(0.5e-4) / (2 * N)));
    expect(variance).toBeGreaterThan(3 * moments(drawDeviates(N, 1, 7, 'normal')).variance);
  });
});
