import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { designProblem } from '../../src/design/designProblem.js';
import { rippleCeiling, rippleCeilingPlan, rippleFloorSharp } from '../../src/design/rippleCeiling.js';
import { rippleFloor, rippleFloorPlan } from '../../src/design/rippleFloor.js';
import { steadyState } from '../../src/engine/index.js';
import { drawnProblem, floorProject, ladderFields } from './randomLadders.js';

/** Invented: a PWM pin into a load (randomLadders.ts). */
const project = floorProject;

/** Random ladders of 2 and 3 stages (randomLadders.ts), equal or unequal drivers, at a random duty. */
const RANDOM_LADDER = fc.record({
  ...ladderFields({ logR: [1.5, 5], logC: [-10, -5], lowMax: 150 }),
  equal: fc.boolean(),
  duty: fc.double({ min: 0.02, max: 0.98, noNaN: true }),
});

/**
 * A strong and a weak driver (1..20 ohm against 0.5..5 kohm, either way round) into a small first
 * resistor: the mismatch terms of the bounds carry much of the ripple here.
 */
const FLOATING_PHASE = fc.record({
  strong: fc.double({ min: 1, max: 20, noNaN: true }),
  weak: fc.double({ min: 500, max: 5000, noNaN: true }),
  highStrong: fc.boolean(),
  logR: fc.array(fc.double({ min: 1, max: 4, noNaN: true }), { minLength: 3, maxLength: 3 }),
  logC: fc.array(fc.double({ min: -9, max: -6, noNaN: true }), { minLength: 3, maxLength: 3 }),
  n: fc.integer({ min: 2, max: 3 }),
  duty: fc.double({ min: 0.05, max: 0.95, noNaN: true }),
});

/** The problem and parts of a FLOATING_PHASE draw. */
function floatingPhase(x: { strong: number; weak: number; highStrong: boolean; logR: number[]; logC: number[]; n: number }) {
  const [high, low] = x.highStrong ? [x.strong, x.weak] : [x.weak, x.strong];
  const p = designProblem(project({ driver: `{ high: ${high} ohm, low: ${low} ohm }` }));
  return { p, r: x.logR.slice(0, x.n).map((v) => 10 ** v), c: x.logC.slice(0, x.n).map((v) => 10 ** v) };
}

describe("rippleCeiling: an upper bound on the engine's ripple from the output's harmonics", () => {
  it('never falls below the ripple of engine/steadyState.ts, and rippleFloorSharp (below) never above it nor under rippleFloor, equal or unequal drivers, 2 and 3 stages (fast-check)', () => {
    let close = 0;
    let sharper = 0;
    fc.assert(
      fc.property(RANDOM_LADDER, (x) => {
        const { p, r, c } = drawnProblem({ ...x, n: Math.max(2, x.n) }, project);
        const plan = rippleCeilingPlan(p, r)!;
        const ceiling = rippleCeiling(plan, c, x.duty);
        const sharp = rippleFloorSharp(plan, c, x.duty);
        const floor = rippleFloor(rippleFloorPlan(p, r), c, x.duty);
        const ripple = steadyState(p.ladderOf(r, c), x.duty).ripple;
        if (ceiling < 1.5 * ripple) close++;
        if (sharp > 1.1 * floor) sharper++;
        return ceiling >= ripple * (1 - 1e-9) && sharp <= ripple * (1 + 1e-9) && sharp >= floor * (1 - 1e-12);
      }),
      { numRuns: 400 },
    );
    // Both say something on many random ladders: the ceiling is not a loose multiple everywhere,
    // and the sharp floor improves on the floor (the near-sine ones), not only in theory.
    expect(close).toBeGreaterThan(100);
    expect(sharper).toBeGreaterThan(30);
  });

  it('holds where the drivers differ by far: one phase all but floating, and so does rippleFloorSharp below (fast-check)', () => {
    fc.assert(
      fc.property(FLOATING_PHASE, (x) => {
        const { p, r, c } = floatingPhase(x);
        const plan = rippleCeilingPlan(p, r)!;
        const ripple = steadyState(p.ladderOf(r, c), x.duty).ripple;
        return rippleCeiling(plan, c, x.duty) >= ripple * (1 - 1e-9) && rippleFloorSharp(plan, c, x.duty) <= ripple * (1 + 1e-9);
      }),
      { numRuns: 300 },
    );
  });

  it('lies within 5 % above the ripple at 50 % of a three-stage ladder that passes little but the fundamental (equal drivers)', () => {
    // An invented 20 kHz three-stage filter, tau of each stage about 10 periods: the output is
    // nearly a sine, whose peak-to-peak is 4 |c1| (common practice), the sum the ceiling starts from.
    // Away from 50 % the pulse train's harmonics are a larger share of it, and the ceiling, which
    // adds their sizes, stands further above (within 30 % here).
    const p = designProblem(project({ driver: '{ high: 25 ohm, low: 25 ohm }' }));
    const r = [1000, 10e3, 100e3];
    const c = [470e-9, 47e-9, 4.7e-9];
    for (const [d, within] of [[0.5, 1.05], [0.1, 1.3], [0.8, 1.3]]) {
      const ripple = steadyState(p.ladderOf(r, c), d).ripple;
      const ratio = rippleCeiling(rippleCeilingPlan(p, r)!, c, d) / ripple;
      expect(ratio).toBeGreaterThanOrEqual(1);
      expect(ratio).toBeLessThan(within);
    }
  });

  it('is null for one stage (the tail bound needs two poles)', () => {
    expect(rippleCeilingPlan(designProblem(project({})), [1000])).toBeNull();
  });
});

describe("rippleFloorSharp: a lower bound on the engine's ripple from the fundamental less the odd harmonics", () => {
  // (random ladders and one phase all but floating: with the ceiling's tests above)

  it('lies within 3 % below the ripple at 50 % of a three-stage ladder that passes little but the fundamental, where the floor is near pi/4 of it', () => {
    // The invented filter of the ceiling's test above: nearly a sine, whose peak-to-peak is 4 |c1|
    // against the floor's pi |c1| (common practice: a sine's peak-to-peak is twice its amplitude).
    const p = designProblem(project({ driver: '{ high: 25 ohm, low: 25 ohm }' }));
    const r = [1000, 10e3, 100e3];
    const c = [470e-9, 47e-9, 4.7e-9];
    const ripple = steadyState(p.ladderOf(r, c), 0.5).ripple;
    const sharp = rippleFloorSharp(rippleCeilingPlan(p, r)!, c, 0.5) / ripple;
    expect(sharp).toBeLessThanOrEqual(1);
    expect(sharp).toBeGreaterThan(0.97);
    expect(rippleFloor(rippleFloorPlan(p, r), c, 0.5) / ripple).toBeLessThan(0.8);
  });
});
