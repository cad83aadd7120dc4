/**
 * compareReport: figures against handbook formulas for a single RC, the input diff, the check
 * status wording, the overlay waveforms, and the shape of the Markdown and text renderings.
 */
import { describe, expect, it } from 'vitest';
import { analyzeProject } from '../../src/engine/analyze.js';
import { compareOverlays } from '../../src/engine/compareOverlays.js';
import { parseProject } from '../../src/project/index.js';
import { compareReport, type CompareSide } from '../../src/report/compare.js';

/** Invented single-stage project: symmetric 50 ohm driver, open output, no load capacitance. */
function yaml(o: { r?: string; c?: string; ripple?: string; more?: string } = {}): string {
  return `pwm:
  frequency: 10 kHz
  bits: 10
  high: 3.3 V
  low: 0 V
  driver: 50 ohm
  duty: { min: 5 %, max: 95 % }
filter:
  stages:
    - { r: ${o.r ?? '4.7k'}, c: ${o.c ?? '1u'} }
${o.more ?? ''}spec:
  ripple: ${o.ripple ?? '1 LSB'}
  gain: none
`;
}

function side(label: string, text: string): CompareSide {
  const project = parseProject(text, label);
  return { label, project, analysis: analyzeProject(project) };
}

const json = (base: CompareSide, head: CompareSide) => JSON.parse(compareReport(base, head, compareOverlays(base.analysis, head.analysis, 72), 'json'));
const figure = (j: { figures: Array<{ key: string }> }, key: string) => j.figures.find((f) => f.key === key) as unknown as {
  base: number;
  head: number;
  delta: number;
  deltaPercent: number | null;
};

describe('compareReport figures', () => {
  const base = side('base.yaml', yaml({ c: '1u' }));
  const head = side('head.yaml', yaml({ c: '2.2u' }));
  const j = json(base, head);
  const tau = (c: number) => (4700 + 50) * c;

  it('reports the cutoff of each side as 1/(2 pi R C), and its change', () => {
    // First-order RC low-pass, fc = 1/(2 pi R C) (any circuits handbook); R includes the driver.
    const cutoff = figure(j, 'cutoff');
    const fb = 1 / (2 * Math.PI * tau(1e-6));
    const fh = 1 / (2 * Math.PI * tau(2.2e-6));
    expect(cutoff.base).toBeCloseTo(fb, 6);
    expect(cutoff.head).toBeCloseTo(fh, 6);
    expect(cutoff.delta).toBeCloseTo(fh - fb, 6);
    expect(cutoff.deltaPercent).toBeCloseTo(100 * (1 / 2.2 - 1), 6);
  });

  it('reports the worst ripple of each side as Vfs tanh(T / (4 tau)) at duty 1/2', () => {
    // Periodic steady state of an RC fed by a symmetric square wave: the exponential charge and
    // discharge over each half period give peak-to-peak Vfs tanh(T/(4 RC)) (derived from the
    // first-order step response; from memory). It is the worst duty by symmetry of D(1-D).
    const ripple = figure(j, 'worstRipple');
    const T = 1e-4;
    expect(ripple.base).toBeCloseTo(3.3 * Math.tanh(T / (4 * tau(1e-6))), 9);
    expect(ripple.head).toBeCloseTo(3.3 * Math.tanh(T / (4 * tau(2.2e-6))), 9);
    expect(ripple.deltaPercent).toBeCloseTo((100 * (ripple.head - ripple.base)) / ripple.base, 9);
  });

  it('gives no relative change for dB, and a settling time of null as never settling', () => {
    expect(figure(j, 'attenuation').deltaPercent).toBeNull();
    // Attenuation (positive dB) at f >> fc of a first-order low-pass: 20 log10(f/fc) + ... ; the
    // change for a 2.2x larger C tends to +20 log10(2.2) dB (handbook 20 dB/decade slope).
    expect(figure(j, 'attenuation').delta).toBeCloseTo(20 * Math.log10(2.2), 1);
  });

  it('lists only the inputs that changed, in SI units', () => {
    expect(j.inputs).toEqual([{ key: 'filter.stages[0].c', label: 'C1', unit: 'F', base: 1e-6, head: 2.2e-6 }]);
    const same = json(base, side('same.yaml', yaml({ r: '4k7', c: '1000n' }))); // same values, other spelling
    expect(same.inputs).toEqual([]);
  });

  it('lists an added stage with no base value', () => {
    const two = side('two.yaml', yaml().replace('    - { r: 4.7k, c: 1u }\n', '    - { r: 4.7k, c: 1u }\n    - { r: 47k, c: 100n }\n'));
    const k = json(base, two);
    expect(k.inputs.map((i: { key: string }) => i.key)).toEqual(['filter.stages[1].r', 'filter.stages[1].c', 'filter.stages[1].buffered']);
    expect(k.inputs[0]).toMatchObject({ base: null, head: 47e3 });
    expect(compareReport(base, two, compareOverlays(base.analysis, two.analysis, 72), 'text')).toMatch(/R2\s+\(no stage\)\s+47 kΩ/);
  });
});

