/**
 * A positive finite number rounded to `digits` significant decimal digits, as a digit string and
 * the decimal exponent of its first digit: 19531.25, 3 -> { figures: '195', exponent: 4 }.
 *
 * Method: start from the shortest decimal that reads back as the same double
 * (`Number.prototype.toExponential()` without argument, ECMA-262 Number::toString digits), then
 * round half away from zero on those decimal digits. So 1.005 gives 1.01, as written, where
 * rounding the binary value (1.00499999999999989...) would give 1.00. This is the rounding of
 * ECMA-402 `Intl.NumberFormat` (roundingMode halfExpand) as ICU implements it.
 *
 * Syntax: roundSignificant(value, digits)
 * Example: roundSignificant(999.7, 3)   // { figures: '100', exponent: 3 }
 */
export function roundSignificant(value: number, digits: number): { figures: string; exponent: number } {
  const [mantissa, exponentText] = value.toExponential().split('e');
  let exponent = Number(exponentText);
  const all = mantissa.replace('.', '');
  let figures = all.slice(0, digits).padEnd(digits, '0');
  if (all.length > digits && all[digits] >= '5') {
    const carried = (BigInt(figures) + 1n).toString();
    if (carried.length > digits) {
      exponent += 1;
      figures = carried.slice(0, digits);
    } else {
      figures = carried.padStart(digits, '0');
    }
  }
  return { figures, exponent };
}
