import { describe, expect, it } from 'vitest';
import type { Duties, Network } from '../../../src/circuit/network.js';
import { firstOrderStep, firstOrderSteady } from '../firstOrderPwm.js';
import { networkDerivative, outputOf, periodicByRelaxation, pinSchedule, settlingBySimulation, simulateNetwork } from './odexNetwork.js';
import {
  complementR,
  complementRC,
  fine44,
  fine44Center,
  network,
  oneRc,
  oneRcCenter,
  pin,
  rc,
  rcBufferedSallenKeyQ055,
  rcSallenKeyQ055,
  rcSallenKeyQ2,
  sallenKey,
  sallenKeyButterworth,
  secondPwm,
  twoRcBufferedFirst,
} from './networks.js';

const relative = (a: number, b: number): number => Math.abs(a - b) / Math.abs(b);
const only = (first: number): Duties => ({ first, second: null });
const T = 50e-6;

/**
 * Millman's theorem (any circuits textbook; e.g. Alexander & Sadiku, Fundamentals of Electric
 * Circuits, nodal analysis): a node fed by sources E_i through R_i with no other DC path sits at
 * sum(E_i / R_i) / sum(1 / R_i). With constant driver resistances the node's time average obeys it
 * with each E_i replaced by the pin's average level (the average capacitor currents are zero in
 * periodic steady state and every branch is linear with a constant resistance).
 */
const millman = (sources: Array<[number, number]>): number => sources.reduce((s, [e, r]) => s + e / r, 0) / sources.reduce((s, [, r]) => s + 1 / r, 0);

describe('pinSchedule', () => {
  it('edge, center, complement and fine intervals; equal neighbours merged, empty ones skipped', () => {
    const f = (n: Network, d: Duties) => pinSchedule(n, d).map((i) => [i.t0 / T, i.t1 / T, i.firstHigh, i.secondHigh]);
    expect(f(oneRc, only(0.25))).toEqual([
      [0, 0.25, true, false],
      [0.25, 1, false, false],
    ]);
    expect(f(oneRcCenter, only(0.5))).toEqual([
      [0, 0.25, false, false],
      [0.25, 0.75, true, false],
      [0.75, 1, false, false],
    ]);
    expect(f(oneRc, only(0))).toEqual([[0, 1, false, false]]);
    expect(f(oneRcCenter, only(1))).toEqual([[0, 1, true, false]]);
    expect(f(complementR, only(0.25))).toEqual([
      [0, 0.25, true, false],
      [0.25, 1, false, true],
    ]);
    expect(f(fine44, { first: 0.25, second: 0.5 })).toEqual([
      [0, 0.25, true, true],
      [0.25, 0.5, false, true],
      [0.5, 1, false, false],
    ]);
    expect(f(fine44, { first: 0.5, second: 0.5 })).toEqual([
      [0, 0.5, true, true],
      [0.5, 1, false, false],
    ]);
    expect(f(fine44Center, { first: 0.5, second: 0.25 })).toEqual([
      [0, 0.25, false, false],
      [0.25, 0.375, true, false],
      [0.375, 0.625, true, true],
      [0.625, 0.75, true, false],
      [0.75, 1, false, false],
    ]);
  });
});

describe('networkDerivative', () => {
  it('RC node loaded by a Sallen-Key input, with a hand-written KCL at a chosen state', () => {
    // y = [v0, u1, u2]: node a = u1 + u2; pin high 3.3 V behind 25 ohm.
    const y = [1.0, 0.2, 0.5];
    const dy = networkDerivative(rcSallenKeyQ055, true, false)(0, y);
    const i0 = (3.3 - 1.0) / (25 + 10e3);
    const i1 = (1.0 - 0.7) / 10e3;
    const i2 = 0.2 / 10e3;
    expect(relative(dy[0], (i0 - i1) / 10e-9)).toBeLessThan(1e-14);
    expect(relative(dy[1], (i1 - i2) / 12.1e-9)).toBeLessThan(1e-14);
    expect(relative(dy[2], i2 / 10e-9)).toBeLessThan(1e-14);
    // behind a follower the RC node gives no current to the Sallen-Key
    const dyb = networkDerivative(rcBufferedSallenKeyQ055, true, false)(0, y);
    expect(relative(dyb[0], i0 / 10e-9)).toBeLessThan(1e-14);
  });
});

