import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { resistiveDroop, resistiveDroopFloor } from '../../src/design/resistiveDroop.js';
import { averageOutput, dcTransfer, prepare } from '../../src/engine/index.js';
import type { Ladder } from '../../src/circuit/ladder.js';

// The bound is derived in src/design/resistiveDroop.ts from Kirchhoff's current law on averages;
// here it is held to the exact engine (dcTransfer, averageOutput), which knows nothing of it.

/** An invented ladder: 1 to 3 stages, levels possibly below ground, drivers in either order. */
const arb = fc.record({
  logR: fc.array(fc.double({ min: 1, max: 5, noNaN: true }), { minLength: 1, maxLength: 3 }),
  logC: fc.array(fc.double({ min: -10, max: -5, noNaN: true }), { minLength: 3, maxLength: 3 }),
  high: fc.double({ min: -1, max: 12, noNaN: true }),
  span: fc.double({ min: 0.5, max: 12, noNaN: true }),
  driverHigh: fc.double({ min: 0, max: 120, noNaN: true }),
  driverLow: fc.double({ min: 0, max: 120, noNaN: true }),
  equal: fc.boolean(),
  logRL: fc.double({ min: 2, max: 7, noNaN: true }),
  logT: fc.double({ min: -6, max: -3, noNaN: true }),
  dutyMin: fc.double({ min: 0.01, max: 0.4, noNaN: true }),
  dutyMax: fc.double({ min: 0.6, max: 0.99, noNaN: true }),
});

type Sample = typeof arb extends fc.Arbitrary<infer T> ? T : never;

function ladderOf(x: Sample): Ladder {
  return {
    period: 10 ** x.logT,
    high: x.high,
    low: x.high - x.span,
    driverHigh: x.driverHigh,
    driverLow: x.equal ? x.driverHigh : x.driverLow,
    stages: x.logR.map((v, k) => ({ r: 10 ** v, c: 10 ** x.logC[k], buffered: false })),
    loadResistance: 10 ** x.logRL,
    loadCapacitance: 0,
  };
}

const seriesOf = (l: Ladder, driver: number) => l.stages.reduce((s, st) => s + st.r, driver);

describe('resistiveDroop', () => {
  it('bounds the DC error at the duty it names, for levels on either side of ground (fast-check, exact engine)', () => {
    let applied = 0;
    fc.assert(
      fc.property(arb, (x) => {
        const l = ladderOf(x);
        const plan = resistiveDroop(l, x.dutyMin, x.dutyMax);
        if (plan === null) return true;
        applied++;
        const floor = resistiveDroopFloor(plan, seriesOf(l, plan.driver));
        // the end of the duty range whose ideal output has the magnitude the plan took
        const ideal = (d: number) => l.low + d * (l.high - l.low);
        const duty = Math.abs(Math.abs(ideal(x.dutyMax)) - plan.ideal) <= 1e-12 * plan.ideal ? x.dutyMax : x.dutyMin;
        const error = Math.abs(ideal(duty) - averageOutput(l, prepare(l), duty));
        const droop = Math.abs(dcTransfer(l, x.dutyMin, x.dutyMax).droop.error);
        // 1e-10 V: the engine's average carries ~1e-11 V of rounding in very stiff cases (T / tau ~ 1e5)
        return error >= floor * (1 - 1e-9) - 1e-10 && droop >= error * (1 - 1e-9) - 1e-10;
      }),
      { numRuns: 200 },
    );
    expect(applied).toBeGreaterThan(100);
  });

  it('is exact for equal drivers, at either end of the range (the ladder is then a DC divider)', () => {
    // Equal drivers: the ladder is linear and time-invariant, so its average output is the average
    // pin level through the DC voltage divider S, R_L (Ohm's law; common practice):
    // average = ideal R_L / (R_L + S) at every duty, and the DC error is exactly ideal S / (R_L + S).
    const base: Ladder = {
      period: 50e-6, high: 3.3, low: -0.1, driverHigh: 30, driverLow: 30,
      stages: [{ r: 4.7e3, c: 1e-6, buffered: false }, { r: 47e3, c: 6.8e-9, buffered: false }],
      loadResistance: 100e3, loadCapacitance: 0,
    };
    const plan = resistiveDroop(base, 0.05, 0.95)!;
    expect(plan.ideal).toBeCloseTo(-0.1 + 0.95 * 3.4, 12);
    const floor = resistiveDroopFloor(plan, seriesOf(base, plan.driver));
    expect(Math.abs(dcTransfer(base, 0.05, 0.95).droop.error)).toBeCloseTo(floor, 9);
    // Levels mostly below ground: the low end of the duty range is the larger error.
    const below = { ...base, high: 0.2, low: -3.1 };
    const planBelow = resistiveDroop(below, 0.05, 0.95)!;
    expect(planBelow.ideal).toBeCloseTo(3.1 - 0.05 * 3.3, 12);
    expect(Math.abs(dcTransfer(below, 0.05, 0.95).droop.error)).toBeCloseTo(resistiveDroopFloor(planBelow, seriesOf(below, planBelow.driver)), 9);
  });

  it('takes the side whose driver resistance is the larger, and claims nothing where the derivation does not reach', () => {
    const base: Ladder = {
      period: 50e-6, high: 3.3, low: -0.1, driverHigh: 40, driverLow: 25,
      stages: [{ r: 1e3, c: 1e-6, buffered: false }], loadResistance: 1e6, loadCapacitance: 0,
    };
    // weaker high side: the high side's bound, with the low-side driver in the series resistance
    expect(resistiveDroop(base, 0.025, 0.975)).toEqual({ ideal: -0.1 + 0.975 * 3.4, driver: 25, load: 1e6 });
    // weaker low side with the low level below ground: the low side's bound
    expect(resistiveDroop({ ...base, driverHigh: 25, driverLow: 40, high: 0.1, low: -3.3 }, 0.025, 0.975)).toEqual({
      ideal: 3.3 - 0.025 * 3.4,
      driver: 25,
      load: 1e6,
    });
    // weaker low side, low level above ground: no bound (Q_l's sign is not known)
    expect(resistiveDroop({ ...base, driverHigh: 25, driverLow: 40, low: 0.5 }, 0.025, 0.975)).toBeNull();
    // weaker high side, high level below ground: none either
    expect(resistiveDroop({ ...base, high: -0.5, low: -3.3 }, 0.025, 0.975)).toBeNull();
    // open output
    expect(resistiveDroop({ ...base, loadResistance: null }, 0.025, 0.975)).toBeNull();
  });
});
