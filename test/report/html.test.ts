/**
 * The HTML reports: every plot has its series with the engine's number of points, the marks the
 * issue asks for, the embedded JSON is the command's JSON report, the numbers in the tables equal
 * the JSON's, and the page is self-contained (nothing to fetch, no script to run) with dark-mode
 * and print styles.
 */
import { describe, expect, it } from 'vitest';
import { designSearch } from '../../src/design/designSearch.js';
import { tradeoffCurves } from '../../src/design/tradeoffCurves.js';
import { analyzeProject, chartSeries, compareOverlays } from '../../src/engine/index.js';
import { loadProject, parseProject } from '../../src/project/index.js';
import { analysisHtml, HTML_PLOT_POINTS } from '../../src/report/analysisHtml.js';
import { compareReport } from '../../src/report/compare.js';
import { designReport } from '../../src/report/design.js';
import { jsonReport } from '../../src/report/json.js';
import { toleranceReport } from '../../src/report/tolerance.js';
import { toleranceStudy } from '../../src/tolerance/study.js';

/** The figure of one plot (`data-plot`), and its series as { name: points }. */
function plot(html: string, id: string) {
  const figure = html.match(new RegExp(`<figure class="plot[^"]*" data-plot="${id}">[\\s\\S]*?</figure>`))?.[0];
  if (!figure) throw new Error(`no plot ${id}`);
  const series = Object.fromEntries([...figure.matchAll(/data-series="([^"]*)" data-points="(\d+)"/g)].map((m) => [m[1], Number(m[2])]));
  const marks = [...figure.matchAll(/data-mark="([^"]*)"/g)].map((m) => m[1]);
  return { figure, series, marks };
}

/** The JSON the page embeds for programs (`<script type="application/json">`). */
function embedded(html: string): unknown {
  const m = html.match(/<script type="application\/json" id="report-data">([\s\S]*?)<\/script>/);
  if (!m) throw new Error('no embedded JSON');
  return JSON.parse(m[1]);
}

/** A page fetches nothing and runs nothing: no src/href to anywhere, no script but the JSON block. */
function expectSelfContained(html: string) {
  expect(html.startsWith('<!DOCTYPE html>')).toBe(true);
  expect(html).not.toMatch(/\s(src|href)=/);
  expect(html).not.toMatch(/url\((?!#)/); // only references inside the page (clip paths)
  expect(html.match(/<script/g)).toHaveLength(1);
  expect(html).toContain('<script type="application/json"');
  expect(html).toContain('prefers-color-scheme:dark');
  expect(html).toContain('@media print');
}

describe('analysis HTML (greenhouse sample)', () => {
  const project = loadProject('sample-configs/greenhouse-heater.yaml');
  const analysis = analyzeProject(project);
  const series = chartSeries(analysis, project.pwm.duty, { columns: HTML_PLOT_POINTS });
  const html = analysisHtml(project, analysis, series);

  it('is one self-contained page', () => expectSelfContained(html));

  it('draws the five plots, each series with the engine series’ number of points', () => {
    const steady = plot(html, 'steady');
    expect(Object.values(steady.series)).toEqual([series.steady.t.length]);
    const step = plot(html, 'step');
    expect(Object.values(step.series)).toEqual([series.step.wave.t.length]);
    expect(step.figure).toContain('class="band"');
    expect(step.marks).toHaveLength(1);
    expect(step.marks[0]).toMatch(/^settled /);
    const zoom = plot(html, 'step-zoom');
    expect(Object.values(zoom.series)).toEqual([series.step.wave.t.length]);
    expect(zoom.figure).toContain('class="band"');
    expect(zoom.figure).toMatch(/clip-path="url\(#clip-step-zoom\)"/);
    const magnitude = plot(html, 'magnitude');
    expect(Object.values(magnitude.series)).toEqual([series.magnitude.frequency.length]);
    expect(magnitude.marks.some((m) => m.startsWith('cutoff '))).toBe(true);
    expect(magnitude.marks.some((m) => m.startsWith('PWM '))).toBe(true);
    const dc = plot(html, 'dc-error');
    expect(Object.values(dc.series)).toEqual([series.dcError.duty.length]);
    expect(html.match(/data-plot="/g)).toHaveLength(5);
    for (const p of [steady, step, zoom, magnitude, dc]) expect(p.figure.match(/class="axis-label/g)).toHaveLength(2);
  });

  it('embeds exactly the JSON report', () => {
    expect(embedded(html)).toEqual(JSON.parse(jsonReport(project, analysis)));
  });

  it('the table of duties shows the JSON’s averages and ripples', () => {
    const json = JSON.parse(jsonReport(project, analysis)) as { points: Array<{ duty: number; average: number; ripple: number }> };
    const table = html.match(/<h2>Output at each duty \(steady state\)<\/h2>\s*<table>[\s\S]*?<\/table>/)?.[0] ?? '';
    const rows = [...table.matchAll(/<tr>(<td[\s\S]*?)<\/tr>/g)].map((r) => [...r[1].matchAll(/<td[^>]*>([^<]*)<\/td>/g)].map((c) => c[1]));
    expect(rows).toHaveLength(json.points.length);
    rows.forEach((cells, i) => {
      expect(Number(cells[0])).toBeCloseTo(100 * json.points[i].duty, 1);
      expect(Number(cells[1])).toBeCloseTo(json.points[i].average, 5);
      expect(Number(cells[5])).toBeCloseTo(1000 * json.points[i].ripple, 3); // ripple (mV)
    });
  });

  it('without series the page has no plots but the same tables', () => {
    const bare = analysisHtml(project, analysis);
    expect(bare).not.toContain('data-plot=');
    expect(bare).toContain('<h2>Spec</h2>');
  });
});

describe('design HTML', () => {
  // invented scenario (the one of test/report/design.test.ts)
  const project = parseProject(
    `pwm: { frequency: 20 kHz, bits: 10, high: 3.3 V, low: 0 V, driver: 30 ohm, duty: { min: 5 %, max: 95 % } }
load: { resistance: 220k }
filter: { stages: [{ r: 10k, c: 1u }] }
spec: { ripple: 0.5 LSB, droop: 2 % }
search: { stages: [1, 2], series: E6, resistance: { min: 1k, max: 10k }, capacitance: { min: 10n, max: 1u } }
`,
    'invented.yaml',
  );
  const result = designSearch(project, { top: 3 });
  const tradeoff = tradeoffCurves(project, [1, 2], project.spec.ripple!, { points: 5 });
  const html = designReport(project, result, 'html', { tradeoff });

  it('is one self-contained page embedding the JSON report', () => {
    expectSelfContained(html);
    expect(embedded(html)).toEqual(JSON.parse(designReport(project, result, 'json', { tradeoff })));
  });

  it('the trade-off plot has one line per stage count, a point per feasible ripple limit, and the spec limit', () => {
    const p = plot(html, 'tradeoff');
    expect(Object.keys(p.series)).toEqual(['1 stage', '2 stages']);
    tradeoff.forEach((c, i) => expect(Object.values(p.series)[i]).toBe(c.points.filter((x) => x.settlingTime !== null).length));
    expect(p.marks.some((m) => m.startsWith('spec ripple'))).toBe(true);
    // the ASCII chart is replaced, not repeated
    expect(html).not.toContain('<pre>settling');
  });
});

describe('tolerance HTML', async () => {
  const project = loadProject('sample-configs/tolerance-fan-reference.yaml');
  const study = await toleranceStudy(project, undefined, { samples: 400, seed: 7, workers: 1 });
  const html = toleranceReport(project, study, 'html');
  const json = JSON.parse(toleranceReport(project, study, 'json')) as {
    limits: Record<string, number | undefined>;
    monteCarlo: { histograms: Record<string, { counts: number[] }> };
  };

  it('is one self-contained page embedding the JSON report', () => {
    expectSelfContained(html);
    expect(embedded(html)).toEqual(json);
  });

  it('each histogram holds the JSON’s bin counts and draws its limit', () => {
    const ids = { worstRipple: 'mc-ripple', droop: 'mc-droop', settlingTime: 'mc-settling' } as const;
    for (const [key, id] of Object.entries(ids)) {
      const p = plot(html, id);
      const counts = [...p.figure.matchAll(/class="bar[^"]*" data-count="(\d+)"/g)].map((m) => Number(m[1]));
      expect(counts).toEqual(json.monteCarlo.histograms[key].counts);
    }
    expect(plot(html, 'mc-ripple').marks.some((m) => m.startsWith('limit '))).toBe(json.limits.ripple !== undefined);
  });
});

describe('compare HTML', () => {
  const text = (r: string) => `pwm: { frequency: 10 kHz, bits: 10, high: 3.3 V, low: 0 V, driver: 50 ohm, duty: { min: 5 %, max: 95 % } }
filter: { stages: [{ r: ${r}, c: 1u }] }
spec: { ripple: 1 LSB, gain: none }
`;
  const side = (label: string, r: string) => {
    const project = parseProject(text(r), label);
    return { label, project, analysis: analyzeProject(project) };
  };
  // invented: the resistor doubled
  const base = side('base.yaml', '4.7k');
  const head = side('head.yaml', '10k');
  const overlays = compareOverlays(base.analysis, head.analysis, 50);
  const html = compareReport(base, head, overlays, 'html');

  it('is one self-contained page embedding the JSON report', () => {
    expectSelfContained(html);
    expect(embedded(html)).toEqual(JSON.parse(compareReport(base, head, overlays, 'json')));
  });

  it('both overlays draw base and head with every grid instant', () => {
    for (const id of ['compare-steady', 'compare-step']) {
      expect(plot(html, id).series).toEqual({ 'base: base.yaml': 50, 'head: head.yaml': 50 });
    }
    expect(html).toContain('<h2>Spec checks</h2>');
  });
});