describe('compareReport inputs of version 1.1 circuits (model.md 1.1)', () => {
  // Invented: the base is one RC stage; the head adds a Sallen-Key stage and a fine second output.
  const base = side('base.yaml', yaml());
  const text = yaml()
    .replace('    - { r: 4.7k, c: 1u }\n', '    - { r: 4.7k, c: 1u }\n    - { active: sallen-key, r1: 10k, r2: 12k, c1: 22n, c2: 10n }\n')
    .replace('filter:', 'second_pwm:\n  role: fine\n  bits: 4\n  into: { stage: 1, r: 75k, c: 1u }\n  driver: { high: 30 ohm, low: 20 ohm }\nfilter:');
  const head = side('head.yaml', text);

  it('lists the Sallen-Key parts and every key of the second output, in SI units', () => {
    const rows = json(base, head).inputs as Array<{ key: string; base: unknown; head: unknown }>;
    const at = Object.fromEntries(rows.map((r) => [r.key, [r.base, r.head]]));
    expect(at['filter.stages[1].active']).toEqual([null, 'sallen-key']);
    expect(at['filter.stages[1].r1']).toEqual([null, 10e3]);
    expect(at['filter.stages[1].r2']).toEqual([null, 12e3]);
    expect(at['filter.stages[1].c1']).toEqual([null, 22e-9]);
    expect(at['filter.stages[1].c2']).toEqual([null, 10e-9]);
    expect(at['second_pwm.role']).toEqual([null, 'fine']);
    expect(at['second_pwm.bits']).toEqual([null, 4]);
    expect(at['second_pwm.into.stage']).toEqual([null, 1]);
    expect(at['second_pwm.into.r']).toEqual([null, 75e3]);
    expect(at['second_pwm.into.c']).toEqual([null, 1e-6]);
    // levels default to pwm's, drivers set apart
    expect(at['second_pwm.high']).toEqual([null, 3.3]);
    expect(at['second_pwm.driver.high']).toEqual([null, 30]);
    expect(at['second_pwm.driver.low']).toEqual([null, 20]);
    // an RC stage's parts are not listed for a Sallen-Key stage, nor unchanged stage 1
    expect(rows.some((r) => r.key === 'filter.stages[1].r' || r.key.startsWith('filter.stages[0]'))).toBe(false);
    // the fine channel's 4 bits make the LSB 16 times smaller (model.md 1.1), so the ripple limit moves
    expect(at['spec.ripple'][1]).toBeCloseTo((at['spec.ripple'][0] as number) / 16, 15);
  });

  it('tells a missing stage from a part of the other kind, and an RC stage from an active one', () => {
    const out = compareReport(head, side('rc2.yaml', yaml().replace('    - { r: 4.7k, c: 1u }\n', '    - { r: 4.7k, c: 1u }\n    - { r: 47k, c: 100n }\n')), compareOverlays(head.analysis, base.analysis, 72), 'text', { width: 120 });
    expect(out).toMatch(/stage 2 active\s+sallen-key\s+no \(RC\)/);
    expect(out).toMatch(/stage 2 R1\s+10 kΩ\s+-/);
    expect(out).toMatch(/R2\s+-\s+47 kΩ/);
    expect(out).toMatch(/second output role\s+fine\s+\(none\)/);
    const three = compareReport(base, head, compareOverlays(base.analysis, head.analysis, 72), 'text', { width: 120 });
    expect(three).toMatch(/stage 2 R1\s+\(no stage\)\s+10 kΩ/);
  });
});

describe('compareReport check status', () => {
  // Ripple 3.3 V tanh(T/(4 RC)) (see above): about 17 mV at 1 uF and 7.9 mV at 2.2 uF, so a
  // 10 mV limit fails the first and holds for the second.
  const small = side('small.yaml', yaml({ c: '1u', ripple: '10 mV' }));
  const large = side('large.yaml', yaml({ c: '2.2u', ripple: '10 mV' }));
  const status = (b: CompareSide, h: CompareSide) => json(b, h).checks.map((c: { name: string; status: string }) => `${c.name}: ${c.status}`);

  it('calls out a change of pass/fail', () => {
    expect(status(large, small)).toEqual(['ripple: now FAILS']);
    expect(status(small, large)).toEqual(['ripple: now passes']);
    expect(status(large, large)).toEqual(['ripple: passes']);
    expect(status(small, small)).toEqual(['ripple: still fails']);
  });

  it('marks checks that appear or disappear', () => {
    const withDroop = side('droop.yaml', yaml({ c: '2.2u', ripple: '10 mV' }) + '  droop: 1 mV\n');
    expect(status(large, withDroop)).toEqual(['ripple: passes', 'droop: new, passes']);
    expect(status(withDroop, large)).toEqual(['ripple: passes', 'droop: removed']);
  });

  it('has the head decide pass in JSON and in the verdict line', () => {
    expect(json(large, small).pass).toBe(false);
    expect(json(small, large).pass).toBe(true);
    expect(compareReport(large, small, compareOverlays(large.analysis, small.analysis, 72), 'markdown')).toMatch(/^\*\*FAIL: head fails ripple .*ripple now FAILS/m);
    expect(compareReport(small, large, compareOverlays(small.analysis, large.analysis, 72), 'markdown')).toMatch(/^\*\*PASS: head holds all 1 spec check .*ripple now passes/m);
  });
});

