import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import type { Ladder } from '../../src/circuit/ladder.js';
import { designSearch } from '../../src/design/index.js';
import { ladderFromProject } from '../../src/project/ladderFromProject.js';
import { parseProject } from '../../src/project/index.js';
import { countPassing } from '../../src/tolerance/countPassing.js';
import { evaluateSamples } from '../../src/tolerance/evaluateSamples.js';
import { ladderMetrics, ladderPasses, type LadderMetrics } from '../../src/tolerance/ladderMetrics.js';
import { metricPlan, type MetricPlan } from '../../src/tolerance/metricPlan.js';
import { monteCarloSetup } from '../../src/tolerance/monteCarlo.js';
import { passesLimits } from '../../src/tolerance/passesLimits.js';
import { summarizeSamples } from '../../src/tolerance/summarizeSamples.js';
import { percentiles } from '../../src/numeric/statistics.js';
import { ladder, stage } from './reference.js';
import { project } from './projectFixture.js';

/**
 * The yield check's pass/fail-only path (countPassing, ladderPasses) must give every sample the
 * verdict of the full figures (ladderMetrics, checked against the engine and ODEX elsewhere) under
 * summarizeSamples' rule. Both are this project's code, so the reference here is the full path
 * itself; the limits are set at, just below and just above each sample's own figures, where a
 * shortcut that were off by a rounding error would show.
 */

/** The next double below / above x (IEEE 754 bit pattern stepped by one; x finite and > 0). */
function nextDown(x: number): number {
  const v = new DataView(new ArrayBuffer(8));
  v.setFloat64(0, x);
  v.setBigUint64(0, v.getBigUint64(0) - 1n);
  return v.getFloat64(0);
}
function nextUp(x: number): number {
  const v = new DataView(new ArrayBuffer(8));
  v.setFloat64(0, x);
  v.setBigUint64(0, v.getBigUint64(0) + 1n);
  return v.getFloat64(0);
}

/** Limits at, around and well away from a figure (|figure| for the signed ones). */
function limitsAround(x: number): number[] {
  if (!Number.isFinite(x)) return [Infinity, 1];
  if (x === 0) return [0, 1e-12];
  return [x, nextDown(x), nextUp(x), 0.5 * x, 2 * x];
}

/** The figure of one limit in the sample table's terms. */
function figureOf(f: LadderMetrics, name: keyof MetricPlan['limits']): number {
  switch (name) {
    case 'ripple':
      return f.worstRipple.ripple;
    case 'droop':
      return Math.abs(f.droop.error);
    case 'inl':
      return Math.abs(f.inl?.error ?? 0);
    case 'gain':
      return Math.abs(f.gain ?? 0);
    case 'settling':
      return f.settlingTime ?? Infinity;
  }
}

const NAMES = ['ripple', 'droop', 'inl', 'gain', 'settling'] as const;

/** Every limit alone at, below and above the ladder's figure, then all of them at once. */
function expectSameVerdicts(l: Ladder, plan: MetricPlan): number {
  const full = ladderMetrics(l, plan);
  let checked = 0;
  const all: MetricPlan['limits'] = {};
  for (const name of NAMES) {
    if ((name === 'inl' && !plan.inl) || (name === 'gain' && !plan.gain)) continue;
    const x = figureOf(full, name);
    all[name] = x;
    for (const limit of limitsAround(x)) {
      const p = { ...plan, limits: { [name]: limit } };
      expect(ladderPasses(l, p), `${name} limit ${limit}, figure ${x}`).toBe(passesLimits(full, p));
      checked++;
    }
  }
  const p = { ...plan, limits: all };
  expect(passesLimits(full, p)).toBe(true);
  expect(ladderPasses(l, p)).toBe(true);
  return checked;
}

const planFor = (l: Ladder, inl: boolean, drivers: { high: number; low: number }): MetricPlan => {
  const p = project(l.stages, { driver: { high: { min: 0.8 * drivers.high, max: 1.2 * drivers.high }, low: { min: 0.8 * drivers.low, max: 1.2 * drivers.low } } }, {
    pwm: { frequency: 1 / l.period, prescaler: 1, alignment: 'edge', high: l.high, low: l.low, driver: drivers, duty: { min: 0.05, max: 0.95 } },
    spec: { ...(inl ? { inl: 1e-3 } : {}), gain: 0.02, settling: { band: 2e-3, time: 1 } },
  });
  return metricPlan(p, l, { gain: true });
};

