import { describe, expect, it } from 'vitest';
import type { Ladder } from '../../src/circuit/ladder.js';
import { dutyPlan } from '../../src/engine/dutyPlan.js';
import { periodPowers } from '../../src/engine/periodPowers.js';
import { periodTrajectory } from '../../src/engine/periodTrajectory.js';
import { prepare } from '../../src/engine/prepare.js';
import { stepWaveform } from '../../src/engine/stepWaveform.js';
import { stepWaveformOnGrid } from '../../src/engine/stepWaveformOnGrid.js';
import { ladder, stage } from './ladders.js';
import { pwmReference } from './pwmReference.js';

/** Invented demo circuits (not from any product). */
const twoStagesUnequalDrivers = ladder([stage(2.2e3, 47e-9), stage(22e3, 10e-9)], { driverHigh: 40, driverLow: 25, loadResistance: 1e5 });
const followerBetween = ladder([stage(1e3, 100e-9, true), stage(10e3, 33e-9)], { driverHigh: 30, driverLow: 18, loadResistance: 47e3 });
const threeStages = ladder([stage(1e3, 220e-9), stage(4.7e3, 47e-9), stage(22e3, 10e-9)], {
  driverHigh: 40,
  driverLow: 25,
  loadResistance: 1e6,
  loadCapacitance: 100e-12,
});

const SWING = 3.3;

/** The engine's previous evaluation path: periodTrajectory of each period from M^k e_0 (periodPowers). */
function trajectoryPath(l: Ladder, from: number, to: number, times: number[]): number[] {
  const p = prepare(l);
  const plan = dutyPlan(p, to);
  const powers = periodPowers(plan.S, p.n);
  const e0 = dutyPlan(p, from).xStart.map((v, i) => v - plan.xStart[i]);
  return times.map((t) => {
    const k = Math.floor(t / l.period);
    const e = powers.applyPower(k, e0);
    return plan.yStart + e[p.system.output] + periodTrajectory(p, plan, e).valueAt(t - k * l.period);
  });
}

const largestError = (a: number[], b: number[]) => Math.max(...a.map((v, i) => Math.abs(v - b[i])));

