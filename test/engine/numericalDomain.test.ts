/**
 * The engine refuses circuits outside the range it computes exactly (numericalDomain.ts) with an
 * input error naming the stage and the figure, instead of an internal error or a wrong number.
 * The reproducers are invented: a cascade of wildly spread parts (1 Tohm / 10 F, 1 kohm / 1 uF,
 * 1 mohm / 1 fF) whose nodal matrix is singular in double precision, and tau = 1e10 s at 100 MHz,
 * where settling is tau ln(V/band) (first-order step response, any circuits textbook) = 1.73e11 s
 * but a period count capped near 2^62 gave 4.61e10 s.
 */
import { describe, expect, it } from 'vitest';
import type { Ladder } from '../../src/circuit/ladder.js';
import { analyzeProject } from '../../src/engine/analyze.js';
import { checkNumericalDomain, NUMERICAL_DOMAIN, OutsideDomainError, settlingTime } from '../../src/engine/index.js';
import { parseProject } from '../../src/project/index.js';
import { InputError } from '../../src/units/index.js';

const ladder = (stages: Array<[number, number]>, period = 1 / 20e3): Ladder => ({
  period,
  high: 3.3,
  low: 0,
  driverHigh: 30,
  driverLow: 30,
  stages: stages.map(([r, c]) => ({ r, c, buffered: false })),
  loadResistance: null,
  loadCapacitance: 0,
});

describe('checkNumericalDomain', () => {
  it('refuses the wildly spread cascade at its first stage, as an input error with the key', () => {
    const wild = ladder([[1e12, 10], [1e3, 1e-6], [1e-3, 1e-15]]);
    let error: unknown;
    try {
      checkNumericalDomain(wild, 'wild.yaml');
    } catch (e) {
      error = e;
    }
    expect(error).toBeInstanceOf(OutsideDomainError);
    expect(error).toBeInstanceOf(InputError);
    expect((error as OutsideDomainError).key).toBe('filter.stages[0]');
    expect((error as Error).message).toMatch(/^wild\.yaml: filter\.stages\[0\]: R1 C1 = 1\.00e\+13 s is 2\.00e\+17 PWM periods/);
  });

  it('refuses a stage far faster than the period', () => {
    expect(() => checkNumericalDomain(ladder([[1e3, 1e-6], [1e-3, 1e-15]]))).toThrow(/filter\.stages\[1\]: R2 C2 = 1\.00e-18 s .* less than 1e-9/);
  });

  it('accepts the edges of the domain and refuses just past them', () => {
    const T = 1 / 20e3;
    expect(() => checkNumericalDomain(ladder([[1e6, (NUMERICAL_DOMAIN.maxTauPeriods * T) / 1e6 / 1.0001]]))).not.toThrow();
    expect(() => checkNumericalDomain(ladder([[1e6, (NUMERICAL_DOMAIN.maxTauPeriods * T) / 1e6 * 1.01]]))).toThrow(OutsideDomainError);
  });

  it('inside the domain, settling of one stage is tau ln(step/band) to within a period (first-order step response)', () => {
    // tau = 1e12 periods at the top of the domain: the count of periods stays far below 2^62.
    const T = 1e-8;
    const tau = 0.999e12 * T;
    const l = { ...ladder([[1e6, tau / 1e6]], T), driverHigh: 0, driverLow: 0 };
    const band = 3.3 / 2048;
    const s = settlingTime(l, 0, 1, band);
    // From 0 to 3.3 V: |v - 3.3| = 3.3 exp(-t/tau) <= band at t = tau ln(3.3 / band); the ripple
    // at this tau/T is ~1e-12 V, far below the band.
    expect(s.time).not.toBeNull();
    expect(Math.abs((s.time as number) - tau * Math.log(3.3 / band)) / tau).toBeLessThan(1e-6);
  });

  it('analyzeProject refuses the absurd file (tau = 1e10 s at 100 MHz) instead of a capped settling time', () => {
    const p = parseProject('pwm: { frequency: 100 MHz, bits: 10, high: 3.3 V }\nfilter: { stages: [{ r: 1 Gohm, c: 10 F }] }\n', 'absurd.yaml');
    expect(() => analyzeProject(p)).toThrow(/absurd\.yaml: filter\.stages\[0\]: R1 C1 = 1\.00e\+10 s is 1\.00e\+18 PWM periods/);
  });
});
