/**
 * Tolerance studies of version 1.1 circuits (model.md 1.1) against independent computations:
 * (1) a plain ladder given as a `Network` (networkOfLadder) against the ladder path (modal form,
 *     ladder engine): worst case and a seeded Monte Carlo;
 * (2) a Sallen-Key stage: f0 and Q at the corners of the tolerance box from the state matrix the
 *     engine integrates, against the standard unity-gain Sallen-Key formulas, and the worst ripple
 *     at the corner of highest f0 against the time-scaling identity;
 * (3) a fine output: the DC effect of the weighting resistor's tolerance against superposition
 *     (Millman's theorem) by hand.
 * Circuits and projects are invented.
 */
import { describe, expect, it } from 'vitest';
import type { Network } from '../../src/circuit/network.js';
import { networkEquations } from '../../src/circuit/networkEquations.js';
import { networkOfLadder } from '../../src/circuit/networkOfLadder.js';
import { networkWorstRipple } from '../../src/engine/index.js';
import type { Project } from '../../src/project/types.js';
import { monteCarlo } from '../../src/tolerance/monteCarlo.js';
import { networkAt, toleranceParameters } from '../../src/tolerance/parameters.js';
import { worstCase } from '../../src/tolerance/worstCase.js';
import { network, pin, rc, sallenKey, secondPwm } from '../engine/periodic/networks.js';
import { ladder, stage } from './reference.js';
import { project } from './projectFixture.js';

const T = 1 / 20e3;

/** A project whose circuit is the given network (the fixture's pwm at 20 kHz, 3.3 V / 0 V). */
function networkProject(n: Network, tolerance: Partial<Project['tolerance']>, extra: Partial<Project> = {}): Project {
  const base = project([], tolerance ?? {}, extra);
  return {
    ...base,
    pwm: { ...base.pwm, driver: { high: n.pin.driverHigh, low: n.pin.driverLow }, ...extra.pwm },
    filter: { stages: n.stages.flatMap((s) => (s.kind === 'rc' ? [{ r: s.r, c: s.c, buffered: s.buffered }] : [])) },
    network: { stages: n.stages, second: n.second },
    load: { capacitance: n.loadCapacitance, ...(n.loadResistance !== null && { resistance: n.loadResistance }) },
  };
}

