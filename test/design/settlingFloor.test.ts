import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { designProblem } from '../../src/design/designProblem.js';
import { floorStep, floorStepScale, NO_FLOOR, pointSettlingFloor, scratchFloorPlan, settlingFloor, settlingFloorPlan, settlingFloorQuick, type SettlingFloorPlan } from '../../src/design/settlingFloor.js';
import { slowestTimeConstant, twoSlowestTimeConstants } from '../../src/design/slowestTimeConstant.js';
import { modalLadderOf, settlingTime, steadySwing, timeConstants, worstRipple } from '../../src/engine/index.js';
import type { Project } from '../../src/project/types.js';

interface Scenario {
  f: number;
  alignment: 'edge' | 'center';
  low: number;
  high: number;
  driverHigh: number;
  driverLow: number;
  load: number | null;
  loadC: number;
  rippleLsb: number;
  bandLsb: number;
  step: [number, number] | null;
}

/** An invented design problem (10 bits). */
function problemOf(x: Scenario) {
  const lsb = Math.abs(x.high - x.low) / 1024;
  const project: Project = {
    file: 'invented.yaml',
    pwm: { frequency: x.f, prescaler: 1, alignment: x.alignment, high: x.high, low: x.low, driver: { high: x.driverHigh, low: x.driverLow }, duty: { min: 0.05, max: 0.95 } },
    load: { ...(x.load !== null && { resistance: x.load }), capacitance: x.loadC },
    filter: { stages: [] },
    spec: { ripple: x.rippleLsb * lsb, settling: { band: x.bandLsb * lsb, ...(x.step && { from: x.step[0], to: x.step[1] }) } },
    search: { stages: [1, 2, 3], series: { resistor: 'E12', capacitor: 'E12' }, margin: 0, buffered: [false], resistance: { min: 100, max: 1e6 }, capacitance: { min: 1e-10, max: 1e-4 } },
  };
  return designProblem(project);
}

/**
 * An invented design to hold a floor to the engine: up to `stages` RC stages, drivers equal or
 * not, with or without a load, and a project around it (problemOf's fields, drawn).
 */
function randomDesign(stages: number) {
  return fc.record({
    n: fc.integer({ min: 1, max: stages }),
    logR: fc.array(fc.double({ min: 2, max: 5, noNaN: true }), { minLength: stages, maxLength: stages }),
    logC: fc.array(fc.double({ min: -9, max: -5.5, noNaN: true }), { minLength: stages, maxLength: stages }),
    driverLow: fc.double({ min: 0, max: 80, noNaN: true }),
    extra: fc.double({ min: -60, max: 80, noNaN: true }),
    load: fc.option(fc.double({ min: 3, max: 7, noNaN: true })),
    loadC: fc.constantFrom(0, 1e-10, 1e-9),
    logF: fc.double({ min: 3, max: 5, noNaN: true }),
    bandLsb: fc.double({ min: 0.25, max: 4, noNaN: true }),
    rippleLsb: fc.double({ min: 0.1, max: 8, noNaN: true }),
    alignment: fc.constantFrom<'edge' | 'center'>('edge', 'center'),
    levels: fc.constantFrom<[number, number]>([0, 3.3], [0, 5], [0.2, 3.3], [-1, 2]),
    step: fc.option(fc.tuple(fc.double({ min: 0.05, max: 0.95, noNaN: true }), fc.double({ min: 0.05, max: 0.95, noNaN: true }))),
  });
}

/** The problem (with ripple limit `rippleLsb`) and the parts of a randomDesign draw. */
function designOf(x: ReturnType<typeof randomDesign> extends fc.Arbitrary<infer T> ? T : never, rippleLsb: number) {
  const driverHigh = Math.max(0, x.driverLow + x.extra);
  const p = problemOf({
    f: 10 ** x.logF, alignment: x.alignment, low: x.levels[0], high: x.levels[1], driverHigh, driverLow: x.driverLow,
    load: x.load === null ? null : 10 ** x.load, loadC: x.loadC, rippleLsb, bandLsb: x.bandLsb, step: x.step,
  });
  return { p, r: x.logR.slice(0, x.n).map((v) => 10 ** v), c: x.logC.slice(0, x.n).map((v) => 10 ** v), driverHigh };
}

/**
 * Last t with S (tau_a e^(-t/tau_a) - tau_b e^(-t/tau_b)) / (tau_a - tau_b) > threshold, by
 * bisection: the step response error of two real poles (overdamped second-order system; K. Ogata,
 * "Modern Control Engineering", 5th ed., section 5-3, from memory).
 */
