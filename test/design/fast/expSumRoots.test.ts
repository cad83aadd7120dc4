import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { expSumRoots } from '../../../src/design/fast/expSumRoots.js';

describe('expSumRoots', () => {
  it('finds ln 2 for -1/2 + e^-t (closed form)', () => {
    expect(expSumRoots([-0.5, 1], [0, 1], 10)).toEqual([Math.LN2]);
  });

  it('matches the quadratic formula for a + b x + c x^2, x = e^-t (textbook algebra)', () => {
    // (x - 0.2)(x - 0.7) = x^2 - 0.9 x + 0.14: zeros at t = -ln 0.7 and -ln 0.2
    const roots = expSumRoots([0.14, -0.9, 1], [0, 1, 2], 10);
    expect(roots).toHaveLength(2);
    expect(roots[0]).toBeCloseTo(-Math.log(0.7), 12);
    expect(roots[1]).toBeCloseTo(-Math.log(0.2), 12);
  });

  it('agrees with the quadratic formula on random two-root cases (fast-check)', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.01, max: 0.98, noNaN: true }), fc.double({ min: 0.01, max: 0.98, noNaN: true }), (p, q) => {
        fc.pre(Math.abs(p - q) > 1e-3);
        // (x - p)(x - q) with x = e^-t: roots -ln p, -ln q (quadratic formula, textbook)
        const roots = expSumRoots([p * q, -(p + q), 1], [0, 1, 2], 50);
        const want = [-Math.log(Math.max(p, q)), -Math.log(Math.min(p, q))];
        return roots.length === 2 && Math.abs(roots[0] - want[0]) < 1e-9 && Math.abs(roots[1] - want[1]) < 1e-9;
      }),
      { numRuns: 300 },
    );
  });

  it('returns nothing for a sum of one sign and roots only inside the interval', () => {
    expect(expSumRoots([1, 2, 3], [0, 1, 5], 10)).toEqual([]);
    expect(expSumRoots([-0.5, 1], [0, 1], 0.5)).toEqual([]); // ln 2 > 0.5
  });
});
