import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { designSearch } from '../../src/design/designSearch.js';
import { tradeoffCurves } from '../../src/design/tradeoffCurves.js';
import { parseProject } from '../../src/project/index.js';
import { bruteForce, designKey } from './bruteForce.js';

/**
 * Random invented small spaces against exhaustive search (the exact engine on every candidate,
 * bruteForce.ts): equal and unequal drivers, with and without a load, ripple limits from well
 * below to well above the settling band (where the band, not the ripple limit, binds), explicit
 * and default settling steps, a droop limit or none. Every pruning of the search (floors of the
 * tuples, the columns and each point) must leave the same ranked designs. `DACSMITH_RANDOM_SPACES`
 * sets a larger count for a longer run.
 */
const RUNS = Math.max(1, Number(process.env.DACSMITH_RANDOM_SPACES ?? 14) || 14);

const space = fc.record({
  f: fc.constantFrom('10 kHz', '20 kHz', '62.5 kHz'),
  bits: fc.constantFrom(8, 10),
  driverHigh: fc.constantFrom(0, 25, 40, 100),
  driverLow: fc.constantFrom(0, 25, 40, 100),
  load: fc.constantFrom('', 'load: { resistance: 1M }', 'load: { resistance: 47k, capacitance: 1n }', 'load: { capacitance: 10n }'),
  ripple: fc.constantFrom('0.1 LSB', '0.3 LSB', '0.5 LSB', '1.5 LSB', '4 LSB'),
  band: fc.constantFrom('0.25 LSB', '0.5 LSB', '1 LSB'),
  step: fc.constantFrom('', ', from: 10 %, to: 90 %', ', from: 80 %, to: 20 %'),
  droop: fc.constantFrom('', '  droop: 40 LSB'),
  stages: fc.constantFrom<string>('[1, 2]', '[2]'),
  series: fc.constantFrom<string>('E3', 'E6'),
  rmin: fc.constantFrom('100', '1k'),
  cmin: fc.constantFrom('10n', '100n'),
});

function projectOf(x: typeof space extends fc.Arbitrary<infer T> ? T : never) {
  const rmax = x.rmin === '100' ? '1k' : '10k';
  const cmax = x.cmin === '10n' ? '1u' : '10u';
  const yaml = `
pwm: { frequency: ${x.f}, bits: ${x.bits}, high: 3.3 V, low: 0 V, driver: { high: ${x.driverHigh} ohm, low: ${x.driverLow} ohm }, duty: { min: 5 %, max: 95 % } }
${x.load}
spec:
  ripple: ${x.ripple}
${x.droop}
  gain: none
  settling: { band: ${x.band}${x.step} }
search:
  stages: ${x.stages}
  series: ${x.series}
  margin: 0 %
  resistance: { min: ${x.rmin}, max: ${rmax} }
  capacitance: { min: ${x.cmin}, max: ${cmax} }
`;
  return parseProject(yaml, 'invented.yaml');
}

describe('design search on random invented small spaces', () => {
  it(`ranks the same top 3 as exhaustive search (${RUNS} spaces)`, () => {
    let nonEmpty = 0;
    fc.assert(
      fc.property(space, (x) => {
        const p = projectOf(x);
        const found = designSearch(p, { top: 3, compare: false, diagnose: false });
        const brute = bruteForce(p, 3);
        if (brute.ranked.length > 0) nonEmpty++;
        expect(found.candidates.map(designKey)).toEqual(brute.ranked.map(designKey));
      }),
      { numRuns: RUNS, seed: 20261204 },
    );
    // not vacuous: most spaces hold designs
    expect(nonEmpty).toBeGreaterThan(RUNS / 2);
  }, 60_000 + RUNS * 2_000);

  // Three stages cost brute force about 2.7 s a space (E3): a seventh of the count.
  const THREE = Math.max(1, Math.round(RUNS / 7));
  it(`ranks the same top 3 as exhaustive search with three stages (${THREE} spaces)`, () => {
    let threeStage = 0;
    fc.assert(
      fc.property(space, fc.constantFrom('[3]', '[2, 3]'), (x, stages) => {
        const p = projectOf({ ...x, stages, series: 'E3' });
        const found = designSearch(p, { top: 3, compare: false, diagnose: false });
        const brute = bruteForce(p, 3).ranked;
        if (brute.some((c) => c.stages.length === 3)) threeStage++;
        expect(found.candidates.map(designKey)).toEqual(brute.map(designKey));
      }),
      { numRuns: THREE, seed: 33 },
    );
    // not vacuous: three-stage designs among the answers
    expect(threeStage).toBeGreaterThan(0);
  }, 60_000 + THREE * 10_000);

  it('draws each trade-off point as the exhaustive optimum under its ripple limit (6 spaces)', () => {
    let drawn = 0;
    fc.assert(
      fc.property(space, (x) => {
        const p = projectOf({ ...x, stages: '[2]' });
        const center = p.spec.ripple!;
        const ripples = [center / 4, center, center * 4];
        const [curve] = tradeoffCurves(p, [2], center, { ripples });
        ripples.forEach((ripple, i) => {
          // the curve's point: the project at that ripple limit in volts (the file has no settling time)
          const inLsb = p.specInLsb ? { ...p.specInLsb } : undefined;
          if (inLsb) delete inLsb.ripple;
          const brute = bruteForce({ ...p, spec: { ...p.spec, ripple }, ...(inLsb && { specInLsb: inLsb }) }, 1);
          if (curve.points[i].best) drawn++;
          expect(curve.points[i].best ? designKey(curve.points[i].best!) : null).toBe(brute.ranked[0] ? designKey(brute.ranked[0]) : null);
        });
      }),
      { numRuns: 6, seed: 4 },
    );
    // not vacuous: most of the 18 points hold a design
    expect(drawn).toBeGreaterThan(9);
  });
});