function twoPoleCrossing(s: number, threshold: number, tauA: number, tauB: number): number {
  const error = (t: number) => (s * (tauA * Math.exp(-t / tauA) - tauB * Math.exp(-t / tauB))) / (tauA - tauB);
  let lo = 0;
  let hi = 100 * tauA;
  for (let i = 0; i < 200; i++) {
    const mid = 0.5 * (lo + hi);
    if (error(mid) > threshold) lo = mid;
    else hi = mid;
  }
  return lo;
}

describe('settlingFloor', () => {
  it('is the two-pole step response crossing when the period is negligible (textbook overdamped response)', () => {
    const cases: Array<[number, number, number, number]> = [
      [1, 1e-3, 1e-3, 0.5e-3],
      [2.64, 3.2e-3, 2.9e-4, 2.0e-4],
      [1, 1e-4, 1e-3, 1e-6],
      [1, 0.3, 1e-3, 0.9e-3],
      [1, 1e-6, 5e-3, 4.999e-3],
    ];
    for (const [s, threshold, tauA, tauB] of cases) {
      const plan: SettlingFloorPlan = { period: 1e-15, steps: [floorStep(s, -Infinity, threshold, threshold)] };
      const want = twoPoleCrossing(s, threshold, tauA, tauB);
      const got = settlingFloor(plan, tauA, tauB);
      expect(got).toBeLessThanOrEqual(want * (1 + 1e-12));
      expect(got).toBeGreaterThan(want * (1 - 1e-8));
    }
  });

  it('with one time constant is tau ln(z0 / threshold) (first-order step response)', () => {
    const plan: SettlingFloorPlan = { period: 1e-15, steps: [floorStep(2, -Infinity, 1e-3, 1e-3)] };
    expect(settlingFloor(plan, 1e-3, 0)).toBeCloseTo(1e-3 * Math.log(2000), 12);
  });

  it('with the band alone below the threshold is tau ln(z0 / band) less two periods, when that is larger (first-order step response)', () => {
    // One time constant tau = 1 ms, period T = 10 us, step 2 V, threshold band + pTo = 2 mV, band 1 mV:
    // z0 = 2 q(T / tau) with q(x) = x / (e^x - 1) (the least a first-order section keeps of a
    // pulse train's mean); the error at the orbit's far side must reach the band alone, a period's
    // position apart: tau ln(z0 / 1e-3) - 2T, above tau ln(z0 / 2e-3) since tau ln 2 > 2T.
    const T = 1e-5;
    const tau = 1e-3;
    const x = T / tau;
    const z0 = (2 * x) / Math.expm1(x);
    const plan: SettlingFloorPlan = { period: T, steps: [floorStep(2, -Infinity, 2e-3, 1e-3)] };
    expect(settlingFloor(plan, tau, 0) / (tau * Math.log(z0 / 1e-3) - 2 * T)).toBeCloseTo(1, 12);
    // and where 2T outweighs the halved threshold (tau ln 2 < 2T) the threshold's crossing stands
    const short: SettlingFloorPlan = { period: 1e-3, steps: [floorStep(2, -Infinity, 2e-3, 1e-3)] };
    const zs = (2 * 1) / Math.expm1(1);
    expect(settlingFloor(short, tau, 0) / (tau * Math.log(zs / 2e-3))).toBeCloseTo(1, 12);
  });

  it('never falls when either time constant grows, and respects its ceiling (fast-check)', () => {
    const arb = fc.record({
      logTa: fc.double({ min: -6, max: -1, noNaN: true }),
      ratio: fc.double({ min: 0, max: 1, noNaN: true }),
      growA: fc.double({ min: 1, max: 3, noNaN: true }),
      growB: fc.double({ min: 1, max: 3, noNaN: true }),
      logT: fc.double({ min: -7, max: -3, noNaN: true }),
      logThreshold: fc.double({ min: -5, max: -1, noNaN: true }),
      head: fc.double({ min: -1, max: 1, noNaN: true }),
    });
    fc.assert(
      fc.property(arb, (x) => {
        const tauA = 10 ** x.logTa;
        const tauB = tauA * x.ratio;
        const plan: SettlingFloorPlan = { period: 10 ** x.logT, steps: [floorStep(1, x.head, 10 ** x.logThreshold, 10 ** x.logThreshold)] };
        const base = settlingFloor(plan, tauA, tauB);
        const tauA2 = tauA * x.growA;
        const tauB2 = Math.min(tauA2, tauB * x.growB);
        const grown = settlingFloor(plan, tauA2, tauB2);
        const ceiling = base * 0.9;
        // with a ceiling below the floor the answer still lies above it
        return grown >= base * (1 - 1e-9) && (base === 0 || settlingFloor(plan, tauA, tauB, ceiling) > ceiling);
      }),
      { numRuns: 300 },
    );
  });

  it('settlingFloorQuick lies at or below the floor for every larger slowest time constant and any second one (fast-check)', () => {
    // The listing orders tuples by it and finishes a key only when it may come first
    // (listTuples.ts, tupleQueue): a quick floor above the floor would reorder the walk.
    const arb = fc.record({
      logTa: fc.double({ min: -7, max: -1, noNaN: true }),
      grow: fc.double({ min: 1, max: 4, noNaN: true }),
      ratio: fc.double({ min: 0, max: 1, noNaN: true }),
      logT: fc.double({ min: -7, max: -3, noNaN: true }),
      logScaled: fc.double({ min: -3, max: 1, noNaN: true }),
      logThreshold: fc.double({ min: -5, max: -1, noNaN: true }),
      bandShare: fc.double({ min: 0.05, max: 1, noNaN: true }),
      head: fc.double({ min: -1, max: 1, noNaN: true }),
    });
    fc.assert(
      fc.property(arb, (x) => {
        const threshold = 10 ** x.logThreshold;
        const plan: SettlingFloorPlan = { period: 10 ** x.logT, steps: [floorStep(10 ** x.logScaled, x.head, threshold, threshold * x.bandShare)] };
        const tauA = 10 ** x.logTa;
        const quick = settlingFloorQuick(plan, tauA);
        const tauA2 = tauA * x.grow;
        return quick >= 0 && quick <= settlingFloor(plan, tauA2, tauA2 * x.ratio) && quick <= settlingFloor(plan, tauA, 0);
      }),
      { numRuns: 500 },
    );
    // and it is not trivial: with the period negligible it is the first-order crossing tau ln(z0 /
    // threshold) (first-order step response, any circuits textbook; common practice)
    const plan: SettlingFloorPlan = { period: 1e-9, steps: [floorStep(1, -Infinity, 1e-3, 1e-3)] };
    expect(settlingFloorQuick(plan, 1e-3)).toBeCloseTo(1e-3 * Math.log(1e3), 8);
    expect(settlingFloorQuick(plan, 0)).toBe(0);
  });

  it('never exceeds the engine settling time of a design that meets the ripple limit, equal or unequal drivers (fast-check)', () => {
    const arb = randomDesign(4);
    let checked = 0;
    let tight = 0;
    fc.assert(
      fc.property(arb, (x) => {
        if (x.step && Math.abs(x.step[0] - x.step[1]) < 0.05) return true;
        const { p, r, c, driverHigh } = designOf(x, x.rippleLsb);
        const l = p.ladderOf(r, c);
        const ripple = worstRipple(l, p.dutyMin, p.dutyMax).ripple;
        if (ripple > p.searchLimits.ripple!) return true; // the floor speaks of designs that meet the ripple limit
        let settle = 0;
        for (const [from, to] of p.steps) settle = Math.max(settle, settlingTime(l, from, to, p.band).time ?? Infinity);
        if (!Number.isFinite(settle)) return true;
        const taus = twoSlowestTimeConstants(r, c, Math.min(driverHigh, x.driverLow), p.circuit.loadResistance, p.circuit.loadCapacitance, [0, 0]);
        const floor = settlingFloor(settlingFloorPlan(p, r), taus[0], taus[1]);
        checked++;
        if (floor > 0.5 * settle) tight++;
        return floor <= settle * (1 + 1e-9);
      }),
      { numRuns: 400 },
    );
    expect(checked).toBeGreaterThan(100);
    // not a vacuous bound: on most such designs it is more than half the settling time
    expect(tight).toBeGreaterThan(checked / 2);
  });
});

