import { UsageError } from './errors.js';

const NUMBER = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:e[+-]?\d+)?$/i;

/**
 * Parse `--duty` values: fractions (`0.25`) or percent (`25%`, `25 %`), repeated or comma-separated.
 * A bare number above 1 is refused (it is ambiguous: write `25%`), as is anything outside 0..1.
 *
 * Syntax: parseDuties(values)
 * Example: parseDuties(['0.25', '50%,75 %'])   // [0.25, 0.5, 0.75]
 */
export function parseDuties(values: string | number | Array<string | number> | undefined): number[] | undefined {
  if (values === undefined) return undefined;
  const list = (Array.isArray(values) ? values : [values]).flatMap((v) => String(v).split(','));
  return list.map((raw) => {
    const text = raw.trim();
    const isPercent = text.endsWith('%');
    const body = isPercent ? text.slice(0, -1).trim() : text;
    if (!NUMBER.test(body)) throw new UsageError(`--duty '${raw}': expected a fraction (0.25) or a percentage (25%)`);
    const value = Number(body);
    const duty = isPercent ? value / 100 : value;
    if (!isPercent && value > 1 && value <= 100) {
      throw new UsageError(`--duty ${text}: a fraction must be within 0..1 (for percent write ${text}%)`);
    }
    if (!(duty >= 0 && duty <= 1)) throw new UsageError(`--duty ${text} is outside 0..1 (0 % to 100 %)`);
    return duty;
  });
}
