import fc from 'fast-check';
import { expm, matrix, multiply, type Matrix } from 'mathjs';
import { describe, expect, it } from 'vitest';
import { networkCache } from '../../../src/engine/periodic/phaseFlows.js';
import { periodicOrbit } from '../../../src/engine/periodic/periodicOrbit.js';
import { transientBound } from '../../../src/engine/periodic/phaseSeries.js';
import { rcSallenKeyQ055, twoRcLoaded } from './networks.js';

/**
 * max |c e^{A_p tau} x| over the period, the deviation x carried phase by phase, on 40 instants
 * per phase: with mathjs's expm (a general-purpose reference library, Pade with scaling and
 * squaring), independent of the engine's flows.
 */
function sampledTransient(phases: ReturnType<typeof periodicOrbit>['phases'], c: readonly number[], delta: readonly number[]): number {
  const n = c.length;
  let x = [...delta];
  let worst = 0;
  for (const ph of phases) {
    const A = matrix(Array.from({ length: n }, (_, i) => ph.A.slice(i * n, i * n + n)));
    for (let s = 0; s <= 40; s++) {
      const E = expm(multiply(A, (ph.duration * s) / 40) as Matrix).toArray() as number[][];
      let y = 0;
      for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) y += c[i] * E[i][j] * x[j];
      worst = Math.max(worst, Math.abs(y));
      if (s === 40) x = E.map((row) => row.reduce((sum, e, j) => sum + e * x[j], 0));
    }
  }
  return worst;
}

describe('transientBound', () => {
  for (const [name, net] of [['two loaded RC stages, unequal drivers', twoRcLoaded], ['RC + Sallen-Key', rcSallenKeyQ055]] as const) {
    it(`${name}: the coarse bound lies above the full one, both above the sampled transient, and a limit reads the same either way (fast-check)`, () => {
      const orbit = periodicOrbit(net, { first: 0.3, second: null });
      const { equations } = networkCache(net);
      const bound = transientBound(orbit.phases, equations.output, equations.scale);
      expect(bound).not.toBeNull();
      const n = equations.n;
      fc.assert(
        fc.property(fc.array(fc.double({ min: -1, max: 1, noNaN: true }), { minLength: n, maxLength: n }), fc.double({ min: 0.5, max: 2, noNaN: true }), (delta, f) => {
          const full = bound!(delta);
          const coarse = bound!(delta, Infinity);
          expect(coarse).toBeGreaterThanOrEqual(full * (1 - 1e-12));
          for (const limit of [full * f, full, coarse, coarse * (1 + 1e-12), coarse * (1 + 1e-11)]) {
            expect(bound!(delta, limit) <= limit).toBe(full <= limit);
          }
        }),
        { numRuns: 300, seed: 14 },
      );
      // Against the reference on a few deviations (expm per instant is slow).
      for (const delta of [Array(n).fill(1), Array.from({ length: n }, (_, i) => (i % 2 ? -0.3 : 0.8)), Array.from({ length: n }, (_, i) => (i === n - 1 ? 1 : 0))]) {
        const seen = sampledTransient(orbit.phases, equations.output, delta);
        expect(bound!(delta)).toBeGreaterThanOrEqual(seen * (1 - 1e-9));
        expect(bound!(delta, Infinity)).toBeGreaterThanOrEqual(seen * (1 - 1e-9));
      }
    });
  }
});
