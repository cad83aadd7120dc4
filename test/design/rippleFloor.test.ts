import fc from 'fast-check';
import { complex, det, matrix, type Complex } from 'mathjs';
import { describe, expect, it } from 'vitest';
import { designProblem } from '../../src/design/designProblem.js';
import { rippleFloor, rippleFloorPlan } from '../../src/design/rippleFloor.js';
import { steadyState } from '../../src/engine/index.js';
import { drawnProblem, floorProject, ladderFields } from './randomLadders.js';

/** Invented: a PWM pin into a load (randomLadders.ts). */
const project = floorProject;

describe("rippleFloor: a lower bound on the engine's ripple from the pin's fundamental", () => {
  it('never exceeds the ripple of engine/steadyState.ts, equal or unequal drivers, 1 to 3 stages (fast-check)', () => {
    const arb = fc.record({
      ...ladderFields({ logR: [1.5, 5], logC: [-10, -5], lowMax: 150 }),
      equal: fc.boolean(),
      duty: fc.double({ min: 0.02, max: 0.98, noNaN: true }),
    });
    let informative = 0;
    fc.assert(
      fc.property(arb, (x) => {
        const { p, r, c } = drawnProblem(x, project);
        const floor = rippleFloor(rippleFloorPlan(p, r), c, x.duty);
        const ripple = steadyState(p.ladderOf(r, c), x.duty).ripple;
        if (floor > 0.5 * ripple) informative++;
        return floor >= 0 && floor <= ripple * (1 + 1e-9) + 1e-15;
      }),
      { numRuns: 400 },
    );
    // The bound says something on most random ladders (not 0 everywhere).
    expect(informative).toBeGreaterThan(200);
  });

  it('is the first-order low-pass fundamental for one stage and equal drivers: span sin(pi D) G / sqrt(1 + (w tau)^2)', () => {
    // Textbook first-order RC low-pass magnitude and the PWM fundamental (2 / pi) span sin(pi D)
    // (Fourier series of a pulse train, any signals text, from memory); ripple >= (pi / 2) x amplitude.
    const p = designProblem(project({ driver: '{ high: 50 ohm, low: 50 ohm }', load: '{ resistance: 47k, capacitance: 100p }' }));
    const r = 2200;
    const c = 220e-9;
    const rs = 50 + r;
    const gain = 47e3 / (47e3 + rs);
    const tau = ((c + 100e-12) * rs * 47e3) / (rs + 47e3);
    const w = 2 * Math.PI * 20e3;
    for (const d of [0.1, 0.37, 0.5, 0.9]) {
      const expected = (3.3 * Math.sin(Math.PI * d) * gain) / Math.sqrt(1 + (w * tau) ** 2);
      expect(rippleFloor(rippleFloorPlan(p, [r]), [c], d)).toBeCloseTo(expected, 12);
    }
  });

  it('takes |det(G + jwC)| of a three-node ladder as mathjs det does (the continuant recurrence)', () => {
    const p = designProblem(project({ driver: '{ high: 30 ohm, low: 30 ohm }', load: '{ resistance: 220k, capacitance: 47p }' }));
    const r = [680, 6800, 33e3];
    const c = [470e-9, 47e-9, 4.7e-9];
    const w = 2 * Math.PI * 20e3;
    const g1 = 1 / (30 + r[0]);
    const g2 = 1 / r[1];
    const g3 = 1 / r[2];
    const gL = 1 / 220e3;
    const y = (g: number, cap: number): Complex => complex(g, w * cap);
    const m = matrix([
      [y(g1 + g2, c[0]), complex(-g2, 0), complex(0, 0)],
      [complex(-g2, 0), y(g2 + g3, c[1]), complex(-g3, 0)],
      [complex(0, 0), complex(-g3, 0), y(g3 + gL, c[2] + 47e-12)],
    ]);
    const d = det(m) as unknown as Complex;
    // equal drivers, duty 1/2: floor = span |H(jw)| = span g1 g2 g3 / |det| (sin(pi / 2) = 1)
    const expected = (g1 * g2 * g3 * 3.3) / Math.hypot(d.re, d.im);
    expect(rippleFloor(rippleFloorPlan(p, r), c, 0.5) / expected).toBeCloseTo(1, 12);
  });

  it('keeps most of the ripple when the filter passes little but the fundamental (pi / 4 for a pure sine)', () => {
    const p = designProblem(project({ driver: '{ high: 25 ohm, low: 25 ohm }' }));
    const r = [1000, 10e3];
    const c = [1e-6, 100e-9];
    const ratio = rippleFloor(rippleFloorPlan(p, r), c, 0.5) / steadyState(p.ladderOf(r, c), 0.5).ripple;
    // a pure sine has ptp = 4 |c1| (ratio pi / 4); the harmonics of a 50 % pulse train flatten the
    // peaks of a two-pole output a little, so its ratio is a little higher, and never above 1
    expect(ratio).toBeGreaterThan(0.75);
    expect(ratio).toBeLessThanOrEqual(1);
  });
});
