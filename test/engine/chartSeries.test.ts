/**
 * The series the analysis charts draw (chartSeries and its parts), tested as data against outside
 * references: the closed forms of a first-order RC driven by a PWM square wave (firstOrderPwm.ts,
 * first-order circuit textbooks), the single-pole magnitude |1 / (1 + j w tau)|, the voltage divider,
 * and for two stages the independent mathjs reference (pwmReference.ts). Every series is compared
 * sample by sample with its sign, so a sign flip in any of them fails here.
 */
import { describe, expect, it } from 'vitest';
import { analyzeProject } from '../../src/engine/analyze.js';
import { chartSeries } from '../../src/engine/chartSeries.js';
import { dcErrorAcrossDuty } from '../../src/engine/dcErrorAcrossDuty.js';
import { magnitudeResponse } from '../../src/engine/magnitudeResponse.js';
import type { Project } from '../../src/project/types.js';
import { oneStageProject, type OneStage } from '../report/projectFixture.js';
import { firstOrderSteady, firstOrderStep, firstOrderTau, type FirstOrderPwm } from './firstOrderPwm.js';
import { ladder, stage } from './ladders.js';
import { pwmReference } from './pwmReference.js';

/** The fixture project and the same circuit for the closed forms. */
function oneStage(o: OneStage & { driverLow?: number }) {
  const base = oneStageProject(o);
  const project: Project =
    o.driverLow === undefined ? base : { ...base, pwm: { ...base.pwm, driver: { high: base.pwm.driver.high, low: o.driverLow } } };
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
  return { project, circuit };
}

// Invented circuits: 1 kohm + 1 uF behind 25 ohm at 10 kHz, 3.3 V (tau ~ 10 periods, ripple above
// the 0.5 LSB band: never settles), open output; the same with a 10 kohm load at 1 MHz (settles,
// a record of ~10^4 periods, strided); and a loaded one on 0.5 V .. 3.3 V levels at 200 kHz.
const CASES: Array<{ name: string; o: OneStage }> = [
  { name: 'open output, never settles', o: {} },
  { name: '10 kohm load', o: { loadResistance: 10e3, frequency: 1e6 } },
  { name: '0.5 V low level, 4.7 kohm load', o: { loadResistance: 4.7e3, low: 0.5, r: 2.2e3, c: 470e-9, frequency: 200e3 } },
];

