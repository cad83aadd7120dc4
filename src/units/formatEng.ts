import { roundSignificant } from './roundSignificant.js';
import { PREFIX_BY_EXPONENT } from './siPrefixes.js';

/**
 * Engineering notation: a mantissa from 1 to 999 with an SI prefix (exponent a multiple of 3)
 * and the unit, trailing zeros dropped.
 *
 * Method: the value is rounded once to `digits` significant digits, half away from zero on its
 * shortest decimal form (`roundSignificant`, the rounding of `Intl.NumberFormat`), then the
 * decimal point is moved in the digit string, so no floating-point noise enters the text. Prefixes are those of the SI
 * Brochure (BIPM, 9th edition 2019, 2022 additions included: q to Q, 1e-30 to 1e30); beyond
 * them the exponent is written out (`1.5e33 V`). The micro prefix is the micro sign U+00B5.
 *
 * Syntax: formatEng(value, unit[, digits])
 * Example: formatEng(4.7e-6, 'F')      // '4.7 µF'
 *          formatEng(19531.25, 'Hz')   // '19.5 kHz'
 *          formatEng(-0.0123, 's')     // '-12.3 ms'
 *          formatEng(0, 'V')           // '0 V'
 *          formatEng(4700, '')         // '4.7k'
 */
export function formatEng(value: number, unit: string, digits = 3): string {
  if (!Number.isInteger(digits) || digits < 1 || digits > 21) {
    throw new RangeError(`formatEng: digits must be a whole number from 1 to 21, got ${digits}`);
  }
  const join = (number: string, prefix: string) => (unit === '' ? `${number}${prefix}` : `${number} ${prefix}${unit}`);
  if (Number.isNaN(value)) return join('NaN', '');
  if (!Number.isFinite(value)) return join(value > 0 ? '\u221e' : '-\u221e', '');
  if (value === 0) return join('0', '');

  const sign = value < 0 ? '-' : '';
  const { figures, exponent } = roundSignificant(Math.abs(value), digits);
  const engExponent = Math.floor(exponent / 3) * 3;
  const integerDigits = exponent - engExponent + 1; // 1 to 3
  const padded = figures.padEnd(integerDigits, '0');
  const fraction = padded.slice(integerDigits).replace(/0+$/, '');
  const number = `${sign}${padded.slice(0, integerDigits)}${fraction ? `.${fraction}` : ''}`;

  const prefix = PREFIX_BY_EXPONENT[engExponent];
  if (prefix === undefined) return join(`${number}e${engExponent}`, '');
  return join(number, prefix);
}
