import { formatEng } from '../units/index.js';
import { axisFormatter } from './axis.js';
import { htmlEscape } from './htmlEscape.js';
import type { PlotAxis, PlotMark } from './svgPlot.js';
import { PLOT_HEIGHT, PLOT_WIDTH } from './svgPlot.js';
import { svgTicks } from './svgTicks.js';

export interface HistogramPlot {
  id: string;
  title: string;
  x: PlotAxis;
  /** Equal-width bins over [lo, hi] (numeric/statistics.ts histogram). */
  lo: number;
  hi: number;
  counts: readonly number[];
  /** The spec limit, drawn as a vertical line; bins wholly beyond it are drawn as failing. */
  limit?: PlotMark;
  /** Samples left out (not finite: a step that never settles), said under the plot. */
  notFinite?: number;
}

const M = { left: 62, right: 34, top: 14, bottom: 46 };
const px = (v: number) => Number(v.toFixed(2));

/**
 * A histogram as an inline SVG figure: one `<rect class="bar">` per bin (`data-count` its count,
 * `data-lo`/`data-hi` its edges in SI units), bins beyond the limit classed `over`, the limit as
 * a labelled vertical line, count ticks on y and engineering ticks on x.
 *
 * Syntax: svgHistogram(plot)
 * Example: svgHistogram({ id: 'ripple', title: 'Worst ripple', x: { label: 'ripple', unit: 'V' },
 *                         lo: 0, hi: 1e-3, counts: [3, 9, 4], limit: { at: 8e-4, label: 'limit' } })
 */
export function svgHistogram(plot: HistogramPlot): string {
  const left = M.left;
  const right = PLOT_WIDTH - M.right;
  const top = M.top;
  const bottom = PLOT_HEIGHT - M.bottom;
  const n = plot.counts.length;
  // a single value (every sample alike) still gets a visible bar
  const [lo, hi] = plot.hi > plot.lo ? [plot.lo, plot.hi] : [plot.lo - Math.abs(plot.lo || 1) * 0.05, plot.hi + Math.abs(plot.hi || 1) * 0.05];
  const xAt = (v: number) => left + ((v - lo) / (hi - lo)) * (right - left);
  const most = Math.max(1, ...plot.counts);
  const yTicks = svgTicks(0, most, { target: 5 }).filter((t) => Number.isInteger(t));
  // headroom above the tallest bar, so that it does not merge with the frame
  const yMax = Math.max(most * 1.08, yTicks[yTicks.length - 1] ?? most);
  const yAt = (c: number) => bottom - (c / yMax) * (bottom - top);
  const xTicks = svgTicks(lo, hi);
  const xLabel = plot.x.format ?? axisFormatter(xTicks[0] ?? lo, xTicks[xTicks.length - 1] ?? hi, Math.max(1, xTicks.length - 1), plot.x.unit, !plot.x.plain);
  const out: string[] = [
    `<svg class="plot-svg" xmlns="http://www.w3.org/2000/svg" viewBox="0 0 ${PLOT_WIDTH} ${PLOT_HEIGHT}" role="img" aria-label="${htmlEscape(plot.title)}">`,
    `<title>${htmlEscape(plot.title)}</title>`,
  ];
  const grid = yTicks.map((t) => `<line x1="${left}" y1="${px(yAt(t))}" x2="${right}" y2="${px(yAt(t))}"/>`);
  out.push(`<g class="grid">${grid.join('')}</g>`);
  const width = (hi - lo) / Math.max(1, n);
  plot.counts.forEach((count, i) => {
    const a = plot.hi > plot.lo ? lo + i * width : lo;
    const b = plot.hi > plot.lo ? a + width : hi;
    const over = plot.limit !== undefined && a >= plot.limit.at;
    const x = px(xAt(a) + 0.5);
    const y = px(yAt(count));
    out.push(
      `<rect class="bar${over ? ' over' : ''}" data-count="${count}" data-lo="${a}" data-hi="${b}" x="${x}" y="${y}" width="${px(Math.max(0.5, xAt(b) - xAt(a) - 1))}" height="${px(bottom - y)}"><title>${htmlEscape(`${formatEng(a, plot.x.unit, 4)} to ${formatEng(b, plot.x.unit, 4)}: ${count}`)}</title></rect>`,
    );
  });
  out.push(`<rect class="frame" x="${left}" y="${top}" width="${right - left}" height="${bottom - top}"/>`);
  const labels = [
    ...xTicks.map((t) => `<text class="tick x-tick" x="${px(xAt(t))}" y="${bottom + 16}" text-anchor="middle">${htmlEscape(xLabel(t))}</text>`),
    ...yTicks.map((t) => `<text class="tick y-tick" x="${left - 6}" y="${px(yAt(t)) + 4}" text-anchor="end">${t}</text>`),
  ];
  out.push(`<g class="ticks">${labels.join('')}</g>`);
  out.push(
    `<text class="axis-label x-label" x="${px((left + right) / 2)}" y="${PLOT_HEIGHT - 8}" text-anchor="middle">${htmlEscape(plot.x.label)}</text>`,
    `<text class="axis-label y-label" transform="translate(14 ${px((top + bottom) / 2)}) rotate(-90)" text-anchor="middle">samples</text>`,
  );
  if (plot.limit && plot.limit.at >= lo && plot.limit.at <= hi) {
    const x = px(xAt(plot.limit.at));
    const anchor = x > (left + right) / 2 ? 'end' : 'start';
    out.push(
      `<g class="mark limit" data-mark="${htmlEscape(plot.limit.label)}"><line x1="${x}" y1="${top}" x2="${x}" y2="${bottom}"/>` +
        `<text x="${anchor === 'end' ? x - 4 : x + 4}" y="${top + 12}" text-anchor="${anchor}">${htmlEscape(plot.limit.label)}</text></g>`,
    );
  }
  out.push('</svg>');
  const note = plot.notFinite ? `<p class="note">${plot.notFinite} samples not drawn: they never settle.</p>` : '';
  return `<figure class="plot histogram" data-plot="${htmlEscape(plot.id)}"><figcaption>${htmlEscape(plot.title)}</figcaption>${out.join('\n')}${note}</figure>\n`;
}
