/**
 * The design space of a version 1.1 circuit (networkProblem.ts): the Sallen-Key c1 choices are
 * exactly the series values whose Q lies in search.q, the fine output's weighting resistor window
 * sits around the ideal weight, that weight makes one fine full range equal one coarse step, and
 * the keys the search does not support are refused with their key.
 */
import { describe, expect, it } from 'vitest';
import type { NetworkStage } from '../../../src/circuit/network.js';
import { FINE_WINDOW, idealWeight, networkProblem } from '../../../src/design/network/networkProblem.js';
import { periodicOrbit } from '../../../src/engine/periodic/periodicOrbit.js';
import { parseProject } from '../../../src/project/index.js';
import { seriesValues } from '../../../src/units/index.js';
import { network, pin, rc, sallenKey, secondPwm } from '../../engine/periodic/networks.js';

const skFile = (q = '') => `
pwm: { frequency: 20 kHz, bits: 10, high: 3.3 V }
filter:
  stages:
    - { active: sallen-key, r1: 10k, r2: 10k, c1: 22n, c2: 10n }
spec: { ripple: 1 LSB }
search:
  series: E12
  resistance: { min: 4k7, max: 22k }
  capacitance: { min: 1n, max: 100n }
${q}`;

describe('the Sallen-Key stage: c1 only where Q lies in the window', () => {
  it('every (r1, r2, c2) with exactly the c1 values whose Q is in [q.min, q.max]', () => {
    const problem = networkProblem(parseProject(skFile('  q: { min: 0.55, max: 0.7 }'), 'p.yaml'));
    const R = seriesValues('E12', 4700, 22e3);
    const C = seriesValues('E12', 1e-9, 100e-9);
    // model.md 1.1, the standard unity-gain Sallen-Key formula: Q = sqrt(r1 r2 c1 c2) / (c2 (r1 + r2)).
    const qOf = (r1: number, r2: number, c1: number, c2: number) => Math.sqrt(r1 * r2 * c1 * c2) / (c2 * (r1 + r2));
    const expected = new Set<string>();
    for (const r1 of R) for (const r2 of R) for (const c1 of C) for (const c2 of C) {
      const q = qOf(r1, r2, c1, c2);
      if (q >= 0.55 - 1e-12 && q <= 0.7 + 1e-12) expected.add(`${r1}/${r2}/${c1}/${c2}`);
    }
    const got = new Set<string>();
    problem.enumerate((stages) => {
      const s = stages[0] as Extract<NetworkStage, { kind: 'sallen-key' }>;
      got.add(`${s.r1}/${s.r2}/${s.c1}/${s.c2}`);
    });
    expect(got).toEqual(expected);
    expect(problem.space).toBe(expected.size);
  });

  it('defaults to Q 0.5 to 0.8; an empty window is refused naming search.q', () => {
    expect(networkProblem(parseProject(skFile(), 'p.yaml')).q).toEqual({ min: 0.5, max: 0.8 });
    const narrow = parseProject(skFile('  q: { min: 20, max: 30 }'), 'p.yaml');
    expect(() => networkProblem(narrow)).toThrow(/search\.q: no r1, r2, c1, c2 of the series and ranges give stage 1 a Q from 20 to 30/);
  });

  it('refuses a search over the resolution (search.bits) for these circuits', () => {
    const text = skFile().replace('pwm: { frequency: 20 kHz, bits: 10', 'pwm: { clock: 20 MHz, bits: 10') + '  bits: { min: 8, max: 10 }\n';
    expect(() => networkProblem(parseProject(text, 'p.yaml'))).toThrow(/search\.bits: a search over the resolution is not supported yet/);
  });
});

describe('the fine output: ideal weight and its window', () => {
  it('with r = idealWeight, one fine full range moves the average exactly as one coarse step (superposition)', () => {
    // Equal drivers on both pins make the circuit linear and time-invariant; by superposition (any
    // circuits textbook) the average output is a weighted sum of the two sources' averages, so the
    // fine source going from always low to always high adds w_f span, one coarse step w_c span / 2^B.
    const B = 6;
    for (const stages of [
      [rc(10e3, 100e-9), rc(22e3, 47e-9)],
      [sallenKey(10e3, 10e3, 22e-9, 10e-9), rc(4.7e3, 220e-9)],
    ]) {
      const injectAt = stages[0].kind === 'rc' ? 0 : 1;
      const base = network(stages, { pin: pin(30, 30), loadResistance: 220e3 });
      const second = secondPwm('fine', injectAt, 1, null, 4, pin(50, 50), B);
      const r = idealWeight({ ...base, second }, stages, second);
      // The path: stage 1 and the driver from the pin; after a Sallen-Key stage, the RC stage alone.
      expect(r).toBeCloseTo(injectAt === 0 ? 2 ** B * (10e3 + 30) - 50 : 2 ** B * 4.7e3 - 50, 6);
      const n = { ...base, second: { ...second, r } };
      const avg = (first: number, fine: number) => periodicOrbit(n, { first, second: fine }, false).average;
      const fineRange = avg(0.5, 1) - avg(0.5, 0);
      const coarseStep = avg(0.5 + 2 ** -B, 0) - avg(0.5, 0);
      expect(Math.abs(fineRange / coarseStep - 1)).toBeLessThan(1e-9);
    }
  });

  it('without search.second_pwm.r: the values within a factor 1.25 of the ideal, and the nearest either side', () => {
    const text = `
pwm: { frequency: 62.5 kHz, bits: 8, high: 3.3 V, driver: { high: 40 ohm, low: 25 ohm } }
second_pwm: { role: fine, bits: 8, into: { stage: 1, r: 2.56M } }
filter:
  stages:
    - { r: 10k, c: 1u }
spec: { ripple: 1 LSB }
search:
  series: E24
  resistance: { min: 10k, max: 22k }
  capacitance: { min: 1u, max: 1u1 }
`;
    const problem = networkProblem(parseProject(text, 'p.yaml'));
    // Per first stage (r1 and c1): the weighting resistors tried with it.
    const seen = new Map<string, number[]>();
    problem.enumerate((stages, second) => {
      const s = stages[0] as { r: number; c: number };
      seen.set(`${s.r}/${s.c}`, [...(seen.get(`${s.r}/${s.c}`) ?? []), second!.r]);
    });
    expect(seen.size).toBe(seriesValues('E24', 10e3, 22e3).length * 2);
    for (const [key, values] of seen) {
      const r1 = Number(key.split('/')[0]);
      const ideal = 256 * (r1 + 32.5) - 32.5;
      const around = seriesValues('E24', ideal / 3, ideal * 3);
      const below = around.filter((v) => v <= ideal).at(-1)!;
      const above = around.find((v) => v >= ideal)!;
      const expected = [...new Set([...around.filter((v) => v >= ideal / FINE_WINDOW && v <= ideal * FINE_WINDOW), below, above])].sort((a, b) => a - b);
      expect(values).toEqual(expected);
      expect(values.length).toBeGreaterThanOrEqual(2);
    }
    let count = 0;
    for (const v of seen.values()) count += v.length;
    expect(problem.space).toBe(count);
  });
});
