import { describe, expect, it } from 'vitest';
import { histogram, percentiles, quantileSorted, wilsonInterval } from '../../src/numeric/statistics.js';

describe('statistics', () => {
  it('quantiles follow Hyndman & Fan definition 7 (R default, NumPy "linear")', () => {
    // worked by hand from the definition: h = (n - 1) q
    expect(quantileSorted([1, 2, 3, 4], 0.5)).toBe(2.5);
    expect(quantileSorted([1, 2, 3, 4], 0.25)).toBe(1.75);
    expect(quantileSorted([10, 20, 30, 40, 50], 0.9)).toBe(46);
    const p = percentiles(Float64Array.from({ length: 1001 }, (_, i) => i));
    expect(p).toEqual({ p50: 500, p99: 990, p999: 999 });
  });

  it('a step that never settles (Infinity) counts as the largest value', () => {
    const p = percentiles([1, 2, Infinity, 3]);
    expect(p.p50).toBe(2.5);
    expect(p.p999).toBe(Infinity);
  });

  it('Wilson interval of 81 of 263 is 0.2553 to 0.3662 (Newcombe, Stat. Med. 17, 1998, Table II; from memory)', () => {
    const [lo, hi] = wilsonInterval(81, 263);
    expect(lo).toBeCloseTo(0.2553, 4);
    expect(hi).toBeCloseTo(0.3662, 4);
  });

  it('Wilson interval stays inside [0, 1] at a yield of 100 %', () => {
    const [lo, hi] = wilsonInterval(10000, 10000);
    expect(hi).toBe(1);
    // closed form at p = 1: n / (n + z^2)
    expect(lo).toBeCloseTo(10000 / (10000 + 1.959963984540054 ** 2), 12);
  });

  it('histogram counts every finite value once and spans the marks', () => {
    const h = histogram([1, 2, 2, 3, Infinity], 4, [5]);
    expect(h.counts.reduce((a, b) => a + b, 0)).toBe(4);
    expect(h.notFinite).toBe(1);
    expect(h.lo).toBe(1);
    expect(h.hi).toBe(5);
  });
});
