import { describe, expect, it } from 'vitest';
import { designSearch } from '../../src/design/designSearch.js';
import { tradeoffCurves } from '../../src/design/tradeoffCurves.js';
import { parseProject } from '../../src/project/index.js';
import { designReport } from '../../src/report/design.js';
import { formatIec60062 } from '../../src/units/index.js';

const yaml = `# invented scenario: a small design problem
pwm: { frequency: 20 kHz, bits: 10, high: 3.3 V, low: 0 V, driver: 30 ohm, duty: { min: 5 %, max: 95 % } }
load: { resistance: 220k }
filter:
  stages:
    - { r: 10k, c: 1u }   # the schematic's first guess
spec:
  ripple: 0.5 LSB
  droop: 2 %
search:
  stages: [1, 2]
  series: E6
  resistance: { min: 1k, max: 10k }
  capacitance: { min: 10n, max: 1u }
`;
const project = parseProject(yaml, 'invented.yaml');
const result = designSearch(project, { top: 3 });

describe('designReport', () => {
  it('JSON holds the contract of model.md: candidates best first with stages, worstRipple, settlingTime, droop, pass; evaluated', () => {
    const body = JSON.parse(designReport(project, result, 'json'));
    expect(body.candidates).toHaveLength(3);
    for (const c of body.candidates) {
      expect(Object.keys(c)).toEqual(expect.arrayContaining(['stages', 'worstRipple', 'settlingTime', 'droop', 'pass']));
      expect(c.stages.every((s: { r: unknown; c: unknown }) => typeof s.r === 'number' && typeof s.c === 'number')).toBe(true);
    }
    expect(body.candidates[0].settlingTime).toBeLessThanOrEqual(body.candidates[1].settlingTime);
    expect(body.evaluated).toBe(result.stats.evaluated);
    expect(body.pass).toBe(true);
    expect(body.current.stages).toEqual([{ r: 10e3, c: 1e-6 }]);
  });

  it('text and Markdown show the values, IEC 60062 codes, margins and the comparison', () => {
    const best = result.candidates[0];
    // Wide enough for every column (at 80 the codes column is the first left out, and says so).
    const text = designReport(project, result, 'text', { width: 300 });
    const md = designReport(project, result, 'markdown');
    expect(designReport(project, result, 'text')).toMatch(/not shown at this width: codes \(IEC 60062\)/);
    for (const out of [text, md]) {
      expect(out).toContain('Recommended designs');
      expect(out).toContain('Compared with the filter: design');
      expect(out).toMatch(/ripple \d+(\.\d+)?%/); // margin to the ripple limit
    }
    // IEC 60062 letter codes of design #1, e.g. 4k7-100n (codes from src/units, tested against IEC 60062)
    const codes = best.stages.map((s) => `${formatIec60062(s.r, 'resistance')}-${formatIec60062(s.c, 'capacitance')}`).join(' + ');
    expect(text).toContain(codes);
    expect(md).toContain(codes);
    expect(md).toMatch(/^\| # \| R1 \/ C1/m);
  });

  it('draws the trade-off chart with the spec marked, one column per stage count', () => {
    const curves = tradeoffCurves(project, [1, 2], project.spec.ripple!, { points: 5 });
    const text = designReport(project, result, 'text', { tradeoff: curves });
    expect(text).toContain('Trade-off: settling time against allowed ripple');
    expect(text).toContain('^ spec ripple limit 0.5 LSB');
    expect(text).toMatch(/ripple limit\s+1 stage\s+2 stages/);
    // a looser ripple limit never makes the best settling slower
    for (const c of curves) {
      const t = c.points.map((p) => p.settlingTime ?? Infinity);
      for (let i = 1; i < t.length; i++) expect(t[i]).toBeLessThanOrEqual(t[i - 1] * (1 + 1e-12));
    }
  });
});

describe('designReport with search.bits: one resolution per LSB figure', () => {
  // Invented scenario: the file runs 8 bits, the search tries 6 to 10.
  const source = `pwm:
  clock: 16 MHz
  bits: 8
  high: 3.3 V
  low: 0 V
  driver: 30 ohm
  duty: { min: 5 %, max: 95 % }
load:
  resistance: 1 Mohm
filter:
  stages:
    - { r: 10k, c: 1u }
spec:
  ripple: 0.5 LSB
  droop: 10 %
  settling: { band: 0.5 LSB, time: 50 ms }
search:
  stages: [1, 2]
  series: E6
  resistance: { min: 1k, max: 100k }
  capacitance: { min: 1n, max: 10u }
  bits: { min: 6, max: 10 }
`;
  const p = parseProject(source, 'bits.yaml');
  const r = designSearch(p, { top: 3 });
  const best = r.candidates[0];
  const lsbAt = r.resolutions.find((x) => x.bits === best.bits)!.lsb;
  const curves = tradeoffCurves(p, [1], 0.5 * lsbAt, { bits: best.bits!, points: 3 });
  // Unwrapped lines, so that each figure and its label stay on one line for the checks below.
  const text = designReport(p, r, 'text', { tradeoff: curves, width: 400 });

  it('names the resolution of every LSB figure, and states LSB limits as holding at each resolution', () => {
    expect(best.bits).not.toBe(8);
    const unlabelled = text.match(/\d LSB(?! @ \d+ bit| at each resolution)/g);
    expect(unlabelled).toBeNull();
    expect(text).toMatch(/ripple 0\.5 LSB at each resolution/);
    // 10 % of 3.3 V full scale, a voltage at every resolution.
    expect(text).toMatch(/droop 330 mV/);
    expect(text).toContain(`${Number((best.worstRipple / lsbAt).toPrecision(3))} LSB @ ${best.bits} bit`);
  });

  it('marks the spec ripple limit on the trade-off chart at the resolution the curves are drawn at', () => {
    expect(text).toContain(`spec ripple limit 0.5 LSB @ ${best.bits} bit`);
  });

  it('names the resolution in the explanation when nothing is feasible', () => {
    const tight = parseProject(source.replace('ripple: 0.5 LSB', 'ripple: 0.01 LSB').replace('time: 50 ms', 'time: 100 us'), 'tight.yaml');
    const none = designSearch(tight, { top: 1 });
    expect(none.feasible).toBe(false);
    const lines = none.diagnosis.join('\n');
    expect(lines).toMatch(/LSB @ \d+ bit/);
    expect(lines).not.toMatch(/\d LSB(?! @ \d+ bit)/);
  });

  it('shows no resolution labels when only one resolution appears', () => {
    const single = designReport(project, result, 'text');
    expect(single).toMatch(/\d LSB/);
    expect(single).not.toMatch(/ @ \d+ bit/);
  });
});
