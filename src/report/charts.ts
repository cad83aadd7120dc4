import type { Analysis, ChartSeries, Waveform } from '../engine/index.js';
import { formatEng } from '../units/index.js';
import { lineChart } from './lineChart.js';
import { tidy } from './quantities.js';

/** Plot columns per chart at most (fewer on a narrow terminal). */
const COLUMNS = 72;
/** Room the y labels and the axis take left of the plot, columns. */
const LABEL_ROOM = 12;

/**
 * Plot columns for a report of `width` columns: as many as the width leaves beside the y labels,
 * at most 72, at least 16. The shell passes it to the engine's chartSeries, so that every series
 * has one sample per plot column.
 *
 * Syntax: chartColumns(width)
 * Example: chartColumns(80)   // 68
 */
export function chartColumns(width: number): number {
  return Math.max(16, Math.min(COLUMNS, width - LABEL_ROOM));
}

export interface Chart {
  title: string;
  body: string;
}

export interface ChartOptions {
  /** asciichart colour codes for the series; omit for plain text. */
  colors?: string[];
  height?: number;
  /** Widest line, columns (default 80): the plots and legends are drawn to fit it. */
  width?: number;
}

const pct = (d: number) => `${(100 * d).toFixed(1)} %`;

/**
 * Per-column minimum and maximum of a long record (so ripple shows as a band, not as aliasing).
 * Samples go to columns by time, to the column where the chart draws that instant (column c at
 * t0 + c (tEnd - t0) / (columns - 1), rounded as lineChart places markers), so a record with gaps
 * (a subset of periods) lands where it belongs. A column no sample falls in repeats its left
 * neighbour (the first such columns: the first filled one).
 *
 * Syntax: envelope(wave, columns)
 * Example: envelope({ t: [0, 0.1, 4], v: [0, 2, 1] }, 3)  // { lower: [0, 0, 1], upper: [2, 2, 1] }
 */
export function envelope(wave: Waveform, columns: number): { lower: number[]; upper: number[] } {
  const lower = new Array<number>(columns).fill(Infinity);
  const upper = new Array<number>(columns).fill(-Infinity);
  const { t, v } = wave;
  const t0 = t[0];
  const span = t[t.length - 1] - t0;
  v.forEach((x, i) => {
    const f = span > 0 ? (t[i] - t0) / span : 0;
    const k = Math.min(columns - 1, Math.max(0, Math.round(f * (columns - 1))));
    lower[k] = Math.min(lower[k], x);
    upper[k] = Math.max(upper[k], x);
  });
  const first = lower.findIndex(Number.isFinite);
  for (let k = 0; k < columns; k++) {
    if (Number.isFinite(lower[k])) continue;
    const from = k < first ? first : k - 1;
    lower[k] = lower[from];
    upper[k] = upper[from];
  }
  return { lower, upper };
}

/**
 * The report's charts: (a) steady-state output over two periods at the worst-ripple duty, (b) the
 * settling step with its band and settling instant, in full and near the final value, (c) the
 * magnitude response against log frequency with cutoff and PWM frequency, (d) the DC error across
 * the used duty range. Formats only: every series comes from the engine (chartSeries.ts), one sample
 * per plot column (the step record is reduced to its per-column envelope here).
 *
 * Each plot has one column per sample of its series (chartColumns(width) when the shell sized
 * them); titles and legends wrap at the width.
 *
 * Syntax: reportCharts(analysis, series[, { colors, height, width }])
 * Example: reportCharts(a, chartSeries(a, p.pwm.duty, { columns: chartColumns(80) })).map((c) => c.title)
 */
