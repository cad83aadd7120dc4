import { formatEng } from '../units/index.js';
import { axisFormatter } from './axis.js';
import { htmlEscape } from './htmlEscape.js';
import { svgTicks } from './svgTicks.js';

/** One axis of a plot: its label, the unit of its tick labels, and whether it is logarithmic. */
export interface PlotAxis {
  label: string;
  /** Unit of the tick labels ('V', 's', 'Hz'); prefixed with SI prefixes unless `plain`. */
  unit: string;
  /** Units without prefixes (dB, %). */
  plain?: boolean;
  log?: boolean;
  /** Fixed range of the axis; what lies outside is clipped at the frame. */
  range?: [number, number];
  /** Smallest span of a linear axis: below it, differences are numerical noise and are drawn flat. */
  minSpan?: number;
  /** Tick label of a value (default: engineering form in `unit`). */
  format?: (v: number) => string;
}

/** One line of a plot; a null or non-finite y leaves a gap. */
export interface PlotSeries {
  name: string;
  x: readonly number[];
  y: readonly (number | null)[];
  /** Draw a dot at each point too (for a few computed points). */
  dots?: boolean;
}

/** A labelled vertical (on x) or horizontal (on y) line. */
export interface PlotMark {
  at: number;
  label: string;
}

export interface LinePlot {
  /** Identifier of the plot in the page (`data-plot`), e.g. 'steady'. */
  id: string;
  title: string;
  x: PlotAxis;
  y: PlotAxis;
  series: PlotSeries[];
  xMarks?: PlotMark[];
  yMarks?: PlotMark[];
  /** A shaded horizontal band (the settling band). */
  yBand?: { lo: number; hi: number; label: string };
}

export const PLOT_WIDTH = 640;
export const PLOT_HEIGHT = 300;
const M = { left: 78, right: 34, top: 14, bottom: 46 };

/** Numbers in SVG coordinates: two decimals are a hundredth of a pixel. */
const px = (v: number) => Number(v.toFixed(2));

/** Domain [lo, hi] of the values, widened so that nothing touches the frame; positive for log. */
function domain(values: number[], log: boolean, minSpan = 0, padded = true): [number, number] {
  const usable = values.filter((v) => Number.isFinite(v) && (!log || v > 0));
  if (usable.length === 0) return log ? [1, 10] : [-1, 1];
  let lo = Math.min(...usable);
  let hi = Math.max(...usable);
  if (log) {
    if (hi / lo < 1.5) return [lo / 1.25, hi * 1.25];
    if (!padded) return [lo, hi];
    // 3 % of the span in log space on each side, so that dots at the ends stay whole
    const pad = (hi / lo) ** 0.03;
    return [lo / pad, hi * pad];
  }
  if (hi - lo < minSpan) {
    const mid = (hi + lo) / 2;
    return [mid - minSpan / 2, mid + minSpan / 2];
  }
  if (hi === lo) {
    const d = lo === 0 ? 1 : Math.abs(lo) * 0.1;
    return [lo - d, hi + d];
  }
  const pad = padded ? 0.05 * (hi - lo) : 0;
  lo -= pad;
  hi += pad;
  return [lo, hi];
}

/** The scale of one axis: value to pixel, its ticks and their labels. */
function scale(axis: PlotAxis, values: number[], from: number, to: number, padded: boolean) {
  const log = axis.log ?? false;
  const [lo, hi] = axis.range ?? domain(values, log, axis.minSpan, padded);
  const ticks = svgTicks(lo, hi, { log });
  const f = log ? Math.log10 : (v: number) => v;
  const a = f(lo);
  const b = f(hi);
  const at = (v: number) => from + ((f(v) - a) / (b - a)) * (to - from);
  const label =
    axis.format ??
    (log ? (v: number) => formatEng(v, axis.unit, 3) : axisFormatter(ticks[0] ?? lo, ticks[ticks.length - 1] ?? hi, Math.max(1, ticks.length - 1), axis.unit, !axis.plain));
  return { lo, hi, ticks, at, label, inside: (v: number) => Number.isFinite(v) && v >= lo && v <= hi && (!log || v > 0) };
}

/**
 * A line plot as an inline SVG figure: frame, grid and ticks with engineering labels, axis
 * labels, one `<path class="series sN">` per series (`data-series` its name, `data-points` the
 * number of points drawn, gaps where y is missing), optional dots, labelled vertical and horizontal
 * marks and a shaded band, and a legend under the plot. Colours and line styles come from the
 * page's CSS classes (htmlPage.ts), so dark mode and print restyle it; series differ by dash
 * pattern too, so a grey print still tells them apart.
 *
 * Syntax: svgPlot(plot)
 * Example: svgPlot({ id: 'dc', title: 'DC error', x: { label: 'duty', unit: '%', plain: true },
 *                    y: { label: 'DC error', unit: 'V' }, series: [{ name: 'ideal - average', x, y }] })
 */
