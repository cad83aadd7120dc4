import { describe, expect, it } from 'vitest';
import { analyzeProject } from '../../src/engine/analyze.js';
import { chartSeries } from '../../src/engine/chartSeries.js';
import type { Project } from '../../src/project/types.js';
import { jsonReport } from '../../src/report/json.js';
import { markdownReport } from '../../src/report/markdown.js';
import { textReport } from '../../src/report/text.js';
import { oneStageProject } from './projectFixture.js';

// 4.7 kohm + 100 nF behind 25 ohm, 3.3 V, 1 MHz, 10 bits, open output (invented example).
const project: Project = {
  ...oneStageProject({ r: 4.7e3, c: 100e-9, frequency: 1e6 }),
  spec: { ripple: 5e-3, droop: 1e-3, settling: { band: 1.6e-3, time: 5e-3 } },
};
const analysis = analyzeProject(project, { duties: [0.25, 0.5] });

describe('text report', () => {
  const charts = chartSeries(analysis, project.pwm.duty);
  const text = textReport(project, analysis, { charts });

  it('writes values in engineering form with SI prefixes (SI Brochure) and IEC 60062 codes', () => {
    expect(text).toContain('4.7 kΩ');
    expect(text).toMatch(/\b4k7\b/);
    expect(text).toContain('100 nF');
    expect(text).toMatch(/\b100n\b/);
    // LSB = 3.3 V / 2^10 = 3.2227 mV, period = 1 / 10 kHz = 100 µs.
    expect(text).toContain('LSB 3.223 mV');
    expect(text).toContain('period 1 µs');
    // Pin peak current 3.3 V / 4725 ohm = 698.4 µA (design notes definition).
    expect(text).toMatch(/Pin peak current:\s+698 µA/);
    // Single pole 1 / (2 pi 4725 ohm 100 nF) = 336.8 Hz (textbook RC low-pass).
    expect(text).toMatch(/Cutoff \(-3 dB\):\s+337 Hz/);
  });

  it('has a row per duty with ideal output, DC error and ripple columns in mV and LSB', () => {
    const row = text.split('\n').find((l) => /^\s+25\.0\s/.test(l))!;
    const cells = row.trim().split(/\s+/);
    expect(cells).toHaveLength(7);
    expect(cells[2]).toBe('0.82500'); // ideal = 0.25 x 3.3 V
    const p = analysis.points[0];
    expect(Number(cells[5])).toBeCloseTo(p.ripple * 1e3, 3);
    expect(Number(cells[6])).toBeCloseTo(p.ripple / (3.3 / 1024), 3);
  });

  it('has a spec table with PASS/FAIL per check and a verdict', () => {
    for (const c of analysis.checks) {
      expect(text).toMatch(new RegExp(`\\n\\s+${c.name}\\s.*\\s${c.pass ? 'PASS' : 'FAIL'}\\n`));
    }
    expect(analysis.pass).toBe(true);
    expect(text).toMatch(/\nPASS: all 3 spec checks hold\.\n$/);
  });

  it('draws the four kinds of chart with their markers and no ANSI codes by default', () => {
    expect(text).toContain('over two PWM periods at duty');
    expect(text).toMatch(/Step response \(step /);
    expect(text).toMatch(/\n\s+S settled at /);
    expect(text).toMatch(/\n\s+c cutoff 337 Hz/);
    // the magnitude chart marks the gain there (negative dB); the figures give the attenuation (positive)
    expect(text).toMatch(/\n\s+P PWM frequency 1 MHz: gain -\d+\.\d dB/);
    expect(text).toMatch(/Attenuation at the PWM frequency:\s+\d+\.\d dB/);
    expect(text).toMatch(/DC error \(ideal - average\) across the used duty range, LSB/);
    expect(text).not.toMatch(/\x1b\[/);
    expect(textReport(project, analysis)).not.toContain('Charts');
  });

  it('says plainly when the output never settles', () => {
    const p: Project = { ...project, spec: { settling: { band: 1e-5, time: 1 } } };
    const a = analyzeProject(p, { duties: [0.5] });
    const t = textReport(p, a);
    expect(t).toMatch(/never settles: ripple exceeds the band/);
    expect(t).toMatch(/\n\s+settling\s+never settles\s.*FAIL\n/);
    expect(t).toMatch(/\nFAIL: settling \(1 of 1 spec checks\)\.\n$/);
  });
});

describe('markdown report', () => {
  const md = markdownReport(project, analysis, { charts: chartSeries(analysis, project.pwm.duty) });
  const lines = md.split('\n');

  it('writes GitHub-flavoured pipe tables: header, alignment row, equal cell counts', () => {
    const cells = (l: string) => l.replace(/\\\|/g, '').split('|').length - 2;
    let tables = 0;
    for (let i = 0; i < lines.length; i++) {
      if (!lines[i].startsWith('|') || (i > 0 && lines[i - 1].startsWith('|'))) continue;
      tables++;
      expect(lines[i + 1]).toMatch(/^\|(:?-{3,}:?\|)+$/);
      const n = cells(lines[i]);
      for (let j = i; j < lines.length && lines[j].startsWith('|'); j++) {
        expect(lines[j].endsWith('|')).toBe(true);
        expect(cells(lines[j])).toBe(n);
      }
    }
    expect(tables).toBeGreaterThanOrEqual(5);
  });

  it('puts charts in fenced blocks and has the same sections as the text report', () => {
    expect(md.match(/^```/gm)!.length % 2).toBe(0);
    expect(md.match(/^```text$/gm)!.length).toBe(5);
    for (const s of ['Inputs', 'Output at each duty', 'Spec', 'Figures', 'Charts', 'Cautions']) {
      expect(md).toMatch(new RegExp(`^## ${s}`, 'm'));
    }
    expect(md.startsWith('# ')).toBe(true);
  });
});

describe('json report', () => {
  const json = JSON.parse(jsonReport(project, analysis));

  it('holds the contract keys of the design notes in SI units', () => {
    expect(Object.keys(json.points[0])).toEqual(expect.arrayContaining(['duty', 'average', 'min', 'max', 'ripple']));
    expect(json.points.map((p: { duty: number }) => p.duty)).toEqual([0.25, 0.5]);
    expect(Object.keys(json.worstRipple).sort()).toEqual(['duty', 'ripple']);
    expect(Object.keys(json.settling).sort()).toEqual(['band', 'from', 'time', 'to']);
    expect(json.cutoff).toBeCloseTo(1 / (2 * Math.PI * 4725 * 100e-9), 6);
    expect(json.checks.map((c: { name: string }) => c.name)).toEqual(['ripple', 'droop', 'settling']);
    for (const c of json.checks) expect(Object.keys(c)).toEqual(expect.arrayContaining(['name', 'value', 'limit', 'pass']));
    expect(typeof json.pass).toBe('boolean');
    expect(json.lsb).toBeCloseTo(3.3 / 1024, 15);
    expect(json.inputs.stages).toEqual([{ r: 4700, c: 100e-9, buffered: false }]);
    expect(json.ladder).toBeUndefined();
  });
});
