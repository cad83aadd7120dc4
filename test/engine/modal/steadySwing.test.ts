import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import type { Ladder } from '../../../src/circuit/ladder.js';
import { modalLadder } from '../../../src/engine/modal/modalLadder.js';
import { modalLadderOf } from '../../../src/engine/modal/modalLadderOf.js';
import { periodicState } from '../../../src/engine/modal/periodicState.js';
import { steadySwing, type SteadySwing } from '../../../src/engine/modal/steadySwing.js';
import { steadyState } from '../../../src/engine/index.js';
import { ladder as demoLadder, stage } from '../ladders.js';
import { oneStageOrbit } from '../../tolerance/reference.js';
import { simulate } from './odexLadder.js';

/** Unbuffered [R, C] stages on the demo pin of the engine tests, at 10 kHz. */
const ladder = (stages: Array<[number, number]>, extra: Partial<Ladder> = {}): Ladder =>
  demoLadder(stages.map(([r, c]) => stage(r, c)), { period: 1e-4, ...extra });

/** Both paths of steadySwing: the scalar one (one or two stages) and the general one (periodicState given). */
function bothPaths(l: Ladder, d: number): Array<[string, SteadySwing]> {
  const m = modalLadder(l)!;
  return [
    ['scalar', steadySwing(m, d)],
    ['general', steadySwing(m, d, periodicState(m, d))],
  ];
}

describe('steadySwing: one stage against the textbook formula', () => {
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
      for (const [path, got] of bothPaths(l, d)) {
        expect(got.ripple / want - 1, path).toBeLessThan(1e-11);
        expect(Math.abs(got.average - k * (l.low + d * span)), path).toBeLessThan(1e-12 * l.high);
      }
    });
  }

  it('open, ideal driver: the excursions about the average are the orbit at the phase ends (textbook orbit)', () => {
    // The orbit rises during the high phase and falls during the low one, so its extremes are the
    // output at the falling edge (d T) and at the rising edge (0) (test/tolerance/reference.ts).
    const l = ladder([[4.7e3, 100e-9]]);
    const tau = 4.7e3 * 100e-9;
    for (const d of [0.1, 0.5, 0.8]) {
      const above = oneStageOrbit(3.3, l.period, d, tau, d * l.period) - 3.3 * d;
      const below = 3.3 * d - oneStageOrbit(3.3, l.period, d, tau, 0);
      for (const [path, got] of bothPaths(l, d)) {
        expect(Math.abs(got.above - above), path).toBeLessThan(1e-12);
        expect(Math.abs(got.below - below), path).toBeLessThan(1e-12);
        expect(Math.abs(got.yStart - oneStageOrbit(3.3, l.period, d, tau, 0)), path).toBeLessThan(1e-12);
      }
    }
  });
});

describe('steadySwing: two stages against an ODEX simulation', () => {
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
      for (const [path, got] of bothPaths(l, d)) {
        expect(Math.abs(got.ripple / ripple - 1), path).toBeLessThan(1e-5); // sampling of the extremes
        expect(Math.abs(got.average - average), path).toBeLessThan(1e-7); // trapezoid rule
        expect(Math.abs(got.above - (Math.max(...v) - average)), path).toBeLessThan(1e-5 * ripple);
        expect(Math.abs(got.below - (average - Math.min(...v))), path).toBeLessThan(1e-5 * ripple);
      }
    });
  }
});

