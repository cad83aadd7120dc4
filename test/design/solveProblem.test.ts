import { afterEach, describe, expect, it, vi } from 'vitest';
import { designProblem } from '../../src/design/designProblem.js';
import { solveProblem } from '../../src/design/solveProblem.js';
import { loadProject } from '../../src/project/index.js';

// The bench's wide two-stage E24 space (invented scenario, scripts/bench-projects/wide-e24.yaml).
const problem = () => designProblem(loadProject('scripts/bench-projects/wide-e24.yaml'));

/** performance.now() replaced by a clock that moves `step` ms at every reading: the walk's cut falls at the same place every run. */
function steppingClock(step: number): () => number {
  let now = 0;
  vi.spyOn(performance, 'now').mockImplementation(() => (now += step));
  return () => now;
}

describe('solveProblem with a deadline', () => {
  afterEach(() => vi.restoreAllMocks());

  it('cuts the walk at the deadline and still verifies the best candidates it had collected', () => {
    const full = solveProblem(problem(), 10, [2]);
    expect(full.complete).toBe(true);
    // The listing reads the clock three times here, then the walk once every 256 fast evaluations
    // (3 963 in all): a deadline between the third and the fourth reading cuts the walk at its first.
    steppingClock(1);
    const cut = solveProblem(problem(), 10, [2], undefined, { deadline: 3.5 });
    expect(cut.complete).toBe(false);
    expect(cut.evaluated).toBeLessThan(full.evaluated / 2);
    // Designs found, each verified by the engine and recommendable, none better than the proven best.
    expect(cut.feasible.length).toBeGreaterThan(0);
    for (const c of cut.feasible) {
      expect(c.keepsMargin).toBe(true);
      expect(c.settlingTime!).toBeGreaterThanOrEqual(full.feasible[0].settlingTime! * (1 - 1e-12));
    }
  });
});
