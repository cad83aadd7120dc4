import { plot } from 'asciichart';
import { formatEng } from '../units/index.js';
import { axisFormatter } from './axis.js';
import { wrapParagraph } from './wrapText.js';

/** A point of interest on the x axis, drawn as `symbol` under the chart and explained below it. */
export interface Marker {
  x: number;
  symbol: string;
  label: string;
}

/** A horizontal reference line, dotted through the empty cells of its row. */
export interface Level {
  y: number;
  /** Legend text; levels with the same label share one legend line. */
  label?: string;
}

export interface LineChartOptions {
  /** Rows of the plot area (default 10). */
  height?: number;
  yUnit: string;
  /** Use SI prefixes on the y axis (false for dB, LSB, %). Default true. */
  yPrefixed?: boolean;
  /** x of the first and last sample; samples are evenly spaced in x (or in log x). */
  x: { start: number; end: number; unit: string; log?: boolean; prefixed?: boolean };
  markers?: Marker[];
  levels?: Level[];
  /** Fix the y range (values outside are clipped to it). */
  yRange?: { min: number; max: number };
  /** Smallest y span drawn: flatter data are centred in it, so rounding noise stays flat. */
  minSpan?: number;
  /** ANSI colour per series (asciichart codes); none when colour is off. */
  colors?: string[];
  /** Widest line of the legend, columns (default: no limit): longer legend lines wrap. */
  width?: number;
}

/** Column of x in a chart of n samples. */
function column(x: number, n: number, o: LineChartOptions['x']): number {
  const f = o.log ? Math.log(x / o.start) / Math.log(o.end / o.start) : (x - o.start) / (o.end - o.start);
  return Math.round(Math.min(1, Math.max(0, Number.isFinite(f) ? f : 0)) * (n - 1));
}

/** Split a chart line into terminal cells, keeping asciichart's colour codes with their character. */
const cells = (line: string): string[] => line.match(/\x1b\[\d+m.\x1b\[0m|./gu) ?? [];

/**
 * ASCII line chart of one or more series (asciichart), with y labels in engineering units,
 * dotted reference levels, an x axis line carrying marker symbols, the x range under its ends and
 * a legend of the markers. Non-finite values and values outside `yRange` are clipped to the plotted
 * range. Sample i of a series is drawn at the i-th column right of the y axis.
 *
 * Syntax: lineChart(series, options)
 * Example: lineChart([[0, 1, 0]], { yUnit: 'V', x: { start: 0, end: 2e-3, unit: 's' } })
 */
export function lineChart(series: number[][], options: LineChartOptions): string {
  const height = options.height ?? 10;
  const n = Math.max(...series.map((s) => s.length));
  const finite = series.flat().filter(Number.isFinite);
  let min = options.yRange?.min ?? Math.min(...finite);
  let max = options.yRange?.max ?? Math.max(...finite);
  const span = Math.max(options.minSpan ?? 0, Math.abs(min) * 1e-9, 1e-300);
  if (max - min < span) {
    const mid = (max + min) / 2;
    [min, max] = [mid - span / 2, mid + span / 2];
  }
  const clip = (v: number) => (Number.isFinite(v) ? Math.min(max, Math.max(min, v)) : v > 0 ? max : min);

  const yLabel = axisFormatter(min, max, height, options.yUnit, options.yPrefixed ?? true);
  const width = Math.max(yLabel(min).length, yLabel(max).length, yLabel(0).length) + 1;
  // offset 2: the y axis sits right after the label, at text column `width`.
  const body = plot(
    series.map((s) => s.map(clip)),
    {
      height,
      offset: 2,
      min,
      max,
      format: (y) => `${yLabel(y).padStart(width - 1)} `,
      ...(options.colors ? { colors: options.colors } : {}),
    },
  );
  const rows = body.split('\n').map(cells);
  // Same row arithmetic as asciichart: row = max2 - round(y * ratio).
  const ratio = height / (max - min);
  for (const level of options.levels ?? []) {
    const row = Math.round(max * ratio) - Math.round(clip(level.y) * ratio);
    const line = rows[row];
    if (!line) continue;
    while (line.length < width + n) line.push(' ');
    for (let c = width + 1; c < width + n; c++) if (line[c] === ' ') line[c] = '·';
  }

  const axis = ['└', ...'─'.repeat(n - 1)];
  for (const m of options.markers ?? []) axis[column(m.x, n, options.x)] = m.symbol;
  const xo = options.x;
  const xLabel = xo.log
    ? (x: number) => (xo.prefixed === false ? `${Number(x.toPrecision(3))} ${xo.unit}` : formatEng(x, xo.unit, 3))
    : axisFormatter(xo.start, xo.end, 4, xo.unit, xo.prefixed ?? true);
  const left = xLabel(xo.start);
  const right = xLabel(xo.end);
  const ends = `${left}${' '.repeat(Math.max(1, n - left.length - right.length))}${right}`;
  const lines = [
    ...rows.map((r) => r.join('').trimEnd()),
    ' '.repeat(width) + axis.join(''),
    ' '.repeat(width) + ends,
  ];
  // Legend lines start under the plot, or further left when the plot is narrow.
  const room = options.width ?? Infinity;
  const lead = ' '.repeat(Math.max(0, Math.min(width, room - 40)));
  const legend = (symbol: string, label: string) =>
    Number.isFinite(room) ? wrapParagraph(label, room, `${lead}${symbol} `, `${lead}  `) : `${lead}${symbol} ${label}`;
  for (const m of options.markers ?? []) lines.push(legend(m.symbol, m.label));
  const levelLabels = new Set((options.levels ?? []).flatMap((l) => (l.label ? [l.label] : [])));
  for (const label of levelLabels) lines.push(legend('·', label));
  return lines.join('\n');
}
