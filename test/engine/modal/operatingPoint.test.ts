import { describe, expect, it } from 'vitest';
import { modalLadder } from '../../../src/engine/modal/modalLadder.js';
import { modalOperatingPoint } from '../../../src/engine/modal/operatingPoint.js';
import { averageOutput } from '../../../src/engine/modal/averageOutput.js';
import { rippleAt } from '../../../src/engine/modal/rippleAt.js';
import { integratePeriod, ladder, oneStageRipple, stage } from '../../tolerance/reference.js';

const T = 1 / 20e3;

describe('modal steady state of one stage', () => {
  it('ripple equals the closed form V(1-e^-DT/tau)(1-e^-(1-D)T/tau)/(1-e^-T/tau) for tau/T from 1e-2 to 1e9', () => {
    // textbook first-order response to a rectangular wave (common practice)
    for (const tauOverT of [1e-2, 0.1, 1, 10, 1e3, 1e6, 1e9]) {
      const R = 4.7e3;
      const tau = tauOverT * T;
      const m = modalLadder(ladder([stage(R, tau / R)]))!;
      for (const D of [0.05, 0.3, 0.5, 0.9]) {
        const ref = oneStageRipple(3.3, T, D, tau);
        expect(Math.abs(modalOperatingPoint(m, D).ripple - ref) / ref).toBeLessThan(1e-12);
        expect(Math.abs(rippleAt(m, D) - ref) / ref).toBeLessThan(1e-12);
      }
    }
  });

  it('average is the ideal output with no load and equal drivers, and the divider R_L/(R_L+R+Rd) times it with a load', () => {
    // mean of a linear circuit in periodic steady state = DC gain x mean input (superposition);
    // the DC gain of the loaded stage is the resistive divider (Ohm's law)
    const open = modalLadder(ladder([stage(10e3, 1e-6)], { driverHigh: 30, driverLow: 30 }))!;
    const loaded = modalLadder(ladder([stage(10e3, 1e-6)], { driverHigh: 30, driverLow: 30, loadResistance: 100e3 }))!;
    for (const D of [0, 0.2, 0.5, 0.77, 1]) {
      expect(averageOutput(open, D)).toBeCloseTo(3.3 * D, 13);
      expect(averageOutput(loaded, D)).toBeCloseTo((3.3 * D * 100e3) / (100e3 + 10e3 + 30), 13);
      expect(modalOperatingPoint(loaded, D).average).toBeCloseTo(averageOutput(loaded, D), 14);
    }
  });
});

describe('modal steady state against time-domain integration (ODEX, npm odex)', () => {
  // The periodic state is reached by integrating period after period from 0 V: moderate time
  // constants (a few periods) so that it converges quickly; min, max from dense output on a
  // 1/2000-period grid (so the reference max may sit up to one grid step below the true one).
  const cases: Array<[string, ReturnType<typeof ladder>, number]> = [
    ['two stages, asymmetric drivers, loaded', ladder([stage(1e3, 47e-9), stage(4.7e3, 10e-9)], { driverHigh: 60, driverLow: 25, loadResistance: 47e3, loadCapacitance: 1e-9 }), 0.3],
    ['three stages, low level above 0 V', ladder([stage(470, 100e-9), stage(2.2e3, 22e-9), stage(10e3, 4.7e-9)], { low: 0.4, driverHigh: 10, driverLow: 40 }), 0.65],
    ['two stages, follower after the last stage', ladder([stage(2.2e3, 47e-9), stage(10e3, 10e-9, true)], { loadResistance: 1e3, loadCapacitance: 1e-6 }), 0.5],
    ['cascade: follower after stage 1, asymmetric drivers, loaded', ladder([stage(4.7e3, 22e-9, true), stage(1e3, 47e-9)], { driverHigh: 60, driverLow: 30, loadResistance: 47e3 }), 0.35],
    ['cascade of three sections', ladder([stage(1e3, 47e-9, true), stage(2.2e3, 47e-9, true), stage(470, 100e-9)], { driverHigh: 20, driverLow: 50 }), 0.8],
  ];
  for (const [name, l, D] of cases) {
    it(name, () => {
      const n = l.stages.length;
      let x = new Array<number>(n).fill(0);
      const lRef = l;
      for (let k = 0; k < 400; k++) {
        const next = integratePeriod(lRef, D, x, 4).end;
        const change = Math.max(...next.map((v, i) => Math.abs(v - x[i])));
        x = next;
        if (change < 1e-13) break;
      }
      const { out } = integratePeriod(lRef, D, x, 2000);
      const refMax = Math.max(...out);
      const refMin = Math.min(...out);
      const op = modalOperatingPoint(modalLadder(l)!, D);
      const ripple = refMax - refMin;
      expect(Math.abs(op.max - refMax)).toBeLessThan(1e-6 * ripple);
      expect(Math.abs(op.min - refMin)).toBeLessThan(1e-6 * ripple);
      expect(Math.abs(op.ripple - ripple) / ripple).toBeLessThan(2e-6);
      expect(Math.abs(rippleAt(modalLadder(l)!, D) - op.ripple) / op.ripple).toBeLessThan(1e-12);
    });
  }

  it('declines a cascade whose sections share a mode (a Jordan block: the engine takes it)', () => {
    // two identical isolated sections: the cascade's state matrix has a repeated eigenvalue
    expect(modalLadder(ladder([stage(1e3, 1e-7, true), stage(1e3, 1e-7)]))).toBeNull();
    expect(modalLadder(ladder([stage(1e3, 1e-7, true), stage(1e3, 1.2e-7)]))).not.toBeNull();
  });
});

describe('modal steady state at duty 0 and 1', () => {
  it('is flat at the DC level of the phase held, exactly flat (two and three stages, loaded, unequal drivers)', () => {
    // A constant pin gives a constant steady state (common practice); its level is the resistive
    // divider R_L / (R_L + sum R + R_driver) times the pin voltage (Ohm's law, capacitors open).
    const RL = 47e3;
    for (const stages of [[stage(1e3, 1e-6), stage(1e4, 1e-7)], [stage(470, 1e-7), stage(2.2e3, 22e-9), stage(1e4, 4.7e-9)]]) {
      const l = ladder(stages, { low: 0.2, driverHigh: 40, driverLow: 25, loadResistance: RL });
      const m = modalLadder(l)!;
      const sumR = stages.reduce((s, st) => s + st.r, 0);
      for (const [d, pin, driver] of [[0, 0.2, 25], [1, 3.3, 40]]) {
        const op = modalOperatingPoint(m, d);
        expect(op.ripple).toBe(0);
        expect(op.min).toBe(op.max);
        expect(op.average).toBe(op.max);
        expect(Math.abs(op.average - (pin * RL) / (RL + sumR + driver))).toBeLessThan(1e-15 * pin);
        expect(averageOutput(m, d)).toBe(op.average);
      }
    }
  });
});