describe('one RC stage against closed forms', () => {
  it('steady ripple = (Vh - Vl)(1 - a)(1 - b)/(1 - ab) and average = ideal, edge and center aligned', () => {
    // Derivation (first-order RC step response per phase, e.g. Alexander & Sadiku ch. 7): with
    // a = e^{-DT/tau}, b = e^{-(1-D)T/tau}, the high phase takes v from vmin to
    // vmax = Vh + (vmin - Vh) a, the low phase back to vmin = Vl + (vmax - Vl) b; solving,
    // vmax - vmin = (Vh - Vl)(1 - a)(1 - b)/(1 - ab). tau = (driver + R) C with equal drivers.
    // Average = ideal: the mean capacitor current is zero over a period (open output, constant R).
    const tau = (25 + 10e3) * 10e-9;
    for (const d of [0.05, 0.3, 0.5, 0.85]) {
      const a = Math.exp((-d * T) / tau);
      const b = Math.exp((-(1 - d) * T) / tau);
      const ripple = (3.3 * (1 - a) * (1 - b)) / (1 - a * b);
      for (const net of [oneRc, oneRcCenter]) {
        const p = periodicByRelaxation(net, only(d));
        expect(relative(p.ripple, ripple)).toBeLessThan(1e-10);
        expect(relative(p.average, 3.3 * d)).toBeLessThan(1e-10);
        expect(p.residual).toBeLessThan(1e-11);
      }
    }
  });

  it('loaded stage with unequal drivers: the waveform matches the per-phase Thevenin closed form', () => {
    // Closed form: firstOrderSteady (test/engine/firstOrderPwm.ts: Thevenin per phase, first-order
    // response, Alexander & Sadiku ch. 7), written independently of this reference.
    const net = network([rc(4.7e3, 22e-9)], { pin: pin(60, 20), loadResistance: 33e3 });
    const closed = firstOrderSteady({ high: 3.3, low: 0, r: 4.7e3, c: 22e-9, driverHigh: 60, driverLow: 20, load: 33e3, period: T }, 0.4);
    const p = periodicByRelaxation(net, only(0.4));
    expect(relative(p.start[0], closed.v0)).toBeLessThan(1e-10);
    expect(relative(p.average, closed.average)).toBeLessThan(1e-10);
    const sim = simulateNetwork(net, only(0.4), p.start, 2, 200);
    let worst = 0;
    sim.t.forEach((t, i) => (worst = Math.max(worst, Math.abs(sim.v[i] - closed.at(t)))));
    expect(worst).toBeLessThan(1e-11);
  });

  it('relaxation from the average-input state finds the same periodic state as shooting', () => {
    const s = periodicByRelaxation(twoRcBufferedFirst, only(0.3));
    const r = periodicByRelaxation(twoRcBufferedFirst, only(0.3), { method: 'relaxation', tolerance: 1e-13 });
    expect(r.periods).toBeGreaterThan(s.periods);
    s.start.forEach((x, i) => expect(Math.abs(r.start[i] - x)).toBeLessThan(1e-11));
    expect(Math.abs(r.ripple - s.ripple)).toBeLessThan(1e-11);
    // behind a follower the first node is the lone first-order stage of firstOrderPwm.ts
    const closed = firstOrderSteady({ high: 3.3, low: 0, r: 4.7e3, c: 47e-9, driverHigh: 40, driverLow: 25, period: T }, 0.3);
    expect(relative(s.start[0], closed.v0)).toBeLessThan(1e-10);
  });

  it('settling, duty 1 -> 0 (no ripple): t_s = tau ln(span / band)', () => {
    // Source: RC discharge v = Vh e^{-t/tau} (textbook first-order response).
    const band = 1e-3;
    const tau = (25 + 10e3) * 10e-9;
    const s = settlingBySimulation(oneRc, only(1), only(0), band);
    expect(relative(s.time as number, tau * Math.log(3.3 / band))).toBeLessThan(1e-9);
  });

  it('settling, duty 0.25 -> 0.75 with ripple: the last band exit of the closed-form step response', () => {
    // Closed form: firstOrderStep (firstOrderPwm.ts). Its last exit from the band is found here by a
    // scan on a T/4000 grid and bisection, independently of ODEX. tau = 20 T, ripple about 31 mV.
    const band = 0.05;
    const net = network([rc(10e3, 100e-9)]);
    const o = { high: 3.3, low: 0, r: 10e3, c: 100e-9, driverHigh: 25, driverLow: 25, period: T };
    const v = firstOrderStep(o, 0.25, 0.75);
    const average = firstOrderSteady(o, 0.75).average;
    const out = (t: number): boolean => Math.abs(v(t) - average) > band;
    let last = 0;
    for (let t = 0; t < 200 * T; t += T / 4000) if (out(t)) last = t;
    expect(last).toBeGreaterThan(50 * T);
    expect(last).toBeLessThan(100 * T);
    let [lo, hi] = [last, last + T / 4000];
    for (let k = 0; k < 60; k++) [lo, hi] = out((lo + hi) / 2) ? [(lo + hi) / 2, hi] : [lo, (lo + hi) / 2];
    const s = settlingBySimulation(net, only(0.25), only(0.75), band);
    expect(relative(s.average, average)).toBeLessThan(1e-12);
    expect(Math.abs((s.time as number) - lo)).toBeLessThan(1e-9 * T);
    // a band inside the ripple (3.3 tanh(T / (4 tau)) = 0.41 V at tau = 2 T): never settles
    expect(settlingBySimulation(oneRc, only(0.25), only(0.5), 0.1).time).toBeNull();
  });
});

