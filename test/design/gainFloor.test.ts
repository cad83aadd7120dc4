import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { gainFloor } from '../../src/design/gainFloor.js';
import { dcTransfer } from '../../src/engine/index.js';

/** Invented circuits: 1 to 3 stages, a resistive load, drivers from ideal to very unequal. */
const arb = fc.record({
  n: fc.integer({ min: 1, max: 3 }),
  logR: fc.array(fc.double({ min: 1, max: 5, noNaN: true }), { minLength: 3, maxLength: 3 }),
  logC: fc.array(fc.double({ min: -9, max: -5, noNaN: true }), { minLength: 3, maxLength: 3 }),
  driverHigh: fc.double({ min: 0, max: 500, noNaN: true }),
  driverLow: fc.double({ min: 0, max: 500, noNaN: true }),
  logLoad: fc.double({ min: 2.5, max: 7, noNaN: true }),
  loadC: fc.double({ min: 0, max: 1e-9, noNaN: true }),
  logF: fc.double({ min: 2.5, max: 5.5, noNaN: true }),
  dMin: fc.double({ min: 0, max: 0.45, noNaN: true }),
  dMax: fc.double({ min: 0.55, max: 1, noNaN: true }),
  low: fc.constantFrom(0, -1.65),
});

describe('gainFloor: the gain error a load takes through the series resistance (derived in gainFloor.ts)', () => {
  it('never exceeds the engine\'s endpoint-fit gain error (dcTransfer), unequal drivers included (fast-check)', () => {
    let positive = 0;
    fc.assert(
      fc.property(arb, (x) => {
        const circuit = { period: 10 ** -x.logF, high: 3.3, low: x.low, driverHigh: x.driverHigh, driverLow: x.driverLow, loadResistance: 10 ** x.logLoad, loadCapacitance: x.loadC };
        const r = x.logR.slice(0, x.n).map((v) => 10 ** v);
        const stages = r.map((rr, k) => ({ r: rr, c: 10 ** x.logC[k], buffered: false }));
        const truth = Math.abs(dcTransfer({ ...circuit, stages }, x.dMin, x.dMax).gainError) / (circuit.high - circuit.low);
        const bound = gainFloor(circuit, r, x.dMin, x.dMax);
        if (bound > 0.01) positive++;
        return bound <= truth * (1 + 1e-9) + 1e-12;
      }),
      { numRuns: 400, seed: 20261202 },
    );
    expect(positive).toBeGreaterThan(50); // the bound is not vacuous on these circuits
  });

  it('equals it for equal drivers: R_s / (R_L + R_s) of full scale (Ohm\'s law, the DC divider)', () => {
    fc.assert(
      fc.property(arb, (x) => {
        const circuit = { period: 10 ** -x.logF, high: 3.3, low: 0, driverHigh: x.driverHigh, driverLow: x.driverHigh, loadResistance: 10 ** x.logLoad, loadCapacitance: x.loadC };
        const r = x.logR.slice(0, x.n).map((v) => 10 ** v);
        const stages = r.map((rr, k) => ({ r: rr, c: 10 ** x.logC[k], buffered: false }));
        const truth = Math.abs(dcTransfer({ ...circuit, stages }, x.dMin, x.dMax).gainError) / 3.3;
        return Math.abs(gainFloor(circuit, r, x.dMin, x.dMax) - truth) <= 1e-9 * truth + 1e-12;
      }),
      { numRuns: 200, seed: 7 },
    );
  });

  it('is 0 without a load or with a single duty (the endpoint fit then takes the ideal slope)', () => {
    const circuit = { period: 1e-4, high: 3.3, low: 0, driverHigh: 40, driverLow: 25, loadResistance: null, loadCapacitance: 0 };
    expect(gainFloor(circuit, [1e3], 0.05, 0.95)).toBe(0);
    expect(gainFloor({ ...circuit, loadResistance: 1e4 }, [1e3], 0.5, 0.5)).toBe(0);
  });
});