describe('compareReport waveforms', () => {
  const base = side('base.yaml', yaml({ c: '1u' }));
  const head = side('head.yaml', yaml({ c: '2.2u' }));
  const w = json(base, head).waveforms;

  it('samples both steady states at the head worst-ripple duty on one grid of two periods', () => {
    expect(w.steady.duty).toBeCloseTo(head.analysis.worstRipple.duty, 12);
    expect(w.steady.t).toHaveLength(72);
    expect(w.steady.t[71]).toBeCloseTo(2e-4, 15);
    for (const [series, s] of [[w.steady.base, base], [w.steady.head, head]] as const) {
      const spread = Math.max(...series) - Math.min(...series);
      // Sampled, so at most the exact ripple and close to it.
      expect(spread).toBeLessThanOrEqual(s.analysis.worstRipple.ripple * (1 + 1e-9));
      expect(spread).toBeGreaterThan(0.9 * s.analysis.worstRipple.ripple);
      // Symmetric driver, open output: no DC error (charge balance on C), and at D = 1/2 the
      // wave is symmetric about the ideal level, so output minus ideal is centred on 0.
      expect(Math.abs((Math.max(...series) + Math.min(...series)) / 2)).toBeLessThan(0.05 * spread);
    }
  });

  it('samples both step responses to the head settling step, following the first-order exponential', () => {
    const { from, to, t } = w.step;
    expect([from, to]).toEqual([head.analysis.settling.from, head.analysis.settling.to]);
    // Step response of an RC: v(t) = v_to + (v_from - v_to) exp(-t/RC) (handbook), here with the
    // PWM ripple on top, which stays within the worst ripple.
    for (const [series, c] of [[w.step.base, 1e-6], [w.step.head, 2.2e-6]] as const) {
      const tau = 4750 * c;
      series.forEach((v: number, i: number) => {
        const smooth = 3.3 * (to + (from - to) * Math.exp(-t[i] / tau));
        expect(Math.abs(v - smooth)).toBeLessThanOrEqual(3.3 * Math.tanh(1e-4 / (4 * tau)));
      });
    }
  });
});

/** GFM table rows split at unescaped pipes (GFM spec 0.29, 4.10 Tables). */
const cells = (row: string) => row.trim().slice(1, -1).split(/(?<!\\)\|/).length;

describe('compareReport renderings', () => {
  const base = side('base.yaml', yaml({ c: '1u' }));
  const head = side('head.yaml', yaml({ c: '2.2u', r: '10k' }));

  it('Markdown: heading, verdict, tables with matching column counts, two fenced charts', () => {
    const md = compareReport(base, head, compareOverlays(base.analysis, head.analysis, 72), 'markdown');
    const lines = md.split('\n');
    expect(lines[0]).toBe('## dacsmith compare: base.yaml -> head.yaml');
    expect(lines[2]).toMatch(/^\*\*(PASS|FAIL): /);
    let tables = 0;
    let fence = false;
    for (let i = 0; i < lines.length; i++) {
      if (lines[i].startsWith('```')) fence = !fence;
      if (fence || !lines[i].startsWith('|') || (i > 0 && lines[i - 1].startsWith('|'))) continue;
      tables++;
      const width = cells(lines[i]);
      expect(lines[i + 1]).toMatch(/^\|(:?-+:?\|)+$/);
      expect(cells(lines[i + 1])).toBe(width);
      for (let k = i + 2; k < lines.length && lines[k].startsWith('|'); k++) expect(cells(lines[k])).toBe(width);
    }
    expect(tables).toBe(3);
    expect(md.match(/^```text$/gm)).toHaveLength(2);
    expect(md).not.toMatch(/\x1b\[/);
  });

  it('draws the base thin and the head heavy, so the curves differ without colour', () => {
    const text = compareReport(base, head, compareOverlays(base.analysis, head.analysis, 72), 'text', { color: false });
    expect(text).not.toMatch(/\x1b\[/);
    expect(text).toMatch(/[━┃┏┓┗┛]/);
    expect(text).toMatch(/[─│╭╮╰╯]/);
    expect(compareReport(base, head, compareOverlays(base.analysis, head.analysis, 72), 'text', { color: true })).toMatch(/\x1b\[/);
  });
});
