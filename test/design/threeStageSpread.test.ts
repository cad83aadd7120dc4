import fc from 'fast-check';
import { det, inv } from 'mathjs';
import { describe, expect, it } from 'vitest';
import { designProblem } from '../../src/design/designProblem.js';
import { designSearch } from '../../src/design/designSearch.js';
import { exactCandidate } from '../../src/design/exactCandidate.js';
import { infeasibilityBounds } from '../../src/design/infeasibilityBounds.js';
import { tupleBounds } from '../../src/design/settlingBounds.js';
import { slowestTimeConstant } from '../../src/design/slowestTimeConstant.js';
import { spreadRatioCap, threeStageSpread, threeStageTauMin } from '../../src/design/threeStageSpread.js';
import { threeStageSpreadFloor } from '../../src/design/threeStageSpreadFloor.js';
import { timeConstants } from '../../src/engine/index.js';
import { parseProject } from '../../src/project/index.js';
import { bruteForce, designKey, everyTuple } from './bruteForce.js';

/** A random three-stage ladder: resistors, capacitors, driver, optional load. */
const ladderArb = fc.record({
  logR: fc.array(fc.double({ min: 1.5, max: 5.5, noNaN: true }), { minLength: 3, maxLength: 3 }),
  logC: fc.array(fc.double({ min: -10, max: -5, noNaN: true }), { minLength: 3, maxLength: 3 }),
  driver: fc.double({ min: 0, max: 60, noNaN: true }),
  load: fc.option(fc.double({ min: 2, max: 7, noNaN: true })),
  logCL: fc.option(fc.double({ min: -12, max: -8, noNaN: true })),
});
const ladderOf = (x: { logR: number[]; logC: number[]; driver: number; load: number | null; logCL: number | null }) => {
  const r = x.logR.map((v) => 10 ** v);
  const c = x.logC.map((v) => 10 ** v);
  const loadR = x.load === null ? null : 10 ** x.load;
  const loadC = x.logCL === null ? 0 : 10 ** x.logCL;
  return {
    r,
    c,
    loadR,
    loadC,
    ladder: { period: 1e-4, high: 3.3, low: 0, driverHigh: x.driver, driverLow: x.driver, stages: r.map((rr, k) => ({ r: rr, c: c[k], buffered: false })), loadResistance: loadR, loadCapacitance: loadC },
  };
};

describe('threeStageSpread: the pole-spread factor of a three-stage ladder', () => {
  it('equals rho_1 rho_2 rho_3 / det(G^-1) from the inverse of the nodal matrix (mathjs inv, det)', () => {
    fc.assert(
      fc.property(ladderArb, (x) => {
        const { r, loadR } = ladderOf(x);
        const g = [1 / (r[0] + x.driver), 1 / r[1], 1 / r[2]];
        const gL = loadR === null ? 0 : 1 / loadR;
        // Nodal conductance matrix of the ladder (Kirchhoff's current law at each node).
        const G = [
          [g[0] + g[1], -g[1], 0],
          [-g[1], g[1] + g[2], -g[2]],
          [0, -g[2], g[2] + gL],
        ];
        const Gi = inv(G);
        const want = (Gi[0][0] * Gi[1][1] * Gi[2][2]) / det(Gi);
        return Math.abs(threeStageSpread(r, x.driver, loadR) / want - 1) < 1e-9;
      }),
      { numRuns: 300 },
    );
  });

  it("bounds the engine's time constants: (sum tau)^3 >= 27 kappa prod tau, and tau_slow >= threeStageTauMin of the ladder's own |H| (fast-check)", () => {
    fc.assert(
      fc.property(ladderArb, fc.double({ min: 2, max: 6, noNaN: true }), (x, logW) => {
        const { r, ladder, loadR } = ladderOf(x);
        const tau = timeConstants(ladder); // the engine's, independent of the bound's algebra
        const kappa = threeStageSpread(r, x.driver, loadR);
        const sum = tau[0] + tau[1] + tau[2];
        const okSpread = sum ** 3 >= 27 * kappa * tau[0] * tau[1] * tau[2] * (1 - 1e-9);
        const omega = 10 ** logW;
        const gamma = tau.reduce((p, t) => p * (1 + omega * omega * t * t), 1);
        const slow = Math.max(...tau);
        return okSpread && threeStageTauMin(gamma * (1 - 1e-9), kappa, omega) <= slow * (1 + 1e-9);
      }),
      { numRuns: 300 },
    );
  });

  it('spreadRatioCap is the root of (2 + p)^3 = 27 kappa p in (0, 1], never below it; 1 for kappa <= 1', () => {
    expect(spreadRatioCap(1)).toBe(1);
    expect(spreadRatioCap(0.5)).toBe(1);
    for (const k of [1.001, 1.5, 2.25, 10, 1e4]) {
      const p = spreadRatioCap(k);
      expect((2 + p) ** 3 - 27 * k * p).toBeLessThanOrEqual(0);
      const below = p * (1 - 1e-6);
      expect((2 + below) ** 3 - 27 * k * below).toBeGreaterThan(0);
    }
  });

  it('threeStageSpreadFloor is the smallest factor over the admissible triples (brute force)', () => {
    const R = [100, 150, 220, 330, 470, 680, 1000];
    for (const [seriesMax, load] of [
      [1200, 10e3],
      [800, null],
      [5000, 4.7e3],
    ] as Array<[number, number | null]>) {
      let want = Infinity;
      for (const [[a, b, c]] of everyTuple(R, [1], 3)) {
        if (a < 150 || 30 + a + b + c > seriesMax) continue;
        want = Math.min(want, threeStageSpread([a, b, c], 30, load));
      }
      expect(threeStageSpreadFloor(R, 150, 30, load, seriesMax)).toBe(want);
    }
  });
});

