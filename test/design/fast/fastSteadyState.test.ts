import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import type { Ladder } from '../../../src/circuit/ladder.js';
import { fastLadder } from '../../../src/design/fast/fastLadder.js';
import { fastSteadyState } from '../../../src/design/fast/fastSteadyState.js';
import { steadyState } from '../../../src/engine/index.js';
import { ladder as demoLadder, stage } from '../../engine/ladders.js';
import { simulate } from './odexLadder.js';

/** Unbuffered [R, C] stages on the demo pin of the engine tests, at 10 kHz. */
const ladder = (stages: Array<[number, number]>, extra: Partial<Ladder> = {}): Ladder =>
  demoLadder(stages.map(([r, c]) => stage(r, c)), { period: 1e-4, ...extra });

describe('fastSteadyState: one stage against the textbook formula', () => {
  // Peak-to-peak ripple of a first-order RC driven by a rectangular wave in steady state:
  // k V (1 - e^-a)(1 - e^-b) / (1 - e^-(a+b)), a = dT/tau, b = (1-d)T/tau, with the Thevenin
  // equivalent of driver + R and the load (k = RL / (RL + Rs), tau = (Rs || RL) C); average = k (low + d V).
  // Textbook first-order circuit analysis (common practice).
  const cases: Array<[string, Ladder, number]> = [
    ['open, ideal driver', ladder([[4.7e3, 100e-9]]), 0.5],
    ['driver and load', ladder([[1e3, 1e-6]], { driverHigh: 30, driverLow: 30, loadResistance: 47e3, loadCapacitance: 1e-9 }), 0.2],
    ['tau much longer than T', ladder([[100e3, 10e-6]], { low: 0.5 }), 0.9],
  ];
  for (const [name, l, d] of cases) {
    it(name, () => {
      const rs = l.stages[0].r + l.driverHigh;
      const rl = l.loadResistance;
      const k = rl === null ? 1 : rl / (rl + rs);
      const tau = (rl === null ? rs : (rs * rl) / (rs + rl)) * (l.stages[0].c + l.loadCapacitance);
      const a = (d * l.period) / tau;
      const b = ((1 - d) * l.period) / tau;
      const span = l.high - l.low;
      const want = (k * span * -Math.expm1(-a) * -Math.expm1(-b)) / -Math.expm1(-(a + b));
      const got = fastSteadyState(fastLadder(l), d);
      expect(got.ripple / want - 1).toBeLessThan(1e-11);
      expect(Math.abs(got.average - k * (l.low + d * span))).toBeLessThan(1e-12 * l.high);
    });
  }
});

describe('fastSteadyState: two stages against an ODEX simulation', () => {
  // Reference: Hairer & Wanner's ODEX (npm odex) on the nodal equations written in odexLadder.ts,
  // integrated from rest for 400 periods (time constants of a few periods: converged to ~1e-15).
  const cases: Array<[string, Ladder, number]> = [
    ['unequal drivers, loaded', ladder([[470, 47e-9], [4.7e3, 10e-9]], { driverHigh: 40, driverLow: 25, loadResistance: 100e3, loadCapacitance: 100e-12 }), 0.3],
    ['equal drivers, open', ladder([[1e3, 22e-9], [10e3, 4.7e-9]], { driverHigh: 20, driverLow: 20 }), 0.65],
  ];
  for (const [name, l, d] of cases) {
    it(name, () => {
      const sim = simulate(l, d, [0, 0], 400, 4000);
      const start = sim.t.findIndex((t) => t >= 399 * l.period - 1e-18);
      const v = sim.v.slice(start);
      const t = sim.t.slice(start);
      const ripple = Math.max(...v) - Math.min(...v);
      let integral = 0;
      for (let i = 1; i < t.length; i++) integral += ((v[i] + v[i - 1]) / 2) * (t[i] - t[i - 1]);
      const average = integral / l.period;
      const got = fastSteadyState(fastLadder(l), d);
      expect(Math.abs(got.ripple / ripple - 1)).toBeLessThan(1e-5); // sampling of the extremes
      expect(Math.abs(got.average - average)).toBeLessThan(1e-7); // trapezoid rule
    });
  }
});

describe('fastSteadyState: same numbers as the exact engine', () => {
  it('random one- and two-stage ladders (fast-check)', () => {
    const arb = fc.record({
      n: fc.integer({ min: 1, max: 2 }),
      r: fc.array(fc.double({ min: 2, max: 6, noNaN: true }), { minLength: 2, maxLength: 2 }),
      c: fc.array(fc.double({ min: -10, max: -5, noNaN: true }), { minLength: 2, maxLength: 2 }),
      dh: fc.double({ min: 0, max: 100, noNaN: true }),
      dl: fc.double({ min: 0, max: 100, noNaN: true }),
      load: fc.option(fc.double({ min: 3, max: 7, noNaN: true })),
      d: fc.double({ min: 0.01, max: 0.99, noNaN: true }),
      logT: fc.double({ min: -6, max: -3, noNaN: true }),
    });
    fc.assert(
      fc.property(arb, (x) => {
        const l = ladder(
          Array.from({ length: x.n }, (_, k) => [10 ** x.r[k], 10 ** x.c[k]] as [number, number]),
          { period: 10 ** x.logT, driverHigh: x.dh, driverLow: x.dl, loadResistance: x.load === null ? null : 10 ** x.load },
        );
        const e = steadyState(l, x.d);
        const f = fastSteadyState(fastLadder(l), x.d);
        // 1e-12 V absolute: rounding of 3.3 V signals in stiff corners (T up to 1e5 time constants)
        return Math.abs(f.ripple - e.ripple) <= 1e-7 * e.ripple + 1e-12 && Math.abs(f.average - e.average) <= 1e-10;
      }),
      { numRuns: 200 },
    );
  });
});
