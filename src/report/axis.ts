/** Axis and tick labels in engineering units with a common SI prefix per axis. */

const PREFIXES: Record<number, string> = {
  [-15]: 'f', [-12]: 'p', [-9]: 'n', [-6]: 'µ', [-3]: 'm', 0: '', 3: 'k', 6: 'M', 9: 'G',
};

/**
 * A formatter for axis labels spanning [min, max] with `steps` divisions: one SI prefix for the
 * whole axis (chosen from the largest magnitude) and one decimal more than the step needs, so
 * that neighbouring labels differ and read close to their rows' values. Units without prefixes (dB, %, LSB) pass `prefixed = false`.
 *
 * Syntax: axisFormatter(min, max, steps, unit[, prefixed])
 * Example: axisFormatter(-2e-4, 2e-4, 8, 'V')(1e-4)   // '100 µV'
 */
export function axisFormatter(
  min: number,
  max: number,
  steps: number,
  unit: string,
  prefixed = true,
): (x: number) => string {
  const largest = Math.max(Math.abs(min), Math.abs(max));
  let exp = 0;
  if (prefixed && largest > 0 && Number.isFinite(largest)) {
    exp = Math.min(9, Math.max(-15, Math.floor(Math.log10(largest) / 3) * 3));
  }
  const scale = 10 ** exp;
  const step = (max - min) / Math.max(1, steps) / scale;
  const decimals = step > 0 && Number.isFinite(step) ? Math.min(4, Math.max(0, Math.ceil(-Math.log10(step) - 1e-9) + 1)) : 2;
  const suffix = prefixed ? `${PREFIXES[exp]}${unit}` : unit;
  return (x: number) => {
    const v = x / scale;
    const text = (Math.abs(v) < 0.5 * 10 ** -decimals ? 0 : v).toFixed(decimals);
    return suffix ? `${text} ${suffix}` : text;
  };
}
