import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { modalLadder } from '../../../src/engine/modal/modalLadder.js';
import { modalSettling } from '../../../src/engine/modal/settling.js';
import { integratePeriod, ladder, oneStageRipple, oneStageSettling, stage } from '../../tolerance/reference.js';

const T = 1 / 20e3;

describe('modalSettling, one stage', () => {
  it('matches the superposition closed form (orbit + e0 e^-t/tau) within T/1e4, tau from 2 to 1e6 periods', () => {
    for (const tauOverT of [2, 10, 100, 1e4, 1e6]) {
      const R = 10e3;
      const tau = tauOverT * T;
      const m = modalLadder(ladder([stage(R, tau / R)]))!;
      for (const [from, to] of [
        [0.1, 0.9],
        [0.9, 0.1],
        [0.5, 0.52],
      ]) {
        const band = Math.max(1e-3, oneStageRipple(3.3, T, to, tau));
        const ref = oneStageSettling(3.3, T, from, to, tau, band);
        const got = modalSettling(m, from, to, band)!;
        expect(got, `tau ${tauOverT} T, ${from} -> ${to}`).not.toBeNull();
        expect(Math.abs(got - ref), `tau ${tauOverT} T, ${from} -> ${to}`).toBeLessThan(T * 1e-4 + 1e-9 * ref);
      }
    }
  });

  it('lies between tau ln(step/band) and tau ln(step/(band - ripple/2)) (derivation: envelope of a decaying exponential)', () => {
    // The transient e0 e^(-t/tau) with e0 ~ the step; the output leaves the band last no earlier
    // than the transient alone would, and no later than with half the ripple added to it.
    const R = 10e3;
    const tau = 50 * T;
    const m = modalLadder(ladder([stage(R, tau / R)]))!;
    const ripple = oneStageRipple(3.3, T, 0.9, tau);
    const band = 5 * ripple;
    const step = 3.3 * 0.8;
    const t = modalSettling(m, 0.1, 0.9, band)!;
    expect(t).toBeGreaterThan(tau * Math.log(step / band) - T);
    expect(t).toBeLessThan(tau * Math.log(step / (band - ripple / 2)) + T);
  });

  it('is null when the ripple alone leaves the band, 0 when the step stays inside it', () => {
    const m = modalLadder(ladder([stage(1e3, 1e-7)]))!;
    const ripple = oneStageRipple(3.3, T, 0.5, 1e-4);
    expect(modalSettling(m, 0.1, 0.5, ripple / 4)).toBeNull();
    expect(modalSettling(m, 0.5, 0.5, ripple)).toBe(0);
  });
});

describe('modalSettling against a step response integrated by ODEX (npm odex)', () => {
  // Brute force: the state at the `from` steady state, then period after period at `to`, output
  // sampled on a T/2000 grid; the reference settling time is the end of the last sample outside
  // the band (so it is known to T/2000), the average at `to` from the last period's samples.
  const cases: Array<[string, ReturnType<typeof ladder>, number, number]> = [
    ['two stages, asymmetric drivers, loaded, rising', ladder([stage(2.2e3, 100e-9), stage(10e3, 22e-9)], { driverHigh: 60, driverLow: 25, loadResistance: 100e3 }), 0.1, 0.9],
    ['two stages, falling, small step', ladder([stage(4.7e3, 47e-9), stage(4.7e3, 47e-9)], { driverHigh: 40, driverLow: 20 }), 0.6, 0.45],
  ];
  for (const [name, l, from, to] of cases) {
    it(name, () => {
      const n = l.stages.length;
      let x = new Array<number>(n).fill(0);
      for (let k = 0; k < 2000; k++) {
        const next = integratePeriod(l, from, x, 4).end;
        const change = Math.max(...next.map((v, i) => Math.abs(v - x[i])));
        x = next;
        if (change < 1e-14) break;
      }
      const grid = 2000;
      const periods: number[][] = [];
      for (let k = 0; k < 400; k++) {
        const r = integratePeriod(l, to, x, grid);
        periods.push(r.out);
        x = r.end;
      }
      const last = periods[periods.length - 1];
      // the recorded samples include both ends of each phase: trapezoid over the evenly spaced interior
      const average = last.slice(1, -1).reduce((a, v) => a + v, 0) / (last.length - 2);
      const ripple = Math.max(...last) - Math.min(...last);
      const band = 3 * ripple;
      let lastOut = -1;
      periods.forEach((samples, k) => {
        samples.forEach((v, i) => {
          if (Math.abs(v - average) > band) lastOut = k * T + (i / (samples.length - 1)) * T;
        });
      });
      const got = modalSettling(modalLadder(l)!, from, to, band)!;
      expect(got).not.toBeNull();
      expect(Math.abs(got - lastOut)).toBeLessThan(T / 500);
    });
  }
});

describe('modalSettling with a ceiling (a yield verdict asks only settling <= limit)', () => {
  // Reference: the same function without a ceiling (held to ODEX and the closed form above). Ceilings
  // at the exact time, one double either side of it, and at several multiples of it.
  const nextDouble = (x: number, step: bigint) => {
    const v = new DataView(new ArrayBuffer(8));
    v.setFloat64(0, x);
    v.setBigUint64(0, v.getBigUint64(0) + step);
    return v.getFloat64(0);
  };
  it('gives the exact verdict for every ceiling, the exact time when above it, and never less than the exact time', () => {
    const arbStage = fc.record({
      r: fc.double({ min: Math.log(220), max: Math.log(100e3), noNaN: true }).map(Math.exp),
      c: fc.double({ min: Math.log(1e-9), max: Math.log(2e-6), noNaN: true }).map(Math.exp),
    });
    let shortcuts = 0;
    fc.assert(
      fc.property(
        fc.array(arbStage, { minLength: 1, maxLength: 3 }),
        fc.tuple(fc.double({ min: 0, max: 80, noNaN: true }), fc.double({ min: 0, max: 80, noNaN: true })),
        fc.tuple(fc.double({ min: 0.02, max: 0.98, noNaN: true }), fc.double({ min: 0.02, max: 0.98, noNaN: true })),
        fc.double({ min: Math.log(1e-4), max: Math.log(3e-2), noNaN: true }).map(Math.exp),
        (stages, [dh, dl], [from, to], band) => {
          const m = modalLadder(ladder(stages.map((s) => stage(s.r, s.c)), { driverHigh: dh, driverLow: dl, loadResistance: 1e6 }));
          fc.pre(m !== null);
          const exact = modalSettling(m!, from, to, band);
          const ceilings = typeof exact === 'number' && exact > 0 ? [exact, nextDouble(exact, -1n), nextDouble(exact, 1n), 1.01 * exact, 1.5 * exact, 3 * exact, 100 * exact] : [T, 1];
          for (const ceiling of ceilings) {
            const got = modalSettling(m!, from, to, band, undefined, ceiling);
            if (typeof exact !== 'number') {
              expect(got).toBe(exact);
              continue;
            }
            expect(typeof got).toBe('number');
            expect(got! <= ceiling).toBe(exact <= ceiling);
            expect(got!).toBeGreaterThanOrEqual(exact);
            if (got! > ceiling) expect(got).toBe(exact);
            if (got !== exact) shortcuts++;
          }
        },
      ),
      { numRuns: 200, seed: 4242 },
    );
    expect(shortcuts).toBeGreaterThan(50);
  });
});
