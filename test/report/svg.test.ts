/**
 * The SVG writer: tick choice (1-2-5 steps, decades), one path per series with the right number of
 * points and gaps, axis labels and marks, coordinates that keep straight lines straight and
 * decades evenly spaced, and histogram bars whose counts are the data's.
 */
import { describe, expect, it } from 'vitest';
import { svgHistogram } from '../../src/report/svgHistogram.js';
import { svgPlot } from '../../src/report/svgPlot.js';
import { svgTicks } from '../../src/report/svgTicks.js';
import { histogram } from '../../src/numeric/statistics.js';

/** The `d` attribute of each series path as [x, y] pairs, split at gaps (an `M`). */
function paths(svg: string): Array<{ name: string; points: number; runs: number[][][] }> {
  return [...svg.matchAll(/<path class="series[^"]*" data-series="([^"]*)" data-points="(\d+)" fill="none"[^>]* d="([^"]*)"/g)].map((m) => ({
    name: m[1],
    points: Number(m[2]),
    runs: m[3]
      .split('M')
      .filter((r) => r.length > 0)
      .map((r) => r.split('L').map((p) => p.trim().split(' ').map(Number))),
  }));
}

describe('svgTicks', () => {
  it('steps of 1, 2 or 5 times a power of ten (common practice)', () => {
    expect(svgTicks(0, 1)).toEqual([0, 0.2, 0.4, 0.6, 0.8, 1]);
    expect(svgTicks(-3.2e-4, 2.1e-4)).toEqual([-3e-4, -2e-4, -1e-4, 0, 1e-4, 2e-4]);
    expect(svgTicks(3, 47)).toEqual([10, 20, 30, 40]);
  });
  it('decades on a log axis, with 2 and 5 when it spans fewer than three', () => {
    expect(svgTicks(1, 1e5, { log: true })).toEqual([1, 10, 100, 1000, 10000, 100000]);
    expect(svgTicks(30, 900, { log: true })).toEqual([50, 100, 200, 500]);
  });
  it('nothing to tick on an empty or reversed range', () => {
    expect(svgTicks(1, 1)).toEqual([1]);
    expect(svgTicks(NaN, 1)).toEqual([]);
  });
});

describe('svgPlot', () => {
  const x = Array.from({ length: 11 }, (_, i) => i / 10);
  const svg = svgPlot({
    id: 'demo',
    title: 'Demo <plot> & more',
    x: { label: 'time', unit: 's' },
    y: { label: 'output', unit: 'V' },
    series: [
      { name: 'line', x, y: x.map((t) => 2 * t + 1) },
      { name: 'gappy', x, y: x.map((t, i) => (i === 4 || i === 5 ? null : 3 - t)) },
    ],
    xMarks: [{ at: 0.3, label: 'settled 300 ms' }],
    yBand: { lo: 2.9, hi: 3.1, label: 'band ±100 mV' },
  });

  it('one path per series, each with its number of points; a missing y splits the line', () => {
    const p = paths(svg);
    expect(p.map((s) => s.name)).toEqual(['line', 'gappy']);
    expect(p[0].points).toBe(11);
    expect(p[0].runs).toHaveLength(1);
    expect(p[0].runs[0]).toHaveLength(11);
    expect(p[1].points).toBe(9);
    expect(p[1].runs.map((r) => r.length)).toEqual([4, 5]);
  });

  it('a straight line stays straight and rises upwards (SVG y grows downwards)', () => {
    const pts = paths(svg)[0].runs[0];
    const slope = (pts[10][1] - pts[0][1]) / (pts[10][0] - pts[0][0]);
    expect(slope).toBeLessThan(0);
    for (const [px, py] of pts) expect(py).toBeCloseTo(pts[0][1] + slope * (px - pts[0][0]), 1); // 2-decimal coordinates
  });

  it('axis labels, tick labels in engineering units, the mark and the band, the title escaped', () => {
    expect(svg).toContain('>time</text>');
    expect(svg).toContain('>output</text>');
    expect(svg).toMatch(/class="tick x-tick"[^>]*>0\.20 s</); // axis.ts: one decimal more than the step needs
    expect(svg).toMatch(/class="tick y-tick"[^>]*>[\d.]+ V</);
    expect(svg).toContain('data-mark="settled 300 ms"');
    expect(svg).toContain('data-band="band ±100 mV"');
    expect(svg).toContain('Demo &lt;plot&gt; &amp; more');
    expect(svg).not.toContain('<plot>');
    expect(svg.match(/<li>/g)).toHaveLength(2); // legend
  });

  it('decades are evenly spaced on a log axis', () => {
    const f = [10, 100, 1000, 10000];
    const log = svgPlot({ id: 'm', title: 'm', x: { label: 'f', unit: 'Hz', log: true }, y: { label: 'g', unit: 'dB', plain: true }, series: [{ name: 'g', x: f, y: [0, -1, -20, -40] }] });
    const xs = paths(log)[0].runs[0].map((p) => p[0]);
    expect(xs[1] - xs[0]).toBeCloseTo(xs[2] - xs[1], 1);
    expect(xs[3] - xs[2]).toBeCloseTo(xs[2] - xs[1], 1);
    expect(log).toContain('>1 kHz</text>');
  });

  it('a log axis leaves out values that are not positive', () => {
    const log = svgPlot({ id: 'm', title: 'm', x: { label: 'f', unit: 'Hz' }, y: { label: 't', unit: 's', log: true }, series: [{ name: 't', x: [1, 2, 3], y: [1e-3, 0, 1e-2] }] });
    expect(paths(log)[0].points).toBe(2);
  });
});

