import fc from 'fast-check';
import { complex, det, matrix, type Complex } from 'mathjs';
import { describe, expect, it } from 'vitest';
import { designProblem, type DesignProblem } from '../../src/design/designProblem.js';
import { requiredAttenuation } from '../../src/design/requiredAttenuation.js';
import { rippleFloor, rippleFloorPlan } from '../../src/design/rippleFloor.js';
import { REL } from '../../src/design/searchAllowance.js';
import { steadyState } from '../../src/engine/index.js';
import { drawnProblem, floorProject, ladderFields } from './randomLadders.js';

/** Invented: a PWM pin into a load (randomLadders.ts) with a settling spec. */
const project = (o: { driver?: string; low?: string; load?: string; f?: string }) =>
  floorProject({ ...o, settling: '{ band: 0.5 LSB, time: 20 ms, from: 10 %, to: 90 % }' });

/**
 * prod(1 + w^2 tau_i^2) of the fast ladder (pin conductance 1 / (smaller driver + r1), the load's
 * capacitance at the last node) as |det(G + j w C)|^2 / det(G)^2, both determinants by mathjs.
 */
function attenuationByMathjs(p: DesignProblem, r: number[], c: number[]): number {
  const k = p.circuit;
  const n = r.length;
  const w = (2 * Math.PI) / p.period;
  const g = [1 / (Math.min(k.driverHigh, k.driverLow) + r[0]), ...r.slice(1).map((x) => 1 / x), k.loadResistance === null ? 0 : 1 / k.loadResistance];
  const entry = (i: number, j: number, omega: number): Complex => {
    if (i === j) return complex(g[i] + g[i + 1], omega * (c[i] + (i === n - 1 ? k.loadCapacitance : 0)));
    if (Math.abs(i - j) === 1) return complex(-g[Math.max(i, j)], 0);
    return complex(0, 0);
  };
  const at = (omega: number) => det(matrix(Array.from({ length: n }, (_, i) => Array.from({ length: n }, (_, j) => entry(i, j, omega))))) as unknown as Complex;
  const ac = at(w);
  const dc = at(0);
  return (ac.re ** 2 + ac.im ** 2) / (dc.re ** 2 + dc.im ** 2);
}

describe('requiredAttenuation: the least prod(1 + w^2 tau^2) a ripple limit asks of the fast ladder', () => {
  it("holds for every ladder that meets the limits by the engine, equal or unequal drivers, 1 to 3 stages (fast-check)", () => {
    const arb = fc.record({ ...ladderFields({ logR: [1.5, 5], logC: [-10, -5], lowMax: 150 }), equal: fc.boolean() });
    let informative = 0;
    let closest = Infinity;
    fc.assert(
      fc.property(arb, (x) => {
        const { p, r, c } = drawnProblem(x, project);
        const ladder = p.ladderOf(r, c);
        // the limit this ladder meets exactly at 50 %; the settling steps' targets as they are
        const ripple = steadyState(ladder, 0.5).ripple;
        if (!(ripple > 0)) return true;
        const settles = p.steps.every(([, to]) => steadyState(ladder, to).ripple <= 2 * p.band);
        if (!settles) return true;
        const gamma = requiredAttenuation(p, r, { ...p.searchLimits, ripple });
        const actual = attenuationByMathjs(p, r, c);
        if (gamma > 0.5 * actual) informative++;
        closest = Math.min(closest, actual / gamma);
        return actual >= gamma * (1 - 1e-9);
      }),
      { numRuns: 300 },
    );
    // The bound is close to the ladder's own attenuation on many random ladders (not 0 everywhere):
    // within (4 / pi)^2 = 1.62 where the output is nearly a sine (rippleFloor.ts: ptp >= pi |c1|).
    expect(informative).toBeGreaterThan(50);
    expect(closest).toBeLessThan(1.7);
  });

  it('is the ripple floor turned around: at the floor value as the limit it gives the ladder its own attenuation', () => {
    // No settling steps bind here: with a 2 LSB limit and a 10 % to 90 % step, the 50 % constraint is the larger.
    const p = designProblem(project({ driver: '{ high: 40 ohm, low: 25 ohm }', load: '{ resistance: 1M, capacitance: 100p }' }));
    for (const [r, c] of [
      [[470], [10e-6]],
      [[470, 16e3], [1.1e-6, 33e-9]],
      [[680, 6800, 33e3], [470e-9, 47e-9, 4.7e-9]],
    ]) {
      const floor = rippleFloor(rippleFloorPlan(p, r), c, 0.5);
      const gamma = requiredAttenuation(p, r, { ...p.searchLimits, ripple: floor / (1 + REL) });
      expect(gamma / attenuationByMathjs(p, r, c)).toBeCloseTo(1, 9);
    }
  });

  it('is (DC gain x span x sin(pi D) / limit)^2 for one stage and equal drivers', () => {
    // The first-order fundamental bound: ripple >= span sin(pi D) G / sqrt(1 + (w tau)^2) (PWM
    // fundamental (2 / pi) span sin(pi D), Fourier series of a pulse train, from memory; ptp >=
    // (pi / 2) amplitude). Equal drivers of 50 ohm, a 47 kohm load: G = 47k / (47k + 50 + R).
    const p = designProblem(project({ driver: '{ high: 50 ohm, low: 50 ohm }', load: '{ resistance: 47k }' }));
    const r = 2200;
    const gain = 47e3 / (47e3 + 50 + r);
    const limit = 1e-3;
    const fromRipple = ((gain * 3.3 * Math.sin(Math.PI * 0.5)) / (limit * (1 + REL))) ** 2;
    const band = p.band;
    const fromSettling = ((gain * 3.3 * Math.sin(Math.PI * 0.9)) / (2 * band * (1 + REL))) ** 2;
    expect(requiredAttenuation(p, [r], { ...p.searchLimits, ripple: limit }) / Math.max(fromRipple, fromSettling)).toBeCloseTo(1, 12);
  });
});
