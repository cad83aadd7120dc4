import { describe, expect, it } from 'vitest';
import { steadyWaveform } from '../../src/engine/steadyWaveform.js';
import { stepWaveform } from '../../src/engine/stepWaveform.js';
import { steadyState } from '../../src/engine/steadyState.js';
import { ladder, oneStageWithRatio, relative, stage } from './ladders.js';

describe('stepWaveform', () => {
  it('first-order step response reaches 63.2 % at one time constant', () => {
    // Source: v(tau) = V (1 - e^-1) = 0.632 V (common practice). Duty 0 -> 1 is a plain step.
    for (const ratio of [0.37, 12.5, 1e6]) {
      const tau = ratio * 50e-6;
      const w = stepWaveform(oneStageWithRatio(ratio), 0, 1, tau, 2);
      expect(w.t[1]).toBe(tau);
      expect(relative(w.v[1], 3.3 * -Math.expm1(-1))).toBeLessThan(1e-12);
      expect(Math.abs(w.v[0])).toBeLessThan(1e-15);
    }
  });

  it('two stages: matches the two-pole step response at arbitrary instants', () => {
    // Source: H = 1/(a s^2 + b s + 1), a = R1C1R2C2, b = R1C1 + R2C2 + R1C2 (network analysis
    // textbooks); step response 1 - (tau1 e^(-t/tau1) - tau2 e^(-t/tau2)) / (tau1 - tau2).
    const [r1, c1, r2, c2] = [1e3, 100e-9, 10e3, 33e-9];
    const a = r1 * c1 * r2 * c2;
    const b = r1 * c1 + r2 * c2 + r1 * c2;
    const tau1 = (b + Math.sqrt(b * b - 4 * a)) / 2;
    const tau2 = a / tau1;
    const w = stepWaveform(ladder([stage(r1, c1), stage(r2, c2)]), 0, 1, 37.3e-4, 101);
    w.t.forEach((t, i) => {
      const ref = 3.3 * (1 - (tau1 * Math.exp(-t / tau1) - tau2 * Math.exp(-t / tau2)) / (tau1 - tau2));
      expect(Math.abs(w.v[i] - ref)).toBeLessThan(1e-12);
    });
  });

  it('starts at the steady state of `from` and ends at the steady state of `to`', () => {
    // Source: model.md (the circuit is in periodic steady state before the step).
    const l = ladder([stage(2.2e3, 47e-9), stage(22e3, 10e-9)], { driverHigh: 40, driverLow: 25, loadResistance: 1e5 });
    const T = l.period;
    const step = stepWaveform(l, 0.2, 0.7, 400 * T, 4001);
    const before = steadyWaveform(l, 0.2, 1, 10);
    const after = steadyWaveform(l, 0.7, 1, 10);
    expect(step.v[0]).toBeCloseTo(before.v[0], 14);
    // samples every T/10; the last period is at steady state after 400 T (tau ~ 5 T)
    for (let i = 0; i <= 10; i++) expect(step.v[3990 + i]).toBeCloseTo(after.v[i], 12);
  });
});

describe('steadyWaveform', () => {
  it('is periodic and stays within the steady-state extremes, touching them at tMin/tMax', () => {
    // Source: definitions of min, max and periodic steady state (model.md).
    const l = ladder([stage(2.2e3, 47e-9), stage(22e3, 10e-9)], { driverHigh: 40, driverLow: 25 });
    const op = steadyState(l, 0.25);
    const w = steadyWaveform(l, 0.25, 2, 400);
    expect(w.v.length).toBe(801);
    expect(w.t[400]).toBeCloseTo(l.period, 18);
    expect(w.v[800]).toBe(w.v[0]);
    expect(w.v[400]).toBe(w.v[0]);
    const lo = Math.min(...w.v);
    const hi = Math.max(...w.v);
    expect(lo).toBeGreaterThanOrEqual(op.min - 1e-15);
    expect(hi).toBeLessThanOrEqual(op.max + 1e-15);
    // the extremes are smooth turning points here, so a T/400 grid gets within a small fraction
    expect(op.max - hi).toBeLessThan(1e-3 * op.ripple);
    expect(lo - op.min).toBeLessThan(1e-3 * op.ripple);
  });

  it('one stage: the mean of the samples approaches the average', () => {
    // Source: the trapezoid rule converges to the integral (common practice); samples at T/1000.
    const l = oneStageWithRatio(3);
    const w = steadyWaveform(l, 0.4, 1, 1000);
    const mean = w.v.slice(0, 1000).reduce((s, v) => s + v, 0) / 1000;
    expect(Math.abs(mean - steadyState(l, 0.4).average)).toBeLessThan(1e-6);
  });
});
