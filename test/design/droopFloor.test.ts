import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { designProblem } from '../../src/design/designProblem.js';
import { droopFloor, droopFloorPlan } from '../../src/design/droopFloor.js';
import { exactCandidate } from '../../src/design/exactCandidate.js';
import { dcTransfer } from '../../src/engine/index.js';
import { parseProject } from '../../src/project/index.js';
import { everyTuple } from './bruteForce.js';
import { drawnProblem, ladderFields } from './randomLadders.js';

/** Invented: a pin that sources more weakly than it sinks, into a load; `o` overrides pieces of the YAML. */
const project = (o: { droop?: string; stages?: string; low?: string; driver?: string; load?: string; f?: string; rmin?: string; rmax?: string; cmin?: string; cmax?: string }) =>
  parseProject(
    `
pwm: { frequency: ${o.f ?? '20 kHz'}, bits: 10, high: 3.3 V, low: ${o.low ?? '0 V'}, driver: ${o.driver ?? '{ high: 120 ohm, low: 20 ohm }'}, duty: { min: 5 %, max: 95 % } }
load: ${o.load ?? '{ resistance: 100k }'}
spec:
  ripple: 2 LSB
  droop: ${o.droop ?? '8 LSB'}
  gain: none
search:
  stages: ${o.stages ?? '[1, 2]'}
  series: E3
  margin: 0 %
  resistance: { min: ${o.rmin ?? '100'}, max: ${o.rmax ?? '2.2k'} }
  capacitance: { min: ${o.cmin ?? '1n'}, max: ${o.cmax ?? '10u'} }
`,
    'invented.yaml',
  );

describe("droopFloor: a lower bound on the engine's droop from the resistors and the first capacitors", () => {
  it('never exceeds the droop of engine/dcTransfer.ts, and never falls when a capacitor grows (fast-check)', () => {
    const arb = fc.record({
      ...ladderFields({ logR: [1.5, 4], logC: [-10, -5], lowMax: 100 }),
      grow: fc.double({ min: 1, max: 10, noNaN: true }),
      at: fc.integer({ min: 0, max: 2 }),
    });
    let informative = 0;
    fc.assert(
      fc.property(arb, (x) => {
        const { p, r, c } = drawnProblem(x, project);
        const plan = droopFloorPlan(p, r);
        if (plan === null) return x.high === x.low;
        const floor = droopFloor(plan, c);
        const droop = Math.abs(dcTransfer(p.ladderOf(r, c), p.dutyMin, p.dutyMax).droop.error);
        if (floor > 0.5 * droop) informative++;
        const k = Math.min(x.at, x.n - 1);
        const bigger = c.map((v, i) => (i === k ? v * x.grow : v));
        return floor <= droop * (1 + 1e-9) + 1e-12 && droopFloor(plan, bigger) >= floor;
      }),
      { numRuns: 300 },
    );
    // The bound says something on a fair share of random ladders (not 0 everywhere).
    expect(informative).toBeGreaterThan(50);
  });

  it('rules out only designs the engine fails on droop (brute force over a small space), and some of them', () => {
    const problem = designProblem(project({ stages: '[2]' }));
    let ruledOut = 0;
    for (const [r, c] of everyTuple(problem.rValues, problem.cValues, 2)) {
      const plan = droopFloorPlan(problem, r)!;
      if (droopFloor(plan, c) <= problem.limits.droop!) continue;
      ruledOut++;
      const exact = exactCandidate(problem, problem.ladderOf(r, c));
      expect(exact.checks.find((k) => k.name === 'droop')?.pass).toBe(false);
    }
    expect(ruledOut).toBeGreaterThan(50);
  });

  it('is null for equal drivers (the droop is then a function of the resistors alone)', () => {
    expect(droopFloorPlan(designProblem(project({ driver: '30 ohm' })), [1000])).toBeNull();
  });
});