describe('steadySwing: the same numbers as the exact engine', () => {
  it('random ladders of one to four stages, with or without a follower at the end (fast-check)', () => {
    // steadyState: the one-stage closed form (oneStage.ts) and the modal route, held to the matrix
    // exponentials and to 80-digit mpmath references in steadyState.routes / highPrecision tests.
    const arb = fc.record({
      n: fc.integer({ min: 1, max: 4 }),
      r: fc.array(fc.double({ min: 2, max: 6, noNaN: true }), { minLength: 4, maxLength: 4 }),
      c: fc.array(fc.double({ min: -10, max: -5, noNaN: true }), { minLength: 4, maxLength: 4 }),
      dh: fc.double({ min: 0, max: 100, noNaN: true }),
      dl: fc.double({ min: 0, max: 100, noNaN: true }),
      load: fc.option(fc.double({ min: 3, max: 7, noNaN: true })),
      buffered: fc.boolean(),
      d: fc.double({ min: 0.01, max: 0.99, noNaN: true }),
      logT: fc.double({ min: -6, max: -3, noNaN: true }),
    });
    fc.assert(
      fc.property(arb, (x) => {
        const stages = Array.from({ length: x.n }, (_, k) => stage(10 ** x.r[k], 10 ** x.c[k], x.buffered && k === x.n - 1));
        const l = demoLadder(stages, { period: 10 ** x.logT, driverHigh: x.dh, driverLow: x.dl, loadResistance: x.load === null ? null : 10 ** x.load });
        const e = steadyState(l, x.d);
        const f = steadySwing(modalLadder(l)!, x.d);
        // 1e-12 V absolute: rounding of 3.3 V signals in stiff corners (T up to 1e5 time constants)
        const near = (a: number, b: number, scale: number) => Math.abs(a - b) <= 1e-7 * scale + 1e-12;
        return (
          near(f.ripple, e.ripple, e.ripple) &&
          Math.abs(f.average - e.average) <= 1e-10 &&
          near(f.above, e.max - e.average, e.ripple) &&
          near(f.below, e.average - e.min, e.ripple)
        );
      }),
      { numRuns: 300 },
    );
  });

  it('the scalar path (one or two stages) gives the figures of the general one (fast-check)', () => {
    const arb = fc.record({
      n: fc.integer({ min: 1, max: 2 }),
      r: fc.array(fc.double({ min: 2, max: 6, noNaN: true }), { minLength: 2, maxLength: 2 }),
      c: fc.array(fc.double({ min: -10, max: -5, noNaN: true }), { minLength: 2, maxLength: 2 }),
      dh: fc.double({ min: 0, max: 100, noNaN: true }),
      dl: fc.double({ min: 0, max: 100, noNaN: true }),
      equal: fc.boolean(),
      load: fc.option(fc.double({ min: 3, max: 7, noNaN: true })),
      cl: fc.double({ min: 0, max: 1e-9, noNaN: true }),
      low: fc.double({ min: 0, max: 1, noNaN: true }),
      // duties a timer can make (one count of a 10-bit timer from either end), plus both ends exactly
      d: fc.oneof(fc.double({ min: 1e-3, max: 1 - 1e-3, noNaN: true }), fc.constantFrom(0, 1)),
      logT: fc.double({ min: -6, max: -3, noNaN: true }),
    });
    fc.assert(
      fc.property(arb, (x) => {
        const circuit = {
          period: 10 ** x.logT, high: 3.3, low: x.low, driverHigh: x.dh, driverLow: x.equal ? x.dh : x.dl,
          loadResistance: x.load === null ? null : 10 ** x.load, loadCapacitance: x.cl,
        };
        const m = modalLadderOf(circuit, x.r.slice(0, x.n).map((v) => 10 ** v), x.c.slice(0, x.n).map((v) => 10 ** v));
        const s = steadySwing(m, x.d);
        const g = steadySwing(m, x.d, periodicState(m, x.d));
        // rounding differs in stiff corners (time constants 1e-3 T, phases of 1e-10 T): 1e-7 relative,
        // 1e-12 V absolute (3.3 V signals carry ~1e-15 V of rounding, amplified there)
        const near = (a: number, b: number, scale: number) => Math.abs(a - b) <= 1e-7 * scale + 1e-12;
        return (
          near(s.ripple, g.ripple, g.ripple) &&
          near(s.average, g.average, 3.3) &&
          near(s.yStart, g.yStart, 3.3) &&
          near(s.above, g.above, g.ripple) &&
          near(s.below, g.below, g.ripple)
        );
      }),
      { numRuns: 500 },
    );
  });

  it('one case by hand: equal drivers give average = DC gain x (low + D (high - low)) (LTI, textbook)', () => {
    const circuit = { period: 1e-4, high: 3.3, low: 0, driverHigh: 50, driverLow: 50, loadResistance: 100e3, loadCapacitance: 0 };
    const m = modalLadderOf(circuit, [1e3, 10e3], [1e-6, 100e-9]);
    const want = (100e3 / (100e3 + 50 + 11e3)) * 0.3 * 3.3;
    expect(steadySwing(m, 0.3).average).toBeCloseTo(want, 12);
    expect(steadySwing(m, 0.3, periodicState(m, 0.3)).average).toBeCloseTo(want, 12);
  });
});