describe('Sallen-Key stage against the second-order step response', () => {
  // Standard second-order low-pass step response (e.g. Ogata, Modern Control Engineering, ch. 5,
  // from memory): with zeta = 1/(2Q), wd = w0 sqrt(1 - zeta^2),
  // y(t) = 1 - e^{-zeta w0 t} (cos(wd t) + zeta / sqrt(1 - zeta^2) sin(wd t)), overshoot
  // exp(-pi zeta / sqrt(1 - zeta^2)) at t_p = pi / wd. Unity-gain Sallen-Key: w0 = 1/sqrt(r1 r2 c1 c2),
  // Q = sqrt(r1 r2 c1 c2) / (c2 (r1 + r2)) (TI application report SLOA024, from memory; also model.md).
  // A pin driver adds to r1. The step is duty 0 -> 1 from rest (the steady state at duty 0 with Vl = 0).
  const cases: Array<[string, Network, number, number, number, number]> = [
    ['Q = 0.707, ideal driver', sallenKeyButterworth, 10e3, 10e3, 20e-9, 10e-9],
    ['Q = 2 with a 100 ohm driver', network([sallenKey(10e3, 10e3, 160e-9, 10e-9)], { pin: pin(100, 100) }), 10e3 + 100, 10e3, 160e-9, 10e-9],
  ];
  for (const [name, net, r1, r2, c1, c2] of cases) {
    const w0 = 1 / Math.sqrt(r1 * r2 * c1 * c2);
    const q = Math.sqrt(r1 * r2 * c1 * c2) / (c2 * (r1 + r2));
    const zeta = 1 / (2 * q);
    const wd = w0 * Math.sqrt(1 - zeta * zeta);
    const step = (t: number): number => 1 - Math.exp(-zeta * w0 * t) * (Math.cos(wd * t) + (zeta / Math.sqrt(1 - zeta * zeta)) * Math.sin(wd * t));

    it(`${name}: overshoot, peak time and waveform`, () => {
      const tp = Math.PI / wd;
      const sim = simulateNetwork(net, only(1), [0, 0], Math.ceil((1.5 * tp) / T), 400);
      const overshoot = Math.exp((-Math.PI * zeta) / Math.sqrt(1 - zeta * zeta));
      if (name.startsWith('Q = 0.707')) expect(Math.abs(overshoot - 0.0432)).toBeLessThan(1e-4);
      expect(relative(sim.max / 3.3 - 1, overshoot)).toBeLessThan(1e-9);
      expect(relative(sim.tMax, tp)).toBeLessThan(1e-6);
      let worst = 0;
      sim.t.forEach((t, i) => (worst = Math.max(worst, Math.abs(sim.v[i] - 3.3 * step(t)))));
      expect(worst).toBeLessThan(1e-11);
    });

    it(`${name}: settling time = last band exit of the closed-form step response`, () => {
      const band = 1e-3;
      // beyond t_env the envelope e^{-zeta w0 t} / sqrt(1 - zeta^2) times 3.3 V is inside the band
      const tEnv = Math.log(3.3 / (band * Math.sqrt(1 - zeta * zeta))) / (zeta * w0);
      const out = (t: number): boolean => Math.abs(3.3 * step(t) - 3.3) > band;
      const dt = T / 2000;
      let last = 0;
      for (let t = 0; t < tEnv; t += dt) if (out(t)) last = t;
      let [lo, hi] = [last, last + dt];
      for (let k = 0; k < 60; k++) [lo, hi] = out((lo + hi) / 2) ? [(lo + hi) / 2, hi] : [lo, (lo + hi) / 2];
      // 200 samples a period catch every excursion (the ringing lasts many periods); each crossing is bisected on dense output
      const s = settlingBySimulation(net, only(0), only(1), band, { samplesPerPeriod: 200 });
      expect(Math.abs((s.time as number) - lo)).toBeLessThan(1e-9 * T);
    });
  }
});

