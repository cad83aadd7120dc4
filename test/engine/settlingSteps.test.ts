/**
 * One choice of settling steps and band for every command (model.md: "settling time", "default
 * step"); the defaults are common practice (0.5 LSB, else 0.1 % of full scale).
 */
import { describe, expect, it } from 'vitest';
import { settlingSteps } from '../../src/engine/index.js';
import { parseProject } from '../../src/project/index.js';

const base = 'pwm: { frequency: 20 kHz, high: 3.3 V, duty: { min: 5 %, max: 95 % } BITS}\nfilter: { stages: [{ r: 4k7, c: 1u }] }\n';
const project = (spec: string, bits = true) => parseProject(base.replace('BITS', bits ? ', bits: 10 ' : '') + spec, 'p.yaml');

describe('settlingSteps', () => {
  it('without a step: the full used range rising and falling, band 0.5 LSB', () => {
    expect(settlingSteps(project(''))).toEqual({ band: (0.5 * 3.3) / 1024, steps: [[0.05, 0.95], [0.95, 0.05]], defaultStep: true });
  });

  it('without bits: the band is 0.1 % of full scale', () => {
    expect(settlingSteps(project('', false)).band).toBeCloseTo(3.3e-3, 15);
  });

  it('a given step and band are used as written', () => {
    expect(settlingSteps(project('spec:\n  settling: { band: 2 mV, from: 10 %, to: 60 % }\n'))).toEqual({ band: 0.002, steps: [[0.1, 0.6]], defaultStep: false });
  });
});
