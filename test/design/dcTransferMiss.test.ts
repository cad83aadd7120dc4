import { describe, expect, it } from 'vitest';
import { designProblem } from '../../src/design/designProblem.js';
import { designSearch } from '../../src/design/designSearch.js';
import { exactCandidate } from '../../src/design/exactCandidate.js';
import { dcTransferMiss } from '../../src/design/dcTransferMiss.js';
import { modalLadderOf } from '../../src/engine/modal/modalLadderOf.js';
import { steadySwing } from '../../src/engine/modal/steadySwing.js';
import { parseProject } from '../../src/project/index.js';
import { bruteForce, designKey, everyTuple } from './bruteForce.js';

/** Invented: unequal drivers into a 10 kohm load bend the DC transfer (INL). */
const project = (inl: string, gain: string, stages = '[1, 2]', margin = '0 %') =>
  parseProject(
    `
pwm: { frequency: 20 kHz, bits: 10, high: 3.3 V, low: 0 V, driver: { high: 60 ohm, low: 20 ohm }, duty: { min: 5 %, max: 95 % } }
load: { resistance: 10k }
spec:
  ripple: 2 LSB
${inl === 'none' ? '' : `  inl: ${inl}`}
  gain: ${gain}
search:
  stages: ${stages}
  series: E3
  margin: ${margin}
  resistance: { min: 100, max: 2.2k }
  capacitance: { min: 100n, max: 10u }
`,
    'invented.yaml',
  );

describe('dcTransferMiss rules out only what the engine fails (brute force over a small space)', () => {
  for (const [inl, gain] of [
    ['0.5 LSB', 'none'],
    ['2 LSB', 'none'],
    ['none', '5 %'],
  ] as const) {
    it(`INL ${inl}, gain ${gain}`, () => {
      const p = project(inl, gain);
      const problem = designProblem(p);
      let ruledOut = 0;
      for (const [r, c] of everyTuple(problem.rValues, problem.cValues, 2)) {
        const model = modalLadderOf(problem.circuit, r, c);
        const miss = dcTransferMiss(problem, (d) => steadySwing(model, d).average);
        if (miss === null) continue;
        ruledOut++;
        // The engine (engine/dcTransfer.ts) fails that same check.
        const exact = exactCandidate(problem, problem.ladderOf(r, c));
        expect(exact.checks.find((k) => k.name === miss)?.pass).toBe(false);
      }
      expect(ruledOut).toBeGreaterThan(0);
    });
  }

  it('the search keeps the exhaustive optimum when INL prunes', () => {
    const p = project('3 LSB', 'none'); // ripple-meeting designs here have INL from about 2.5 to 6.5 LSB
    const found = designSearch(p, { top: 5, compare: false, diagnose: false });
    const brute = bruteForce(p, 5);
    expect(brute.ranked.length).toBeGreaterThan(0);
    expect(found.candidates.map(designKey)).toEqual(brute.ranked.map(designKey));
  });

  it('holds INL and gain to the limits less search.margin, as the search ranks (the engine rejects the rest)', () => {
    // With a 10 % margin a design whose INL lies between 90 % and 100 % of the limit meets the
    // file but is not recommended: ruling it out is right, and letting it lower the walk's
    // threshold made the search verify it and widen again (a three-resolution E96 search over
    // unequal drivers and a follower ran out of memory that way).
    // (limits chosen so that some designs of this space lie between 90 % and 100 % of them)
    for (const [inl, gain] of [
      ['6.6 LSB', 'none'],
      ['none', '5 %'],
    ] as const) {
      const p = project(inl, gain, '[1, 2]', '10 %');
      const problem = designProblem(p);
      const name = inl === 'none' ? 'gain' : 'inl';
      let insideLimitOnly = 0;
      for (const [r, c] of everyTuple(problem.rValues, problem.cValues, 2)) {
        const model = modalLadderOf(problem.circuit, r, c);
        if (dcTransferMiss(problem, (d) => steadySwing(model, d).average) === null) continue;
        // The engine: this design does not keep the margin on that figure.
        const exact = exactCandidate(problem, problem.ladderOf(r, c));
        expect(exact.margins[name]!).toBeLessThan(0.1);
        if (exact.checks.find((k) => k.name === name)?.pass) insideLimitOnly++;
      }
      // some of them meet the file's limit itself (the margin, not the limit, rules them out)
      expect(insideLimitOnly).toBeGreaterThan(0);
      const found = designSearch(p, { top: 5, compare: false, diagnose: false });
      expect(found.candidates.map(designKey)).toEqual(bruteForce(p, 5).ranked.map(designKey));
    }
  });
});
