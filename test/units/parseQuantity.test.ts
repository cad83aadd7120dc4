import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { formatEng, formatIec60062, parseQuantity, QuantityError, type Dimension } from '../../src/units/index.js';

/** Relative closeness for values that went through a prefix multiplication. */
function expectSi(actual: number, expected: number): void {
  expect(Math.abs(actual - expected)).toBeLessThanOrEqual(1e-15 * Math.abs(expected));
}

function errorOf(fn: () => unknown): QuantityError {
  try {
    fn();
  } catch (error) {
    expect(error).toBeInstanceOf(QuantityError);
    return error as QuantityError;
  }
  throw new Error('expected a QuantityError, got a value');
}

describe('parseQuantity: units with SI prefixes', () => {
  // Prefix values: SI Brochure (BIPM, 9th edition 2019), table 7: p 1e-12, n 1e-9, µ 1e-6,
  // m 1e-3, k 1e3, M 1e6. Unit symbols: F, Ω, V, Hz, A, s (SI Brochure, tables 2 and 4).
  const cases: Array<[string, Dimension, number]> = [
    ['4.7 uF', 'capacitance', 4.7e-6],
    ['4.7 \u00b5F', 'capacitance', 4.7e-6], // micro sign U+00B5
    ['4.7 \u03bcF', 'capacitance', 4.7e-6], // Greek small mu U+03BC
    ['4.7uF', 'capacitance', 4.7e-6],
    ['100 pF', 'capacitance', 100e-12],
    ['10 kohm', 'resistance', 10e3],
    ['10 k\u03a9', 'resistance', 10e3], // Greek capital omega U+03A9
    ['10 k\u2126', 'resistance', 10e3], // ohm sign U+2126
    ['10 kOhm', 'resistance', 10e3],
    ['2.2 Mohm', 'resistance', 2.2e6],
    ['3.3 V', 'voltage', 3.3],
    ['500 mV', 'voltage', 0.5],
    ['-3.3 V', 'voltage', -3.3],
    ['20 kHz', 'frequency', 20e3],
    ['16 MHz', 'frequency', 16e6],
    ['1.5 mA', 'current', 1.5e-3],
    ['20 ms', 'time', 20e-3],
    ['500 us', 'time', 500e-6],
    ['2 min', 'time', 120],
  ];
  it.each(cases)('%s is %s %d in SI', (text, dimension, si) => {
    expectSi(parseQuantity(text, dimension), si);
  });

  it('gives the double nearest the decimal value, without prefix noise', () => {
    // 4.7 * 1e-9 in binary floating point is not the double nearest 4.7e-9; the parser must be.
    expect(parseQuantity('4.7 nF', 'capacitance')).toBe(4.7e-9);
    expect(parseQuantity('6.8 nF', 'capacitance')).toBe(6.8e-9);
    expect(parseQuantity('0.1 uF', 'capacitance')).toBe(1e-7);
    expect(parseQuantity('3.3 mV', 'voltage')).toBe(3.3e-3);
  });
});

describe('parseQuantity: shorthand with the dimension implied', () => {
  const cases: Array<[string, Dimension, number]> = [
    ['10k', 'resistance', 10e3],
    ['4.7k', 'resistance', 4.7e3],
    ['10K', 'resistance', 10e3], // K for kilo: common practice
    ['100n', 'capacitance', 100e-9],
    ['2.2u', 'capacitance', 2.2e-6],
    ['2.2\u00b5', 'capacitance', 2.2e-6],
    ['1M', 'resistance', 1e6],
    ['470', 'resistance', 470],
    ['20k', 'frequency', 20e3],
    ['10m', 'current', 10e-3],
    ['100nF', 'capacitance', 100e-9],
  ];
  it.each(cases)('%s is %s %d in SI', (text, dimension, si) => {
    expectSi(parseQuantity(text, dimension), si);
  });

  it("reads 1m as milli, not mega, for a resistance too (SI: m = milli)", () => {
    // Documented rule: a prefix letter is always the SI prefix; mega is M.
    expect(parseQuantity('1m', 'resistance')).toBe(1e-3);
    expect(parseQuantity('1M', 'resistance')).toBe(1e6);
    expect(parseQuantity('1 mohm', 'resistance')).toBe(1e-3);
    expect(parseQuantity('1 Mohm', 'resistance')).toBe(1e6);
  });
});