describe('a ladder as a Network: the network tolerance path agrees with the ladder path', () => {
  // Two stages, unequal drivers, a 200 kohm load: ripple, droop, INL, gain and settling all move.
  const l = ladder([stage(2.2e3, 470e-9), stage(10e3, 47e-9)], { driverHigh: 40, driverLow: 25, loadResistance: 200e3 });
  const p = project(
    [stage(2.2e3, 470e-9), stage(10e3, 47e-9)],
    { resistor: 0.01, capacitor: 0.1, driver: { high: { min: 20, max: 60 }, low: { min: 15, max: 40 } }, supply: 0.05, load: 0.1 },
    {
      pwm: { frequency: 20e3, prescaler: 1, alignment: 'edge', high: 3.3, low: 0, driver: { high: 40, low: 25 }, duty: { min: 0.05, max: 0.95 } },
      load: { resistance: 200e3, capacitance: 0 },
      // limits near the middle of each figure's spread, so that the yields are neither 0 nor 1
      spec: { ripple: 5.5e-4, droop: 0.19, inl: 5e-3, gain: 0.06, settling: { band: 1.6e-3, time: 0.0097 } },
    },
  );
  const n = networkOfLadder(l);

  it('the same parameters, worst points and worst-case values (ripple 1e-8, DC 1e-9 relative, settling 1e-6 T)', () => {
    const a = worstCase(p, l, { gain: true });
    const b = worstCase(p, n, { gain: true });
    expect(b.parameters).toEqual(a.parameters);
    const close = (x: number | null, y: number | null, rel: number, abs: number) => {
      expect(x === null).toBe(y === null);
      if (x !== null && y !== null) expect(Math.abs(x - y)).toBeLessThan(rel * Math.abs(y) + abs);
    };
    close(b.worstRipple.value, a.worstRipple.value, 1e-8, 1e-15);
    close(b.droop.value, a.droop.value, 1e-9, 1e-12 * 3.3);
    close(b.inl!.value, a.inl!.value, 1e-9, 1e-12 * 3.3);
    close(b.gain!.value, a.gain!.value, 1e-9, 1e-12);
    close(b.settlingTime.value, a.settlingTime.value, 0, 1e-6 * T);
    for (const f of ['worstRipple', 'droop', 'settlingTime'] as const) expect(b[f].z).toEqual(a[f].z);
    expect(b.pass).toBe(a.pass);
  });

  it('a seeded Monte Carlo: every sample\'s figures and the yield', () => {
    const a = monteCarlo(p, l, { samples: 150, seed: 7, gain: true });
    const b = monteCarlo(p, n, { samples: 150, seed: 7, gain: true });
    for (let i = 0; i < 150; i++) {
      expect(Math.abs(b.values.worstRipple[i] - a.values.worstRipple[i])).toBeLessThan(1e-8 * a.values.worstRipple[i]);
      expect(Math.abs(b.values.droop[i] - a.values.droop[i])).toBeLessThan(1e-9 * Math.abs(a.values.droop[i]) + 1e-12 * 3.3);
      expect(Math.abs(b.values.inl![i] - a.values.inl![i])).toBeLessThan(1e-9 * Math.abs(a.values.inl![i]) + 1e-12 * 3.3);
      expect(Math.abs(b.values.gain![i] - a.values.gain![i])).toBeLessThan(1e-9 * Math.abs(a.values.gain![i]) + 1e-12);
      expect(Math.abs(b.values.settlingTime[i] - a.values.settlingTime[i])).toBeLessThan(1e-6 * T);
    }
    expect(b.passed).toBe(a.passed);
    expect(b.yieldBySpec).toEqual(a.yieldBySpec);
    // every spec fails some samples and passes others, so the yield comparison means something
    for (const y of Object.values(a.yieldBySpec)) {
      expect(y).toBeGreaterThan(0);
      expect(y).toBeLessThan(1);
    }
  });
});