export function reportCharts(analysis: Analysis, series: ChartSeries, options: ChartOptions = {}): Chart[] {
  const width = options.width ?? 80;
  const height = options.height ?? 10;
  const colors = options.colors;
  const { lsb } = analysis;
  const ladder = analysis.ladder ?? analysis.network!.pin;
  const columns = series.columns;
  const charts: Chart[] = [];

  // (a) Steady state: deviation from the average, so the ripple fills the chart.
  const steady = series.steady;
  const wDuty = steady.duty;
  const avg = tidy(steady.average, ladder.high - ladder.low);
  charts.push({
    title: `Output minus its average (${formatEng(avg, 'V', 5)}) over two PWM periods at duty ${pct(wDuty)} (worst ripple)`,
    body: lineChart([steady.deviation], {
      height,
      yUnit: 'V',
      minSpan: 1e-6,
      x: { start: steady.t[0], end: steady.t[steady.t.length - 1], unit: 's' },
      colors,
      width,
    }),
  });

  // (b) Settling step: envelope of the record, band lines, settling instant.
  const step = series.step;
  const { lower, upper } = envelope(step.wave, columns);
  const bandLabel = `band ±${formatEng(step.band, 'V', 3)} around the final value`;
  const levels = [
    { y: step.final + step.band, label: bandLabel },
    { y: step.final - step.band, label: bandLabel },
  ];
  const tEnd = step.wave.t[step.wave.t.length - 1];
  const xAxis = { start: step.wave.t[0], end: tEnd, unit: 's' };
  const markers =
    step.time !== null
      ? [{ x: step.time, symbol: 'S', label: `settled at ${formatEng(step.time, 's', 3)} (stays within ±${formatEng(step.band, 'V', 3)})` }]
      : [{ x: tEnd, symbol: '!', label: `never settles: ripple exceeds the band ±${formatEng(step.band, 'V', 3)}` }];
  const what = `step ${pct(step.from)} -> ${pct(step.to)}, band ±${formatEng(step.band, 'V', 3)} around ${formatEng(step.final, 'V', 5)}`;
  charts.push({
    title: `Step response (${what}); ripple drawn as its envelope`,
    body: lineChart([upper, lower], { height, yUnit: 'V', x: xAxis, markers, levels, colors, width }),
  });
  // Zoom so that one band is exactly two rows: the band lines then sit symmetric about the final row.
  const zoomHeight = 12;
  const zoom = (zoomHeight / 4) * step.band;
  charts.push({
    title: `Step response near the final value (±${formatEng(zoom, 'V', 3)}, clipped)`,
    body: lineChart([upper, lower], {
      height: zoomHeight,
      yUnit: 'V',
      x: xAxis,
      markers,
      levels,
      yRange: { min: step.final - zoom, max: step.final + zoom },
      colors,
      width,
    }),
  });

  // (c) Magnitude response on a log frequency axis.
  const { frequency: freqs, gainDb, cutoff, pwmFrequency: fPwm } = series.magnitude;
  const fLo = freqs[0];
  const fHi = freqs[freqs.length - 1];
  charts.push({
    title: 'Magnitude response relative to DC (dB) against log frequency',
    body: lineChart([gainDb], {
      height,
      yUnit: 'dB',
      yPrefixed: false,
      x: { start: fLo, end: fHi, unit: 'Hz', log: true },
      markers: [
        { x: cutoff, symbol: 'c', label: `cutoff ${formatEng(cutoff, 'Hz', 3)}` },
        { x: fPwm, symbol: 'P', label: `PWM frequency ${formatEng(fPwm, 'Hz', 3)}: gain ${(-analysis.attenuation).toFixed(1)} dB` },
      ],
      colors,
      width,
    }),
  });

  // (d) DC error across the used duty range.
  const { duty: duties, error: errors } = series.dcError;
  const dMin = duties[0];
  const dMax = duties[duties.length - 1];
  const inLsb = lsb !== null;
  charts.push({
    title: `DC error (ideal - average) across the used duty range, ${inLsb ? 'LSB' : 'V'}`,
    body: lineChart([inLsb ? errors.map((e) => e / lsb) : errors], {
      height,
      yUnit: inLsb ? 'LSB' : 'V',
      yPrefixed: !inLsb,
      // Below 0.01 LSB (or 10 µV) the error is numerical noise: draw it flat.
      minSpan: inLsb ? 0.02 : 20e-6,
      x: { start: 100 * dMin, end: 100 * dMax, unit: '%', prefixed: false },
      markers:
        tidy(analysis.dc.droop.error, ladder.high - ladder.low) === 0
          ? []
          : [{ x: 100 * analysis.dc.droop.duty, symbol: 'D', label: `largest error (droop) at duty ${pct(analysis.dc.droop.duty)}` }],
      colors,
      width,
    }),
  });
  return charts;
}
