import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { expSumRoots } from '../../../src/engine/modal/expSumRoots.js';

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
});