describe('a Sallen-Key stage: f0 and Q at the corners of the tolerance box', () => {
  // Standard unity-gain Sallen-Key low-pass formulas (e.g. TI application report SLOA024, "Analysis
  // of the Sallen-Key architecture"; written here from memory): f0 = 1 / (2 pi sqrt(r1 r2 c1 c2)),
  // Q = sqrt(r1 r2 c1 c2) / (c2 (r1 + r2)).
  const f0Of = (r1: number, r2: number, c1: number, c2: number) => 1 / (2 * Math.PI * Math.sqrt(r1 * r2 * c1 * c2));
  const qOf = (r1: number, r2: number, c1: number, c2: number) => Math.sqrt(r1 * r2 * c1 * c2) / (c2 * (r1 + r2));
  // Alone, with ideal drivers (0 ohm) and an open output: f0 = 1.13 kHz, Q = 0.707 (Butterworth).
  const sk = network([sallenKey(10e3, 10e3, 20e-9, 10e-9)], { pin: pin(0, 0) });
  const tr = 0.01;
  const tc = 0.05;
  const p = networkProject(sk, { resistor: tr, capacitor: tc }, { spec: { ripple: 1e-2 } });
  const params = toleranceParameters(p.tolerance!, sk);

  it('every corner: the state matrix the engine integrates has det = w0^2 and -trace = w0 / Q of the closed forms', () => {
    // A second-order system x' = A x + b has characteristic polynomial s^2 - tr(A) s + det(A), and
    // the low-pass denominator is s^2 + (w0 / Q) s + w0^2 (textbook second-order form).
    expect(params.map((q) => q.key)).toEqual(['s1.r1', 's1.r2', 's1.c1', 's1.c2']);
    let f0Max = 0;
    let f0Min = Infinity;
    let qMax = 0;
    let qMin = Infinity;
    for (let mask = 0; mask < 16; mask++) {
      const z = [0, 1, 2, 3].map((k) => ((mask >> k) & 1 ? 1 : -1));
      const v = networkAt(sk, params, z);
      const s = v.stages[0];
      if (s.kind !== 'sallen-key') throw new Error('expected a Sallen-Key stage');
      const A = networkEquations(v).phases.hl.A;
      const det = A[0] * A[3] - A[1] * A[2];
      const trace = A[0] + A[3];
      const w0 = 2 * Math.PI * f0Of(s.r1, s.r2, s.c1, s.c2);
      expect(Math.abs(Math.sqrt(det) - w0) / w0).toBeLessThan(1e-12);
      expect(Math.abs(-trace - w0 / qOf(s.r1, s.r2, s.c1, s.c2)) / (w0 / qOf(s.r1, s.r2, s.c1, s.c2))).toBeLessThan(1e-12);
      f0Max = Math.max(f0Max, Math.sqrt(det) / (2 * Math.PI));
      f0Min = Math.min(f0Min, Math.sqrt(det) / (2 * Math.PI));
      qMax = Math.max(qMax, Math.sqrt(det) / -trace);
      qMin = Math.min(qMin, Math.sqrt(det) / -trace);
    }
    // Extremes by hand: f0 ~ (r1 r2 c1 c2)^-1/2; Q ~ sqrt(c1 / c2) sqrt(r1 r2) / (r1 + r2), largest
    // with r1 = r2, c1 max and c2 min, smallest with r1, r2 apart, c1 min and c2 max.
    const f0 = f0Of(10e3, 10e3, 20e-9, 10e-9);
    const q = qOf(10e3, 10e3, 20e-9, 10e-9);
    expect(f0Max / (f0 / ((1 - tr) * (1 - tc)))).toBeCloseTo(1, 12);
    expect(f0Min / (f0 / ((1 + tr) * (1 + tc)))).toBeCloseTo(1, 12);
    expect(qMax / (q * Math.sqrt((1 + tc) / (1 - tc)))).toBeCloseTo(1, 12);
    expect(qMin / (q * Math.sqrt((1 - tc) / (1 + tc)) * Math.sqrt(1 - tr * tr))).toBeCloseTo(1, 12);
  });

  it('the worst ripple sits at the corner of highest f0 (every part at its minimum), with the value of a time-scaled nominal', () => {
    // Well above f0 a second-order low-pass passes (f0 / f)^2 of the ripple (handbook asymptote), so
    // raising any part lowers it. At the all-minimum corner every time constant is scaled by
    // k = (1 - tr)(1 - tc) (Q unchanged), so the circuit is the nominal one run k times slower:
    // its ripple equals the nominal's at the period T / k (scaling t -> t / k in x' = A x + b).
    const wc = worstCase(p);
    expect(wc.worstRipple.z).toEqual([-1, -1, -1, -1]);
    expect(wc.worstRipple.effects).toEqual(['lowers', 'lowers', 'lowers', 'lowers']);
    const k = (1 - tr) * (1 - tc);
    const scaled = networkWorstRipple({ ...sk, period: T / k }, 0.1, 0.9).ripple;
    expect(Math.abs(wc.worstRipple.value! - scaled) / scaled).toBeLessThan(1e-8);
    const [r1, r2, c1, c2] = wc.worstRipple.values;
    expect(f0Of(r1, r2, c1, c2) / (f0Of(10e3, 10e3, 20e-9, 10e-9) / k)).toBeCloseTo(1, 12);
  });
});

