/**
 * The data behind compare's overlay charts and analyze's CSV (compareOverlays, waveformRecords),
 * tested against the closed forms of a first-order RC driven by a PWM square wave
 * (firstOrderPwm.ts, first-order circuit textbooks), sample by sample with their signs.
 */
import { describe, expect, it } from 'vitest';
import { analyzeProject } from '../../src/engine/analyze.js';
import { compareOverlays } from '../../src/engine/compareOverlays.js';
import { waveformRecords } from '../../src/engine/waveformRecords.js';
import { oneStageProject, type OneStage } from '../report/projectFixture.js';
import { firstOrderSteady, firstOrderStep, type FirstOrderPwm } from './firstOrderPwm.js';

function side(o: OneStage) {
  const project = oneStageProject(o);
  const circuit: FirstOrderPwm = {
    high: project.pwm.high,
    low: project.pwm.low,
    r: project.filter.stages[0].r,
    c: project.filter.stages[0].c,
    driverHigh: project.pwm.driver.high,
    driverLow: project.pwm.driver.low,
    load: project.load.resistance,
    period: 1 / project.pwm.frequency,
  };
  return { analysis: analyzeProject(project), circuit };
}

describe('compareOverlays', () => {
  // Invented: base 1 kohm + 1 uF with a 4.7 kohm load (DC error ~ 17 % of the level), head the
  // same with 2.2 uF and a 47 kohm load, both at 10 kHz, 3.3 V, 25 ohm driver.
  const base = side({ loadResistance: 4.7e3 });
  const head = side({ loadResistance: 47e3, c: 2.2e-6 });
  const o = compareOverlays(base.analysis, head.analysis, 72);
  const tol = 1e-9 * 3.3;

  it('steady states at the head worst-ripple duty on one grid of two periods, output minus ideal', () => {
    // Source: firstOrderSteady (closed form); ideal = low + D (high - low) (model.md). A load pulls
    // the output below the ideal, so output minus ideal is negative on both sides (README sign convention).
    const { duty, t } = o.steady;
    expect(duty).toBe(head.analysis.worstRipple.duty);
    expect(t).toHaveLength(72);
    expect(t[0]).toBe(0);
    expect(t[71]).toBeCloseTo(2e-4, 15);
    const ideal = 3.3 * duty;
    for (const [series, s] of [[o.steady.base, base], [o.steady.head, head]] as const) {
      const ref = firstOrderSteady(s.circuit, duty);
      t.forEach((x, i) => expect(Math.abs(series[i] - (ref.at(x) - ideal))).toBeLessThan(tol));
      expect(Math.max(...series)).toBeLessThan(0);
    }
  });

  it('step responses to the head settling step on one grid, long enough for the slower side', () => {
    // Source: firstOrderStep (deviation from the new steady state decays as e^{-t/tau}).
    const { from, to, t } = o.step;
    expect([from, to]).toEqual([head.analysis.settling.from, head.analysis.settling.to]);
    expect(t).toHaveLength(72);
    // Neither settles (ripple above 0.5 LSB), so 8 x the slower time constant (stepRecordDuration rule).
    expect(head.analysis.settling.time).toBeNull();
    expect(t[71]).toBeCloseTo(8 * head.analysis.timeConstants[0], 12);
    for (const [series, s] of [[o.step.base, base], [o.step.head, head]] as const) {
      const ref = firstOrderStep(s.circuit, from, to);
      t.forEach((x, i) => expect(Math.abs(series[i] - ref(x))).toBeLessThan(tol));
    }
    // rising step: the output ends above where it starts
    expect(to).toBeGreaterThan(from);
    expect(o.step.head[71]).toBeGreaterThan(o.step.head[0]);
  });

  it('interpolates a side whose period does not divide the window, staying within its ripple band', () => {
    // Invented: head at 10 kHz, base at 3 kHz: the window is two base periods; the head is sampled
    // densely and read by linear interpolation (never outside the exact waveform's range).
    const slow = side({ loadResistance: 4.7e3, frequency: 3e3 });
    const w = compareOverlays(slow.analysis, head.analysis, 50);
    expect(w.steady.t[49]).toBeCloseTo(2 / 3e3, 12);
    const ref = firstOrderSteady(head.circuit, w.steady.duty);
    const ideal = 3.3 * w.steady.duty;
    const exact = Array.from({ length: 2001 }, (_, i) => ref.at(i * 1e-7) - ideal);
    for (const v of w.steady.head) {
      expect(v).toBeGreaterThanOrEqual(Math.min(...exact) - tol);
      expect(v).toBeLessThanOrEqual(Math.max(...exact) + tol);
    }
    // the base holds whole periods in the window: exact at every grid instant
    const refBase = firstOrderSteady(slow.circuit, w.steady.duty);
    w.steady.t.forEach((x, i) => expect(Math.abs(w.steady.base[i] - (refBase.at(x) - ideal))).toBeLessThan(tol));
  });
});

describe('waveformRecords (analyze --csv)', () => {
  const s = side({ loadResistance: 10e3 });
  const r = waveformRecords(s.analysis);

  it('steady record: two periods at 200 samples per period at the worst-ripple duty, absolute output', () => {
    // Source: firstOrderSteady (closed form).
    expect(r.steady.duty).toBe(s.analysis.worstRipple.duty);
    expect(r.steady.wave.t).toHaveLength(401);
    const ref = firstOrderSteady(s.circuit, r.steady.duty);
    expect(Math.abs(r.steady.average - ref.average)).toBeLessThan(1e-9 * 3.3);
    r.steady.wave.t.forEach((x, i) => expect(Math.abs(r.steady.wave.v[i] - ref.at(x))).toBeLessThan(1e-9 * 3.3));
  });

  it('step record: the settling step of the analysis', () => {
    // Source: firstOrderStep.
    const { from, to } = s.analysis.settling;
    const ref = firstOrderStep(s.circuit, from, to);
    r.step.wave.t.forEach((x, i) => expect(Math.abs(r.step.wave.v[i] - ref(x))).toBeLessThan(1e-9 * 3.3));
  });
});
