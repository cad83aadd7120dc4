import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import type { Ladder } from '../../src/circuit/ladder.js';
import { steadyState } from '../../src/engine/index.js';
import { ladderMetrics, type LadderMetrics } from '../../src/tolerance/ladderMetrics.js';
import { modalLadder } from '../../src/engine/modal/modalLadder.js';
import { MAX_MODAL_CONDITION } from '../../src/engine/modalRoute.js';
import type { MetricPlan } from '../../src/tolerance/metricPlan.js';
import { metricPlan } from '../../src/tolerance/metricPlan.js';
import { ladder, stage } from './reference.js';
import { project } from './projectFixture.js';

/**
 * The modal fast path against the engine's matrix-exponential path (engineOnly), on random
 * follower-free ladders: two independent exact methods for the same figures must agree. (The
 * engine is checked against textbook formulas and ODEX in test/engine.)
 */
const planFor = (l: Ladder, inl: boolean, from?: number, to?: number): MetricPlan => {
  const p = project(l.stages, { driver: { high: { min: 0, max: 80 }, low: { min: 0, max: 80 } } }, {
    pwm: { frequency: 1 / l.period, prescaler: 1, alignment: 'edge', high: l.high, low: l.low, driver: { high: l.driverHigh, low: l.driverLow }, duty: { min: 0.05, max: 0.95 } },
    spec: { ...(inl ? { inl: 1e-3 } : {}), gain: 0.02, settling: { band: 2e-3, ...(from !== undefined ? { from, to } : {}) } },
  });
  return metricPlan(p, l, { gain: true });
};

/**
 * Skip knife edges where the steady-state excursion at a step's end equals the band to rounding:
 * there "never settles" and "settles" are both right within floating point.
 */
function skipBandKnifeEdges(l: Ladder, plan: MetricPlan): void {
  for (const { to } of plan.steps) {
    const op = steadyState(l, to);
    for (const excursion of [op.max - op.average, op.average - op.min]) {
      fc.pre(Math.abs(excursion - plan.band) > 1e-9 * plan.band);
    }
  }
}

/**
 * The fast figures against the engine's: ripple 1e-8 relative (a ripple of 1e-5 of the level or
 * less keeps fewer digits in both methods: cancellation inside the period map, about
 * eps (tau/T)^(n-1)); DC errors, differences of averages of order full scale, 1e-9 relative with a
 * 1e-12 FS floor; settling within 1e-6 T (exactly equal when `exactSettling`).
 */
function expectSameFigures(fast: LadderMetrics, ref: LadderMetrics, l: Ladder, inl: boolean, exactSettling = false): void {
  const fs = l.high - l.low;
  expect(Math.abs(fast.worstRipple.ripple - ref.worstRipple.ripple)).toBeLessThan(1e-8 * ref.worstRipple.ripple + 1e-15 * fs);
  expect(Math.abs(fast.droop.error - ref.droop.error)).toBeLessThan(1e-9 * Math.abs(ref.droop.error) + 1e-12 * fs);
  if (inl) expect(Math.abs(fast.inl!.error - ref.inl!.error)).toBeLessThan(1e-9 * Math.abs(ref.inl!.error) + 1e-12 * fs);
  // gain error, a fraction of full scale: the modal fit against dcTransfer's (same endpoint fit)
  expect(fast.gain).not.toBeNull();
  expect(Math.abs(fast.gain! - ref.gain!)).toBeLessThan(1e-9 * Math.abs(ref.gain!) + 1e-12);
  if (exactSettling || ref.settlingTime === null) expect(fast.settlingTime).toBe(ref.settlingTime);
  else expect(Math.abs(fast.settlingTime! - ref.settlingTime)).toBeLessThan(1e-6 * l.period + 1e-9 * ref.settlingTime);
}

