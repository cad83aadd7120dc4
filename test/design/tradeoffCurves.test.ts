import { describe, expect, it } from 'vitest';
import { relaxProject } from '../../src/design/relaxProject.js';
import { tradeoffCurves } from '../../src/design/tradeoffCurves.js';
import { bestDesigns } from '../../src/design/bestDesigns.js';
import { designProblem } from '../../src/design/designProblem.js';
import { paretoSearch } from '../../src/design/paretoSearch.js';
import { loadProject, parseProject } from '../../src/project/index.js';
import type { Project } from '../../src/project/types.js';
import { bruteForce, designKey } from './bruteForce.js';

// Invented scenario: small E3/E6 spaces so the exhaustive reference stays quick.
const yaml = (o: { driver?: string; settling?: string; series?: string }) => `
pwm: { frequency: 20 kHz, bits: 10, high: 3.3 V, low: 0 V, driver: ${o.driver ?? '30 ohm'}, duty: { min: 5 %, max: 95 % } }
spec:
  ripple: 1 LSB
${o.settling ? `  settling: ${o.settling}` : ''}
search:
  stages: [1, 2]
  series: ${o.series ?? 'E3'}
  resistance: { min: 1k, max: 47k }
  capacitance: { min: 10n, max: 2.2u }
`;

/** The same curve point by exhaustive search: that ripple limit, no settling-time limit. */
function exhaustivePoint(p: Project, ripple: number, stages: number) {
  const free = relaxProject(p, ['settling'], Infinity);
  const inLsb = free.specInLsb ? { ...free.specInLsb } : undefined;
  if (inLsb) delete inLsb.ripple;
  const at: Project = { ...free, spec: { ...free.spec, ripple }, search: { ...free.search!, stages: [stages] }, ...(inLsb && { specInLsb: inLsb }) };
  return bruteForce(at, 1).ranked[0] ?? null;
}

/**
 * The Pareto walk's point at each ripple limit (the project's other limits, no settling-time
 * limit), one and two stages, against one design search alone at that limit; returns the designs
 * found (the reference is bestDesigns.ts, which test/design/designSearch.test.ts holds to
 * exhaustive search).
 */
function frontAgainstAlone(p: Project, ripples: number[]) {
  const free = relaxProject(p, ['settling'], Infinity);
  const inLsb = free.specInLsb ? { ...free.specInLsb } : undefined;
  if (inLsb) delete inLsb.ripple;
  const problems = ripples.map((ripple) => designProblem({ ...free, spec: { ...free.spec, ripple }, ...(inLsb && { specInLsb: inLsb }) }));
  const found = [];
  for (const n of [1, 2]) {
    const front = paretoSearch(problems, n);
    for (let i = 0; i < problems.length; i++) {
      const alone = bestDesigns(problems[i], 1, [n]).feasible[0] ?? null;
      expect(front[i], `${n} stages at ${ripples[i]} V`).toStrictEqual(alone);
      if (alone) found.push(alone);
    }
  }
  return found;
}

