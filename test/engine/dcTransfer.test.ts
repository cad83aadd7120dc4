import { describe, expect, it } from 'vitest';
import { dcTransfer } from '../../src/engine/dcTransfer.js';
import { steadyState } from '../../src/engine/steadyState.js';
import { ladder, relative, stage } from './ladders.js';

/** Largest |f| on [a, b] by a dense scan and golden-section polish (test-side reference search). */
function largestMagnitude(f: (x: number) => number, a: number, b: number) {
  let best = a;
  for (let i = 0; i <= 20000; i++) {
    const x = a + ((b - a) * i) / 20000;
    if (Math.abs(f(x)) > Math.abs(f(best))) best = x;
  }
  let lo = Math.max(a, best - (b - a) / 20000);
  let hi = Math.min(b, best + (b - a) / 20000);
  const g = (Math.sqrt(5) - 1) / 2;
  for (let i = 0; i < 80; i++) {
    const x1 = hi - g * (hi - lo);
    const x2 = lo + g * (hi - lo);
    if (Math.abs(f(x1)) > Math.abs(f(x2))) hi = x2;
    else lo = x1;
  }
  const x = Math.abs(f(lo)) > Math.abs(f(best)) ? lo : best;
  return { x, value: f(x) };
}

describe('dcTransfer', () => {
  it('loaded stage, equal drivers: divider k = R_L/(R_L + R + R_d) gives all four terms', () => {
    // Source: Ohm's law (resistive divider; the capacitor carries no DC current):
    // average(D) = k (low + D span), so droop = (1 - k) ideal(D) largest at the top of the range,
    // and, signed ideal - actual (README "Sign convention"): offset error = (1 - k) low,
    // gain error = (1 - k) span, INL = 0 (affine transfer).
    const [r, rd, rl] = [10e3, 30, 220e3];
    const l = ladder([stage(r, 1e-6)], { low: 0.3, driverHigh: rd, driverLow: rd, loadResistance: rl });
    const k = rl / (rl + r + rd);
    const dc = dcTransfer(l, 0.1, 0.9);
    expect(dc.droop.duty).toBeCloseTo(0.9, 9);
    expect(relative(dc.droop.error, (1 - k) * (0.3 + 0.9 * 3))).toBeLessThan(1e-10);
    expect(relative(dc.offsetError, (1 - k) * 0.3)).toBeLessThan(1e-10);
    expect(relative(dc.gainError, (1 - k) * 3)).toBeLessThan(1e-10);
    // the loaded output falls short of ideal: every term positive, as the DC error is
    expect(dc.droop.error).toBeGreaterThan(0);
    expect(dc.gainError).toBeGreaterThan(0);
    expect(Math.abs(dc.inl.error)).toBeLessThan(1e-13);
  });

  it('no load, equal drivers: no DC error at all', () => {
    // Source: the average node voltage equals the average pin voltage (common practice).
    const dc = dcTransfer(ladder([stage(4.7e3, 100e-9), stage(47e3, 10e-9)], { driverHigh: 20, driverLow: 20 }), 0.05, 0.95);
    for (const v of [dc.droop.error, dc.offsetError, dc.gainError, dc.inl.error]) expect(Math.abs(v)).toBeLessThan(1e-13);
  });

  it('unequal drivers: droop and INL follow the charge balance when tau >> T', () => {
    // Source: zero average capacitor current (Kirchhoff's current law over a period) with the
    // output nearly constant (tau = 1e7 T, ripple ~1e-7 of full scale):
    // D (Vh - X)/Rh + (1 - D)(Vl - X)/Rl = 0, X(D) = (D Vh/Rh + (1-D) Vl/Rl) / (D/Rh + (1-D)/Rl),
    // Rh = R + Rd_high, Rl = R + Rd_low. Reference extremes by a dense scan of the closed form.
    const [r, rdh, rdl] = [1e3, 200, 40];
    const l = ladder([stage(r, (1e7 * 50e-6) / r)], { driverHigh: rdh, driverLow: rdl });
    const [rh, rlo] = [r + rdh, r + rdl];
    const X = (d: number) => ((d * 3.3) / rh) / (d / rh + (1 - d) / rlo);
    const [a, b] = [0.05, 0.95];
    const dc = dcTransfer(l, a, b);
    const droop = largestMagnitude((d) => 3.3 * d - X(d), a, b);
    expect(relative(dc.droop.error, droop.value)).toBeLessThan(1e-5);
    expect(Math.abs(dc.droop.duty - droop.x)).toBeLessThan(1e-3);
    const slope = (X(b) - X(a)) / (b - a);
    // signed fit - average, like DC error = ideal - average (README "Sign convention")
    const inl = largestMagnitude((d) => X(a) + slope * (d - a) - X(d), a, b);
    expect(relative(dc.inl.error, inl.value)).toBeLessThan(1e-4);
    expect(Math.abs(dc.inl.duty - inl.x)).toBeLessThan(1e-3);
    expect(relative(dc.gainError, 3.3 - slope)).toBeLessThan(1e-5);
    expect(relative(dc.offsetError, -(X(a) - slope * a))).toBeLessThan(1e-5);
  });

  it('the searched droop is at least the largest error on a fine duty grid (two stages, loaded)', () => {
    // Source: definition (largest |DC error| over the range), checked against 201 grid duties.
    const l = ladder([stage(1e3, 220e-9), stage(4.7e3, 47e-9)], { driverHigh: 60, driverLow: 20, loadResistance: 22e3 });
    const dc = dcTransfer(l, 0.02, 0.98);
    let worst = 0;
    for (let i = 0; i <= 200; i++) {
      const d = 0.02 + (0.96 * i) / 200;
      worst = Math.max(worst, Math.abs(3.3 * d - steadyState(l, d).average));
    }
    expect(Math.abs(dc.droop.error)).toBeGreaterThanOrEqual(worst - 1e-15);
    expect(Math.abs(dc.droop.error)).toBeLessThan(worst * (1 + 1e-6));
  });
});
