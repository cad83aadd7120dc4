/** Small formatters shared by the report renderers (SI in, display text out). */
import { formatEng } from '../units/index.js';

/** Duty as percent with one decimal: 0.255 -> '25.5 %'. */
export const percent = (d: number): string => `${(100 * d).toFixed(1)} %`;

/** Fixed-point text without a minus sign on a value that rounds to zero: fixed(-1e-9, 3) -> '0.000'. */
export const fixed = (x: number, decimals: number): string => {
  const text = x.toFixed(decimals);
  return /^-0\.?0*$/.test(text) ? text.slice(1) : text;
};

/** Volts as millivolts with three decimals, no unit: 0.0012345 -> '1.235'. */
export const millivolts = (v: number): string => fixed(1e3 * v, 3);

/** Volts as a count of LSB with three decimals, no unit; '-' when the LSB is unknown. */
export const lsbCount = (v: number, lsb: number | null): string => (lsb === null ? '-' : fixed(v / lsb, 3));

/**
 * Zero for a voltage below 1e-12 of full scale: floating-point residue of an exact zero (an open
 * output with a symmetric driver has no DC error), shown as 0 instead of attovolts.
 *
 * Syntax: tidy(v, fullScale)
 * Example: tidy(-4.4e-16, 3.3)   // 0
 */
export function tidy(v: number, fullScale: number): number {
  return Math.abs(v) < 1e-12 * Math.abs(fullScale) ? 0 : v;
}

/**
 * A voltage in engineering form, followed by its size in LSB when known.
 *
 * Syntax: voltsAndLsb(v, lsb)
 * Example: voltsAndLsb(1.6e-3, 3.2e-3)   // '1.6 mV (0.500 LSB)'
 */
export function voltsAndLsb(v: number, lsb: number | null): string {
  const eng = formatEng(v, 'V', 3);
  return lsb === null ? eng : `${eng} (${lsbCount(v, lsb)} LSB)`;
}

/** A check value or limit in its unit ('V' also in LSB). */
export function checkQuantity(x: number, unit: 'V' | 's' | 'A' | '1', lsb: number | null): string {
  if (unit === '1') return ofFullScale(x);
  return unit === 'V' ? voltsAndLsb(x, lsb) : formatEng(x, unit, 3);
}

/**
 * A fraction of full scale as the reports print it.
 *
 * Syntax: ofFullScale(fraction[, digits])
 * Example: ofFullScale(0.0215)   // '2.15 % of full scale'
 */
export function ofFullScale(fraction: number, digits = 3): string {
  return `${Number((100 * fraction).toPrecision(digits))} % of full scale`;
}
