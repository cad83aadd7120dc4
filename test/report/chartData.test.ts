/**
 * The report layer draws the engine's series as given: each chart hands its series to the plotter
 * unchanged (only the unit conversion V -> LSB and the per-column envelope of the step record), the
 * compare overlays go to the plotter and to the JSON as they are, and the CSV prints the records'
 * numbers. The data themselves are tested against closed forms in test/engine (chartSeries.test.ts,
 * compareOverlays.test.ts); here a sign flip or any other change between the data and the drawing
 * fails.
 */
import { describe, expect, it, vi } from 'vitest';

vi.mock('../../src/report/lineChart.js', async (importOriginal) => {
  const mod = await importOriginal<typeof import('../../src/report/lineChart.js')>();
  return { ...mod, lineChart: vi.fn(mod.lineChart) };
});
vi.mock('asciichart', async (importOriginal) => {
  const mod = await importOriginal<typeof import('asciichart')>();
  return { ...mod, plot: vi.fn(mod.plot) };
});

import { plot } from 'asciichart';
import { analyzeProject } from '../../src/engine/analyze.js';
import { chartSeries } from '../../src/engine/chartSeries.js';
import { compareOverlays } from '../../src/engine/compareOverlays.js';
import { waveformRecords } from '../../src/engine/waveformRecords.js';
import { envelope, reportCharts } from '../../src/report/charts.js';
import { compareReport } from '../../src/report/compare.js';
import { waveformCsv } from '../../src/report/csv.js';
import { lineChart } from '../../src/report/lineChart.js';
import { oneStageProject } from './projectFixture.js';

// Invented: 1 kohm + 1 uF behind 25 ohm, 10 kOhm load (DC error well away from 0), 10 kHz, 10 bits.
const project = oneStageProject({ loadResistance: 10e3 });
const analysis = analyzeProject(project);

describe('reportCharts draws the series it is given', () => {
  const series = chartSeries(analysis, project.pwm.duty);
  vi.mocked(lineChart).mockClear();
  const charts = reportCharts(analysis, series);
  const calls = vi.mocked(lineChart).mock.calls;

  it('one plot per chart, in the documented order', () => {
    expect(charts).toHaveLength(5);
    expect(calls).toHaveLength(5);
  });

  it('(a) steady state: the deviation from the average, two periods', () => {
    expect(calls[0][0]).toEqual([series.steady.deviation]);
    expect(calls[0][1].x).toMatchObject({ start: 0, end: series.steady.t.at(-1) });
  });

  it('(b) step response: the per-column envelope of the record, band lines around the final value', () => {
    const { upper, lower } = envelope(series.step.wave, series.columns);
    expect(calls[1][0]).toEqual([upper, lower]);
    expect(calls[2][0]).toEqual([upper, lower]);
    expect(calls[1][1].levels?.map((l) => l.y)).toEqual([series.step.final + series.step.band, series.step.final - series.step.band]);
  });

  it('(c) magnitude: the gain in dB on the log axis from the first to the last frequency', () => {
    expect(calls[3][0]).toEqual([series.magnitude.gainDb]);
    expect(calls[3][1].x).toMatchObject({ start: series.magnitude.frequency[0], end: series.magnitude.frequency.at(-1), log: true });
    expect(calls[3][1].markers?.map((m) => m.x)).toEqual([series.magnitude.cutoff, series.magnitude.pwmFrequency]);
  });

  it('(d) DC error: ideal - average in LSB, the same sign as the data (README "Sign convention")', () => {
    const lsb = analysis.lsb as number;
    expect(calls[4][0]).toEqual([series.dcError.error.map((e) => e / lsb)]);
    // the load pulls the output down: positive error, so the y axis is all positive
    expect(Math.min(...(calls[4][0][0] as number[]))).toBeGreaterThan(0);
  });
});

describe('compareReport draws and writes the overlays it is given', () => {
  const head = { label: 'head.yaml', project: oneStageProject({ loadResistance: 47e3, c: 2.2e-6 }), analysis: analyzeProject(oneStageProject({ loadResistance: 47e3, c: 2.2e-6 })) };
  const base = { label: 'base.yaml', project, analysis };
  const overlays = compareOverlays(base.analysis, head.analysis, 60);

  it('JSON: the overlays verbatim', () => {
    const j = JSON.parse(compareReport(base, head, overlays, 'json'));
    expect(j.waveforms.steady).toEqual({ ...overlays.steady, quantity: 'output minus ideal, V' });
    expect(j.waveforms.step).toEqual({ ...overlays.step, quantity: 'output, V' });
  });

  it('text: base and head series go to the plotter unchanged', () => {
    vi.mocked(plot).mockClear();
    compareReport(base, head, overlays, 'text');
    const drawn = vi.mocked(plot).mock.calls.map((c) => c[0]);
    expect(drawn).toEqual([[overlays.steady.base], [overlays.steady.head], [overlays.step.base], [overlays.step.head]]);
  });
});

describe('waveformCsv prints the records', () => {
  it('one line per sample, steady then step, numbers as given', () => {
    const r = waveformRecords(analysis);
    const lines = waveformCsv(r).trimEnd().split('\n');
    expect(lines[0]).toBe('time_s,output_V,waveform,duty');
    const rows = lines.slice(1).map((l) => l.split(','));
    expect(rows).toHaveLength(r.steady.wave.t.length + r.step.wave.t.length);
    r.steady.wave.t.forEach((t, i) => expect(rows[i]).toEqual([String(t), String(r.steady.wave.v[i]), 'steady', String(r.steady.duty)]));
    const k = r.steady.wave.t.length;
    r.step.wave.t.forEach((t, i) => expect(rows[k + i]).toEqual([String(t), String(r.step.wave.v[i]), 'step', String(r.step.to)]));
  });
});