describe('svgHistogram', () => {
  // invented samples: 100 values spread over [0, 1)
  const values = Array.from({ length: 100 }, (_, i) => ((i * 37) % 100) / 100);
  const h = histogram(values, 10, [0.85]);
  const svg = svgHistogram({ id: 'r', title: 'Ripple', x: { label: 'ripple', unit: 'V' }, lo: h.lo, hi: h.hi, counts: h.counts, limit: { at: 0.85, label: 'limit 850 mV' } });
  const bars = [...svg.matchAll(/<rect class="bar( over)?" data-count="(\d+)" data-lo="([^"]+)" data-hi="([^"]+)"/g)];

  it('one bar per bin, holding the bin counts of the data', () => {
    expect(bars).toHaveLength(10);
    expect(bars.map((b) => Number(b[2]))).toEqual(h.counts);
    expect(bars.reduce((s, b) => s + Number(b[2]), 0)).toBe(100);
    // each bar's count is the number of samples between its edges (the last edge included)
    for (const b of bars) {
      const [lo, hi] = [Number(b[3]), Number(b[4])];
      const inside = values.filter((v) => v >= lo && (v < hi || (hi === h.hi && v <= hi))).length;
      expect(Number(b[2])).toBe(inside);
    }
  });

  it('the limit is drawn and bins beyond it are marked as failing', () => {
    expect(svg).toContain('data-mark="limit 850 mV"');
    const over = bars.filter((b) => b[1] === ' over').map((b) => Number(b[3]));
    expect(over.length).toBeGreaterThan(0);
    for (const lo of over) expect(lo).toBeGreaterThanOrEqual(0.85);
    expect(svg).toContain('>ripple</text>');
    expect(svg).toContain('>samples</text>');
  });
});

describe('svgPlot with a fixed range', () => {
  it('keeps the range and clips the lines at the frame', () => {
    const svg = svgPlot({ id: 'zoom 1', title: 'z', x: { label: 't', unit: 's' }, y: { label: 'v', unit: 'V', range: [0.9, 1.1] }, series: [{ name: 'v', x: [0, 1, 2], y: [0, 1, 2] }] });
    expect(svg).toContain('<clipPath id="clip-zoom_1">');
    expect(svg).toContain('clip-path="url(#clip-zoom_1)"');
    // ticks only inside the range
    const ticks = [...svg.matchAll(/class="tick y-tick"[^>]*>([^<]*)</g)].map((m) => m[1]);
    expect(ticks[0]).toBe('0.900 V'); // axis.ts: one prefix per axis, from its largest value
    expect(ticks[ticks.length - 1]).toBe('1.100 V');
  });
});
