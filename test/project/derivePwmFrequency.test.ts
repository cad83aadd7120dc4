import { describe, expect, it } from 'vitest';
import { derivePwmFrequency } from '../../src/project/index.js';
import { agreesAsWritten, significantDigitsWritten } from '../../src/project/agreesAsWritten.js';

describe('derivePwmFrequency (common practice for microcontroller timers)', () => {
  it('edge-aligned: clock / (prescaler * 2^bits)', () => {
    // Fast PWM of an 8-bit AVR timer: f = f_clk / (N * (1 + TOP)), TOP = 255: 16 MHz / 256 =
    // 62.5 kHz (from memory of the ATmega328P data sheet, Timer/Counter0 fast PWM mode).
    expect(derivePwmFrequency({ clock: 16e6, bits: 8 })).toBe(62500);
    expect(derivePwmFrequency({ clock: 16e6, bits: 8, prescaler: 8 })).toBe(7812.5);
    // model.md example: 20 MHz, 10 bits, prescaler 1 -> 19531.25 Hz (hand-calculated).
    expect(derivePwmFrequency({ clock: 20e6, bits: 10, prescaler: 1, alignment: 'edge' })).toBe(19531.25);
  });

  it('center-aligned: clock / (2 * prescaler * 2^bits), half the edge-aligned frequency', () => {
    // Up-down counting takes two counts per step (center-aligned mode of general-purpose timers,
    // from memory of microcontroller reference manuals). 72 MHz, 10 bits: 72e6 / 2048 = 35156.25 Hz.
    expect(derivePwmFrequency({ clock: 72e6, bits: 10, alignment: 'center' })).toBe(35156.25);
    expect(derivePwmFrequency({ clock: 64e6, bits: 12, alignment: 'center' })).toBe(7812.5);
    for (const bits of [1, 8, 10, 16, 32]) {
      expect(derivePwmFrequency({ clock: 48e6, bits, prescaler: 3, alignment: 'center' })).toBe(
        derivePwmFrequency({ clock: 48e6, bits, prescaler: 3 }) / 2,
      );
    }
  });

  it('refuses impossible timers', () => {
    expect(() => derivePwmFrequency({ clock: 0, bits: 8 })).toThrow(RangeError);
    expect(() => derivePwmFrequency({ clock: 1e6, bits: 8.5 })).toThrow(RangeError);
    expect(() => derivePwmFrequency({ clock: 1e6, bits: 8, prescaler: 0 })).toThrow(RangeError);
  });
});

describe('agreesAsWritten: a written frequency against the derived one', () => {
  it('counts the significant digits as written', () => {
    expect(significantDigitsWritten('19.5 kHz')).toBe(3);
    expect(significantDigitsWritten('0.0195 MHz')).toBe(3);
    expect(significantDigitsWritten('20 kHz')).toBe(2);
    expect(significantDigitsWritten('19k5')).toBe(3);
    expect(significantDigitsWritten('2e4')).toBe(1);
    expect(significantDigitsWritten(19500)).toBe(5);
    expect(significantDigitsWritten('19531.25 Hz')).toBe(7);
  });

  it('accepts the derived value rounded to those digits, and nothing else', () => {
    // 20 MHz / 2^10 = 19531.25 Hz
    expect(agreesAsWritten('19.5 kHz', 19500, 19531.25)).toBe(true);
    expect(agreesAsWritten('19.53 kHz', 19530, 19531.25)).toBe(true);
    expect(agreesAsWritten('19.6 kHz', 19600, 19531.25)).toBe(false);
    expect(agreesAsWritten('19.52 kHz', 19520, 19531.25)).toBe(false);
    expect(agreesAsWritten(19531, 19531, 19531.25)).toBe(true);
    expect(agreesAsWritten(19530, 19530, 19531.25)).toBe(false);
    // 16 MHz / 2^10 = 15625 Hz: 20 kHz is off at every precision.
    expect(agreesAsWritten('20 kHz', 20000, 15625)).toBe(false);
    // Within a relative 1e-6 always agrees, however many digits.
    expect(agreesAsWritten('19531.2500001', 19531.2500001, 19531.25)).toBe(true);
  });
});
