import { describe, expect, it } from 'vitest';
import { steadyState } from '../../src/engine/steadyState.js';
import { prepare } from '../../src/engine/prepare.js';
import { dutyPlan } from '../../src/engine/dutyPlan.js';
import { periodTrajectory } from '../../src/engine/periodTrajectory.js';
import { ladder, oneStageWithRatio, relative, stage } from './ladders.js';

const RATIOS = [1e-2, 0.1, 1, 10, 1e3, 1e6, 1e9]; // tau / T
const DUTIES = [0.05, 0.3, 0.5, 0.9];

/**
 * Ripple of one RC stage driven by a rectangular wave V, duty D, period T (textbook first-order
 * circuit result, e.g. any circuit-theory text on RC charging):
 * V (1 - e^(-DT/tau)) (1 - e^(-(1-D)T/tau)) / (1 - e^(-T/tau)), written with expm1 so that the
 * reference itself keeps its digits for tau >> T.
 */
const closedFormRipple = (v: number, d: number, ratio: number) =>
  (v * Math.expm1(-d / ratio) * Math.expm1(-(1 - d) / ratio)) / -Math.expm1(-1 / ratio);

describe('steadyState, one stage', () => {
  it('ripple equals the closed form for tau/T from 1e-2 to 1e9 (closed-form fast path)', () => {
    for (const ratio of RATIOS) {
      for (const d of DUTIES) {
        const op = steadyState(oneStageWithRatio(ratio), d);
        expect(relative(op.ripple, closedFormRipple(3.3, d, ratio))).toBeLessThan(1e-13);
      }
    }
  });

  it('the general matrix path (used for settling and waveforms) agrees with the closed form too', () => {
    // Same reference; exercises flow.ts/dutyPlan.ts/periodTrajectory.ts with a 1 x 1 state.
    for (const ratio of RATIOS) {
      for (const d of DUTIES) {
        const p = prepare(oneStageWithRatio(ratio));
        const plan = dutyPlan(p, d);
        const tr = periodTrajectory(p, plan);
        expect(relative(tr.maxW - tr.minW, closedFormRipple(3.3, d, ratio))).toBeLessThan(1e-12);
        expect(relative(plan.average, 3.3 * d)).toBeLessThan(1e-13);
      }
    }
  });

  it('average equals the ideal output low + D (high - low) with equal drivers and no load', () => {
    // Source: the capacitor carries no DC current, so the average node voltage equals the
    // average pin voltage (Kirchhoff's current law over a period; common practice).
    for (const ratio of RATIOS) {
      for (const d of [0, ...DUTIES, 1]) {
        const l = oneStageWithRatio(ratio, { low: 0.2, driverHigh: 33, driverLow: 33 });
        expect(steadyState(l, d).average).toBeCloseTo(0.2 + d * 3.1, 12);
      }
    }
  });

  it('extremes sit at the phase boundaries and min <= average <= max', () => {
    // Source: first-order response to a constant input is monotone (common practice).
    const op = steadyState(oneStageWithRatio(3), 0.3);
    expect(op.tMin).toBe(0);
    expect(op.tMax).toBeCloseTo(0.3 * 50e-6, 18);
    expect(op.min).toBeLessThan(op.average);
    expect(op.max).toBeGreaterThan(op.average);
    expect(op.max - op.min).toBeCloseTo(op.ripple, 14);
  });

  it('loaded stage: average = R_L / (R_L + R + R_d) times the ideal output', () => {
    // Source: Ohm's law, resistive divider (the capacitor carries no DC current).
    const rl = 47e3;
    for (const ratio of [0.5, 20, 1e5]) {
      const l = oneStageWithRatio(ratio, { driverHigh: 30, driverLow: 30, loadResistance: rl });
      for (const d of [0.1, 0.5, 0.8]) {
        const divider = rl / (rl + 10e3 + 30);
        expect(relative(steadyState(l, d).average, divider * 3.3 * d)).toBeLessThan(1e-12);
      }
    }
  });

  it('duty 0 and 1 give a flat output at the levels', () => {
    // Source: a constant input gives a constant steady state (common practice).
    const l = oneStageWithRatio(2);
    expect(steadyState(l, 0)).toMatchObject({ average: 0, min: 0, max: 0, ripple: 0 });
    const full = steadyState(l, 1);
    expect(full.ripple).toBe(0);
    expect(full.average).toBeCloseTo(3.3, 14);
  });

  it('rejects a duty outside 0..1', () => {
    expect(() => steadyState(oneStageWithRatio(1), 1.2)).toThrow(RangeError);
    expect(() => steadyState(oneStageWithRatio(1), Number.NaN)).toThrow(RangeError);
  });
});

