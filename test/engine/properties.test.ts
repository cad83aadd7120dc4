import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { steadyState } from '../../src/engine/steadyState.js';
import { settlingTime } from '../../src/engine/settlingTime.js';
import { worstRipple } from '../../src/engine/worstRipple.js';
import { dcTransfer } from '../../src/engine/dcTransfer.js';
import { cutoff } from '../../src/engine/cutoff.js';
import { timeConstants } from '../../src/engine/timeConstants.js';
import { ladderArb } from './arbitraries.js';

const duty = fc.double({ min: 0, max: 1, noNaN: true });

describe('engine properties over random valid ladders (fast-check)', () => {
  it('ripple does not grow when any capacitor grows (equal drivers)', () => {
    // Source: with equal drivers the filter is linear time-invariant and more shunt capacitance
    // only adds smoothing (common practice). With unequal high/low drivers this is false on
    // purpose: a larger C1 shifts the charge balance towards the lower-resistance phase and can
    // raise both the average and the ripple (see dcTransfer.test.ts, charge balance).
    // Tolerance 1e-6 relative: the engine's own rounding at ripples down to 1e-13 of the level.
    fc.assert(
      fc.property(ladderArb, fc.nat(3), fc.double({ min: 0.01, max: 10, noNaN: true }), duty, (l0, i0, grow, d) => {
        const l = { ...l0, driverLow: l0.driverHigh };
        const i = i0 % l.stages.length;
        const bigger = { ...l, stages: l.stages.map((s, k) => (k === i ? { ...s, c: s.c * (1 + grow) } : s)) };
        const before = steadyState(l, d).ripple;
        const after = steadyState(bigger, d).ripple;
        return after <= before * (1 + 1e-6) + 1e-15 * l.high;
      }),
      { numRuns: 150 },
    );
  });

  it('the average (and every value) lies between the levels', () => {
    // Source: a passive RC network cannot leave the range of its sources (maximum principle for
    // RC networks; common practice). A load resistor is one more source: ground, 0 V.
    // Slack: rounding, which the squaring phase of the matrix exponential amplifies by about
    // T / tau_min in stiff ladders (Higham 2005, section 3): 1e-15 (1 + T/tau_min) of the level.
    fc.assert(
      fc.property(ladderArb, duty, (l, d) => {
        const op = steadyState(l, d);
        const stiffness = 1 + l.period / Math.min(...timeConstants(l));
        const slack = 1e-15 * stiffness * Math.max(Math.abs(l.high), Math.abs(l.low));
        const lowest = l.loadResistance === null ? l.low : Math.min(l.low, 0);
        const highest = l.loadResistance === null ? l.high : Math.max(l.high, 0);
        const inside = (v: number) => v >= lowest - slack && v <= highest + slack;
        return inside(op.average) && inside(op.min) && inside(op.max);
      }),
      { numRuns: 150 },
    );
  });

  it('every result is finite for any valid ladder', () => {
    // Source: none needed; robustness over values spanning many decades (1 ohm .. 10 Mohm,
    // 1 pF .. 1 mF, drivers 0 .. 1 kohm, open or loaded, 1-4 stages, 100 Hz .. 1 MHz).
    fc.assert(
      fc.property(ladderArb, duty, duty, (l, a, b) => {
        const op = steadyState(l, a);
        const finite = [op.average, op.min, op.max, op.ripple, op.tMin, op.tMax].every(Number.isFinite);
        const band = 1e-3 * (l.high - l.low);
        const s = settlingTime(l, a, b, band).time;
        const lo = Math.min(a, b);
        const hi = Math.max(a, b);
        const w = worstRipple(l, lo, hi);
        const dc = dcTransfer(l, lo, hi);
        const fc3 = cutoff(l);
        const taus = timeConstants(l);
        return (
          finite &&
          op.ripple >= 0 &&
          (s === null || (Number.isFinite(s) && s >= 0)) &&
          Number.isFinite(w.ripple) &&
          w.ripple >= op.ripple * (lo <= a && a <= hi ? 1 - 1e-9 : 0) &&
          [dc.droop.error, dc.offsetError, dc.gainError, dc.inl.error].every(Number.isFinite) &&
          Number.isFinite(fc3) &&
          fc3 > 0 &&
          taus.length === l.stages.length &&
          taus.every((t) => Number.isFinite(t) && t > 0)
        );
      }),
      { numRuns: 40 },
    );
  });
});
