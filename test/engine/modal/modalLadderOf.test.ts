import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import type { Ladder } from '../../../src/circuit/ladder.js';
import { modalLadder } from '../../../src/engine/modal/modalLadder.js';
import { modalLadderOf, modalLadderOfAnyOrder } from '../../../src/engine/modal/modalLadderOf.js';
import { ladder, stage } from '../ladders.js';
import { pwmReference } from '../pwmReference.js';

const logUniform = (lo: number, hi: number) => fc.double({ min: Math.log10(lo), max: Math.log10(hi), noNaN: true }).map((e) => 10 ** e);

/** Invented follower-free ladders, time constants within a few decades of the period (mathjs expm stays accurate). */
const ladderArb = fc
  .record({
    stages: fc.array(fc.record({ r: logUniform(1e3, 1e5), c: logUniform(1e-9, 1e-7) }), { minLength: 1, maxLength: 4 }),
    driverHigh: fc.double({ min: 0, max: 100, noNaN: true }),
    driverLow: fc.double({ min: 0, max: 100, noNaN: true }),
    equal: fc.boolean(),
    loadResistance: fc.option(logUniform(1e4, 1e7), { nil: null }),
    loadCapacitance: fc.oneof(fc.constant(0), logUniform(1e-12, 1e-9)),
    low: fc.constantFrom(0, 0.2),
  })
  .map(
    (x): Ladder =>
      ladder(
        x.stages.map((s) => stage(s.r, s.c)),
        { period: 1e-4, driverHigh: x.driverHigh, driverLow: x.equal ? x.driverHigh : x.driverLow, loadResistance: x.loadResistance, loadCapacitance: x.loadCapacitance, low: x.low },
      ),
  );

describe('modalLadderOf', () => {
  it('the phase flows of the modal form are those of the nodal equations (mathjs expm, fast-check)', () => {
    // Reference: pwmReference.ts (nodal equations written in the tests, mathjs expm). From the low
    // DC state the high phase gives y(t) = outHigh - sum_i hi.out_i e^(hi.rate_i t) delta_i, and from
    // the high DC state the low phase y(t) = outLow + sum_i lo.out_i e^(lo.rate_i t) (mix delta)_i
    // (x(t) = x_p + e^(A t) (x(0) - x_p) in modal coordinates, Delta = x_h - x_l).
    fc.assert(
      fc.property(ladderArb, logUniform(1e-7, 1e-4), (l, t) => {
        const n = l.stages.length;
        const m = modalLadderOf(l, l.stages.map((s) => s.r), l.stages.map((s) => s.c));
        const ref = pwmReference(l);
        const xLow = ref.steadyStart(0);
        const xHigh = ref.steadyStart(1);
        let high = m.outHigh;
        let low = m.outLow;
        for (let i = 0; i < n; i++) {
          high -= m.hi.out[i] * Math.exp(m.hi.rate[i] * t) * m.delta[i];
          let lowCoordinate = 0;
          for (let j = 0; j < n; j++) lowCoordinate += m.mix[i * n + j] * m.delta[j];
          low += m.lo.out[i] * Math.exp(m.lo.rate[i] * t) * lowCoordinate;
        }
        const tol = 1e-9 * l.high;
        expect(Math.abs(m.outLow - xLow[n - 1])).toBeLessThan(tol);
        expect(Math.abs(m.outHigh - xHigh[n - 1])).toBeLessThan(tol);
        expect(Math.abs(high - ref.within(1, xLow, t))).toBeLessThan(tol);
        expect(Math.abs(low - ref.within(0, xHigh, t))).toBeLessThan(tol);
      }),
      { numRuns: 100 },
    );
  });

  it('is what modalLadder gives a follower-free ladder, and the unloaded ladder behind a last follower', () => {
    fc.assert(
      fc.property(ladderArb, fc.boolean(), (l, buffered) => {
        const r = l.stages.map((s) => s.r);
        const c = l.stages.map((s) => s.c);
        if (!buffered) {
          expect(modalLadderOf(l, r, c)).toEqual(modalLadder(l));
          return;
        }
        const withFollower = { ...l, stages: l.stages.map((s, k) => stage(s.r, s.c, k === l.stages.length - 1)) };
        expect(modalLadderOf({ ...l, loadResistance: null, loadCapacitance: 0 }, r, c)).toEqual(modalLadder(withFollower));
      }),
      { numRuns: 100 },
    );
  });

  it('one and two stages: the scalar path gives the general construction digit for digit (fast-check)', () => {
    // Same operations in the same order, so Object.is on every number (no tolerance).
    const digits = (m: ReturnType<typeof modalLadderOf>) => [m.n, m.period, m.high, m.low, m.outLow, m.outHigh, m.condition, ...m.hi.rate, ...m.hi.out, ...m.lo.rate, ...m.lo.out, ...m.mix, ...m.delta];
    fc.assert(
      fc.property(ladderArb, (l) => {
        const r = l.stages.slice(0, 2).map((s) => s.r);
        const c = l.stages.slice(0, 2).map((s) => s.c);
        for (const k of [1, 2]) {
          if (r.length < k) continue;
          const a = digits(modalLadderOf(l, r.slice(0, k), c.slice(0, k)));
          const b = digits(modalLadderOfAnyOrder(l, r.slice(0, k), c.slice(0, k)));
          expect(a.length).toBe(b.length);
          a.forEach((v, i) => expect(Object.is(v, b[i]), `number ${i}: ${v} against ${b[i]}`).toBe(true));
        }
      }),
      { numRuns: 300 },
    );
  });

  it('written into an earlier model of as many stages: the same numbers, no new object', () => {
    fc.assert(
      fc.property(ladderArb, ladderArb, (a, b) => {
        const k = Math.min(2, a.stages.length, b.stages.length);
        const rc = (l: Ladder) => [l.stages.slice(0, k).map((s) => s.r), l.stages.slice(0, k).map((s) => s.c)] as const;
        const circuit = { ...b, driverLow: b.driverHigh + (a.driverLow > 50 ? 10 : 0) };
        const into = modalLadderOf(circuit, ...rc(a));
        const want = modalLadderOf(circuit, ...rc(b));
        const got = modalLadderOf(circuit, ...rc(b), into);
        expect(got).toBe(into);
        expect(got).toEqual(want);
      }),
      { numRuns: 200 },
    );
  });

  it('rejects a stage without a positive R or C', () => {
    const circuit = ladder([]);
    expect(() => modalLadderOf(circuit, [1e3, 0], [1e-6, 1e-7])).toThrow(RangeError);
    expect(() => modalLadderOf(circuit, [1e3], [Number.NaN])).toThrow(RangeError);
  });
});