describe('second PWM output: DC average by superposition (Millman)', () => {
  it('fine output into the first node of a 2-stage ladder, edge and center aligned', () => {
    for (const [d1, d2] of [
      [0.25, 0.5],
      [0.8125, 0.0625],
      [0, 0.9375],
    ]) {
      const expected = millman([
        [3.3 * d1, 25 + 10e3],
        [3.3 * d2, 25 + 160e3],
      ]);
      for (const net of [fine44, fine44Center]) {
        const p = periodicByRelaxation(net, { first: d1, second: d2 });
        expect(relative(p.average, expected)).toBeLessThan(1e-10);
      }
    }
  });

  it('complement through r alone: both pins in the superposition; through r + c: the capacitor blocks DC', () => {
    for (const d of [0.1, 0.5, 0.7]) {
      const expected = millman([
        [3.3 * d, 25 + 10e3],
        [3.3 * (1 - d), 25 + 22e3],
      ]);
      expect(relative(periodicByRelaxation(complementR, only(d)).average, expected)).toBeLessThan(1e-10);
      // no mean current through a series capacitor in steady state, so only the first pin counts
      expect(relative(periodicByRelaxation(complementRC, only(d)).average, 3.3 * d)).toBeLessThan(1e-10);
    }
  });

  it('complement through r + c: the injected current changes the waveform (ripple) but not the average', () => {
    const plain = periodicByRelaxation(oneRc, only(0.3));
    const injected = periodicByRelaxation(complementRC, only(0.3));
    expect(relative(injected.ripple, plain.ripple)).toBeGreaterThan(0.01);
    // the series capacitor's mean voltage is the second pin's mean minus the node's mean (its mean
    // current is zero, so the resistor's mean drop is too); at the period start it is off that mean
    // by at most its ripple, about (2.3 V / 22 kohm) T / 100 nF = 0.05 V of 1.32 V
    expect(relative(injected.start[1], 3.3 * 0.7 - 3.3 * 0.3)).toBeLessThan(0.04);
  });
});

describe('Sallen-Key after an RC stage', () => {
  it('DC average = source average (no DC current into capacitors); an ideal output ignores its load', () => {
    for (const net of [rcSallenKeyQ055, rcSallenKeyQ2, rcBufferedSallenKeyQ055]) {
      for (const d of [0.2, 0.6]) expect(relative(periodicByRelaxation(net, only(d)).average, 3.3 * d)).toBeLessThan(1e-10);
    }
    const unloaded: Network = { ...rcSallenKeyQ055, loadResistance: null, loadCapacitance: 0 };
    const a = periodicByRelaxation(rcSallenKeyQ055, only(0.3));
    const b = periodicByRelaxation(unloaded, only(0.3));
    expect(a.ripple).toBe(b.ripple);
  });

  it('step response first moment = R (C + c2) + c2 (r1 + r2) unbuffered, R C + c2 (r1 + r2) behind a follower', () => {
    // For a step response y -> 1, the area above it is the integral of (1 - y) = -H'(0) (Laplace
    // transform moment; Elmore, J. Appl. Phys. 19, 55 (1948)). Sallen-Key alone:
    // H = 1 / (1 + s c2 (r1 + r2) + s^2 r1 r2 c1 c2), so -H'(0) = c2 (r1 + r2). Its input admittance
    // is s c2 + O(s^2) (to first order c1 carries no current and i1 = c2 dv_b/dt), so the unbuffered
    // node sees v0 / E = 1 / (1 + s R (C + c2) + O(s^2)); moments of a cascade add.
    const R = 25 + 10e3;
    const C = 10e-9;
    const skMoment = 10e-9 * 20e3;
    for (const [net, expected] of [
      [rcSallenKeyQ055, R * (C + 10e-9) + skMoment],
      [rcBufferedSallenKeyQ055, R * C + skMoment],
    ] as const) {
      const periods = 200;
      const sim = simulateNetwork(net, only(1), [0, 0, 0], periods, 20);
      expect(Math.abs(outputOf(net, sim.y) - 3.3)).toBeLessThan(1e-12);
      const moment = (3.3 * periods * T - sim.integral) / 3.3;
      expect(relative(moment, expected)).toBeLessThan(1e-9);
    }
  });

  it('the Sallen-Key input current changes the settling time of the unbuffered chain', () => {
    const loaded = settlingBySimulation(rcSallenKeyQ055, only(0.2), only(0.8), 0.01).time as number;
    const buffered = settlingBySimulation(rcBufferedSallenKeyQ055, only(0.2), only(0.8), 0.01).time as number;
    expect(relative(loaded, buffered)).toBeGreaterThan(0.05);
  });
});
