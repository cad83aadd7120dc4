import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { expSumRoots } from '../../src/numeric/expSumRoots.js';

describe('expSumRoots', () => {
  it('finds the closed-form root of two terms: e^-s = 2 e^-2s at s = ln 2', () => {
    const roots = expSumRoots([1, -2], [-1, -2], 5);
    expect(roots).toHaveLength(1);
    expect(roots[0]).toBeCloseTo(Math.LN2, 14);
  });

  it('finds both roots of a three-term sum built from known roots', () => {
    // (e^-s - e^-1)(e^-s - e^-3) = e^-2s - (e^-1 + e^-3) e^-s + e^-4: roots at s = 1 and s = 3
    const roots = expSumRoots([1, -(Math.exp(-1) + Math.exp(-3)), Math.exp(-4)], [-2, -1, 0], 10);
    expect(roots).toHaveLength(2);
    expect(roots[0]).toBeCloseTo(1, 12);
    expect(roots[1]).toBeCloseTo(3, 12);
  });

  it('finds every sign change a dense scan sees, and nothing else (random sums of 2-4 terms)', () => {
    // An exponential sum of m terms has at most m - 1 real roots (Polya & Szego, Part V, problem 75):
    // with a fine scan of 20000 points every simple root is seen as a sign change.
    fc.assert(
      fc.property(
        fc.integer({ min: 2, max: 4 }).chain((m) =>
          fc.tuple(
            // magnitudes 1e-6..1 of either sign (subnormal coefficients make the scan itself unreliable)
            fc.array(
              fc.tuple(fc.boolean(), fc.double({ min: -6, max: 0, noNaN: true })).map(([neg, e]) => (neg ? -1 : 1) * 10 ** e),
              { minLength: m, maxLength: m },
            ),
            fc.uniqueArray(fc.integer({ min: 1, max: 400 }), { minLength: m, maxLength: m }),
          ),
        ),
        ([coef, rateSteps]) => {
          const rate = rateSteps.map((k) => -k / 40);
          const f = (s: number) => coef.reduce((acc, c, i) => acc + c * Math.exp(rate[i] * s), 0);
          const L = 4;
          const roots = expSumRoots(coef, rate, L);
          expect(roots.length).toBeLessThanOrEqual(coef.length - 1);
          for (const r of roots) expect(Math.abs(f(r))).toBeLessThan(1e-12 * coef.reduce((a, c) => a + Math.abs(c), 0));
          const N = 20000;
          const scale = coef.reduce((a, c) => a + Math.abs(c), 0);
          // a root on an end of the interval (f(0) or f(L) zero to rounding) is not inside it
          const endRoot = (s: number) => (s === 0 || s === L) && Math.abs(f(s)) <= 1e-12 * scale;
          let prev = f(0);
          for (let i = 1; i <= N; i++) {
            const v = f((L * i) / N);
            if ((prev < 0 && v > 0) || (prev > 0 && v < 0)) {
              const lo = (L * (i - 1)) / N;
              const hi = (L * i) / N;
              if (!endRoot(lo) && !endRoot(hi)) {
                expect(roots.some((r) => r >= lo - 1e-12 && r <= hi + 1e-12)).toBe(true);
              }
            }
            prev = v;
          }
        },
      ),
      { numRuns: 300, seed: 424242 },
    );
  });

  it('finds ln 2 for -1/2 + e^-t (closed form)', () => {
    expect(expSumRoots([-0.5, 1], [0, -1], 10)).toEqual([Math.LN2]);
  });

  it('matches the quadratic formula for a + b x + c x^2, x = e^-t (textbook algebra)', () => {
    // (x - 0.2)(x - 0.7) = x^2 - 0.9 x + 0.14: zeros at t = -ln 0.7 and -ln 0.2
    const roots = expSumRoots([0.14, -0.9, 1], [0, -1, -2], 10);
    expect(roots).toHaveLength(2);
    expect(roots[0]).toBeCloseTo(-Math.log(0.7), 12);
    expect(roots[1]).toBeCloseTo(-Math.log(0.2), 12);
  });

  it('agrees with the quadratic formula on random two-root cases (fast-check)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.01, max: 0.98, noNaN: true }), fc.double({ min: 0.01, max: 0.98, noNaN: true }), (p, q) => {
        fc.pre(Math.abs(p - q) > 1e-3);
        // (x - p)(x - q) with x = e^-t: roots -ln p, -ln q (quadratic formula, textbook)
        const roots = expSumRoots([p * q, -(p + q), 1], [0, -1, -2], 50);
        const want = [-Math.log(Math.max(p, q)), -Math.log(Math.min(p, q))];
        return roots.length === 2 && Math.abs(roots[0] - want[0]) < 1e-9 && Math.abs(roots[1] - want[1]) < 1e-9;
      }),
      { numRuns: 300 },
    );
  });

  it('does not depend on the order of the terms', () => {
    // the same quadratic in x = e^-t, terms listed in another order
    const a = expSumRoots([0.14, -0.9, 1], [0, -1, -2], 10);
    const b = expSumRoots([1, 0.14, -0.9], [-2, 0, -1], 10);
    expect(b).toHaveLength(2);
    for (let i = 0; i < 2; i++) expect(b[i]).toBeCloseTo(a[i], 13);
  });

  it('returns nothing for a sum of one sign and roots only inside the interval', () => {
    expect(expSumRoots([1, 2, 3], [0, -1, -5], 10)).toEqual([]);
    expect(expSumRoots([-0.5, 1], [0, -1], 0.5)).toEqual([]); // ln 2 > 0.5
    // a root exactly on an end is not inside the open interval: 1 - e^-t at t = 0
    expect(expSumRoots([1, -1], [0, -1], 1)).toEqual([]);
  });
});