describe.each(CASES)('chartSeries of a one-stage RC ($name)', ({ o }) => {
  const { project, circuit } = oneStage(o);
  const analysis = analyzeProject(project);
  const series = chartSeries(analysis, project.pwm.duty);
  const fs = circuit.high - circuit.low;
  const tol = 1e-9 * fs;

  it('steady state: output minus its average over two periods, exponentials between the levels', () => {
    // Source: first-order RC driven by a square wave, firstOrderSteady (closed form, see firstOrderPwm.ts).
    const { duty, average, t, deviation } = series.steady;
    expect(duty).toBe(analysis.worstRipple.duty);
    const ref = firstOrderSteady(circuit, duty);
    expect(Math.abs(average - ref.average)).toBeLessThan(tol);
    expect(t).toHaveLength(73); // 36 samples per period (72 columns / 2), two periods, both ends
    expect(t[72]).toBeCloseTo(2 * circuit.period, 15);
    t.forEach((x, i) => expect(Math.abs(deviation[i] - (ref.at(x) - ref.average))).toBeLessThan(tol));
    // Right after the rising edge the output climbs: the deviation rises (sign of the series).
    expect(deviation[1]).toBeGreaterThan(deviation[0]);
  });

  it('steady state at duty 1/2 (the worst, equal drivers): ripple (high - low) k tanh(T / (4 tau))', () => {
    // Source: textbook ripple of an RC fed by a symmetric square wave, (V_H - V_L) tanh(T/(4 RC))
    // (from memory; follows from the closed form above), with the Thevenin factor k of a load.
    expect(series.steady.duty).toBeCloseTo(0.5, 6);
    const k = circuit.load === undefined ? 1 : circuit.load / (circuit.load + circuit.r + circuit.driverHigh);
    const ripple = fs * k * Math.tanh(circuit.period / (4 * firstOrderTau(circuit)));
    const d = series.steady.deviation;
    // samples at 0 and T/2 are the edges, where the extremes are (to the accuracy of the duty search)
    expect(Math.max(...d) - Math.min(...d)).toBeCloseTo(ripple, 9);
    expect(d[0]).toBeCloseTo(Math.min(...d), 9); // minimum at the rising edge
    expect(d[18]).toBeCloseTo(Math.max(...d), 9); // maximum at the falling edge
  });

  it('step record: the first-order response between the two steady states, with band and settling instant', () => {
    // Source: firstOrderStep (the deviation from the new steady state decays as e^{-t/tau}).
    const step = series.step;
    expect([step.from, step.to, step.band, step.time]).toEqual([
      analysis.settling.from,
      analysis.settling.to,
      analysis.settling.band,
      analysis.settling.time,
    ]);
    const ref = firstOrderStep(circuit, step.from, step.to);
    step.wave.t.forEach((x, i) => expect(Math.abs(step.wave.v[i] - ref(x))).toBeLessThan(tol));
    expect(Math.abs(step.final - firstOrderSteady(circuit, step.to).average)).toBeLessThan(tol);
    if (step.time === null) {
      // Never settles: the ripple at `to` is wider than the band (definition, model.md).
      expect(firstOrderSteady(circuit, step.to).at(0)).toBeLessThan(step.final - step.band);
      return;
    }
    // From the settling instant on, the record stays in the band (definition of settling time, model.md),
    // and it leaves the band somewhere before it.
    const settled = step.time;
    const off = step.wave.v.map((v) => Math.abs(v - step.final));
    step.wave.t.forEach((x, i) => {
      if (x >= settled) expect(off[i]).toBeLessThanOrEqual(step.band * (1 + 1e-9));
    });
    expect(off[0]).toBeGreaterThan(step.band);
  });

  it('magnitude: 20 log10 |1 / (1 + j w tau)| on a log grid from fmin / 100 to 10 fmax, cutoff and PWM frequency marked', () => {
    // Source: single-pole low-pass |H(jw)| = 1 / sqrt(1 + (w tau)^2), -3 dB at 1 / (2 pi tau)
    // (Sedra & Smith, Microelectronic Circuits, single-time-constant networks; from memory).
    const m = series.magnitude;
    const tau = firstOrderTau(circuit);
    const fc = 1 / (2 * Math.PI * tau);
    const fPwm = 1 / circuit.period;
    expect(m.cutoff).toBeCloseTo(fc, 6);
    expect(m.pwmFrequency).toBeCloseTo(fPwm, 9);
    expect(m.frequency).toHaveLength(72);
    expect(m.frequency[0]).toBeCloseTo(Math.min(fc, fPwm) / 100, 9);
    expect(m.frequency[71] / (Math.max(fc, fPwm) * 10)).toBeCloseTo(1, 12);
    const ratios = m.frequency.slice(1).map((f, i) => f / m.frequency[i]);
    for (const r of ratios) expect(r).toBeCloseTo(ratios[0], 12); // evenly spaced in log f
    m.frequency.forEach((f, i) => {
      const ref = -10 * Math.log10(1 + (2 * Math.PI * f * tau) ** 2);
      expect(Math.abs(m.gainDb[i] - ref)).toBeLessThan(1e-9);
    });
    expect(m.gainDb[0]).toBeLessThan(0);
    expect(m.gainDb[0]).toBeGreaterThan(-1e-3);
  });

  it('DC error: ideal - average across the used duty range (README "Sign convention")', () => {
    // Source: the closed-form average (integral of the exponentials, firstOrderPwm.ts); with a load
    // it equals the voltage divider k (low + D (high - low)) (Ohm's law), so the error is positive.
    const { duty, error } = series.dcError;
    expect(duty).toHaveLength(72);
    expect(duty[0]).toBe(project.pwm.duty.min);
    expect(duty[71]).toBeCloseTo(project.pwm.duty.max, 15);
    duty.forEach((d, i) => {
      const ideal = circuit.low + d * fs;
      expect(Math.abs(error[i] - (ideal - firstOrderSteady(circuit, d).average))).toBeLessThan(tol);
      if (circuit.load !== undefined) {
        const k = circuit.load / (circuit.load + circuit.r + circuit.driverHigh);
        expect(Math.abs(error[i] - (1 - k) * ideal)).toBeLessThan(tol);
        expect(error[i]).toBeGreaterThan(0); // a load only pulls the output down (README)
      } else {
        expect(Math.abs(error[i])).toBeLessThan(tol); // charge balance on C: no DC error (common practice)
      }
    });
  });
});

