/**
 * Preferred number series E3 to E192 of IEC 60063:2015 (preferred number series for resistors
 * and capacitors), and the values of a series over any range of decades.
 *
 * The tables hold the significant figures as published: two figures for E3 to E24 (1.0 to 9.1),
 * three for E48 to E192 (1.00 to 9.88), written here as whole numbers (10 to 91, 100 to 988).
 */

export type ESeries = 'E3' | 'E6' | 'E12' | 'E24' | 'E48' | 'E96' | 'E192';

export const E_SERIES_NAMES: readonly ESeries[] = ['E3', 'E6', 'E12', 'E24', 'E48', 'E96', 'E192'];

const E24 = [10, 11, 12, 13, 15, 16, 18, 20, 22, 24, 27, 30, 33, 36, 39, 43, 47, 51, 56, 62, 68, 75, 82, 91];

const E192 = [
  100, 101, 102, 104, 105, 106, 107, 109, 110, 111, 113, 114, 115, 117, 118, 120, 121, 123, 124, 126,
  127, 129, 130, 132, 133, 135, 137, 138, 140, 142, 143, 145, 147, 149, 150, 152, 154, 156, 158, 160,
  162, 164, 165, 167, 169, 172, 174, 176, 178, 180, 182, 184, 187, 189, 191, 193, 196, 198, 200, 203,
  205, 208, 210, 213, 215, 218, 221, 223, 226, 229, 232, 234, 237, 240, 243, 246, 249, 252, 255, 258,
  261, 264, 267, 271, 274, 277, 280, 284, 287, 291, 294, 298, 301, 305, 309, 312, 316, 320, 324, 328,
  332, 336, 340, 344, 348, 352, 357, 361, 365, 370, 374, 379, 383, 388, 392, 397, 402, 407, 412, 417,
  422, 427, 432, 437, 442, 448, 453, 459, 464, 470, 475, 481, 487, 493, 499, 505, 511, 517, 523, 530,
  536, 542, 549, 556, 562, 569, 576, 583, 590, 597, 604, 612, 619, 626, 634, 642, 649, 657, 665, 673,
  681, 690, 698, 706, 715, 723, 732, 741, 750, 759, 768, 777, 787, 796, 806, 816, 825, 835, 845, 856,
  866, 876, 887, 898, 909, 920, 931, 942, 953, 965, 976, 988,
];

const E96 = [
  100, 102, 105, 107, 110, 113, 115, 118, 121, 124, 127, 130, 133, 137, 140, 143, 147, 150, 154, 158,
  162, 165, 169, 174, 178, 182, 187, 191, 196, 200, 205, 210, 215, 221, 226, 232, 237, 243, 249, 255,
  261, 267, 274, 280, 287, 294, 301, 309, 316, 324, 332, 340, 348, 357, 365, 374, 383, 392, 402, 412,
  422, 432, 442, 453, 464, 475, 487, 499, 511, 523, 536, 549, 562, 576, 590, 604, 619, 634, 649, 665,
  681, 698, 715, 732, 750, 768, 787, 806, 825, 845, 866, 887, 909, 931, 953, 976,
];

const E48 = [
  100, 105, 110, 115, 121, 127, 133, 140, 147, 154, 162, 169, 178, 187, 196, 205, 215, 226, 237, 249,
  261, 274, 287, 301, 316, 332, 348, 365, 383, 402, 422, 442, 464, 487, 511, 536, 562, 590, 619, 649,
  681, 715, 750, 787, 825, 866, 909, 953,
];

/** Significant figures of each series as whole numbers, ascending within one decade. */
export const E_SERIES: Readonly<Record<ESeries, readonly number[]>> = {
  E3: [10, 22, 47],
  E6: [10, 15, 22, 33, 47, 68],
  E12: [10, 12, 15, 18, 22, 27, 33, 39, 47, 56, 68, 82],
  E24,
  E48,
  E96,
  E192,
};

/** How many significant figures the series is published with. */
function figuresOf(series: ESeries): number {
  return E_SERIES[series][0] >= 100 ? 3 : 2;
}

/** figures x 10^(decade - figures + 1), read from decimal text: the double nearest the value. */
function valueOf(figures: number, count: number, decade: number): number {
  return Number(`${figures}e${decade - count + 1}`);
}

/** Decimal exponent of a positive finite value, exact (no log10 rounding at powers of ten). */
function decadeOf(value: number): number {
  return Number(value.toExponential().split('e')[1]);
}

/**
 * Every value of a series from `min` to `max` (both included), ascending, over any decades.
 *
 * Method: each value is built from its decimal text (`'47e-10'` -> 4.7e-9) so it is the double
 * nearest the nominal value, never `4.7 * 1e-9` with its rounding error. Bounds get a relative
 * slack of 1e-9 so that a bound computed in floating point still includes a nominal value.
 *
 * Syntax: seriesValues(series, min, max)
 * Example: seriesValues('E6', 1e-9, 10e-9)   // [1e-9, 1.5e-9, 2.2e-9, 3.3e-9, 4.7e-9, 6.8e-9, 1e-8]
 */
export function seriesValues(series: ESeries, min: number, max: number): number[] {
  const table = E_SERIES[series];
  if (!table) throw new RangeError(`unknown series '${series}'; expected one of ${E_SERIES_NAMES.join(', ')}`);
  if (!(Number.isFinite(min) && Number.isFinite(max) && min > 0 && max >= min)) {
    throw new RangeError(`seriesValues: need 0 < min <= max, got min ${min}, max ${max}`);
  }
  const count = figuresOf(series);
  const low = min * (1 - 1e-9);
  const high = max * (1 + 1e-9);
  const values: number[] = [];
  for (let decade = decadeOf(min) - 1; decade <= decadeOf(max); decade++) {
    for (const figures of table) {
      const value = valueOf(figures, count, decade);
      if (value >= low && value <= high) values.push(value);
    }
  }
  return values;
}

/**
 * The value of a series nearest to `value` by ratio (smallest |ln(candidate / value)|), the
 * natural distance for a geometric series. A value exactly halfway (by ratio) between two
 * series values goes to the lower one.
 *
 * Method: candidates from the decade of `value` and its two neighbours, built as in
 * `seriesValues`.
 *
 * Syntax: nearestInSeries(value, series)
 * Example: nearestInSeries(5000, 'E12')     // 4700
 *          nearestInSeries(9.6e-9, 'E24')   // 1e-8
 */
export function nearestInSeries(value: number, series: ESeries): number {
  const table = E_SERIES[series];
  if (!table) throw new RangeError(`unknown series '${series}'; expected one of ${E_SERIES_NAMES.join(', ')}`);
  if (!(Number.isFinite(value) && value > 0)) {
    throw new RangeError(`nearestInSeries: need a positive finite value, got ${value}`);
  }
  const count = figuresOf(series);
  const decade = decadeOf(value);
  let best = NaN;
  let bestDistance = Infinity;
  for (let d = decade - 1; d <= decade + 1; d++) {
    for (const figures of table) {
      const candidate = valueOf(figures, count, d);
      const distance = Math.abs(Math.log(candidate / value));
      if (distance < bestDistance) {
        best = candidate;
        bestDistance = distance;
      }
    }
  }
  return best;
}