describe('ladderPasses: the verdict of the full figures, limits at the figures themselves', () => {
  it('random ladders of 1 to 3 stages (cascades among them), equal and unequal drivers, perturbed from the plan\'s nominal', () => {
    const arbStage = fc.record({
      r: fc.double({ min: Math.log(220), max: Math.log(100e3), noNaN: true }).map(Math.exp),
      c: fc.double({ min: Math.log(1e-9), max: Math.log(2e-6), noNaN: true }).map(Math.exp),
      buffered: fc.boolean(),
    });
    const factor = fc.double({ min: 0.85, max: 1.15, noNaN: true });
    let checked = 0;
    fc.assert(
      fc.property(
        fc.array(fc.tuple(arbStage, factor, factor), { minLength: 1, maxLength: 3 }),
        fc.tuple(fc.double({ min: 0, max: 80, noNaN: true }), fc.double({ min: 0, max: 80, noNaN: true }), fc.boolean()),
        fc.option(fc.double({ min: Math.log(1e3), max: Math.log(1e6), noNaN: true }).map(Math.exp), { nil: null }),
        fc.boolean(),
        (parts, [dh, dl, equal], load, inl) => {
          const drivers = { high: dh, low: equal ? dh : dl };
          const nominal = ladder(parts.map(([s], k) => stage(s.r, s.c, s.buffered && k < parts.length - 1)), { driverHigh: drivers.high, driverLow: drivers.low, loadResistance: load });
          // time constants within 1 to 2000 periods so that the engine's settling (cascades) stays short
          const tau = parts.reduce((a, [s]) => a + s.r * s.c, 0);
          fc.pre(tau > nominal.period && tau < 2000 * nominal.period);
          const plan = planFor(nominal, inl, drivers);
          const sample = { ...nominal, stages: nominal.stages.map((s, k) => ({ ...s, r: s.r * parts[k][1], c: s.c * parts[k][2] })) };
          checked += expectSameVerdicts(sample, plan);
        },
      ),
      { numRuns: 120, seed: 20261202 },
    );
    expect(checked).toBeGreaterThan(1000);
  });
});

// Invented scenario: a two-stage filter behind unequal drivers (40 / 25 ohm, so the DC errors
// are searched), with INL and settling limits, its designs checked sample by sample.
const demo = parseProject(
  `
pwm: { frequency: 15.625 kHz, bits: 10, high: 3.3 V, low: 0 V, driver: { high: 40 ohm, low: 25 ohm }, duty: { min: 5 %, max: 95 % } }
load: { resistance: 1 Mohm, capacitance: 100 pF }
spec:
  ripple: 0.5 LSB
  droop: 2 %
  inl: 1 LSB
  settling: { band: 0.5 LSB, time: 50 ms, from: 10 %, to: 90 % }
search:
  stages: [1, 2]
  series: E12
  margin: 0 %
  resistance: { min: 100 ohm, max: 100k }
  capacitance: { min: 1n, max: 10u }
tolerance: { resistor: 1 %, capacitor: 10 %, yield: 99 %, seed: 11, driver: { high: { min: 30 ohm, max: 50 ohm }, low: { min: 20 ohm, max: 30 ohm } } }
`,
  'count-passing.yaml',
);

describe('countPassing: summarizeSamples(evaluateSamples(...)).passed, sample for sample', () => {
  it('designs of a search, with the project\'s limits and with limits at the samples\' own medians', () => {
    const designs = designSearch(demo, { top: 6, compare: false, diagnose: false }).candidates;
    expect(designs.length).toBeGreaterThan(2);
    let failing = 0;
    for (const d of designs) {
      const nominal = ladderFromProject(demo, d.stages.map((s) => ({ r: s.r, c: s.c, buffered: false })));
      const setup = monteCarloSetup(demo, nominal, { samples: 200 });
      const { circuit, parameters, deviates } = setup;
      const table = evaluateSamples(circuit, parameters, setup.plan, deviates, 0, 200);
      // medians fail half of the samples on each figure, so every check's miss is exercised
      const median = (xs: Float64Array) => percentiles(Array.from(xs, Math.abs)).p50;
      const medians: MetricPlan = {
        ...setup.plan,
        limits: { ripple: median(table.worstRipple), droop: median(table.droop), inl: median(table.inl!), settling: median(table.settlingTime) },
      };
      for (const plan of [setup.plan, medians]) {
        const want = summarizeSamples(plan === setup.plan ? table : evaluateSamples(circuit, parameters, plan, deviates, 0, 200), plan).passed;
        expect(countPassing(circuit, parameters, plan, deviates, 0, 200)).toBe(want);
        expect(countPassing(circuit, parameters, plan, deviates, 50, 120)).toBe(summarizeSamples(evaluateSamples(circuit, parameters, plan, deviates, 50, 120), plan).passed);
        failing += 200 - want;
      }
    }
    expect(failing).toBeGreaterThan(300);
  });
});
