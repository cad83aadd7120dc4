/**
 * Reference formulas for the tolerance tests, written here from textbooks, independently of
 * src/engine and src/tolerance.
 */
import odex from 'odex';
import { erf } from 'mathjs';
import type { Ladder } from '../../src/circuit/ladder.js';

// The same invented demo ladders as the engine tests: 20 kHz, 3.3 V / 0 V, ideal drivers, open output.
export { ladder, stage } from '../engine/ladders.js';

/**
 * Peak-to-peak ripple of one RC stage (time constant tau) driven by a rectangular wave of swing
 * V, period T, duty D, in periodic steady state:
 * V (1 - e^(-DT/tau)) (1 - e^(-(1-D)T/tau)) / (1 - e^(-T/tau)) (textbook first-order circuit;
 * common practice). Written with expm1 so that it keeps its digits when tau >> T.
 */
export function oneStageRipple(V: number, T: number, D: number, tau: number): number {
  return (V * -Math.expm1((-D * T) / tau) * -Math.expm1((-(1 - D) * T) / tau)) / -Math.expm1(-T / tau);
}

/**
 * Output of one RC stage (equal drivers, low = 0, swing V) in periodic steady state at duty D,
 * t within [0, T): rises toward V during D T, falls toward 0 after (textbook first-order response).
 */
export function oneStageOrbit(V: number, T: number, D: number, tau: number, t: number): number {
  const start = (V * -Math.expm1((-D * T) / tau) * Math.exp((-(1 - D) * T) / tau)) / -Math.expm1(-T / tau);
  if (t <= D * T) return V + (start - V) * Math.exp(-t / tau);
  const top = V + (start - V) * Math.exp((-D * T) / tau);
  return top * Math.exp(-(t - D * T) / tau);
}

/**
 * Settling time of one RC stage after the duty steps from `from` to `to` at a rising edge: the
 * output is the new periodic orbit plus the decaying difference of the two orbits' starting
 * values, e0 e^(-t/tau) (superposition in a linear first-order circuit). Within each phase both
 * parts are a constant plus a multiple of e^(-t/tau), so the error is monotone there and its
 * extremes sit at the phase boundaries; the transient's magnitude falls period by period, so the
 * last period leaving the band is found by bisection over periods, and the crossing inside it
 * by bisection in time on its monotone piece.
 */
export function oneStageSettling(V: number, T: number, from: number, to: number, tau: number, band: number): number {
  const s0 = (d: number) => oneStageOrbit(V, T, d, tau, 0);
  const e0 = s0(from) - s0(to);
  const err = (k: number, t: number) => oneStageOrbit(V, T, to, tau, t) - V * to + e0 * Math.exp(-(k * T + t) / tau);
  const ends = [0, to * T, T];
  const leaves = (k: number) => ends.some((t) => Math.abs(err(k, t)) > band);
  // the orbit's extremes are at the phase ends (monotone phases)
  const above = oneStageOrbit(V, T, to, tau, to * T) - V * to;
  const below = V * to - oneStageOrbit(V, T, to, tau, 0);
  if (above >= band || below >= band) throw new RangeError('reference: the ripple alone leaves the band');
  if (!leaves(0)) return 0;
  let lo = 0;
  let hi = 1;
  while (leaves(hi)) [lo, hi] = [hi, 2 * hi];
  while (hi - lo > 1) {
    const mid = Math.floor((lo + hi) / 2);
    if (leaves(mid)) lo = mid;
    else hi = mid;
  }
  // in period lo: the last phase piece that leaves the band, then bisection on it
  for (let p = ends.length - 1; p > 0; p--) {
    let a = ends[p - 1];
    let b = ends[p];
    const outA = Math.abs(err(lo, a)) > band;
    const outB = Math.abs(err(lo, b)) > band;
    if (outB) return lo * T + b;
    if (!outA) continue;
    for (let i = 0; i < 100; i++) {
      const m = 0.5 * (a + b);
      if (Math.abs(err(lo, m)) > band) a = m;
      else b = m;
    }
    return lo * T + b;
  }
  return lo * T;
}

/**
 * Nodal equations C x' = currents (Kirchhoff's current law at each node). A buffered stage feeds
 * the next resistor from an ideal follower, so that resistor draws no current from its node; a
 * follower after the last stage drives the load, which then does not touch the ladder (model.md).
 */
export function nodalDerivative(l: Ladder, pin: number, driver: number) {
  const n = l.stages.length;
  const lastBuffered = l.stages[n - 1].buffered;
  const cap = l.stages.map((s, k) => s.c + (k === n - 1 && !lastBuffered ? l.loadCapacitance : 0));
  return (_t: number, x: number[]): number[] =>
    x.map((v, k) => {
      const before = k === 0 ? pin : x[k - 1];
      const rIn = l.stages[k].r + (k === 0 ? driver : 0);
      let current = (before - v) / rIn;
      if (k + 1 < n) {
        if (!l.stages[k].buffered) current -= (v - x[k + 1]) / l.stages[k + 1].r;
      } else if (l.loadResistance !== null && !lastBuffered) current -= v / l.loadResistance;
      return current / cap[k];
    });
}

/**
 * Output samples of one PWM period from state x0 (duty d), by ODEX (Hairer & Wanner's GBS
 * extrapolation, npm `odex`) with dense output on `grid` points per period; returns the samples
 * and the state at the end.
 */
export function integratePeriod(l: Ladder, d: number, x0: number[], grid = 2000): { out: number[]; end: number[] } {
  const n = l.stages.length;
  const solver = new odex.Solver(n);
  solver.absoluteTolerance = 1e-13;
  solver.relativeTolerance = 1e-13;
  solver.maxSteps = 1e6;
  solver.denseOutput = true;
  const T = l.period;
  const out: number[] = [];
  let x = x0;
  const phases: Array<[number, number, number, number]> = [
    [l.high, l.driverHigh, 0, d * T],
    [l.low, l.driverLow, d * T, T],
  ];
  for (const [pin, driver, start, end] of phases) {
    if (end <= start) continue;
    out.push(x[n - 1]);
    const record = solver.grid(T / grid, (_t: number, y: number[]) => out.push(y[n - 1]));
    x = solver.solve(nodalDerivative(l, pin, driver), start, x, end, record).y;
    out.push(x[n - 1]);
  }
  return { out, end: x };
}

/** CDF of the standard normal, from mathjs erf. */
export const normalCdf = (x: number): number => 0.5 * (1 + (erf(x / Math.SQRT2) as number));

/** Density of the standard normal. */
export const normalPdf = (x: number): number => Math.exp(-0.5 * x * x) / Math.sqrt(2 * Math.PI);