export function svgPlot(plot: LinePlot): string {
  const xs = plot.series.flatMap((s) => s.x.filter((_, i) => s.y[i] !== null && Number.isFinite(s.y[i] as number)));
  const ys = plot.series.flatMap((s) => s.y.filter((v): v is number => v !== null));
  const X = scale(plot.x, [...xs, ...(plot.xMarks ?? []).map((m) => m.at)], M.left, PLOT_WIDTH - M.right, plot.series.some((s) => s.dots));
  const Y = scale(
    plot.y,
    [...ys, ...(plot.yMarks ?? []).map((m) => m.at), ...(plot.yBand ? [plot.yBand.lo, plot.yBand.hi] : [])],
    PLOT_HEIGHT - M.bottom,
    M.top,
    true,
  );
  const left = M.left;
  const right = PLOT_WIDTH - M.right;
  const top = M.top;
  const bottom = PLOT_HEIGHT - M.bottom;
  const out: string[] = [];
  out.push(
    `<svg class="plot-svg" xmlns="http://www.w3.org/2000/svg" viewBox="0 0 ${PLOT_WIDTH} ${PLOT_HEIGHT}" role="img" aria-label="${htmlEscape(plot.title)}">`,
    `<title>${htmlEscape(plot.title)}</title>`,
  );
  const clip = `clip-${plot.id.replace(/[^A-Za-z0-9_-]/g, '_')}`;
  out.push(`<defs><clipPath id="${clip}"><rect x="${left}" y="${top}" width="${right - left}" height="${bottom - top}"/></clipPath></defs>`);
  const grid: string[] = [];
  const labels: string[] = [];
  for (const t of X.ticks) {
    const x = px(X.at(t));
    grid.push(`<line x1="${x}" y1="${top}" x2="${x}" y2="${bottom}"/>`);
    labels.push(`<text class="tick x-tick" x="${x}" y="${bottom + 16}" text-anchor="middle">${htmlEscape(X.label(t))}</text>`);
  }
  for (const t of Y.ticks) {
    const y = px(Y.at(t));
    grid.push(`<line x1="${left}" y1="${y}" x2="${right}" y2="${y}"/>`);
    labels.push(`<text class="tick y-tick" x="${left - 6}" y="${y + 4}" text-anchor="end">${htmlEscape(Y.label(t))}</text>`);
  }
  out.push(`<g class="grid">${grid.join('')}</g>`);
  if (plot.yBand) {
    const y1 = px(Y.at(Math.min(Y.hi, plot.yBand.hi)));
    const y2 = px(Y.at(Math.max(Y.lo, plot.yBand.lo)));
    out.push(
      `<rect class="band" data-band="${htmlEscape(plot.yBand.label)}" x="${left}" y="${y1}" width="${px(right - left)}" height="${px(y2 - y1)}"><title>${htmlEscape(plot.yBand.label)}</title></rect>`,
    );
  }
  out.push(`<rect class="frame" x="${left}" y="${top}" width="${right - left}" height="${bottom - top}"/>`);
  out.push(`<g class="ticks">${labels.join('')}</g>`);
  out.push(
    `<text class="axis-label x-label" x="${px((left + right) / 2)}" y="${PLOT_HEIGHT - 8}" text-anchor="middle">${htmlEscape(plot.x.label)}</text>`,
    `<text class="axis-label y-label" transform="translate(14 ${px((top + bottom) / 2)}) rotate(-90)" text-anchor="middle">${htmlEscape(plot.y.label)}</text>`,
  );
  plot.series.forEach((s, k) => {
    const parts: string[] = [];
    const dots: string[] = [];
    let pen = 'M';
    let drawn = 0;
    for (let i = 0; i < s.x.length; i++) {
      const v = s.y[i];
      // beyond a fixed y range the line runs on outside the frame, where the clip path hides it
      if (v === null || v === undefined || !X.inside(s.x[i]) || !Number.isFinite(v) || (plot.y.log && v <= 0)) {
        pen = 'M';
        continue;
      }
      const x = px(X.at(s.x[i]));
      const y = px(Y.at(v));
      parts.push(`${pen}${x} ${y}`);
      pen = 'L';
      drawn++;
      if (s.dots) dots.push(`<circle class="dot s${k % 4}" cx="${x}" cy="${y}" r="3"/>`);
    }
    out.push(
      `<path class="series s${k % 4}" data-series="${htmlEscape(s.name)}" data-points="${drawn}" fill="none" clip-path="url(#${clip})" d="${parts.join('')}"/>`,
      ...dots,
    );
  });
  for (const m of plot.xMarks ?? []) {
    if (!X.inside(m.at)) continue;
    const x = px(X.at(m.at));
    // a label right of the middle reads leftwards from its line, so that it stays inside the frame
    const end = x > (left + right) / 2;
    out.push(
      `<g class="mark" data-mark="${htmlEscape(m.label)}"><line x1="${x}" y1="${top}" x2="${x}" y2="${bottom}"/>` +
        `<text x="${end ? x - 4 : x + 4}" y="${top + 12}" text-anchor="${end ? 'end' : 'start'}">${htmlEscape(m.label)}</text></g>`,
    );
  }
  for (const m of plot.yMarks ?? []) {
    if (!Y.inside(m.at)) continue;
    const y = px(Y.at(m.at));
    out.push(
      `<g class="mark" data-mark="${htmlEscape(m.label)}"><line x1="${left}" y1="${y}" x2="${right}" y2="${y}"/>` +
        `<text x="${right - 4}" y="${y - 4}" text-anchor="end">${htmlEscape(m.label)}</text></g>`,
    );
  }
  out.push('</svg>');
  const legend = plot.series
    .map(
      (s, k) =>
        `<li><svg class="swatch" viewBox="0 0 28 8" width="28" height="8" aria-hidden="true"><line class="series s${k % 4}" x1="0" y1="4" x2="28" y2="4"/></svg>${htmlEscape(s.name)}</li>`,
    )
    .join('');
  return (
    `<figure class="plot" data-plot="${htmlEscape(plot.id)}">` +
    `<figcaption>${htmlEscape(plot.title)}</figcaption>` +
    out.join('\n') +
    `<ul class="legend">${legend}</ul></figure>\n`
  );
}
