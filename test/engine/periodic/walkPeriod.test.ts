import { describe, expect, it } from 'vitest';
import { networkCache } from '../../../src/engine/periodic/phaseFlows.js';
import { periodicOrbit } from '../../../src/engine/periodic/periodicOrbit.js';
import { periodTrajectoryPoints, walkPeriod } from '../../../src/engine/periodic/trajectory.js';
import { fine44, rcSallenKeyQ055, twoRcLoaded } from './networks.js';

// walkPeriod without fresh arrays reuses two state buffers; what a visitor reads at once must be
// what the list of points holds (the orbit's ripple itself is held to ODE time-stepping in
// engineVsOdex.test.ts and odexNetwork.test.ts).
describe('walkPeriod', () => {
  for (const [name, net, duties] of [
    ['two loaded RC stages', twoRcLoaded, { first: 0.3, second: null }],
    ['RC + Sallen-Key', rcSallenKeyQ055, { first: 0.7, second: null }],
    ['fine output', fine44, { first: 0.25, second: 0.5 }],
  ] as const) {
    it(`${name}: the same points, states included, with and without fresh arrays`, () => {
      const orbit = periodicOrbit(net, duties);
      const { equations } = networkCache(net);
      const d0 = orbit.start.map((_, i) => (i % 2 ? 1e-3 : -2e-3));
      const list = periodTrajectoryPoints(orbit.phases, equations.output, orbit.start, d0, equations.scale);
      for (const fresh of [true, false]) {
        const seen: Array<{ phase: number; tau: number; t: number; d: number[]; w: number }> = [];
        walkPeriod(orbit.phases, equations.output, orbit.start, d0, equations.scale, fresh, (phase, tau, t, d, w) => seen.push({ phase, tau, t, d: [...d], w }));
        expect(seen).toEqual(list.map((p) => ({ ...p, d: [...p.d] })));
      }
      expect(list.length).toBeGreaterThan(8);
      // The orbit's extremes are those of its own trajectory's points.
      const own = periodTrajectoryPoints(orbit.phases, equations.output, orbit.start, orbit.start.map(() => 0), equations.scale);
      expect(orbit.ripple).toBe(Math.max(...own.map((p) => p.w)) - Math.min(...own.map((p) => p.w)));
    });
  }
});
