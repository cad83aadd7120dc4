/**
 * networkFromProject: the general circuit of any project. For a plain file it must carry the same
 * numbers as the ladder the existing engine computes (ladderFromProject), and the network of a
 * version 1.1 file its stages and second output; requireLadder keeps such a file from ladder code.
 */
import { readdirSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { networkOfLadder } from '../../src/circuit/networkOfLadder.js';
import { ladderFromProject } from '../../src/project/ladderFromProject.js';
import { loadProject, lsbOf, networkFromProject, parseProject, requireFilter, requireLadder } from '../../src/project/index.js';
import { InputError } from '../../src/units/index.js';

const plainSamples = readdirSync('sample-configs')
  .filter((f) => f.endsWith('.yaml'))
  .map((f) => loadProject(`sample-configs/${f}`))
  .filter((p) => p.network === undefined && p.filter.stages.length > 0);

describe('networkFromProject', () => {
  it('there are plain samples with a filter to compare on', () => {
    expect(plainSamples.length).toBeGreaterThanOrEqual(5);
  });

  for (const p of plainSamples) {
    it(`${p.file}: the same numbers as ladderFromProject`, () => {
      const ladder = ladderFromProject(p);
      const network = networkFromProject(p);
      expect(network.period).toBe(ladder.period);
      expect(network.pin).toEqual({ high: ladder.high, low: ladder.low, driverHigh: ladder.driverHigh, driverLow: ladder.driverLow });
      expect(network.stages).toEqual(ladder.stages.map((s) => ({ kind: 'rc', r: s.r, c: s.c, buffered: s.buffered })));
      expect(network.loadResistance).toBe(ladder.loadResistance);
      expect(network.loadCapacitance).toBe(ladder.loadCapacitance);
      expect(network.second).toBeNull();
      expect(network.alignment).toBe(p.pwm.alignment);
      expect(network).toEqual(networkOfLadder(ladder, p.pwm.alignment));
    });
  }

  it('takes the alignment from pwm.alignment (a center-aligned sample)', () => {
    const centered = plainSamples.filter((p) => p.pwm.alignment === 'center');
    expect(centered.length).toBeGreaterThan(0);
    for (const p of centered) expect(networkFromProject(p).alignment).toBe('center');
  });

  it('a version 1.1 file: its stages in file order and its second output', () => {
    const p = loadProject('sample-configs/fine-16bit-setpoint.yaml');
    const n = networkFromProject(p);
    expect(n.stages).toBe(p.network!.stages);
    expect(n.second).toBe(p.network!.second);
    expect(n.period).toBe(1 / 62500);
    expect(n.pin).toEqual({ high: 3.3, low: 0, driverHigh: 40, driverLow: 25 });
    expect(n.loadResistance).toBe(10e6);
    expect(n.loadCapacitance).toBe(47e-12);
    const sk = networkFromProject(loadProject('sample-configs/sallen-key-reference.yaml'));
    expect(sk.stages.map((s) => s.kind)).toEqual(['rc', 'sallen-key']);
    expect(sk.loadCapacitance).toBe(0);
  });
});

describe('requireLadder and the ladder code', () => {
  const refusal = (run: () => unknown): InputError => {
    try {
      run();
    } catch (error) {
      expect(error).toBeInstanceOf(InputError);
      return error as InputError;
    }
    throw new Error('expected a refusal');
  };

  it('passes a plain project through unchanged', () => {
    expect(requireLadder(plainSamples[0], 'analyze')).toBe(plainSamples[0]);
  });

  it('refuses second_pwm, naming the key, the file and the command', () => {
    const p = loadProject('sample-configs/complement-ripple-cancel.yaml');
    const e = refusal(() => requireLadder(p, 'tolerance'));
    expect(e.key).toBe('second_pwm');
    expect(e.file).toBe('sample-configs/complement-ripple-cancel.yaml');
    expect(e.detail).toMatch(/^'tolerance' does not yet handle a second PWM output \(second_pwm, role complement\)/);
    // and ladderFromProject never turns it into a ladder without it
    expect(refusal(() => ladderFromProject(p)).key).toBe('second_pwm');
  });

  it('refuses an active stage, naming filter.stages[i].active', () => {
    const p = loadProject('sample-configs/sallen-key-reference.yaml');
    expect(refusal(() => requireLadder(p, 'compare')).key).toBe('filter.stages[1].active');
    expect(refusal(() => ladderFromProject(p, [])).key).toBe('filter.stages[1].active');
  });

  it('a filter of active stages only is a filter (requireFilter), but not a ladder', () => {
    const p = parseProject(
      'pwm: { frequency: 20 kHz, high: 3.3 V }\nfilter:\n  stages:\n    - { active: sallen-key, r1: 10k, r2: 10k, c1: 22n, c2: 10n }\n',
      'p.yaml',
    );
    expect(p.filter.stages).toEqual([]);
    expect(requireFilter(p, 'analyze')).toBe(p);
    expect(refusal(() => requireLadder(p, 'analyze')).key).toBe('filter.stages[0].active');
  });
});

describe('lsbOf', () => {
  it('counts the fine bits (model.md 1.1: full scale over 2^(pwm.bits + b)) and agrees with project.lsb', () => {
    for (const name of ['fine-16bit-setpoint', 'complement-ripple-cancel', 'sallen-key-reference', 'greenhouse-heater']) {
      const p = loadProject(`sample-configs/${name}.yaml`);
      expect(lsbOf(p), name).toBe(p.lsb);
    }
    expect(lsbOf(loadProject('sample-configs/fine-16bit-setpoint.yaml'))).toBe(3.3 / 2 ** 16);
  });
});