describe('parseQuantity: IEC 60062 letter-and-digit code', () => {
  // IEC 60062:2016, letter and digit code for resistance and capacitance values: the letter
  // stands for the decimal point and the multiplier (R = 1 for ohms; p, n, µ, m for farads;
  // k, M, G for ohms). Examples as given there (from memory of the standard).
  const cases: Array<[string, Dimension, number]> = [
    ['4k7', 'resistance', 4.7e3],
    ['2R2', 'resistance', 2.2],
    ['2r2', 'resistance', 2.2],
    ['R47', 'resistance', 0.47],
    ['470R', 'resistance', 470],
    ['1M0', 'resistance', 1e6],
    ['4M7', 'resistance', 4.7e6],
    ['4u7', 'capacitance', 4.7e-6],
    ['4\u00b57', 'capacitance', 4.7e-6],
    ['4n7', 'capacitance', 4.7e-9],
    ['6n8', 'capacitance', 6.8e-9],
    ['100n', 'capacitance', 100e-9],
    ['2p2', 'capacitance', 2.2e-12],
    ['p47', 'capacitance', 0.47e-12],
    ['1u5', 'capacitance', 1.5e-6],
    ['3V3', 'voltage', 3.3], // V as decimal marker for volts: common practice (rail names)
    ['4k7\u03a9', 'resistance', 4.7e3],
  ];
  it.each(cases)('%s is %s %d in SI', (text, dimension, si) => {
    expectSi(parseQuantity(text, dimension), si);
  });

  it('reads back every code formatIec60062 writes for E24 values over 12 decades', () => {
    // Round trip through our own writer; the writer is checked against IEC 60062 examples separately.
    const e24 = [10, 11, 12, 13, 15, 16, 18, 20, 22, 24, 27, 30, 33, 36, 39, 43, 47, 51, 56, 62, 68, 75, 82, 91];
    for (let decade = -13; decade <= 8; decade++) {
      for (const figures of e24) {
        const value = Number(`${figures}e${decade}`);
        if (value >= 0.1) expect(parseQuantity(formatIec60062(value, 'resistance'), 'resistance')).toBe(value);
        if (value <= 1) expect(parseQuantity(formatIec60062(value, 'capacitance'), 'capacitance')).toBe(value);
      }
    }
  });
});

describe('parseQuantity: plain numbers and fractions', () => {
  it('takes plain numbers in SI base units', () => {
    expect(parseQuantity(470, 'resistance')).toBe(470);
    expect(parseQuantity('1e-9', 'capacitance')).toBe(1e-9);
    expect(parseQuantity(' 3.3 ', 'voltage')).toBe(3.3);
    expect(parseQuantity(-0, 'voltage')).toBe(0);
    expect(Object.is(parseQuantity(-0, 'voltage'), -0)).toBe(false);
  });

  it('reads percentages and plain fractions from 0 to 1', () => {
    expect(parseQuantity('5 %', 'fraction')).toBe(0.05);
    expect(parseQuantity('5%', 'fraction')).toBe(0.05);
    expect(parseQuantity('0.1 %', 'fraction')).toBe(0.001);
    expect(parseQuantity('100 %', 'fraction')).toBe(1);
    expect(parseQuantity(0.95, 'fraction')).toBe(0.95);
    expect(parseQuantity('0', 'fraction')).toBe(0);
  });

  it('refuses fractions outside 0..1 and hints at % for a bare 5', () => {
    expect(errorOf(() => parseQuantity(5, 'fraction')).message).toContain("write '5 %' if you mean 5 percent");
    expect(errorOf(() => parseQuantity('120 %', 'fraction')).message).toContain("got '120 %'");
    expect(errorOf(() => parseQuantity(-0.1, 'fraction')).message).toContain('from 0 to 1');
  });
});

