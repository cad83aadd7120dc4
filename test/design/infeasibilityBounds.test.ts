import { describe, expect, it } from 'vitest';
import { designProblem } from '../../src/design/designProblem.js';
import { exactCandidate } from '../../src/design/exactCandidate.js';
import { infeasibilityBounds } from '../../src/design/infeasibilityBounds.js';
import { parseProject } from '../../src/project/index.js';
import { everyTuple } from './bruteForce.js';

/** An invented project with a search section; `o` overrides pieces of the YAML. */
function project(o: Record<string, string>) {
  const yaml = `
pwm: { frequency: ${o.f ?? '20 kHz'}, bits: ${o.bits ?? 10}, high: 3.3 V, low: ${o.low ?? '0 V'}, driver: ${o.driver ?? '30 ohm'}, duty: { min: 5 %, max: 95 % } }
${o.load ? `load: ${o.load}` : ''}
spec:
  ripple: ${o.ripple ?? '0.5 LSB'}
${o.droop ? `  droop: ${o.droop}` : ''}
${o.gain ? `  gain: ${o.gain}` : ''}
${o.settling ? `  settling: ${o.settling}` : ''}
search:
  stages: ${o.stages ?? '[1, 2]'}
  series: E3
  margin: 0 %
  resistance: { min: ${o.rmin ?? '1k'}, max: ${o.rmax ?? '10k'} }
  capacitance: { min: ${o.cmin ?? '10n'}, max: ${o.cmax ?? '1u'} }
${o.pin ? `  pin_current: ${o.pin}` : ''}
`;
  return parseProject(yaml, 'invented.yaml');
}

/** Every n-stage candidate of the problem's space, evaluated by the exact engine (brute force). */
function everyDesign(p: ReturnType<typeof project>, n: number) {
  const problem = designProblem(p);
  const R = problem.rValues;
  const C = problem.cValues;
  const out = [];
  for (const [r, c] of everyTuple(R, C, n)) out.push(exactCandidate(problem, problem.ladderOf(r, c)));
  return { problem, designs: out };
}

const cases: Array<[string, Record<string, string>, number]> = [
  ['one stage, open output', { f: '5 kHz', ripple: '10 LSB', settling: '{ band: 0.5 LSB, time: 1 ms }' }, 1],
  ['two stages, 47 kohm load', { f: '2 kHz', ripple: '0.1 LSB', load: '{ resistance: 47k, capacitance: 1n }', gain: 'none', settling: '{ band: 1 LSB, time: 2 ms, from: 10 %, to: 90 % }' }, 2],
  ['two stages, 4.7 kohm load (series above the load)', { f: '1 kHz', ripple: '0.5 LSB', load: '{ resistance: 4.7k }', gain: 'none' }, 2],
  ['three stages, 100 kohm load', { f: '2 kHz', ripple: '2 LSB', load: '{ resistance: 100k }', gain: 'none', rmax: '4.7k', cmax: '470n' }, 3],
];

describe('infeasibility bounds are true bounds (brute force over every design with the exact engine)', () => {
  for (const [name, o, n] of cases) {
    it(name, () => {
      const { problem, designs } = everyDesign(project(o), n);
      const { bounds, misses } = infeasibilityBounds(problem, n);
      // Ripple floor at or below the smallest worst ripple of the space.
      const minRipple = Math.min(...designs.map((d) => d.worstRipple));
      expect(bounds.rippleFloor).toBeGreaterThan(0);
      expect(bounds.rippleFloor).toBeLessThanOrEqual(minRipple * (1 + 1e-9));
      // Settling floor at or below the fastest settling among designs that meet the ripple limit.
      const rippleOk = designs.filter((d) => d.worstRipple <= problem.limits.ripple! && d.settlingTime !== null);
      expect(bounds.settlingFloor).toBeGreaterThan(0);
      expect(rippleOk.length).toBeGreaterThan(0);
      if (rippleOk.length > 0) expect(bounds.settlingFloor).toBeLessThanOrEqual(Math.min(...rippleOk.map((d) => d.settlingTime!)) * (1 + 1e-9));
      // A proven miss means no design meets that limit.
      for (const m of misses) {
        const check = m.limit;
        expect(designs.every((d) => d.checks.find((k) => k.name === check)?.pass === false)).toBe(true);
      }
    });
  }

  it('proves a ripple limit out of reach, and the brute force agrees', () => {
    // 0.01 LSB at 1 kHz with at most 10 kohm and 1 uF: two stages cannot reach it.
    const { problem, designs } = everyDesign(project({ f: '1 kHz', ripple: '0.01 LSB' }), 2);
    const { misses } = infeasibilityBounds(problem, 2);
    expect(misses.map((m) => m.limit)).toContain('ripple');
    expect(designs.every((d) => d.worstRipple > problem.limits.ripple!)).toBe(true);
  });

  it('proves the pin current, droop and gain limits out of reach (Ohm\'s law, DC current balance)', () => {
    const pin = infeasibilityBounds(designProblem(project({ pin: '100 uA' })), 1).misses.map((m) => m.limit);
    expect(pin).toContain('pin_current'); // 3.3 V / 100 uA = 33 kohm > 10 kohm
    const droop = infeasibilityBounds(designProblem(project({ droop: '1 %', load: '{ resistance: 47k }' })), 2).misses.map((m) => m.limit);
    expect(droop).toContain('droop'); // 2 kohm + 30 ohm in series into 47 kohm loses 4 % of 3.13 V
    const { problem, designs } = everyDesign(project({ gain: '1 %', load: '{ resistance: 47k }' }), 2);
    expect(infeasibilityBounds(problem, 2).misses.map((m) => m.limit)).toContain('gain');
    expect(designs.every((d) => d.checks.find((k) => k.name === 'gain')?.pass === false)).toBe(true);
  });

  it('proves the droop out of reach with the low level below ground and unequal drivers too (a search over it used to run for minutes)', () => {
    // 40/25 ohm drivers, low -0.1 V: 1 kohm + 1 kohm + 25 ohm into 47 kohm loses 2025 / 49025 of
    // the 3.13 V ideal output at 95 % duty, 129 mV (resistiveDroop.ts); every design, by the engine, more.
    const p = project({ low: '-0.1 V', driver: '{ high: 40 ohm, low: 25 ohm }', droop: '100 mV', load: '{ resistance: 47k }' });
    const { problem, designs } = everyDesign(p, 2);
    const miss = infeasibilityBounds(problem, 2).misses.find((m) => m.limit === 'droop');
    expect(miss?.reach).toBeCloseTo((3.13 * 2025) / 49025, 9);
    expect(designs.every((d) => d.droop > 0.1)).toBe(true);
  });
});
