import { describe, expect, it } from 'vitest';
import type { Ladder } from '../../../src/circuit/ladder.js';
import { fastLadder } from '../../../src/design/fast/fastLadder.js';
import { fastSettlingBound } from '../../../src/design/fast/fastSettlingBound.js';
import { fastSteadyState } from '../../../src/design/fast/fastSteadyState.js';
import { ladder as demoLadder, stage } from '../../engine/ladders.js';
import { simulate } from './odexLadder.js';

/** Unbuffered [R, C] stages on the demo pin of the engine tests, at 10 kHz. */
const ladder = (stages: Array<[number, number]>, extra: Partial<Ladder> = {}): Ladder =>
  demoLadder(stages.map(([r, c]) => stage(r, c)), { period: 1e-4, ...extra });

describe('fastSettlingBound', () => {
  it('one stage, ripple well inside the band: tau ln(S / band) within a period (textbook first-order step)', () => {
    // error after a step = S e^(-t/tau) (first-order step response, textbook; common practice);
    // the ripple moves the last crossing by at most about (high - low) T / (8 band) < T here.
    const l = ladder([[10e3, 1e-6]], { period: 1e-6 });
    const tau = 10e3 * 1e-6;
    const band = 0.5;
    const m = fastLadder(l);
    const step = fastSteadyState(m, 0.8).average - fastSteadyState(m, 0.2).average;
    const got = fastSettlingBound(m, 0.2, 0.8, band);
    expect(Math.abs(got - tau * Math.log(step / band))).toBeLessThan(l.period);
  });

  const cases: Array<[string, Ladder, number, number, number]> = [
    // ~155 periods, ripple 3 % of the band
    ['two stages, unequal drivers, rising', ladder([[1e3, 100e-9], [10e3, 22e-9]], { period: 1e-5, driverHigh: 40, driverLow: 25, loadResistance: 100e3 }), 0.1, 0.9, 5e-3],
    // ~87 periods, ripple 90 % of the band
    ['two stages, falling, band close to the ripple', ladder([[1e3, 47e-9], [10e3, 10e-9]], { period: 1e-5, driverHigh: 30, driverLow: 30 }), 0.7, 0.3, 2e-3],
  ];
  for (const [name, l, from, to, band] of cases) {
    it(`${name}: the last band violation of an ODEX simulation`, () => {
      // Reference: ODEX (npm odex) from the steady state at `from` (1500 periods from rest), then
      // `to`; the last sample outside the band brackets the settling time to one sample.
      const samples = 2000;
      const start = simulate(l, from, [0, 0], 1500, 20).y; // ~50 slowest time constants
      const after = simulate(l, to, start, 300, samples);
      const settled = simulate(l, to, after.y, 1500, 20).y; // then ~50 time constants more
      const tail = simulate(l, to, settled, 1, samples);
      let integral = 0;
      for (let i = 1; i < tail.t.length; i++) integral += ((tail.v[i] + tail.v[i - 1]) / 2) * (tail.t[i] - tail.t[i - 1]);
      const average = integral / l.period;
      let last = -1;
      after.v.forEach((v, i) => {
        if (Math.abs(v - average) > band) last = i;
      });
      expect(last).toBeGreaterThan(0);
      expect(last).toBeLessThan(after.v.length - 1);
      const got = fastSettlingBound(fastLadder(l), from, to, band);
      const dt = l.period / samples;
      expect(got).toBeGreaterThanOrEqual(after.t[last] - 1e-3 * dt);
      expect(got).toBeLessThanOrEqual(after.t[last] + dt * 1.001);

      // With a ceiling the bound may stop early, but it answers "above the ceiling?" as the full
      // bound does, stays a violation instant of the simulation (at most the last one), and is the
      // full bound itself when that lies under the ceiling.
      for (const fraction of [0.1, 0.5, 0.9, 0.99, 1.01, 2]) {
        const ceiling = got * fraction;
        const capped = fastSettlingBound(fastLadder(l), from, to, band, undefined, undefined, ceiling);
        expect(capped > ceiling).toBe(got > ceiling);
        expect(capped).toBeLessThanOrEqual(after.t[last] + dt * 1.001);
        if (got <= ceiling) expect(capped).toBe(got);
        else {
          // the simulation's samples around that instant leave the band (to the sample spacing)
          const i = after.t.findIndex((t) => t >= capped);
          const nearby = [i - 1, i].filter((k) => k >= 0 && k < after.v.length);
          const worst = Math.max(...nearby.map((k) => Math.abs(after.v[k] - average)));
          expect(worst).toBeGreaterThan(band * 0.999);
        }
      }
    });
  }

  it('is Infinity when the ripple at the target duty leaves the band', () => {
    const l = ladder([[1e3, 10e-9]]);
    const m = fastLadder(l);
    const ripple = fastSteadyState(m, 0.5).ripple;
    expect(fastSettlingBound(m, 0.2, 0.5, ripple / 4)).toBe(Infinity);
  });
});