describe('parseQuantity: errors in an engineer\'s words', () => {
  it('names the expected and the given dimension', () => {
    const e = errorOf(() => parseQuantity('3.3 V', 'capacitance'));
    expect(e.message).toContain("expected a capacitance (F), got '3.3 V'");
    expect(e.message).toContain('a voltage');
    expect(e.expected).toBe('capacitance');
    expect(e.input).toBe('3.3 V');
    expect(errorOf(() => parseQuantity('10 kohm', 'capacitance')).message).toContain('a resistance');
    expect(errorOf(() => parseQuantity('2R2', 'capacitance')).message).toContain("got '2R2' (a resistance)");
    expect(errorOf(() => parseQuantity('20 kHz', 'time')).message).toContain("expected a time (s), got '20 kHz' (a frequency)");
    expect(errorOf(() => parseQuantity('5 %', 'voltage')).message).toContain('a percentage');
    expect(errorOf(() => parseQuantity('5 V', 'fraction')).message).toContain("got '5 V' (a voltage)");
    expect(errorOf(() => parseQuantity('3 m/s', 'time')).message).toContain('a quantity in m / s');
  });

  it('refuses NaN and Infinity in every spelling', () => {
    for (const input of [NaN, Infinity, -Infinity, 'NaN', 'Infinity', '-Infinity', '.inf', '.nan', '1e400', '1e400 V']) {
      expect(errorOf(() => parseQuantity(input, 'voltage')).message).toMatch(/not a finite number/);
    }
  });

  it('says what it expected for text that is no quantity', () => {
    expect(errorOf(() => parseQuantity('abc', 'resistance')).message).toContain("expected a resistance (ohm) such as '10 kohm'");
    expect(errorOf(() => parseQuantity('', 'voltage')).message).toContain('empty value');
    expect(errorOf(() => parseQuantity('4,7 uF', 'capacitance')).message).toContain('use a point as the decimal marker');
    expect(errorOf(() => parseQuantity('uF', 'capacitance')).message).toContain("got 'uF'");
    expect(errorOf(() => parseQuantity('4k7k', 'resistance')).message).toContain("got '4k7k'");
  });

  it('checks the sign when asked', () => {
    expect(errorOf(() => parseQuantity('-4.7k', 'resistance', { sign: 'positive' })).message).toBe(
      "expected a resistance (ohm) greater than 0, got '-4.7k'",
    );
    expect(errorOf(() => parseQuantity(0, 'capacitance', { sign: 'positive' })).message).toContain('greater than 0');
    expect(parseQuantity(0, 'capacitance', { sign: 'nonNegative' })).toBe(0);
    expect(errorOf(() => parseQuantity('-1 pF', 'capacitance', { sign: 'nonNegative' })).message).toContain('of 0 or more');
  });
});

describe('parseQuantity: properties', () => {
  it('reads back formatEng text to 15 digits for any finite value (round trip)', () => {
    fc.assert(
      fc.property(fc.double({ min: 1e-20, max: 1e20, noNaN: true }), fc.boolean(), (magnitude, negative) => {
        const value = negative ? -magnitude : magnitude;
        const back = parseQuantity(formatEng(value, 'V', 15), 'voltage');
        return Math.abs(back - value) <= 1e-14 * Math.abs(value);
      }),
      { numRuns: 500 },
    );
  });

  it('gives plain decimal numbers exactly as JavaScript reads them', () => {
    fc.assert(
      fc.property(fc.double({ noNaN: true, noDefaultInfinity: true }), (value) => {
        const text = String(value);
        return Object.is(parseQuantity(text, 'voltage'), value === 0 ? 0 : value);
      }),
      { numRuns: 300 },
    );
  });
});