describe('a fine output: the weighting resistor against Millman by hand', () => {
  // 4 + 4 bits, one RC stage (10 kohm, 1 uF), the fine output into its node through 160 kohm (16
  // times R1, the ideal weight), ideal drivers, open output, every code in range (duty 0 to 1).
  // Only the weighting resistor varies (R1's tolerance overridden to 0, capacitors exact).
  const R1 = 10e3;
  const r = 160e3;
  const t = 0.01;
  const V = 3.3;
  const fine = network([rc(R1, 1e-6)], { pin: pin(0, 0), second: secondPwm('fine', 0, r, null, 4, pin(0, 0), 4) });
  const p = networkProject(
    fine,
    { resistor: t, capacitor: 0, stages: [{ resistor: 0 }] },
    { pwm: { frequency: 20e3, prescaler: 1, alignment: 'edge', high: V, low: 0, bits: 4, driver: { high: 0, low: 0 }, duty: { min: 0, max: 1 } }, spec: { droop: 1, inl: 1e-3, gain: 0.05 } },
  );

  /**
   * Millman's theorem at the node (the capacitor carries no DC current, the output is open): the
   * mean node voltage is (V d1 / R1 + V d2 / r) / (1 / R1 + 1 / r) for duties d1 = c / 16, d2 = f / 16.
   * Endpoint fit through codes 0 and 256 (average 0 and V G1 / (G1 + G2)); the deviation fit - average
   * at code 16 c + f is V (f / 16) (G1 / 16 - G2) / (G1 + G2), largest at f = 15; the droop (ideal -
   * average) is largest at code 256, V G2 / (G1 + G2); the gain error is G2 / (G1 + G2) of full scale.
   */
  const byHand = (rr: number) => {
    const G1 = 1 / R1;
    const G2 = 1 / rr;
    return { inl: (V * (15 / 16) * (G1 / 16 - G2)) / (G1 + G2), droop: (V * G2) / (G1 + G2), gain: G2 / (G1 + G2) };
  };

  it('worst-case INL, droop and gain error at the resistor\'s ends equal the superposition figures', () => {
    const wc = worstCase(p, undefined, { gain: true, confirmWithEngine: true });
    expect(wc.parameters.map((q) => q.key)).toEqual(['second.r']);
    const low = byHand(r * (1 - t));
    const high = byHand(r * (1 + t));
    // |INL| is larger with the resistor low (fine weight 1 % high: 15 steps of 1 % of a fine step)
    const inl = Math.abs(low.inl) > Math.abs(high.inl) ? { value: low.inl, z: -1 } : { value: high.inl, z: 1 };
    expect(Math.abs(wc.inl!.value! - inl.value)).toBeLessThan(1e-9 * Math.abs(inl.value));
    expect(wc.inl!.z).toEqual([inl.z]);
    expect(wc.inl!.duty! * 256 % 16).toBe(15);
    expect(Math.abs(wc.droop.value! - low.droop)).toBeLessThan(1e-9 * low.droop);
    expect(wc.droop.duty).toBe(1);
    expect(Math.abs(wc.gain!.value! - low.gain)).toBeLessThan(1e-9 * low.gain);
    // nominal: r = 16 R1 exactly, so the fine weight is ideal and the INL vanishes
    expect(Math.abs(wc.nominal.inl!.error)).toBeLessThan(1e-12 * V);
  });

  it('every Monte Carlo sample lies between the two ends', () => {
    const mc = monteCarlo(p, undefined, { samples: 60, seed: 3, gain: true });
    const low = byHand(r * (1 - t));
    const high = byHand(r * (1 + t));
    for (let i = 0; i < 60; i++) {
      expect(mc.values.inl![i]).toBeGreaterThanOrEqual(Math.min(low.inl, high.inl) - 1e-12);
      expect(mc.values.inl![i]).toBeLessThanOrEqual(Math.max(low.inl, high.inl) + 1e-12);
      expect(mc.values.gain![i]).toBeGreaterThanOrEqual(high.gain - 1e-12);
      expect(mc.values.gain![i]).toBeLessThanOrEqual(low.gain + 1e-12);
    }
  });
});
