import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { designProblem } from '../../src/design/designProblem.js';
import { designSearch } from '../../src/design/designSearch.js';
import { exactCandidate } from '../../src/design/exactCandidate.js';
import { inlFloor, inlFloorPlan } from '../../src/design/inlFloor.js';
import { dcTransfer } from '../../src/engine/index.js';
import { parseProject } from '../../src/project/index.js';
import { bruteForce, designKey, everyTuple } from './bruteForce.js';
import { drawnProblem, ladderFields } from './randomLadders.js';

/** Invented: unequal drivers into a load bend the DC transfer; `o` overrides pieces of the YAML. */
const project = (o: { inl?: string; stages?: string; low?: string; driver?: string; load?: string; f?: string; settling?: string; series?: string; rmax?: string; cmin?: string; cmax?: string }) =>
  parseProject(
    `
pwm: { frequency: ${o.f ?? '20 kHz'}, bits: 10, high: 3.3 V, low: ${o.low ?? '0 V'}, driver: ${o.driver ?? '{ high: 60 ohm, low: 20 ohm }'}, duty: { min: 5 %, max: 95 % } }
load: ${o.load ?? '{ resistance: 10k }'}
spec:
  ripple: 2 LSB
  inl: ${o.inl ?? '0.5 LSB'}
  gain: none
${o.settling ? `  settling: ${o.settling}` : ''}
search:
  stages: ${o.stages ?? '[1, 2]'}
  series: ${o.series ?? 'E3'}
  margin: 0 %
  resistance: { min: 100, max: ${o.rmax ?? '2.2k'} }
  capacitance: { min: ${o.cmin ?? '100n'}, max: ${o.cmax ?? '10u'} }
`,
    'invented.yaml',
  );

describe("inlFloor: a lower bound on the engine's INL from the resistors and the first capacitors", () => {
  it('never exceeds the INL of engine/dcTransfer.ts, and never falls when a capacitor grows (fast-check)', () => {
    const arb = fc.record({
      ...ladderFields({ logR: [1.5, 4], logC: [-9, -5], lowMax: 100 }),
      grow: fc.double({ min: 1, max: 10, noNaN: true }),
    });
    let informative = 0;
    fc.assert(
      fc.property(arb, (x) => {
        const { p, r, c } = drawnProblem(x, project);
        const plan = inlFloorPlan(p, r);
        if (plan === null) return x.high === x.low;
        const floor = inlFloor(plan, c);
        const inl = Math.abs(dcTransfer(p.ladderOf(r, c), p.dutyMin, p.dutyMax).inl.error);
        if (floor > 0.5 * inl) informative++;
        const bigger = c.map((v, k) => (k === x.n - 1 ? v * x.grow : v));
        const smaller = c.map((v, k) => (k === 0 ? v / x.grow : v));
        return floor <= inl * (1 + 1e-9) + 1e-12 && inlFloor(plan, bigger) >= floor && inlFloor(plan, smaller) <= floor;
      }),
      { numRuns: 300 },
    );
    // The bound says something on a fair share of random ladders (not 0 everywhere).
    expect(informative).toBeGreaterThan(20);
  });

  it('rules out only designs the engine fails on INL (brute force over a small space), and some of them', () => {
    const problem = designProblem(project({ stages: '[2]' }));
    let ruledOut = 0;
    for (const [r, c] of everyTuple(problem.rValues, problem.cValues, 2)) {
      const plan = inlFloorPlan(problem, r)!;
      if (inlFloor(plan, c) <= problem.limits.inl!) continue;
      ruledOut++;
      const exact = exactCandidate(problem, problem.ladderOf(r, c));
      expect(exact.checks.find((k) => k.name === 'inl')?.pass).toBe(false);
    }
    expect(ruledOut).toBeGreaterThan(50);
  });

  it('the search keeps the exhaustive optimum with the INL floor pruning (one to three stages)', () => {
    for (const o of [
      { inl: '3 LSB', stages: '[1, 2]' },
      { inl: '14 LSB', stages: '[3]', rmax: '470', cmin: '1u', cmax: '4.7u' },
    ]) {
      const p = project(o);
      const found = designSearch(p, { top: 5, compare: false, diagnose: false });
      const brute = bruteForce(p, 5);
      expect(brute.ranked.length).toBeGreaterThan(0);
      expect(found.candidates.map(designKey)).toEqual(brute.ranked.map(designKey));
    }
  });
});
