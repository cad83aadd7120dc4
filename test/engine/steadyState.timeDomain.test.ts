import { describe, expect, it } from 'vitest';
import odex from 'odex';
import { lusolve } from 'mathjs';
import type { Ladder } from '../../src/circuit/ladder.js';
import { steadyState } from '../../src/engine/steadyState.js';
import { ladder, nodalRates, relative, stage } from './ladders.js';

/**
 * Time-domain cross-check against Hairer & Wanner's ODEX (GBS extrapolation; npm `odex`, a port
 * of the Fortran original). The nodal equations are written here independently of the engine
 * (Kirchhoff's current law per capacitor node, ladders.ts nodalRates; time in periods),
 * integrated phase by phase.
 * The periodic start is found from the one-period map measured with ODEX (n + 1 runs over one
 * period; fixed point by mathjs lusolve), then periods are integrated one after another until the
 * start state repeats to 1e-12; min/max are read from ODEX dense output on a 1/4000-period grid
 * plus the phase boundaries, and the average from an extra state holding the integral.
 */
function derivative(l: Ladder, pin: number, driver: number) {
  const rates = nodalRates(l, pin, driver);
  const n = l.stages.length;
  // time in periods; the extra last state integrates the output
  return (_t: number, y: number[]): number[] => [...rates(y.slice(0, n)).map((r) => r * l.period), y[n - 1]];
}

function integratePeriod(l: Ladder, d: number, x0: number[], record?: (v: number) => void): number[] {
  const n = l.stages.length;
  const solver = new odex.Solver(n + 1);
  solver.absoluteTolerance = 1e-13;
  solver.relativeTolerance = 1e-13;
  solver.initialStepSize = 1e-4;
  solver.maxSteps = 100000;
  solver.denseOutput = record !== undefined;
  let y = [...x0, 0];
  const phases: Array<[number, number, number, number]> = [
    [l.high, l.driverHigh, 0, d],
    [l.low, l.driverLow, d, 1],
  ];
  for (const [pin, driver, start, end] of phases) {
    if (end <= start) continue;
    const f = derivative(l, pin, driver);
    if (record) {
      record(y[n - 1]);
      const out = solver.grid(1 / 4000, (_t: number, yy: number[]) => record(yy[n - 1]));
      y = solver.solve(f, start, y, end, out).y;
      record(y[n - 1]);
    } else {
      y = solver.solve(f, start, y, end).y;
    }
  }
  return y;
}

function referenceSteadyState(l: Ladder, d: number) {
  const n = l.stages.length;
  const g = integratePeriod(l, d, new Array(n).fill(0)).slice(0, n);
  const a = Array.from({ length: n }, (_, i) => {
    const e = new Array(n).fill(0);
    e[i] = 1;
    const col = integratePeriod(l, d, e);
    return col.slice(0, n).map((v, k) => v - g[k]);
  });
  const iMinusM = Array.from({ length: n }, (_, r) => Array.from({ length: n }, (_, c) => (r === c ? 1 : 0) - a[c][r]));
  let x = (lusolve(iMinusM, g) as number[][]).map((row) => row[0]);
  for (let k = 0; k < 50; k++) {
    const next = integratePeriod(l, d, x).slice(0, n);
    const change = Math.max(...next.map((v, i) => Math.abs(v - x[i])));
    x = next;
    if (change < 1e-12) break;
  }
  const samples: number[] = [];
  const y = integratePeriod(l, d, x, (v) => samples.push(v));
  const min = Math.min(...samples);
  const max = Math.max(...samples);
  return { average: y[n], min, max, ripple: max - min };
}

const cases: Array<[string, Ladder, number]> = [
  ['two stages', ladder([stage(2.2e3, 47e-9), stage(22e3, 10e-9)]), 0.3],
  [
    'asymmetric drivers, loaded',
    ladder([stage(1e3, 220e-9), stage(4.7e3, 47e-9)], {
      driverHigh: 60,
      driverLow: 20,
      loadResistance: 22e3,
      loadCapacitance: 1e-9,
    }),
    0.7,
  ],
  [
    'buffered first stage, loaded output',
    ladder([stage(3.3e3, 100e-9, true), stage(10e3, 15e-9)], { driverHigh: 30, driverLow: 30, loadResistance: 47e3 }),
    0.55,
  ],
  ['one stage, asymmetric drivers', ladder([stage(470, 1e-6)], { driverHigh: 200, driverLow: 50 }), 0.4],
];

describe('steadyState against ODEX time-domain integration', () => {
  for (const [name, l, d] of cases) {
    it(`${name}: min, max, average and ripple within 1e-6`, () => {
      const ref = referenceSteadyState(l, d);
      const op = steadyState(l, d);
      expect(relative(op.average, ref.average)).toBeLessThan(1e-6);
      expect(relative(op.min, ref.min)).toBeLessThan(1e-6);
      expect(relative(op.max, ref.max)).toBeLessThan(1e-6);
      expect(relative(op.ripple, ref.ripple)).toBeLessThan(1e-6);
    });
  }
});
