import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { modulus } from '../../src/numeric/modulus.js';

describe('modulus: |re + j im| without overflow', () => {
  it('is 5 for 3 + 4j and exact on the axes', () => {
    // the 3-4-5 right triangle (common practice)
    expect(modulus(3, 4)).toBe(5);
    expect(modulus(-3, 4)).toBe(5);
    expect(modulus(0, -2.5)).toBe(2.5);
    expect(modulus(7, 0)).toBe(7);
    expect(modulus(0, 0)).toBe(0);
  });

  it('agrees with Math.hypot (ECMAScript) to 2 units in the last place over 600 decades (fast-check)', () => {
    const part = fc.oneof(fc.double({ noNaN: true, noDefaultInfinity: true }), fc.double({ min: -1e3, max: 1e3, noNaN: true }));
    fc.assert(
      fc.property(part, part, (re, im) => {
        const want = Math.hypot(re, im);
        const got = modulus(re, im);
        return got === want || Math.abs(got - want) <= 4 * Number.EPSILON * want;
      }),
      { numRuns: 2000 },
    );
  });

  it('keeps what squaring would lose: 1e200 and 1e-200 scales', () => {
    // (1e200)^2 overflows and (1e-200)^2 underflows to 0; the scaled form keeps both
    expect(modulus(3e200, 4e200) / 5e200).toBeCloseTo(1, 15);
    expect(modulus(3e-200, 4e-200) / 5e-200).toBeCloseTo(1, 15);
  });

  it('treats Infinity and NaN as Math.hypot does (ECMAScript: an infinite part wins over NaN)', () => {
    expect(modulus(Infinity, Number.NaN)).toBe(Infinity);
    expect(modulus(Number.NaN, -Infinity)).toBe(Infinity);
    expect(modulus(Number.NaN, 1)).toBeNaN();
    expect(modulus(1, Number.NaN)).toBeNaN();
    expect(modulus(Number.NaN, 0)).toBeNaN();
  });
});
