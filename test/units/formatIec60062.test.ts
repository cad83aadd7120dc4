import { describe, expect, it } from 'vitest';
import { E_SERIES, E_SERIES_NAMES, formatIec60062, parseQuantity } from '../../src/units/index.js';

describe('formatIec60062: IEC 60062:2016 letter-and-digit code', () => {
  // Examples of the letter-and-digit code of IEC 60062:2016 (from memory of the standard):
  // 4k7 = 4.7 kohm, R47 = 0.47 ohm, 4n7 = 4.7 nF, 2R2 = 2.2 ohm. The standard writes kilo-ohm
  // with K; we print the SI symbol k (documented choice), so the expected text uses k.
  it.each([
    [4700, 'resistance', '4k7'],
    [2.2, 'resistance', '2R2'],
    [0.47, 'resistance', 'R47'],
    [470, 'resistance', '470R'],
    [47e3, 'resistance', '47k'],
    [1e6, 'resistance', '1M0'], // one significant figure: trailing 0 (common practice)
    [1e3, 'resistance', '1k0'],
    [4.75e3, 'resistance', '4k75'],
    [10.2, 'resistance', '10R2'],
    [0, 'resistance', '0R'], // zero-ohm jumper: common practice
    [4.7e-9, 'capacitance', '4n7'],
    [100e-9, 'capacitance', '100n'],
    [4.7e-6, 'capacitance', '4u7'],
    [47e-12, 'capacitance', '47p'],
    [0.47e-12, 'capacitance', 'p47'],
    [2.2e-3, 'capacitance', '2m2'],
    [1e-9, 'capacitance', '1n0'],
  ] as const)('%d ohm/F (%s) -> %s', (value, kind, code) => {
    expect(formatIec60062(value, kind)).toBe(code);
  });

  it('rounds to 3 significant figures', () => {
    expect(formatIec60062(4712, 'resistance')).toBe('4k71');
    expect(formatIec60062(4715, 'resistance')).toBe('4k72');
  });

  it('refuses values without a code', () => {
    expect(() => formatIec60062(-1, 'resistance')).toThrow(RangeError);
    expect(() => formatIec60062(0, 'capacitance')).toThrow(RangeError);
    expect(() => formatIec60062(NaN, 'resistance')).toThrow(RangeError);
    expect(() => formatIec60062(Infinity, 'capacitance')).toThrow(RangeError);
  });

  it('is read back to the same value for every E-series value from 1 ohm to 10 Mohm', () => {
    for (const series of E_SERIES_NAMES) {
      const figures = E_SERIES[series][0] >= 100 ? 3 : 2;
      for (let decade = 0; decade <= 6; decade++) {
        for (const f of E_SERIES[series]) {
          const value = Number(`${f}e${decade - figures + 1}`);
          const code = formatIec60062(value, 'resistance');
          expect(code).toMatch(/^\d*[RkM]\d*$/);
          expect(parseQuantity(code, 'resistance')).toBe(value);
        }
      }
    }
  });
});