describe('tradeoffCurves: each point is the exhaustive optimum at its ripple limit', () => {
  const cases: Array<[string, Parameters<typeof yaml>[0]]> = [
    ['equal drivers, default settling step', {}],
    ['unequal drivers, a time limit the curve ignores, a given step', { driver: '{ high: 40 ohm, low: 20 ohm }', settling: '{ band: 1 LSB, time: 1 ms, from: 20 %, to: 70 % }' }],
  ];
  for (const [name, o] of cases) {
    it(name, () => {
      const p = parseProject(yaml(o), 'tradeoff.yaml');
      // Limits out of order, one so tight nothing meets it (the bound then starts later), and two
      // pairs so close that each pair shares its optimum (the bound must let it through again).
      const ripples = [4e-3, 1e-6, 5e-4, 2e-3, 1e-3, 8e-3, 2.0001e-3, 1.0001e-3];
      const curves = tradeoffCurves(p, [1, 2], p.spec.ripple!, { ripples });
      expect(curves.map((c) => c.stages)).toEqual([1, 2]);
      let found = 0;
      for (const curve of curves) {
        expect(curve.points.map((q) => q.ripple)).toEqual(ripples);
        curve.points.forEach((q, i) => {
          const ref = exhaustivePoint(p, ripples[i], curve.stages);
          expect(q.best === null, `${curve.stages} stages at ${ripples[i]} V`).toBe(ref === null);
          if (ref && q.best) {
            found++;
            expect(designKey(q.best)).toBe(designKey(ref));
            expect(q.settlingTime).toBe(ref.settlingTime);
            // Checks as the user's limits give them: no settling-time limit here.
            expect(q.best.checks.map((c) => c.name)).toEqual(ref.checks.map((c) => c.name));
          }
        });
        // A looser ripple limit never makes the best settling time worse.
        const order = ripples.map((_, i) => i).sort((a, b) => ripples[a] - ripples[b]);
        const times = order.map((i) => curve.points[i].settlingTime).filter((t): t is number => t !== null);
        for (let k = 1; k < times.length; k++) expect(times[k]).toBeLessThanOrEqual(times[k - 1] * (1 + 1e-9));
      }
      expect(found).toBeGreaterThan(6);
    });
  }

  it('at a resolution other than the file\'s, with the default band, every point equals its unbounded search', () => {
    // Invented: a timer-clocked 10-bit output whose curves are drawn at 8 bits, no settling band
    // given (the default, 0.5 LSB, follows the resolution). Reference: each point alone (one limit,
    // one stage count: a single search, no bound). A bounded search once took the default band at
    // the file's resolution instead.
    const p = parseProject(
      `
pwm: { clock: 16 MHz, bits: 10, high: 3.3 V, low: 0 V, driver: 30 ohm, duty: { min: 5 %, max: 95 % } }
load: { resistance: 1 Mohm, capacitance: 47 pF }
spec:
  ripple: 1 LSB
  droop: 2 %
search:
  stages: [1, 2]
  series: E6
  resistance: { min: 1k, max: 47k }
  capacitance: { min: 10n, max: 2.2u }
  pin_current: 20 mA
`,
      'resolution.yaml',
    );
    const curves = tradeoffCurves(p, [1, 2], 2e-3, { bits: 8 });
    let found = 0;
    for (const curve of curves) {
      for (const point of curve.points) {
        const [alone] = tradeoffCurves(p, [curve.stages], 2e-3, { bits: 8, ripples: [point.ripple] });
        expect(point, `${curve.stages} stages at ${point.ripple} V`).toStrictEqual(alone.points[0]);
        if (point.best) found++;
      }
    }
    expect(found).toBeGreaterThan(10);
  });

  it('one Pareto walk gives what one search per ripple limit gives (followers, load, unequal drivers)', () => {
    // Invented scenario, E12 over three decades of each part: a space too large for the
    // exhaustive reference, so the reference is the design search itself (bestDesigns.ts), run
    // alone at each limit, which test/design/designSearch.test.ts holds to exhaustive search.
    const p = parseProject(
      `
pwm: { frequency: 20 kHz, bits: 10, high: 3.3 V, low: 0 V, driver: { high: 40 ohm, low: 25 ohm }, duty: { min: 5 %, max: 95 % } }
load: { resistance: 200 kohm, capacitance: 47 pF }
spec:
  ripple: 1 LSB
  droop: 3 %
search:
  stages: [1, 2]
  series: E12
  margin: 10 %
  buffered: [false, true]
  resistance: { min: 100 ohm, max: 100k }
  capacitance: { min: 1n, max: 10u }
`,
      'pareto.yaml',
    );
    const found = frontAgainstAlone(p, [2e-4, 5e-4, 1e-3, 2e-3, 3.2e-3, 6e-3, 1.2e-2, 2.5e-2]);
    expect(found.length).toBeGreaterThan(10);
  });

  it('a load that only a follower can drive: the points are the follower designs one search per limit finds', () => {
    // The invented follower sample: a 10 kohm load and a 1 LSB INL limit that no ladder without a
    // follower meets (proven by infeasibilityBounds.ts). The walk once took that proof for the
    // whole limit and drew empty curves while the search listed follower designs.
    const found = frontAgainstAlone(loadProject('sample-configs/design-follower-10k.yaml'), [1e-3, 3.2e-3, 1e-2]);
    expect(found.length).toBe(6);
    for (const c of found) expect(c.stages[c.stages.length - 1].buffered).toBe(true);
  });
});