describe('pointSettlingFloor', () => {
  it('with no excursions and no head is the one-step floor with the band as both thresholds', () => {
    const plan: SettlingFloorPlan = { period: 1e-4, steps: [floorStep(2.4, -Infinity, 1.6e-3, 1.6e-3)] };
    expect(pointSettlingFloor(1e-4, 2.4, -Infinity, 1.6e-3, 0, 0, 3e-3, 1e-3)).toBe(settlingFloor(plan, 3e-3, 1e-3));
  });

  it('is Infinity when the far side of the target orbit already leaves the band (never settles, model.md)', () => {
    expect(pointSettlingFloor(1e-4, 2.4, -Infinity, 1.6e-3, 0, 1.6e-3, 3e-3, 1e-3)).toBe(Infinity);
  });

  it('never exceeds the engine settling time, equal or unequal drivers, and is tighter than the tuple floor (fast-check)', () => {
    const arb = randomDesign(3);
    let checked = 0;
    let tight = 0;
    let tighter = 0;
    fc.assert(
      fc.property(arb, (x) => {
        if (x.step && Math.abs(x.step[0] - x.step[1]) < 0.05) return true;
        // no ripple limit of its own: the point floor takes the design's actual excursions
        const { p, r, c, driverHigh } = designOf(x, 1e6);
        const lti = driverHigh === x.driverLow;
        const l = p.ladderOf(r, c);
        const model = modalLadderOf(p.circuit, r, c);
        const taus = twoSlowestTimeConstants(r, c, Math.min(driverHigh, x.driverLow), p.circuit.loadResistance, p.circuit.loadCapacitance, [0, 0]);
        const scale = floorStepScale(p, r);
        for (const [from, to] of p.steps) {
          const settle = settlingTime(l, from, to, p.band).time;
          const a = steadySwing(model, from);
          const b = steadySwing(model, to);
          const rising = to > from;
          const floor = pointSettlingFloor(p.period, Math.abs(to - from) * scale, lti ? Math.abs(b.yStart - a.yStart) : -Infinity, p.band, rising ? b.above : b.below, rising ? b.below : b.above, taus[0], taus[1]);
          // the engine says never (null): the floor may say anything; it says Infinity where the far side leaves the band
          if (settle === null) continue;
          checked++;
          if (floor > 0.5 * settle) tight++;
          const plan = settlingFloor(settlingFloorPlan(p, r), taus[0], taus[1]);
          if (floor > plan) tighter++;
          if (!(floor <= settle * (1 + 1e-9))) return false;
        }
        return true;
      }),
      { numRuns: 400, seed: 20261204 },
    );
    expect(checked).toBeGreaterThan(100);
    // not a vacuous bound: on most designs more than half the settling time, and above the plan's floor
    expect(tight).toBeGreaterThan(checked / 2);
    expect(tighter).toBeGreaterThan(checked / 4);
  });
});