/** An invented three-stage project: E3 values, equal drivers, a 100 kohm load and a droop limit. */
function project(o: { settling: string; droop?: string; margin?: string }) {
  return parseProject(
    `
pwm: { frequency: 2 kHz, bits: 10, high: 3.3 V, low: 0 V, driver: 30 ohm, duty: { min: 5 %, max: 95 % } }
load: { resistance: 100k }
spec:
  ripple: 2 LSB
  droop: ${o.droop ?? '10 %'}
  gain: none
  settling: { band: 0.5 LSB, time: ${o.settling} }
search:
  stages: [3]
  series: E3
  margin: ${o.margin ?? '0 %'}
  resistance: { min: 1k, max: 4.7k }
  capacitance: { min: 10n, max: 470n }
`,
    'invented.yaml',
  );
}

describe('the three-stage spread bound against exhaustive search (exact engine on every design)', () => {
  it('the tuple bound (tauMin, tau_slow * factor) holds for every design that meets the ripple limit', () => {
    const problem = designProblem(project({ settling: '1 s' }));
    let checked = 0;
    for (const [r, c] of everyTuple(problem.rValues, problem.cValues, 3)) {
      const d = exactCandidate(problem, problem.ladderOf(r, c));
      if (d.worstRipple > problem.limits.ripple! || d.settlingTime === null) continue;
      checked++;
      const tb = tupleBounds(problem, r);
      const tau = slowestTimeConstant(r, c, tb.driver, problem.circuit.loadResistance, problem.circuit.loadCapacitance);
      expect(tb.tauMin).toBeLessThanOrEqual(tau * (1 + 1e-9));
      expect(tau * tb.factor - tb.slack).toBeLessThanOrEqual(d.settlingTime * (1 + 1e-9));
    }
    expect(checked).toBeGreaterThan(50);
  });

  it('the proven settling floor lies below every design meeting the ripple and droop limits, and proves a limit the equal-poles bound could not', () => {
    const problem = designProblem(project({ settling: '6 ms' }));
    const { bounds, misses } = infeasibilityBounds(problem, 3);
    let fastest = Infinity;
    for (const [r, c] of everyTuple(problem.rValues, problem.cValues, 3)) {
      const d = exactCandidate(problem, problem.ladderOf(r, c));
      if (d.worstRipple <= problem.limits.ripple! && d.droop <= problem.limits.droop! && d.settlingTime !== null) fastest = Math.min(fastest, d.settlingTime);
    }
    expect(bounds.settlingFloor).toBeLessThanOrEqual(fastest);
    // 6 ms lies between the equal-poles floor (about 4.1 ms here) and the spread floor (about 7.4 ms).
    expect(misses.map((m) => m.limit)).toContain('settling');
    expect(fastest).toBeGreaterThan(6e-3);
  });

  it('designSearch keeps the exhaustive optimum where the spread bound prunes resistor triples', () => {
    for (const settling of ['25 ms', '40 ms']) {
      const p = project({ settling });
      const found = designSearch(p, { top: 3, compare: false });
      const brute = bruteForce(p, 3);
      expect(brute.ranked.length).toBeGreaterThan(0);
      expect(found.candidates.map(designKey)).toEqual(brute.ranked.map(designKey));
    }
  });
});
