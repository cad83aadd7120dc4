/**
 * Reference step response of a PWM-driven ladder, written independently of the engine: nodal
 * equations from Kirchhoff's current law (ladders.ts nodalRates), the matrix exponential and the
 * linear solves from mathjs (a general-purpose library: Padé scaling and squaring, LU). Each phase
 * is solved as x(t) = x_p + e^{A t} (x(0) - x_p), x_p = -A^{-1} b (linear ODE with constant
 * coefficients, any ODE text); the steady state at a duty is the fixed point of the one-period map
 * (solved with lusolve); periods after the step are marched one after another.
 */
import { expm, lusolve, matrix } from 'mathjs';
import type { Ladder } from '../../src/circuit/ladder.js';
import { nodalRates } from './ladders.js';

type Vec = number[];
type Mat = number[][];

const mv = (a: Mat, x: Vec): Vec => a.map((row) => row.reduce((s, v, k) => s + v * x[k], 0));
const expOf = (a: Mat, t: number): Mat =>
  (expm(matrix(a.map((row) => row.map((v) => v * t)))) as unknown as { toArray(): Mat }).toArray();
const solve = (a: Mat, b: Vec): Vec => (lusolve(a, b) as number[][]).map((r) => r[0]);

interface Phase {
  A: Mat;
  xp: Vec;
}

export interface PwmReference {
  /** Capacitor voltages at the rising edge in periodic steady state at duty d. */
  steadyStart(d: number): Vec;
  /** Output at each instant (sorted ascending) after the duty steps from `from` to `to` at t = 0. */
  step(from: number, to: number, times: number[]): number[];
  /** Output tau into a period at duty d that starts from the state x0. */
  within(d: number, x0: Vec, tau: number): number;
}

export function pwmReference(l: Ladder): PwmReference {
  const n = l.stages.length;
  const T = l.period;
  const phase = (pin: number, driver: number): Phase => {
    const f = nodalRates(l, pin, driver);
    const b = f(new Array(n).fill(0));
    const cols = Array.from({ length: n }, (_, i) => f(Array.from({ length: n }, (_, k) => (k === i ? 1 : 0))).map((v, k) => v - b[k]));
    const A = Array.from({ length: n }, (_, r) => cols.map((c) => c[r]));
    return { A, xp: solve(A, b.map((v) => -v)) };
  };
  const high = phase(l.high, l.driverHigh);
  const low = phase(l.low, l.driverLow);
  const propagate = (p: Phase, x: Vec, t: number, e = expOf(p.A, t)): Vec =>
    mv(e, x.map((v, i) => v - p.xp[i])).map((v, i) => v + p.xp[i]);
  const periodMap = (d: number) => {
    const eh = expOf(high.A, d * T);
    const el = expOf(low.A, (1 - d) * T);
    return (x: Vec) => propagate(low, propagate(high, x, d * T, eh), (1 - d) * T, el);
  };
  const steadyStart = (d: number): Vec => {
    const map = periodMap(d);
    const g = map(new Array(n).fill(0));
    const iMinusM = Array.from({ length: n }, (_, i) => {
      const e = Array.from({ length: n }, (_, k) => (k === i ? 1 : 0));
      return map(e).map((v, k) => (k === i ? 1 : 0) - (v - g[k]));
    });
    // iMinusM[i] is column i of I - M
    const a = Array.from({ length: n }, (_, r) => iMinusM.map((c) => c[r]));
    return solve(a, g);
  };
  const within = (d: number, x: Vec, tau: number): number => {
    const t1 = d * T;
    const y = tau <= t1 ? propagate(high, x, tau) : propagate(low, propagate(high, x, t1), tau - t1);
    return y[n - 1];
  };
  return {
    steadyStart,
    within,
    step(from, to, times) {
      const map = periodMap(to);
      let x = steadyStart(from);
      let k = 0;
      return times.map((t) => {
        const kt = Math.floor(t / T);
        for (; k < kt; k++) x = map(x);
        return within(to, x, t - k * T);
      });
    },
  };
}
