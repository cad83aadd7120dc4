import fc from 'fast-check';
import { eigs } from 'mathjs';
import { describe, expect, it } from 'vitest';
import { designProblem } from '../../src/design/designProblem.js';
import { tupleBounds } from '../../src/design/settlingBounds.js';
import { slowestTimeConstant } from '../../src/design/slowestTimeConstant.js';
import { defaultSettling, worstRipple } from '../../src/engine/index.js';
import type { Project } from '../../src/project/types.js';

/** An invented design problem; equal drivers unless told otherwise. */
function problemOf(x: { f: number; driverHigh: number; driverLow: number; load: number | null; ripple: number; band: number }) {
  const project: Project = {
    file: 'invented.yaml',
    pwm: { frequency: x.f, prescaler: 1, alignment: 'edge', high: 3.3, low: 0, driver: { high: x.driverHigh, low: x.driverLow }, duty: { min: 0.05, max: 0.95 } },
    load: { ...(x.load !== null && { resistance: x.load }), capacitance: 0 },
    filter: { stages: [] },
    spec: { ripple: x.ripple, settling: { band: x.band } },
    search: { stages: [1, 2], series: { resistor: 'E12', capacitor: 'E12' }, margin: 0, buffered: [false], resistance: { min: 100, max: 1e6 }, capacitance: { min: 1e-10, max: 1e-4 } },
  };
  return designProblem(project);
}

describe('slowestTimeConstant', () => {
  // (against the engine on random ladders of 1 to 5 stages: with twoSlowestTimeConstants, whose
  // first value it is, in test/design/settlingFloor.test.ts)
  it('three stages of one time constant (each RC 100 us, impedance x10..x1000 per stage): near-equal roots, to 1e-9 of mathjs eigs', () => {
    // The case where the cubic's roots crowd together (Newton's start at the Laguerre-Samuelson
    // bound). Reference: mathjs eigs (a general-purpose library) of the nodal matrix
    // C^-1/2 G C^-1/2 of the open-output ladder, tau_max = 1 / its smallest eigenvalue.
    for (const k of [10, 100, 1000]) {
      const r = [1e3, 1e3 * k, 1e3 * k * k];
      const c = [1e-7, 1e-7 / k, 1e-7 / (k * k)];
      const g = r.map((x) => 1 / x);
      const diag = [(g[0] + g[1]) / c[0], (g[1] + g[2]) / c[1], g[2] / c[2]];
      const off = [-g[1] / Math.sqrt(c[0] * c[1]), -g[2] / Math.sqrt(c[1] * c[2])];
      const S = [
        [diag[0], off[0], 0],
        [off[0], diag[1], off[1]],
        [0, off[1], diag[2]],
      ];
      const lambdas = (eigs(S).values as number[]).map(Number);
      const want = 1 / Math.min(...lambdas);
      expect(Math.abs(slowestTimeConstant(r, c, 0, null, 0) / want - 1)).toBeLessThan(1e-9);
    }
  });
});

describe('tupleBounds: lower bounds the search prunes with (equal drivers: proven, see settlingBounds.ts)', () => {
  it('tau_slow * factor and the ripple-implied tauMin never exceed the engine on feasible designs (fast-check)', () => {
    const arb = fc.record({
      n: fc.integer({ min: 1, max: 2 }),
      logR: fc.array(fc.double({ min: 2.5, max: 5, noNaN: true }), { minLength: 2, maxLength: 2 }),
      logC: fc.array(fc.double({ min: -9, max: -5.5, noNaN: true }), { minLength: 2, maxLength: 2 }),
      driver: fc.double({ min: 0, max: 60, noNaN: true }),
      load: fc.option(fc.double({ min: 4, max: 7, noNaN: true })),
      logF: fc.double({ min: 3.5, max: 5, noNaN: true }),
      bandLsb: fc.double({ min: 0.25, max: 4, noNaN: true }),
    });
    let checked = 0;
    fc.assert(
      fc.property(arb, (x) => {
        const lsb = 3.3 / 1024;
        const p = problemOf({ f: 10 ** x.logF, driverHigh: x.driver, driverLow: x.driver, load: x.load === null ? null : 10 ** x.load, ripple: x.bandLsb * lsb, band: x.bandLsb * lsb });
        const r = x.logR.slice(0, x.n).map((v) => 10 ** v);
        const c = x.logC.slice(0, x.n).map((v) => 10 ** v);
        const l = p.ladderOf(r, c);
        const ripple = worstRipple(l, p.dutyMin, p.dutyMax).ripple;
        const settle = defaultSettling(l, p.dutyMin, p.dutyMax, p.band).time;
        if (ripple > p.limits.ripple! || settle === null) return true; // the bounds speak of feasible designs
        checked++;
        const tb = tupleBounds(p, r);
        const tau = slowestTimeConstant(r, c, tb.driver, p.circuit.loadResistance, p.circuit.loadCapacitance);
        return tb.tauMin <= tau * (1 + 1e-9) && tau * tb.factor - tb.slack <= settle * (1 + 1e-9);
      }),
      { numRuns: 150 },
    );
    expect(checked).toBeGreaterThan(20);
  });

  it('tauMin never exceeds the fast ladder\'s slowest time constant of a design at its own ripple limit, unequal drivers, 1 to 3 stages (fast-check)', () => {
    // Proven through the ripple floor (requiredAttenuation.ts): any design that meets the ripple
    // limit and settles at all has a fast ladder (the smaller driver resistance) this slow. Each
    // drawn design is given its own worst ripple as the limit (and as the band, so that it
    // settles): it lies on the bound's boundary, where an overestimate would show.
    const arb = fc.record({
      n: fc.integer({ min: 1, max: 3 }),
      logR: fc.array(fc.double({ min: 2.5, max: 5, noNaN: true }), { minLength: 3, maxLength: 3 }),
      logC: fc.array(fc.double({ min: -9, max: -5.5, noNaN: true }), { minLength: 3, maxLength: 3 }),
      high: fc.double({ min: 5, max: 120, noNaN: true }),
      low: fc.double({ min: 5, max: 120, noNaN: true }),
      load: fc.option(fc.double({ min: 4, max: 7, noNaN: true })),
      logF: fc.double({ min: 3.5, max: 5, noNaN: true }),
    });
    let closest = Infinity;
    fc.assert(
      fc.property(arb, (x) => {
        const first = problemOf({ f: 10 ** x.logF, driverHigh: x.high, driverLow: x.low, load: x.load === null ? null : 10 ** x.load, ripple: 1, band: 1 });
        const r = x.logR.slice(0, x.n).map((v) => 10 ** v);
        const c = x.logC.slice(0, x.n).map((v) => 10 ** v);
        const ripple = worstRipple(first.ladderOf(r, c), first.dutyMin, first.dutyMax).ripple;
        if (!(ripple > 0)) return true;
        const p = problemOf({ f: 10 ** x.logF, driverHigh: x.high, driverLow: x.low, load: x.load === null ? null : 10 ** x.load, ripple, band: ripple });
        const tb = tupleBounds(p, r);
        const tau = slowestTimeConstant(r, c, tb.driver, p.circuit.loadResistance, p.circuit.loadCapacitance);
        if (tb.tauMin > 0) closest = Math.min(closest, tau / tb.tauMin);
        return tb.driver === Math.min(x.high, x.low) && tb.tauMin <= tau * (1 + 1e-9);
      }),
      { numRuns: 300 },
    );
    // and it is close: within 25 % for some design (ptp >= pi |c1| gives up 4 / pi on a sine)
    expect(closest).toBeLessThan(1.25);
  });
});
