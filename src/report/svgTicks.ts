/**
 * Tick positions for a plot axis: on a linear axis the "nice" steps 1, 2 or 5 times a power of ten
 * (the usual choice of plotting programs, common practice), about `target` of them; on a log axis
 * every decade, with 2 and 5 inside each decade when the axis spans fewer than three decades.
 *
 * Syntax: svgTicks(lo, hi[, { log, target }])
 * Example: svgTicks(0, 1)                       // [0, 0.2, 0.4, 0.6, 0.8, 1]
 *          svgTicks(10, 1e4, { log: true })     // [10, 100, 1000, 10000]
 */
export function svgTicks(lo: number, hi: number, options: { log?: boolean; target?: number } = {}): number[] {
  if (!(hi > lo) || !Number.isFinite(lo) || !Number.isFinite(hi)) return Number.isFinite(lo) ? [lo] : [];
  if (options.log) {
    const first = Math.floor(Math.log10(lo) + 1e-9);
    const last = Math.ceil(Math.log10(hi) - 1e-9);
    const inside = last - first < 3 ? [1, 2, 5] : [1];
    const ticks: number[] = [];
    for (let e = first; e <= last; e++) {
      for (const m of inside) {
        const v = m * 10 ** e;
        // the tolerance keeps a tick that sits on an end but differs from it by rounding
        if (v >= lo * (1 - 1e-9) && v <= hi * (1 + 1e-9)) ticks.push(Number(v.toPrecision(12)));
      }
    }
    return ticks;
  }
  const target = options.target ?? 6;
  const raw = (hi - lo) / Math.max(1, target - 1);
  const power = 10 ** Math.floor(Math.log10(raw));
  // of the nice steps around the raw one, the one whose tick count comes closest to the target
  const count = (step: number) => Math.floor(hi / step + 1e-9) - Math.ceil(lo / step - 1e-9) + 1;
  const step = [0.5, 1, 2, 5, 10]
    .map((m) => m * power)
    .reduce((best, s) => (Math.abs(count(s) - target) < Math.abs(count(best) - target) ? s : best));
  const ticks: number[] = [];
  for (let k = Math.ceil(lo / step - 1e-9); k * step <= hi + step * 1e-9; k++) {
    // toPrecision removes the 0.30000000000000004 of k * step
    ticks.push(Number((k * step).toPrecision(12)) || 0);
  }
  return ticks;
}
