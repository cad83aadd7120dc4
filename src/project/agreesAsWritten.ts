/**
 * Whether a value the user wrote agrees with a computed one: within a relative 1e-6, or equal
 * to the computed value rounded to the significant digits the user wrote (`19.5 kHz` agrees
 * with 19531.25 Hz; `20 kHz` agrees with 19.53 kHz only to 2 digits, and so it does; `19.6 kHz`
 * does not). Digits are counted in the number as written, before any exponent or unit, leading
 * zeros excluded, trailing zeros included; a letter-and-digit code counts its digits (`19k5`: 3).
 *
 * Syntax: agreesAsWritten(written, value, computed)
 * Example: agreesAsWritten('19.5 kHz', 19500, 19531.25)   // true
 *          agreesAsWritten('19.6 kHz', 19600, 19531.25)   // false
 */
export function agreesAsWritten(written: string | number, value: number, computed: number): boolean {
  if (Math.abs(value - computed) <= 1e-6 * Math.abs(computed)) return true;
  const digits = significantDigitsWritten(written);
  return value.toPrecision(digits) === computed.toPrecision(digits);
}

/** `19.5 kHz` -> 3, `0.0195 MHz` -> 3, `20 kHz` -> 2, `19k5` -> 3, 19500 -> 5, `2e4` -> 1. */
export function significantDigitsWritten(written: string | number): number {
  const text = typeof written === 'number' ? String(written).replace(/e.*$/i, '') : written.trim();
  const match = /^[+-]?(\d*)(?:\.|[RrpnumkKMGTVF\u00b5\u03bc](?=\d))?(\d*)/.exec(text);
  const digits = `${match?.[1] ?? ''}${match?.[2] ?? ''}`.replace(/^0+/, '');
  return Math.min(21, Math.max(1, digits.length));
}
