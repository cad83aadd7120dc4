import { expm, lusolve, matrix, multiply, type Matrix } from 'mathjs';
import { describe, expect, it } from 'vitest';
import { odeRipple } from '../../scripts/bench-ode.js';
import type { Ladder } from '../../src/circuit/ladder.js';
// Invented demo circuits: 20 kHz, 3.3 V PWM (shared engine-test fixtures).
import { ladder, relative } from '../engine/ladders.js';

/**
 * Periodic steady-state ripple of one RC stage, closed form. Each phase is a first-order step
 * response toward the phase's Thevenin level v_inf with time constant tau (the exponential
 * charging law of an RC circuit, e.g. Horowitz & Hill, "The Art of Electronics", 3rd ed., 1.4.2;
 * from memory): v(end) = v_inf + (v(start) - v_inf) exp(-t / tau). Periodicity fixes the start
 * level v0 = (v_l (1 - b) + b (1 - a) v_h) / (1 - a b); the ripple is the rise of the high phase.
 */
function oneStageRipple(l: Ladder, duty: number): number {
  const { r, c } = l.stages[0];
  const cap = c + l.loadCapacitance;
  const thevenin = (level: number, driver: number) => {
    const rs = r + driver;
    if (l.loadResistance === null) return { level, tau: rs * cap };
    const rl = l.loadResistance;
    return { level: (level * rl) / (rs + rl), tau: ((rs * rl) / (rs + rl)) * cap };
  };
  const h = thevenin(l.high, l.driverHigh);
  const lo = thevenin(l.low, l.driverLow);
  const a = Math.exp((-duty * l.period) / h.tau);
  const b = Math.exp((-(1 - duty) * l.period) / lo.tau);
  const v0 = (lo.level * (1 - b) + b * (1 - a) * h.level) / (1 - a * b);
  const v1 = h.level + (v0 - h.level) * a;
  return v1 - v0;
}

/**
 * Periodic steady-state ripple of a two-stage ladder from the exact solution of x' = A x + b per
 * phase: x(t) = x_inf + expm(A t) (x(0) - x_inf), x_inf = -A^{-1} b, with mathjs expm (Pade with
 * scaling and squaring) and lusolve for the fixed point of the period map; the output sampled at
 * 20 000 points per period (the propagator over one step taken once and applied repeatedly).
 * Node equations from Kirchhoff's current law, written here for two stages only.
 */
function twoStageRipple(l: Ladder, duty: number): number {
  const [s1, s2] = l.stages;
  const cl = l.loadCapacitance;
  const gl = l.loadResistance === null ? 0 : 1 / l.loadResistance;
  const system = (pin: number, driver: number) => {
    const g1 = 1 / (s1.r + driver);
    const g2 = 1 / s2.r;
    const back = s1.buffered ? 0 : g2; // a follower does not load node 1
    const A = [
      [-(g1 + back) / s1.c, back / s1.c],
      [g2 / (s2.c + cl), -(g2 + gl) / (s2.c + cl)],
    ];
    const b = [(g1 * pin) / s1.c, 0];
    const xInf = (lusolve(A, b.map((v) => -v)) as number[][]).map((row) => row[0]);
    return { A, xInf };
  };
  const phases = [
    { ...system(l.high, l.driverHigh), length: duty * l.period },
    { ...system(l.low, l.driverLow), length: (1 - duty) * l.period },
  ];
  const propagate = (A: number[][], t: number) => (expm(matrix(A).map((v: number) => v * t)) as Matrix).toArray() as number[][];
  const apply = (E: number[][], xInf: number[], x: number[]) => {
    const d = multiply(E, [x[0] - xInf[0], x[1] - xInf[1]]) as number[];
    return [xInf[0] + d[0], xInf[1] + d[1]];
  };
  // Fixed point of x -> map(x), affine: x = M x + g, solved as (I - M) x = g.
  const map = (x: number[]) => phases.reduce((y, p) => apply(propagate(p.A, p.length), p.xInf, y), x);
  const g = map([0, 0]);
  const m0 = map([1, 0]).map((v, i) => v - g[i]);
  const m1 = map([0, 1]).map((v, i) => v - g[i]);
  let x = (lusolve([[1 - m0[0], -m1[0]], [-m0[1], 1 - m1[1]]], g) as number[][]).map((row) => row[0]);
  let min = Infinity;
  let max = -Infinity;
  const perPeriod = 20_000;
  for (const p of phases) {
    const steps = Math.max(1, Math.round((perPeriod * p.length) / l.period));
    const E = propagate(p.A, p.length / steps);
    for (let k = 0; k <= steps; k++) {
      if (k > 0) x = apply(E, p.xInf, x);
      min = Math.min(min, x[1]);
      max = Math.max(max, x[1]);
    }
  }
  return max - min;
}

describe('odeRipple (bench ODE route) against closed forms', () => {
  const oneStageCases: Array<[string, Ladder, number]> = [
    ['ideal driver, open output, tau 30 T', ladder([{ r: 10e3, c: 150e-9, buffered: false }]), 0.3],
    [
      'asymmetric drivers, resistive and capacitive load',
      ladder([{ r: 4.7e3, c: 220e-9, buffered: false }], { driverHigh: 60, driverLow: 20, loadResistance: 47e3, loadCapacitance: 10e-9 }),
      0.75,
    ],
  ];
  for (const [name, l, duty] of oneStageCases) {
    it(`one stage, ${name}: ripple to 1e-8`, () => {
      expect(relative(odeRipple(l, duty).ripple, oneStageRipple(l, duty))).toBeLessThan(1e-8);
    });
  }

  const twoStageCases: Array<[string, Ladder, number]> = [
    [
      'loaded, 25 ohm driver',
      ladder([{ r: 3.3e3, c: 150e-9, buffered: false }, { r: 33e3, c: 15e-9, buffered: false }], { driverHigh: 25, driverLow: 25, loadResistance: 1e6 }),
      0.3,
    ],
    [
      'follower after stage 1, asymmetric drivers',
      ladder([{ r: 2.2e3, c: 100e-9, buffered: true }, { r: 10e3, c: 22e-9, buffered: false }], { driverHigh: 40, driverLow: 25, loadResistance: 100e3 }),
      0.6,
    ],
  ];
  for (const [name, l, duty] of twoStageCases) {
    it(`two stages, ${name}: ripple to 1e-6`, () => {
      const ode = odeRipple(l, duty);
      expect(relative(ode.ripple, twoStageRipple(l, duty))).toBeLessThan(1e-6);
      expect(ode.periods).toBeGreaterThan(10);
    });
  }

  it('refuses duties at the ends, where a phase has no length', () => {
    const l = oneStageCases[0][1];
    expect(() => odeRipple(l, 0)).toThrow(RangeError);
    expect(() => odeRipple(l, 1)).toThrow(RangeError);
  });
});
