import { describe, expect, it } from 'vitest';
import { modalRoute, MAX_MODAL_CONDITION } from '../../src/engine/modalRoute.js';
import { modalLadder } from '../../src/engine/modal/modalLadder.js';
import { ladder, stage } from './ladders.js';

describe('modalRoute', () => {
  it('returns the cached modal form for the same ladder object', () => {
    const l = ladder([stage(1e3, 1e-6), stage(1e4, 1e-7)]);
    const m = modalRoute(l);
    expect(m).not.toBeNull();
    expect(modalRoute(l)).toBe(m);
    // a fresh but equal ladder gets its own (equal) form
    const other = modalRoute({ ...l, stages: l.stages.map((s) => ({ ...s })) });
    expect(other).not.toBe(m);
    expect(other).toEqual(m);
  });

  it('caches a missing form too: a ladder changed in place keeps its first answer', () => {
    // Ladders are treated as immutable (as prepare.ts): the cache is by identity. Two identical
    // isolated sections have no modal form; making them distinct in place must not be noticed.
    const l = ladder([stage(1e3, 1e-7, true), stage(1e3, 1e-7)]);
    expect(modalRoute(l)).toBeNull();
    // @ts-expect-error Ladder is deeply readonly: the compiler refuses this write (test/circuit/ladder.test.ts)
    l.stages[1].c = 3e-7;
    expect(modalLadder(l)).not.toBeNull();
    expect(modalRoute(l)).toBeNull();
    // and the other way round
    const k = ladder([stage(1e3, 1e-7, true), stage(1e3, 3e-7)]);
    const m = modalRoute(k);
    expect(m).not.toBeNull();
    // @ts-expect-error as above
    k.stages[1].c = 1e-7;
    expect(modalRoute(k)).toBe(m);
  });

  it('no modal route for one stage, for a repeated mode, or above the condition limit', () => {
    expect(modalRoute(ladder([stage(1e3, 1e-7)]))).toBeNull();
    expect(modalRoute(ladder([stage(1e3, 1e-7, true), stage(1e3, 1e-7)]))).toBeNull();
    const near = ladder([stage(1e4, 1e-8, true), stage(1e4, 1.01e-8)]);
    expect(modalLadder(near)!.condition).toBeGreaterThan(MAX_MODAL_CONDITION);
    expect(modalRoute(near)).toBeNull();
    const apart = ladder([stage(1e4, 1e-8, true), stage(1e4, 3e-8)]);
    expect(modalLadder(apart)!.condition).toBeLessThan(MAX_MODAL_CONDITION);
    expect(modalRoute(apart)).not.toBeNull();
  });

  it('rejects an invalid ladder like the other routes', () => {
    expect(() => modalRoute(ladder([stage(1e3, 1e-7), stage(-1, 1e-7)]))).toThrow(RangeError);
  });
});
