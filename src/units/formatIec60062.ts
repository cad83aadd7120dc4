import { roundSignificant } from './roundSignificant.js';

/**
 * Letter-and-digit code of IEC 60062:2016 (marking codes for resistors and capacitors): the
 * multiplier letter stands in place of the decimal point, e.g. 4k7 = 4.7 kohm, R47 = 0.47 ohm,
 * 4n7 = 4.7 nF.
 *
 * Letters: resistance R (x1), k (x1e3), M, G, T; capacitance p, n, u (micro), m, F. IEC 60062
 * writes kilo-ohm as K; the SI symbol k is printed here (common practice) and both are read back
 * by `parseQuantity`. A value with one significant figure and nothing after the letter gets a
 * trailing 0 (`1k0`, `1M0`, `1n0`), as marking practice does, so the letter is never last on a
 * single digit. Zero ohm is `0R` (jumper marking, common practice).
 *
 * Method: the value is rounded to 3 significant digits (enough for every E-series up to E192)
 * by `roundSignificant`, then the decimal point of the digit string is replaced by the letter of
 * the largest multiplier not above the value.
 *
 * Syntax: formatIec60062(value, kind)
 * Example: formatIec60062(4700, 'resistance')     // '4k7'
 *          formatIec60062(0.47, 'resistance')     // 'R47'
 *          formatIec60062(100e-9, 'capacitance')  // '100n'
 *          formatIec60062(1e6, 'resistance')      // '1M0'
 */
export function formatIec60062(value: number, kind: 'resistance' | 'capacitance'): string {
  const letters = MULTIPLIERS[kind];
  if (!Number.isFinite(value) || value < 0 || (value === 0 && kind === 'capacitance')) {
    throw new RangeError(`formatIec60062: no code for ${kind} ${value}`);
  }
  if (value === 0) return '0R';

  const rounded = roundSignificant(value, 3);
  const exponent = rounded.exponent;
  const figures = rounded.figures.replace(/0+$/, '') || '0';
  const chosen = [...letters].reverse().find((m) => m.exponent <= exponent) ?? letters[0];
  const integerDigits = exponent - chosen.exponent + 1; // <= 0 when below the smallest letter

  let integer: string;
  let fraction: string;
  if (integerDigits <= 0) {
    integer = '';
    fraction = '0'.repeat(-integerDigits) + figures;
  } else {
    integer = figures.slice(0, integerDigits).padEnd(integerDigits, '0');
    fraction = figures.slice(integerDigits);
  }
  if (fraction === '' && integer.length === 1) fraction = '0';
  return `${integer}${chosen.letter}${fraction}`;
}

const MULTIPLIERS: Record<'resistance' | 'capacitance', ReadonlyArray<{ letter: string; exponent: number }>> = {
  resistance: [
    { letter: 'R', exponent: 0 },
    { letter: 'k', exponent: 3 },
    { letter: 'M', exponent: 6 },
    { letter: 'G', exponent: 9 },
    { letter: 'T', exponent: 12 },
  ],
  capacitance: [
    { letter: 'p', exponent: -12 },
    { letter: 'n', exponent: -9 },
    { letter: 'u', exponent: -6 },
    { letter: 'm', exponent: -3 },
    { letter: 'F', exponent: 0 },
  ],
};
