import { describe, expect, it } from 'vitest';
import { modalLadderOf } from '../../../src/engine/modal/modalLadderOf.js';
import { periodicState, periodicStateAnyOrder } from '../../../src/engine/modal/periodicState.js';
import { ladder } from '../ladders.js';

/** Relative difference, against the larger magnitude (0 when both are 0). */
const rel = (a: number, b: number) => (a === b ? 0 : Math.abs(a - b) / Math.max(Math.abs(a), Math.abs(b)));

/** A small deterministic generator (common practice: a linear congruential generator, Numerical Recipes' constants). */
function lcg(seed: number): () => number {
  let x = seed >>> 0;
  return () => {
    x = (Math.imul(x, 1664525) + 1013904223) >>> 0;
    return x / 2 ** 32;
  };
}

/**
 * The scalar one- and two-stage path of periodicState is the general-order code written out
 * (same operations, same order), so it must agree with periodicStateAnyOrder to rounding; held to
 * 1e-13 relative on random ladders (decades of R and C, equal and unequal drivers, with and without
 * a load, duties from 0 to 1 inclusive). Internal consistency, not physics: the physics of
 * periodicState is held to independent references in periodicState.test.ts.
 */
describe('periodicState: one and two stages on scalars equal the general-order code', () => {
  const random = lcg(20261202);
  const decade = (lo: number, hi: number) => lo * (hi / lo) ** random();
  for (let trial = 0; trial < 300; trial++) {
    const stages = 1 + (trial % 2);
    const unequal = trial % 3 === 0;
    const loaded = trial % 5 !== 0;
    const circuit = ladder([], {
      driverHigh: unequal ? decade(5, 80) : 25,
      driverLow: 25,
      loadResistance: loaded ? decade(1e3, 1e7) : null,
      loadCapacitance: trial % 7 === 0 ? decade(1e-12, 1e-9) : 0,
      period: 1 / decade(100, 1e6),
    });
    const r = Array.from({ length: stages }, () => decade(100, 1e6));
    const c = Array.from({ length: stages }, () => decade(1e-10, 1e-5));
    const m = modalLadderOf(circuit, r, c);
    const duty = trial % 11 === 0 ? 1 : trial % 13 === 0 ? 0 : random();
    it(`trial ${trial}: ${stages} stage(s), duty ${duty.toFixed(3)}`, () => {
      const a = periodicState(m, duty);
      const b = periodicStateAnyOrder(m, duty);
      const scalars: Array<keyof typeof a> = ['duty', 't1', 't2', 'yStart', 'meanOffset', 'average'];
      for (const k of scalars) expect(rel(a[k] as number, b[k] as number)).toBeLessThanOrEqual(1e-13);
      expect(a.start.length).toBe(stages);
      for (let i = 0; i < stages; i++) {
        expect(rel(a.start[i], b.start[i])).toBeLessThanOrEqual(1e-13);
        expect(rel(a.high.gain[i], b.high.gain[i])).toBeLessThanOrEqual(1e-13);
        expect(rel(a.low.gain[i], b.low.gain[i])).toBeLessThanOrEqual(1e-13);
      }
      expect(rel(a.low.offset, b.low.offset)).toBeLessThanOrEqual(1e-13);
      expect(a.high.length).toBe(b.high.length);
      expect(a.low.length).toBe(b.low.length);
    });
  }
});