describe('ladderMetrics: modal fast path against the engine', () => {
  it('random follower-free ladders of 1 to 3 stages', () => {
    const arbStage = fc.record({
      r: fc.double({ min: Math.log(220), max: Math.log(100e3), noNaN: true }).map(Math.exp),
      c: fc.double({ min: Math.log(1e-9), max: Math.log(2e-6), noNaN: true }).map(Math.exp),
    });
    fc.assert(
      fc.property(
        fc.array(arbStage, { minLength: 1, maxLength: 3 }),
        fc.double({ min: 0, max: 80, noNaN: true }),
        fc.double({ min: 0, max: 80, noNaN: true }),
        fc.option(fc.double({ min: Math.log(1e3), max: Math.log(1e6), noNaN: true }).map(Math.exp), { nil: null }),
        fc.boolean(),
        (stages, dh, dl, load, inl) => {
          const l = ladder(
            stages.map((s) => stage(s.r, s.c)),
            { driverHigh: dh, driverLow: dl, loadResistance: load },
          );
          // keep the time constants within 1 to 2000 periods so the engine's run stays short
          const tau = stages.reduce((a, s) => a + s.r * s.c, 0);
          fc.pre(tau > l.period && tau < 2000 * l.period);
          const plan = planFor(l, inl);
          skipBandKnifeEdges(l, plan);
          const fast = ladderMetrics(l, plan);
          const ref = ladderMetrics(l, plan, { engineOnly: true });
          expect(fast.usedEngine).toBe(false);
          expectSameFigures(fast, ref, l, inl);
        },
      ),
      { numRuns: 150, seed: 20261201 },
    );
  });

  it('perturbed ladders searched from the nominal ladder\'s plan (as in Monte Carlo)', () => {
    const arbStage = fc.record({
      r: fc.double({ min: Math.log(470), max: Math.log(47e3), noNaN: true }).map(Math.exp),
      c: fc.double({ min: Math.log(4.7e-9), max: Math.log(1e-6), noNaN: true }).map(Math.exp),
    });
    const factor = fc.double({ min: 0.85, max: 1.15, noNaN: true });
    fc.assert(
      fc.property(
        fc.array(fc.tuple(arbStage, factor, factor), { minLength: 1, maxLength: 2 }),
        fc.tuple(fc.double({ min: 0, max: 80, noNaN: true }), fc.double({ min: 0, max: 80, noNaN: true })),
        fc.option(fc.double({ min: Math.log(1e4), max: Math.log(1e6), noNaN: true }).map(Math.exp), { nil: null }),
        fc.boolean(),
        (parts, [dh, dl], load, inl) => {
          const nominal = ladder(parts.map(([s]) => stage(s.r, s.c)), { driverHigh: 40, driverLow: 40, loadResistance: load });
          const tau = parts.reduce((a, [s]) => a + s.r * s.c, 0);
          fc.pre(tau > nominal.period && tau < 2000 * nominal.period);
          const plan = planFor(nominal, inl);
          const sample = ladder(parts.map(([s, fr, fcap]) => stage(s.r * fr, s.c * fcap)), { driverHigh: dh, driverLow: dl, loadResistance: load });
          skipBandKnifeEdges(sample, plan);
          expectSameFigures(ladderMetrics(sample, plan), ladderMetrics(sample, plan, { engineOnly: true }), sample, inl);
        },
      ),
      { numRuns: 150, seed: 77 },
    );
  });

  it('cascades (followers inside the ladder): modal ripple and DC, the engine\'s settling', () => {
    const arbStage = fc.record({
      r: fc.double({ min: Math.log(470), max: Math.log(47e3), noNaN: true }).map(Math.exp),
      c: fc.double({ min: Math.log(4.7e-9), max: Math.log(1e-6), noNaN: true }).map(Math.exp),
      buffered: fc.boolean(),
    });
    fc.assert(
      fc.property(
        fc.array(arbStage, { minLength: 2, maxLength: 3 }),
        fc.tuple(fc.double({ min: 0, max: 80, noNaN: true }), fc.double({ min: 0, max: 80, noNaN: true })),
        fc.option(fc.double({ min: Math.log(1e3), max: Math.log(1e6), noNaN: true }).map(Math.exp), { nil: null }),
        (stages, [dh, dl], load) => {
          fc.pre(stages.slice(0, -1).some((s) => s.buffered));
          const l = ladder(stages.map((s) => stage(s.r, s.c, s.buffered)), { driverHigh: dh, driverLow: dl, loadResistance: load });
          const tau = stages.reduce((a, s) => a + s.r * s.c, 0);
          fc.pre(tau > l.period && tau < 2000 * l.period);
          const plan = planFor(l, true);
          skipBandKnifeEdges(l, plan);
          const fast = ladderMetrics(l, plan);
          const ref = ladderMetrics(l, plan, { engineOnly: true });
          if (ref.settlingTime !== null) expect(fast.usedEngine).toBe(true); // settling
          expectSameFigures(fast, ref, l, true, true);
        },
      ),
      { numRuns: 100, seed: 31 },
    );
  });

  it('a cascade of nearly equal sections goes to the matrix exponentials, as in the engine', () => {
    // Two sections 1 % apart behind a follower: the modal basis is ill-conditioned (engine/modalRoute.ts
    // measured its digits lost against 80-digit references), so every figure comes from the expm route.
    // Its driver probes in metricPlan lose the modal form altogether (they once crashed the plan).
    const l = ladder([stage(10e3, 100e-9, true), stage(10.1e3, 100e-9)], { driverHigh: 30, driverLow: 20 });
    const modal = modalLadder(l);
    expect(modal).not.toBeNull();
    expect(modal!.condition).toBeGreaterThan(MAX_MODAL_CONDITION);
    const plan = planFor(l, true);
    expect(ladderMetrics(l, plan)).toEqual(ladderMetrics(l, plan, { engineOnly: true }));
  });
});