describe('steadyState, several stages', () => {
  it('two identical buffered stages (a Jordan block) match two cascaded first-order sections', () => {
    // Source: closed form of two isolated first-order sections with equal tau in cascade
    // (solve x1' = (V - x1)/tau, x2' = (x1 - x2)/tau): x1 = V + (a - V) e^(-t/tau),
    // x2 = V + e^(-t/tau) [(b - V) + (a - V) t/tau]; turning point of x2 at
    // t* = tau (1 - (b - V)/(a - V)); integral of x2 over [0, t] =
    // V t + (b - V) tau (1 - e^(-t/tau)) + (a - V) tau (1 - e^(-t/tau)(1 + t/tau)).
    // The load sits behind the last follower and must not matter.
    const T = 50e-6;
    const tau = 2 * T;
    const l = ladder([stage(10e3, tau / 10e3, true), stage(10e3, tau / 10e3, true)], {
      loadResistance: 1e3,
      loadCapacitance: 1e-6,
    });
    for (const d of [0.2, 0.5, 0.85]) {
      const phases: Array<[number, number]> = [
        [3.3, d * T],
        [0, (1 - d) * T],
      ];
      const step = ([a, b]: number[], [v, t]: [number, number]) => {
        const e = Math.exp(-t / tau);
        return [v + (a - v) * e, v + e * (b - v + ((a - v) * t) / tau)];
      };
      const period = (x: number[]) => step(step(x, phases[0]), phases[1]);
      // The period map is affine: x -> M x + g; solve the 2 x 2 fixed point by Cramer's rule.
      const g = period([0, 0]);
      const m0 = period([1, 0]).map((v, i) => v - g[i]);
      const m1 = period([0, 1]).map((v, i) => v - g[i]);
      const [a11, a21, a12, a22] = [1 - m0[0], -m0[1], -m1[0], 1 - m1[1]];
      const det = a11 * a22 - a12 * a21;
      let x = [(g[0] * a22 - a12 * g[1]) / det, (a11 * g[1] - a21 * g[0]) / det];
      let integral = 0;
      const values: number[] = [x[1]];
      for (const [v, t] of phases) {
        const [a, b] = x;
        const e = Math.exp(-t / tau);
        integral += v * t + (b - v) * tau * (1 - e) + (a - v) * tau * (1 - e * (1 + t / tau));
        const tStar = tau * (1 - (b - v) / (a - v));
        if (tStar > 0 && tStar < t) values.push(step(x, [v, tStar])[1]);
        x = step(x, [v, t]);
        values.push(x[1]);
      }
      const op = steadyState(l, d);
      const ref = { average: integral / T, min: Math.min(...values), max: Math.max(...values) };
      expect(relative(op.average, ref.average)).toBeLessThan(1e-12);
      expect(relative(op.min, ref.min)).toBeLessThan(1e-12);
      expect(relative(op.max, ref.max)).toBeLessThan(1e-12);
      expect(relative(op.ripple, ref.max - ref.min)).toBeLessThan(1e-10);
    }
  });

  it('keeps relative accuracy for huge time constants: two-pole ripple scales as 1/s^2', () => {
    // Source: far above its poles a two-pole low-pass attenuates as 1/omega^2, so scaling both
    // capacitors by s scales the ripple by 1/s^2 up to O(1/s) corrections (common practice).
    // Digit loss in the engine would show up as noise far above 1e-6 here.
    const base = (s: number) => ladder([stage(1e3, 1e-7 * s), stage(10e3, 1e-8 * s)]);
    const scaled = [1e6, 1e7, 1e8].map((s) => steadyState(base(s), 0.37).ripple * s * s);
    expect(relative(scaled[1], scaled[2])).toBeLessThan(1e-6);
    expect(relative(scaled[0], scaled[2])).toBeLessThan(1e-5);
  });

  it('periodic: the trajectory returns to its start after one period', () => {
    // Source: definition of the periodic steady state (model.md).
    const l = ladder([stage(1e3, 1e-7), stage(10e3, 1e-8), stage(22e3, 4.7e-9)], {
      driverHigh: 40,
      driverLow: 25,
      loadResistance: 100e3,
    });
    const p = prepare(l);
    for (const d of [0, 0.1, 0.5, 0.99, 1]) {
      const tr = periodTrajectory(p, dutyPlan(p, d));
      for (const w of tr.wEnd) expect(Math.abs(w)).toBeLessThan(1e-14);
      const op = steadyState(l, d);
      expect(op.min).toBeLessThanOrEqual(op.average + 1e-15);
      expect(op.max).toBeGreaterThanOrEqual(op.average - 1e-15);
    }
  });
});