describe('chartSeries, unequal drivers and a chosen column count', () => {
  // Invented: 60 ohm high-side and 20 ohm low-side driver, open output: the output spends longer
  // near the low level than the ideal, so the DC error is positive and grows with the duty.
  const { project, circuit } = oneStage({ driver: 60, driverLow: 20, r: 100, c: 2.2e-6, duty: { min: 0.1, max: 0.9 } });
  const analysis = analyzeProject(project);
  const series = chartSeries(analysis, project.pwm.duty, { columns: 40 });

  it('DC error follows the closed-form average with one tau per phase', () => {
    // Source: firstOrderSteady (exponentials with tau_H = (R + R_dH) C, tau_L = (R + R_dL) C).
    const { duty, error } = series.dcError;
    expect(duty).toHaveLength(40);
    duty.forEach((d, i) => {
      const ref = circuit.low + d * (circuit.high - circuit.low) - firstOrderSteady(circuit, d).average;
      expect(Math.abs(error[i] - ref)).toBeLessThan(1e-9 * circuit.high);
      expect(error[i]).toBeGreaterThan(0);
    });
    // The chart's marker is the analysis droop: the largest error on the grid cannot exceed it.
    expect(Math.max(...error)).toBeLessThanOrEqual(analysis.dc.droop.error * (1 + 1e-12));
    expect(series.columns).toBe(40);
    expect(series.steady.t).toHaveLength(41);
    expect(series.magnitude.gainDb).toHaveLength(40);
  });

  it('steady state at the worst-ripple duty matches the closed form', () => {
    const { duty, t, deviation, average } = series.steady;
    const ref = firstOrderSteady(circuit, duty);
    expect(Math.abs(average - ref.average)).toBeLessThan(1e-9 * circuit.high);
    t.forEach((x, i) => expect(Math.abs(deviation[i] - (ref.at(x) - ref.average))).toBeLessThan(1e-9 * circuit.high));
  });
});

describe('series of a two-stage ladder against the mathjs reference', () => {
  // Invented: 2.2 kohm + 47 nF, 22 kohm + 10 nF behind 40 / 25 ohm, 100 kohm load, 20 kHz.
  const l = ladder([stage(2.2e3, 47e-9), stage(22e3, 10e-9)], { driverHigh: 40, driverLow: 25, loadResistance: 1e5 });
  const ref = pwmReference(l);

  it('DC error: ideal minus the average of the reference waveform (trapezoid over 4000 samples)', () => {
    // Source: pwmReference (nodal equations, mathjs expm); the average by the composite trapezoid
    // rule, accurate to ~1e-7 of the level at 4000 samples per period (common practice).
    const series = dcErrorAcrossDuty(l, 0.1, 0.9, 5);
    series.duty.forEach((d, i) => {
      const x0 = ref.steadyStart(d);
      const n = 4000;
      let sum = 0;
      for (let j = 0; j <= n; j++) sum += (j === 0 || j === n ? 0.5 : 1) * ref.within(d, x0, (j * l.period) / n);
      const average = sum / n;
      const ideal = l.low + d * (l.high - l.low);
      expect(Math.abs(series.error[i] - (ideal - average))).toBeLessThan(1e-6);
      expect(series.error[i]).toBeGreaterThan(0); // the load pulls the output down
    });
  });

  it('magnitude: |H(j w)| / |H(0)| of the two-pole transfer function', () => {
    // Source: H(s) = 1 / (a s^2 + b s + c) of the loaded two-stage ladder from its nodal equations
    // (KCL at both nodes, network analysis textbooks): a = Rs C1 R2 C2,
    // b = Rs C1 + R2 C2 + Rs C2 + Rs R2 C1 / RL, c = 1 + (Rs + R2) / RL, Rs = R1 + mean driver.
    const rs = 2.2e3 + 32.5;
    const [c1, r2, c2, rl] = [47e-9, 22e3, 10e-9, 1e5];
    const a = rs * c1 * r2 * c2;
    const b = rs * c1 + r2 * c2 + rs * c2 + (rs * r2 * c1) / rl;
    const c0 = 1 + (rs + r2) / rl;
    const m = magnitudeResponse(l, 30);
    m.frequency.forEach((f, i) => {
      const w = 2 * Math.PI * f;
      const h = c0 / Math.hypot(c0 - a * w * w, b * w);
      expect(Math.abs(m.gainDb[i] - 20 * Math.log10(h))).toBeLessThan(1e-8);
    });
  });
});
