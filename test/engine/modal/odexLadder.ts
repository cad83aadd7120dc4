import odex from 'odex';
import type { Ladder } from '../../../src/circuit/ladder.js';

/**
 * Reference time-domain simulation of an unbuffered RC ladder with Hairer & Wanner's ODEX (npm
 * `odex`, GBS extrapolation), written here independently of src/: Kirchhoff's current law at each
 * capacitor node, the pin a source behind the driver resistance of its phase (model.md).
 */
export function nodalDerivative(l: Ladder, pin: number, driver: number): (t: number, y: number[]) => number[] {
  const n = l.stages.length;
  return (_t, y) => {
    const dy = new Array<number>(n);
    for (let k = 0; k < n; k++) {
      const before = k === 0 ? pin : y[k - 1];
      const rIn = l.stages[k].r + (k === 0 ? driver : 0);
      let i = (before - y[k]) / rIn;
      if (k < n - 1) i -= (y[k] - y[k + 1]) / l.stages[k + 1].r;
      else if (l.loadResistance !== null) i -= y[k] / l.loadResistance;
      const c = l.stages[k].c + (k === n - 1 ? l.loadCapacitance : 0);
      dy[k] = i / c;
    }
    return dy;
  };
}

/**
 * Integrate `periods` PWM periods at duty d from state y0, sampling the output every
 * period / samples; returns the final state and the samples (time, output) of every period.
 */
export function simulate(l: Ladder, d: number, y0: number[], periods: number, samples = 2000): { y: number[]; t: number[]; v: number[] } {
  const n = l.stages.length;
  const solver = new odex.Solver(n);
  solver.absoluteTolerance = 1e-14;
  solver.relativeTolerance = 1e-12;
  solver.maxSteps = 1e6;
  solver.denseOutput = true;
  const t: number[] = [];
  const v: number[] = [];
  let y = [...y0];
  const T = l.period;
  for (let k = 0; k < periods; k++) {
    const phases: Array<[number, number, number, number]> = [
      [l.high, l.driverHigh, k * T, (k + d) * T],
      [l.low, l.driverLow, (k + d) * T, (k + 1) * T],
    ];
    for (const [pin, driver, a, b] of phases) {
      if (b <= a) continue;
      const out = solver.grid(T / samples, (x, yy) => {
        t.push(x);
        v.push(yy[n - 1]);
      });
      y = solver.solve(nodalDerivative(l, pin, driver), a, y, b, out).y;
      t.push(b);
      v.push(y[n - 1]);
    }
  }
  return { y, t, v };
}
