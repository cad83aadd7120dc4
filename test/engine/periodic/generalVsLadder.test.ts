/**
 * The general piecewise-linear engine (src/engine/periodic) against the passive-ladder engine on
 * passive ladders, where both apply: two independent routes to the same exact figures (the ladder
 * engine itself is held to 40- and 80-digit references in test/engine). Random circuits are
 * invented by fast-check with a fixed seed.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import type { Ladder } from '../../../src/circuit/ladder.js';
import type { Network } from '../../../src/circuit/network.js';
import { cutoff } from '../../../src/engine/cutoff.js';
import { periodicOrbit } from '../../../src/engine/periodic/periodicOrbit.js';
import { periodicSettling } from '../../../src/engine/periodic/periodicSettling.js';
import { networkCutoff } from '../../../src/engine/periodic/networkResponse.js';
import { settlingTime } from '../../../src/engine/settlingTime.js';
import { steadyState } from '../../../src/engine/steadyState.js';
import { filterLadders, unitInterval } from '../arbitraries.js';

const asNetwork = (l: Ladder, alignment: 'edge' | 'center' = 'edge'): Network => ({
  period: l.period,
  alignment,
  pin: { high: l.high, low: l.low, driverHigh: l.driverHigh, driverLow: l.driverLow },
  stages: l.stages.map((s) => ({ kind: 'rc', ...s })),
  second: null,
  loadResistance: l.loadResistance,
  loadCapacitance: l.loadCapacitance,
});
const one = (d: number) => ({ first: d, second: null });

describe('general engine on passive ladders', () => {
  it('periodic steady state: average, ripple and extremes agree with the ladder engine (tau/T 1e-2 .. 1e6)', () => {
    fc.assert(
      fc.property(filterLadders(1e-2, 1e6), unitInterval, (l, u) => {
        const d = 0.02 + 0.96 * u;
        const a = steadyState(l, d);
        const b = periodicOrbit(asNetwork(l), one(d));
        const span = l.high - l.low;
        expect(Math.abs(b.average - a.average)).toBeLessThan(1e-12 * span);
        expect(Math.abs(b.ripple - a.ripple)).toBeLessThan(1e-9 * a.ripple + 1e-15 * span);
        expect(Math.abs(b.max - a.max)).toBeLessThan(1e-12 * span);
      }),
      { numRuns: 60, seed: 20261202, endOnFailure: true },
    );
  });

  it('center alignment moves the waveform, not the ripple or the average (model.md)', () => {
    fc.assert(
      fc.property(filterLadders(1e-1, 1e4), unitInterval, (l, u) => {
        const d = 0.05 + 0.9 * u;
        const edge = periodicOrbit(asNetwork(l), one(d));
        const center = periodicOrbit(asNetwork(l, 'center'), one(d));
        expect(Math.abs(center.ripple - edge.ripple)).toBeLessThan(1e-9 * edge.ripple + 1e-15);
        expect(Math.abs(center.average - edge.average)).toBeLessThan(1e-12 * (l.high - l.low));
      }),
      { numRuns: 30, seed: 7, endOnFailure: true },
    );
  });

  it('settling time agrees with the ladder engine (tau/T 1e-1 .. 1e4)', () => {
    fc.assert(
      fc.property(filterLadders(1e-1, 1e4), unitInterval, unitInterval, (l, u, v) => {
        const from = 0.05 + 0.9 * u;
        const to = 0.05 + 0.9 * v;
        const band = 0.002 * (l.high - l.low);
        const a = settlingTime(l, from, to, band).time;
        const b = periodicSettling(asNetwork(l), one(from), one(to), band).time;
        if (a === null) expect(b).toBeNull();
        else expect(Math.abs(b! - a)).toBeLessThan(1e-6 * a + 1e-9 * l.period);
      }),
      { numRuns: 40, seed: 11, endOnFailure: true },
    );
  });

  it('cutoff agrees with the ladder engine', () => {
    fc.assert(
      fc.property(filterLadders(1e-1, 1e5), (l) => {
        const a = cutoff(l);
        expect(Math.abs(networkCutoff(asNetwork(l)) / a - 1)).toBeLessThan(1e-9);
      }),
      { numRuns: 40, seed: 3, endOnFailure: true },
    );
  });
});

describe('published worked example: one RC stage, 8 bits, 10 kHz', () => {
  // "PWM DAC Ripple Reduction", Circuit Cellar (2022), as quoted in our issue: RC = 64 T gives
  // 1 LSB of ripple at 8 bits, and settling to 1 LSB after a full-scale step takes about 355 T
  // (35 ms at 10 kHz; tau ln 256 = 64 T x 5.545 = 354.9 T).
  const T = 1e-4;
  const V = 3.3;
  const lsb = V / 256;
  const net: Network = {
    period: T,
    alignment: 'edge',
    pin: { high: V, low: 0, driverHigh: 0, driverLow: 0 },
    stages: [{ kind: 'rc', r: 6.4e3, c: 1e-6, buffered: false }],
    second: null,
    loadResistance: null,
    loadCapacitance: 0,
  };
  it('ripple at 50 % duty is 1 LSB to within the T/(4RC) approximation (0.002 %)', () => {
    expect(periodicOrbit(net, one(0.5)).ripple / lsb).toBeCloseTo(1, 4);
  });
  it('settling from 0 to full scale within 1 LSB takes 354.9 T (35 ms)', () => {
    const t = periodicSettling(net, one(0), one(1), lsb).time!;
    expect(t / T).toBeGreaterThan(354);
    expect(t / T).toBeLessThan(356);
  });
});