describe('settlingFloorPlan', () => {
  it('written into one reused scratch plan, equals a fresh plan tuple after tuple (the search reuses it)', () => {
    // Invented scenarios: one with the default rising and falling steps (deduplicated to one), one
    // with a stated step, one with unequal drivers; each tuple's plan goes into the same scratch.
    const base: Scenario = { f: 20e3, alignment: 'edge', low: 0, high: 3.3, driverHigh: 30, driverLow: 30, load: 1e5, loadC: 1e-10, rippleLsb: 0.5, bandLsb: 1, step: null };
    const scenarios: Scenario[] = [base, { ...base, step: [0.1, 0.9] }, { ...base, driverHigh: 45, driverLow: 20, load: null }];
    const scratch = scratchFloorPlan();
    for (const x of scenarios) {
      const p = problemOf(x);
      for (const r of [[1e3], [4.7e3, 10e3], [220, 33e3, 1e5], [1e5, 470]]) {
        const into = settlingFloorPlan(p, r, p.searchLimits, scratch);
        expect(into).toBe(scratch);
        expect(into).toEqual(settlingFloorPlan(p, r));
      }
    }
  });

  it('NO_FLOOR is the trivial floor 0 (a plan not made yet)', () => {
    expect(settlingFloor(NO_FLOOR, 1e-3, 1e-4)).toBe(0);
    expect(settlingFloor(NO_FLOOR, 1e-3, 1e-4, 1e-6)).toBe(0);
  });
});

describe('twoSlowestTimeConstants and slowestTimeConstant', () => {
  it('equal the two slowest time constants of the engine (fast-check, 1 to 5 stages; averaged model)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 5 }), fc.array(fc.double({ min: 2, max: 6, noNaN: true }), { minLength: 10, maxLength: 10 }), (n, e) => {
        const r = e.slice(0, n).map((v) => 10 ** v);
        const c = e.slice(5, 5 + n).map((v) => 10 ** (v - 12));
        const l = { period: 1e-4, high: 3.3, low: 0, driverHigh: 30, driverLow: 30, stages: r.map((rr, k) => ({ r: rr, c: c[k], buffered: false })), loadResistance: 1e5, loadCapacitance: 1e-11 };
        const want = timeConstants(l);
        const got = twoSlowestTimeConstants(r, c, 30, 1e5, 1e-11, [0, 0]);
        const second = n === 1 ? 0 : want[1];
        // slowestTimeConstant is the first of the two
        return Math.abs(got[0] / want[0] - 1) < 1e-9 && (n === 1 ? got[1] === 0 : Math.abs(got[1] / second - 1) < 1e-7) && slowestTimeConstant(r, c, 30, 1e5, 1e-11) === got[0];
      }),
      { numRuns: 300 },
    );
  });
});
