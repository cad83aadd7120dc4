import { type Analysis, magnitude, steadyState, type Waveform } from '../engine/index.js';
import { formatEng } from '../units/index.js';
import { lineChart } from './lineChart.js';
import { tidy } from './quantities.js';
import { stepRecord, worstRippleWave } from './waveforms.js';

/** Plot columns per chart. */
const COLUMNS = 72;

export interface Chart {
  title: string;
  body: string;
}

export interface ChartOptions {
  /** asciichart colour codes for the series; omit for plain text. */
  colors?: string[];
  height?: number;
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
 * the used duty range. All data come from the engine.
 *
 * Syntax: reportCharts(analysis, dutyRange[, { colors, height }])
 * Example: reportCharts(a, p.pwm.duty).map((c) => c.title)
 */
export function reportCharts(
  analysis: Analysis,
  dutyRange: { min: number; max: number },
  options: ChartOptions = {},
): Chart[] {
  const height = options.height ?? 10;
  const colors = options.colors;
  const { ladder, lsb } = analysis;
  const period = ladder.period;
  const charts: Chart[] = [];

  // (a) Steady state: deviation from the average, so the ripple fills the chart.
  const wDuty = analysis.worstRipple.duty;
  const steady = worstRippleWave(analysis, Math.round(COLUMNS / 2));
  const avg = tidy(steadyState(ladder, wDuty).average, ladder.high - ladder.low);
  charts.push({
    title: `Output minus its average (${formatEng(avg, 'V', 5)}) over two PWM periods at duty ${pct(wDuty)} (worst ripple)`,
    body: lineChart([steady.v.map((v) => v - avg)], {
      height,
      yUnit: 'V',
      minSpan: 1e-6,
      x: { start: steady.t[0], end: steady.t[steady.t.length - 1], unit: 's' },
      colors,
    }),
  });

  // (b) Settling step: envelope of the record, band lines, settling instant.
  const step = stepRecord(analysis);
  const { lower, upper } = envelope(step.wave, COLUMNS);
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
    body: lineChart([upper, lower], { height, yUnit: 'V', x: xAxis, markers, levels, colors }),
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
    }),
  });

  // (c) Magnitude response on a log frequency axis.
  const fPwm = 1 / period;
  const fLo = Math.min(analysis.cutoff, fPwm) / 100;
  const fHi = Math.max(analysis.cutoff, fPwm) * 10;
  const freqs = Array.from({ length: COLUMNS }, (_, i) => fLo * (fHi / fLo) ** (i / (COLUMNS - 1)));
  charts.push({
    title: 'Magnitude response relative to DC (dB) against log frequency',
    body: lineChart([freqs.map((f) => 20 * Math.log10(magnitude(ladder, f)))], {
      height,
      yUnit: 'dB',
      yPrefixed: false,
      x: { start: fLo, end: fHi, unit: 'Hz', log: true },
      markers: [
        { x: analysis.cutoff, symbol: 'c', label: `cutoff ${formatEng(analysis.cutoff, 'Hz', 3)}` },
        { x: fPwm, symbol: 'P', label: `PWM frequency ${formatEng(fPwm, 'Hz', 3)}: gain ${(-analysis.attenuation).toFixed(1)} dB` },
      ],
      colors,
    }),
  });

  // (d) DC error across the used duty range.
  const { min: dMin, max: dMax } = dutyRange;
  const duties = Array.from({ length: COLUMNS }, (_, i) => dMin + ((dMax - dMin) * i) / (COLUMNS - 1));
  const errors = duties.map((d) => ladder.low + d * (ladder.high - ladder.low) - steadyState(ladder, d).average);
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
    }),
  });
  return charts;
}
