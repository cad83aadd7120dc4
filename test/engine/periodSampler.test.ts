import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { dutyPlan } from '../../src/engine/dutyPlan.js';
import { periodSampler } from '../../src/engine/periodSampler.js';
import { prepare } from '../../src/engine/prepare.js';
import { ladder, stage } from './ladders.js';
import { pwmReference } from './pwmReference.js';

/** Invented demo circuits (not from any product). */
const circuits = {
  'two stages, unequal drivers': ladder([stage(2.2e3, 47e-9), stage(22e3, 10e-9)], { driverHigh: 40, driverLow: 25, loadResistance: 1e5 }),
  'follower between stages': ladder([stage(1e3, 100e-9, true), stage(10e3, 33e-9)], { driverHigh: 30, driverLow: 18 }),
  'three stages': ladder([stage(1e3, 220e-9), stage(4.7e3, 47e-9), stage(22e3, 10e-9)], { driverHigh: 40, driverLow: 25, loadResistance: 1e6 }),
};

describe('periodSampler', () => {
  for (const [name, l] of Object.entries(circuits)) {
    it(`${name}: y(tau) = y_s(tau) + r(tau) . e for any start deviation e (property)`, () => {
      // Source: superposition for a linear system (the output is affine in the initial state),
      // checked against mathjs expm on nodal equations written in the test (pwmReference.ts).
      const p = prepare(l);
      const ref = pwmReference(l);
      const T = l.period;
      const n = l.stages.length;
      fc.assert(
        fc.property(
          fc.double({ min: 0.02, max: 0.98, noNaN: true }),
          fc.array(fc.double({ min: -2, max: 2, noNaN: true }), { minLength: n, maxLength: n }),
          fc.array(fc.double({ min: 0, max: 1, noNaN: true }), { minLength: 1, maxLength: 4 }),
          (d, e, fractions) => {
            const plan = dutyPlan(p, d);
            const sampler = periodSampler(p, plan, fractions.map((f) => f * T));
            const x0 = plan.xStart.map((x, i) => x + e[i]);
            return fractions.every((f, j) => Math.abs(sampler.valueAt(j, e) - ref.within(d, x0, f * T)) < 1e-12 * 3.3);
          },
        ),
        { numRuns: 40 },
      );
    });
  }

  it('at the rising edge is the state itself, and one period later is the one-period map (I - S)', () => {
    // Source: Phi(0) = I and Phi(T) = E_l E_h = M (definition of the one-period map, model.md);
    // periodic steady state: y_s(T) = y_s(0).
    const l = circuits['three stages'];
    const p = prepare(l);
    const plan = dutyPlan(p, 0.3);
    const n = p.n;
    const out = p.system.output;
    const s = periodSampler(p, plan, [0, l.period]);
    expect(s.steady[0]).toBe(0);
    expect(s.rows[0]).toEqual(Array.from({ length: n }, (_, i) => (i === out ? 1 : 0)));
    expect(Math.abs(s.steady[1])).toBeLessThan(1e-15);
    s.rows[1].forEach((r, i) => expect(Math.abs(r - ((i === out ? 1 : 0) - plan.S[out * n + i]))).toBeLessThan(1e-14));
  });

  it('clamps offsets outside the period to its ends', () => {
    // Source: the contract in periodSampler.ts.
    const l = circuits['two stages, unequal drivers'];
    const p = prepare(l);
    const s = periodSampler(p, dutyPlan(p, 0.5), [-1, 2 * l.period]);
    expect(s.offsets).toEqual([0, l.period]);
  });
});
