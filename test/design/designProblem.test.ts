import { describe, expect, it } from 'vitest';
import { designProblem, followerOptions, withFollower } from '../../src/design/designProblem.js';
import { loadProject } from '../../src/project/index.js';

// The invented follower sample: a 10 kohm load, search.buffered [false, true].
describe('follower variants of a design problem', () => {
  const p = loadProject('sample-configs/design-follower-10k.yaml');

  it('followerOptions lists the options of search.buffered, without first', () => {
    expect(followerOptions(designProblem(p))).toEqual([false, true]);
    expect(followerOptions(designProblem({ ...p, search: { ...p.search!, buffered: [true] } }))).toEqual([true]);
  });

  it('withFollower removes the load the ladder sees, keeps the resolution and returns the problem itself when it already is the variant', () => {
    // The invented bench scenario (clock 16 MHz, a 1 Mohm load) at 8 bits instead of its 10.
    const bench = loadProject('scripts/bench-projects/wide-e24.yaml');
    const plain = designProblem({ ...bench, search: { ...bench.search!, buffered: [false, true] } }, 8);
    const follower = withFollower(plain, true);
    expect(plain.circuit.loadResistance).toBe(1e6);
    expect(follower.circuit.loadResistance).toBeNull();
    expect(follower.buffered).toBe(true);
    expect(follower.bits).toBe(8);
    expect(follower.frequency).toBe(plain.frequency);
    expect(withFollower(plain, false)).toBe(plain);
    expect(withFollower(follower, true)).toBe(follower);
    expect(withFollower(follower, false).circuit.loadResistance).toBe(1e6);
  });
});
