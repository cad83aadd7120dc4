import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { fastLadder } from '../../../src/design/fast/fastLadder.js';
import { fastSteadyState } from '../../../src/design/fast/fastSteadyState.js';
import { twoStageSteady } from '../../../src/design/fast/twoStageSteady.js';

describe('twoStageSteady', () => {
  it('gives the same figures as the general fast model (itself checked against ODEX and the engine)', () => {
    const arb = fc.record({
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
        const [r1, r2] = x.r.map((v) => 10 ** v);
        const [c1, c2] = x.c.map((v) => 10 ** v);
        const g = fastSteadyState(fastLadder({ ...circuit, stages: [{ r: r1, c: c1, buffered: false }, { r: r2, c: c2, buffered: false }] }), x.d);
        const s = twoStageSteady(circuit, r1, c1, r2, c2, x.d);
        // rounding differs in stiff corners (time constants 1e-3 T, phases of 1e-10 T): 1e-7 relative,
        // 1e-12 V absolute (3.3 V signals carry ~1e-15 V of rounding, amplified there); the search allows 1e-6
        const near = (a: number, b: number, scale: number) => Math.abs(a - b) <= 1e-7 * scale + 1e-12;
        return (
          near(s.ripple, g.ripple, g.ripple) &&
          near(s.average, g.average, 3.3) &&
          near(s.yStart, g.yStart, 3.3) &&
          near(s.above, g.maxDev - g.meanOffset, g.ripple) &&
          near(s.below, g.meanOffset - g.minDev, g.ripple)
        );
      }),
      { numRuns: 500 },
    );
  });

  it('one case by hand: equal drivers give average = DC gain x (low + D (high - low)) (LTI, textbook)', () => {
    const circuit = { period: 1e-4, high: 3.3, low: 0, driverHigh: 50, driverLow: 50, loadResistance: 100e3, loadCapacitance: 0 };
    const s = twoStageSteady(circuit, 1e3, 1e-6, 10e3, 100e-9, 0.3);
    expect(s.average).toBeCloseTo((100e3 / (100e3 + 50 + 11e3)) * 0.3 * 3.3, 12);
  });
});