describe('stepWaveformOnGrid', () => {
  it('lies on the per-period grid, starts at 0 and ends exactly at the duration', () => {
    // Source: the contract in stepWaveformOnGrid.ts (t = k T + j T / m, plus the end).
    const T = twoStagesUnequalDrivers.period;
    const w = stepWaveformOnGrid(twoStagesUnequalDrivers, 0.2, 0.7, 12.37 * T, 8);
    expect(w.t[0]).toBe(0);
    expect(w.t.at(-1)).toBe(12.37 * T);
    expect(w.t.length).toBe(12 * 8 + 3 + 1); // 12 whole periods, j = 0..2 of the 13th (2.96 < 3), the end
    for (let i = 0; i + 1 < w.t.length; i++) expect(w.t[i]).toBeCloseTo((i * T) / 8, 18);
  });

  for (const [name, l, from, to] of [
    ['two stages, unequal drivers, rising', twoStagesUnequalDrivers, 0.2, 0.7],
    ['two stages, unequal drivers, falling', twoStagesUnequalDrivers, 0.9, 0.15],
    ['a follower between the stages', followerBetween, 0.1, 0.9],
    ['three stages with load capacitance', threeStages, 0.35, 0.8],
  ] as const) {
    it(`${name}: agrees with an independent matrix-exponential reference to 1e-12 of the swing`, () => {
      // Source: mathjs expm/lusolve on nodal equations written in the test (pwmReference.ts).
      const T = l.period;
      const w = stepWaveformOnGrid(l, from, to, 30.37 * T, 16);
      const ref = pwmReference(l).step(from, to, w.t);
      expect(largestError(w.v, ref)).toBeLessThan(1e-12 * SWING);
    });

    it(`${name}: agrees with the per-period trajectory path and with stepWaveform at the same instants`, () => {
      // Source: periodTrajectory.valueAt (marched cell flows) of the state M^k e_0, an independent
      // code path inside the engine; stepWaveform with one instant per call.
      const T = l.period;
      const w = stepWaveformOnGrid(l, from, to, 40.5 * T, 12);
      expect(largestError(w.v, trajectoryPath(l, from, to, w.t))).toBeLessThan(1e-12 * SWING);
      const picks = [0, 5, 100, 333, w.t.length - 1];
      for (const i of picks) {
        const single = w.t[i] === 0 ? stepWaveform(l, from, to, T, 2).v[0] : stepWaveform(l, from, to, w.t[i], 2).v[1];
        expect(Math.abs(single - w.v[i])).toBeLessThan(1e-12 * SWING);
      }
    });
  }

  it('one stage: matches the RC charging formula phase by phase, with unequal drivers and a load', () => {
    // Source: exponential charging of an RC circuit, v(t) = v_inf + (v0 - v_inf) e^{-t/tau} per
    // phase (any circuits textbook; common practice), with the Thevenin equivalent of the pin,
    // driver, R and load: v_inf = V RL / (Rd + R + RL), tau = C (Rd + R) || RL. The steady state
    // at the rising edge is the fixed point of one period:
    // v0 = (v_l (1 - a_l) + v_h (1 - a_h) a_l) / (1 - a_h a_l), a_p = e^{-t_p / tau_p}.
    const [r, c, rl, rdh, rdl, vh, vl] = [4.7e3, 100e-9, 47e3, 60, 20, 3.3, 0.2];
    const l = ladder([stage(r, c)], { driverHigh: rdh, driverLow: rdl, loadResistance: rl, high: vh, low: vl });
    const T = l.period;
    const thevenin = (v: number, rd: number) => ({ inf: (v * rl) / (rd + r + rl), tau: (c * (rd + r) * rl) / (rd + r + rl) });
    const h = thevenin(vh, rdh);
    const lo = thevenin(vl, rdl);
    const charge = (v0: number, p: { inf: number; tau: number }, t: number) => p.inf + (v0 - p.inf) * Math.exp(-t / p.tau);
    const start = (d: number) => {
      const ah = Math.exp((-d * T) / h.tau);
      const al = Math.exp((-(1 - d) * T) / lo.tau);
      return (lo.inf * (1 - al) + h.inf * (1 - ah) * al) / (1 - ah * al);
    };
    const [from, to] = [0.25, 0.85];
    const w = stepWaveformOnGrid(l, from, to, 17.5 * T, 20);
    let v = start(from);
    let k = 0;
    w.t.forEach((t, i) => {
      for (; k < Math.floor(t / T); k++) v = charge(charge(v, h, to * T), lo, (1 - to) * T);
      const tau = t - k * T;
      const ref = tau <= to * T ? charge(v, h, tau) : charge(charge(v, h, to * T), lo, tau - to * T);
      expect(Math.abs(w.v[i] - ref)).toBeLessThan(1e-12 * vh);
    });
  });

  it('one stage, duty 1 -> 0: decays as V e^{-t/RC} (no high phase at all)', () => {
    // Source: RC discharge v(t) = V e^{-t/RC} (common practice); ideal driver, open output.
    const l = ladder([stage(10e3, 100e-9)]);
    const tau = 10e3 * 100e-9;
    const w = stepWaveformOnGrid(l, 1, 0, 3.3 * tau, 4);
    w.t.forEach((t, i) => expect(Math.abs(w.v[i] - 3.3 * Math.exp(-t / tau))).toBeLessThan(1e-12 * 3.3));
  });

  it('a long record samples an evenly spread subset of whole periods, each spanning its true ripple', () => {
    // Source: per-period extremes from periodTrajectory (phase boundaries plus Brent-refined turning
    // points, steadyState.ts method) of the same state M^k e_0. The period's samples j h (j < m) leave
    // no instant of [0, T] farther than h from a sample (T itself, where a rising step peaks), so an
    // extreme is missed by at most max|y'| h (mean value theorem); max|y'| from a 64x finer sampling.
    const l = ladder([stage(10e3, 1e-6), stage(100e3, 100e-9)], { driverHigh: 40, driverLow: 25, loadResistance: 1e6 });
    const T = l.period;
    const m = 16;
    const duration = 5001 * T; // the last sampled period (5000) is then whole too
    const maxSamples = 2000;
    const w = stepWaveformOnGrid(l, 0.1, 0.9, duration, m, maxSamples);
    expect(w.t.length).toBeLessThanOrEqual(maxSamples);
    expect(w.t[0]).toBe(0);
    expect(w.t.at(-1)).toBe(duration);
    const count = (w.t.length - 1) / m;
    expect(count).toBe(Math.floor((maxSamples - 1) / m));
    const starts = Array.from({ length: count }, (_, s) => Math.round(w.t[s * m] / T));
    expect(starts[0]).toBe(0);
    expect(starts.at(-1)).toBe(5000);
    const gaps = starts.slice(1).map((k, s) => k - starts[s]);
    expect(Math.max(...gaps) - Math.min(...gaps)).toBeLessThanOrEqual(1);

    const p = prepare(l);
    const plan = dutyPlan(p, 0.9);
    const powers = periodPowers(plan.S, p.n);
    const e0 = dutyPlan(p, 0.1).xStart.map((v, i) => v - plan.xStart[i]);
    const out = p.system.output;
    for (let s = 0; s < count; s++) {
      const k = starts[s];
      const period = w.v.slice(s * m, s * m + m);
      for (let j = 0; j < m; j++) expect(w.t[s * m + j]).toBeCloseTo(k * T + (j * T) / m, 15);
      const e = powers.applyPower(k, e0);
      const traj = periodTrajectory(p, plan, e);
      const base = plan.yStart + e[out];
      const dense = Array.from({ length: 64 * m + 1 }, (_, i) => traj.valueAt((i * T) / (64 * m)));
      const slope = Math.max(...dense.slice(1).map((v, i) => Math.abs(v - dense[i]))) / (T / (64 * m));
      const resolution = 1.1 * slope * (T / m);
      const [lo, hi] = [Math.min(...period), Math.max(...period)];
      expect(hi).toBeLessThanOrEqual(base + traj.maxW + 1e-12);
      expect(lo).toBeGreaterThanOrEqual(base + traj.minW - 1e-12);
      expect(base + traj.maxW - hi).toBeLessThanOrEqual(resolution);
      expect(lo - (base + traj.minW)).toBeLessThanOrEqual(resolution);
    }
  });

  it('rejects a sample budget too small for two whole periods, and bad counts', () => {
    // Source: the contract in stepWaveformOnGrid.ts.
    const l = twoStagesUnequalDrivers;
    expect(() => stepWaveformOnGrid(l, 0.1, 0.9, 100 * l.period, 16, 32)).toThrow(RangeError);
    expect(() => stepWaveformOnGrid(l, 0.1, 0.9, 100 * l.period, 2.5)).toThrow(RangeError);
    expect(() => stepWaveformOnGrid(l, 0.1, 1.2, 100 * l.period, 16)).toThrow(RangeError);
    expect(stepWaveformOnGrid(l, 0.1, 0.9, 100 * l.period, 16, 33).t.length).toBe(33);
  });
});
