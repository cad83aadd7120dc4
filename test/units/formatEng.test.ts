import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { formatEng } from '../../src/units/index.js';

// Prefix symbols and values: SI Brochure (BIPM, 9th edition 2019), table 7, with the 2022
// additions (ronto r 1e-27, quecto q 1e-30, ronna R 1e27, quetta Q 1e30).
const PREFIX_VALUE: Record<string, number> = {
  q: -30, r: -27, y: -24, z: -21, a: -18, f: -15, p: -12, n: -9, '\u00b5': -6, m: -3, '': 0,
  k: 3, M: 6, G: 9, T: 12, P: 15, E: 18, Z: 21, Y: 24, R: 27, Q: 30,
};

describe('formatEng: worked examples', () => {
  it.each([
    [4.7e-6, 'F', '4.7 \u00b5F'],
    [0.0123, 's', '12.3 ms'],
    [0.00161, 'V', '1.61 mV'],
    [100e3, '\u03a9', '100 k\u03a9'],
    [19531.25, 'Hz', '19.5 kHz'],
    [0, 'V', '0 V'],
    [-0, 'V', '0 V'],
    [-3.3e-3, 'V', '-3.3 mV'],
    [1, 'A', '1 A'],
    [999.7, 'V', '1 kV'], // rounds up into the next prefix
    [1.005, 'V', '1.01 V'], // half away from zero on the decimal as written
    [47e-12, 'F', '47 pF'],
    [2.2e9, 'Hz', '2.2 GHz'],
    [1e-30, 'F', '1 qF'],
    [1e30, 'V', '1 QV'],
    [1.5e33, 'V', '1.5e33 V'], // beyond the largest prefix
    [4700, '', '4.7k'],
  ])('%d %s -> %s', (value, unit, text) => {
    expect(formatEng(value, unit)).toBe(text);
  });

  it('honours the number of significant digits', () => {
    expect(formatEng(19531.25, 'Hz', 6)).toBe('19.5313 kHz');
    expect(formatEng(19531.25, 'Hz', 1)).toBe('20 kHz');
    expect(formatEng(123456, 'V', 2)).toBe('120 kV');
    expect(() => formatEng(1, 'V', 0)).toThrow(RangeError);
  });

  it('writes non-finite values plainly', () => {
    expect(formatEng(Infinity, 'V')).toBe('\u221e V');
    expect(formatEng(-Infinity, 'V')).toBe('-\u221e V');
    expect(formatEng(NaN, 'V')).toBe('NaN V');
  });
});

describe('formatEng against Intl.NumberFormat engineering notation (ECMA-402, ICU)', () => {
  // Reference: the JavaScript engine's own Intl.NumberFormat with notation 'engineering'
  // writes mantissa x 10^(3k); formatEng must give the same mantissa and exponent.
  const reference = (digits: number) =>
    new Intl.NumberFormat('en-US', { notation: 'engineering', maximumSignificantDigits: digits, useGrouping: false });

  it('agrees on mantissa and prefix for random values across 60 decades', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1e-29, max: 9e29, noNaN: true }),
        fc.boolean(),
        fc.integer({ min: 1, max: 6 }),
        (magnitude, negative, digits) => {
          const value = negative ? -magnitude : magnitude;
          const [mantissa, exponent] = reference(digits).format(value).split('E');
          const match = /^(-?[\d.]+) (.*)V$/.exec(formatEng(value, 'V', digits));
          expect(match).not.toBeNull();
          expect(match![1]).toBe(mantissa);
          expect(PREFIX_VALUE[match![2]]).toBe(Number(exponent));
        },
      ),
      { numRuns: 2000 },
    );
  });

  it('agrees on short decimals, where rounding ties are common (1.005, 0.0009995, ...)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 99999 }), fc.integer({ min: -25, max: 25 }), fc.integer({ min: 1, max: 4 }), (int, exp, digits) => {
        const value = Number(`${int}e${exp}`);
        const [mantissa, exponent] = reference(digits).format(value).split('E');
        const match = /^([\d.]+) (.*)V$/.exec(formatEng(value, 'V', digits));
        expect(match![1]).toBe(mantissa);
        expect(PREFIX_VALUE[match![2]]).toBe(Number(exponent));
      }),
      { numRuns: 2000 },
    );
  });
});
