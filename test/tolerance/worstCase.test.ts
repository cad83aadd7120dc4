import { describe, expect, it } from 'vitest';
import { worstCase } from '../../src/tolerance/worstCase.js';
import { oneStageRipple, oneStageSettling, stage } from './reference.js';
import { project } from './projectFixture.js';

const T = 1 / 20e3;
const V = 3.3;

describe('worstCase, one RC stage', () => {
  it('worst ripple is the closed form at (R - tol, C - tol), D = 0.5, found as a corner', () => {
    // V (1-e^(-DT/tau))(1-e^(-(1-D)T/tau))/(1-e^(-T/tau)) (textbook; common practice); with equal
    // drivers the ripple is symmetric about D = 0.5 and largest there
    const p = project([stage(10e3, 100e-9)], { resistor: 0.01, capacitor: 0.1 }, { spec: { ripple: 1e-2 } });
    const wc = worstCase(p);
    const expected = oneStageRipple(V, T, 0.5, 10e3 * 0.99 * 100e-9 * 0.9);
    expect(Math.abs(wc.worstRipple.value! - expected) / expected).toBeLessThan(1e-10);
    expect(wc.worstRipple.duty).toBeCloseTo(0.5, 6);
    expect(wc.worstRipple.method).toBe('corner');
    expect(wc.worstRipple.z).toEqual([-1, -1]);
    expect(wc.worstRipple.effects).toEqual(['lowers', 'lowers']);
    expect(wc.worstRipple.cornerSweepWorse).toBe(false);
    expect(wc.worstRipple.pass).toBe(expected <= 1e-2);
  });

  it('worst droop with a load is the divider error at the top duty, R max, load R min, supply max', () => {
    // equal drivers: the mean output is R_L / (R_L + R) times the ideal (Ohm's law), so the DC
    // error high D R / (R_L + R) grows with R and the supply and shrinks with R_L
    const p = project(
      [stage(10e3, 100e-9)],
      { resistor: 0.01, capacitor: 0.1, load: 0.2, supply: 0.05 },
      { load: { resistance: 100e3, capacitance: 0 }, spec: { droop: 0.5 } },
    );
    const wc = worstCase(p);
    const R = 10e3 * 1.01;
    const RL = 100e3 * 0.8;
    const expected = V * 1.05 * 0.9 * (R / (RL + R));
    expect(Math.abs(wc.droop.value! - expected) / expected).toBeLessThan(1e-12);
    expect(wc.droop.duty).toBe(0.9);
    const at = Object.fromEntries(wc.parameters.map((q, i) => [q.key, wc.droop.values[i]]));
    expect(at.r1).toBeCloseTo(R, 9);
    expect(at.load).toBeCloseTo(RL, 9);
    expect(at.supply).toBeCloseTo(V * 1.05, 12);
    expect(wc.droop.effects[wc.parameters.findIndex((q) => q.key === 'c1')]).toBe('none');
    expect(wc.droop.pass).toBe(true);
  });

  it('worst gain error (spec.gain, model.md 1.1) is the divider loss R / (R_L + R) at R max, load R min, supply free', () => {
    // equal drivers: average(D) = k ideal(D), k = R_L / (R_L + R) (Ohm's law), so the gain error as
    // a fraction of full scale, ideal - actual, is 1 - k whatever the supply
    const p = project(
      [stage(10e3, 100e-9)],
      { resistor: 0.01, capacitor: 0.1, load: 0.2, supply: 0.05 },
      { load: { resistance: 100e3, capacitance: 0 }, spec: { gain: 0.02 } },
    );
    const R = 10e3 * 1.01;
    const RL = 100e3 * 0.8;
    const wc = worstCase(p, undefined, { gain: true });
    expect(Math.abs(wc.gain!.value! - R / (RL + R)) / (R / (RL + R))).toBeLessThan(1e-10);
    expect(wc.gain!.limit).toBe(0.02);
    expect(wc.gain!.pass).toBe(false); // 11.2 % > 2 %
    expect(wc.pass).toBe(false);
    const at = Object.fromEntries(wc.parameters.map((q, i) => [q.key, wc.gain!.values[i]]));
    expect(at.r1).toBeCloseTo(R, 9);
    expect(at.load).toBeCloseTo(RL, 9);
    expect(wc.gain!.effects[wc.parameters.findIndex((q) => q.key === 'supply')]).toBe('none');
    // without the option (the robust design search) the gain is not part of the worst case
    expect(worstCase(p).gain).toBeNull();
  });

  it('worst settling time is the superposition closed form at R max, C max, supply max', () => {
    // tau = 10 ms = 200 periods: ripple at 90 % about 1.5 mV, inside the 5 mV band
    const band = 5e-3;
    const p = project(
      [stage(10e3, 1e-6)],
      { resistor: 0.01, capacitor: 0.1, supply: 0.05 },
      { spec: { settling: { band, time: 0.07, from: 0.1, to: 0.9 } } },
    );
    const wc = worstCase(p);
    const expected = oneStageSettling(V * 1.05, T, 0.1, 0.9, 10e3 * 1.01 * 1e-6 * 1.1, band);
    expect(Math.abs(wc.settlingTime.value! - expected)).toBeLessThan(T * 1e-4);
    expect(wc.settlingTime.z).toEqual([1, 1, 1]);
    expect(wc.settlingTime.pass).toBe(expected <= 0.07);
    expect(wc.pass).toBe(wc.settlingTime.pass);
  });

  it('confirming with the engine gives the same worst-case values', () => {
    const p = project(
      [stage(2.2e3, 470e-9), stage(10e3, 47e-9)],
      { resistor: 0.01, capacitor: 0.1, driver: { high: { min: 20, max: 60 }, low: { min: 15, max: 40 } } },
      { load: { resistance: 200e3, capacitance: 0 }, spec: { ripple: 1e-3, settling: { band: 1.6e-3, time: 0.02 } } },
    );
    const fast = worstCase(p);
    const confirmed = worstCase(p, undefined, { confirmWithEngine: true });
    for (const k of ['worstRipple', 'droop', 'settlingTime'] as const) {
      const a = fast[k].value!;
      const b = confirmed[k].value!;
      expect(Math.abs(a - b)).toBeLessThan(1e-9 * Math.abs(b) + (k === 'settlingTime' ? T * 1e-6 : 0));
    }
  });
});
