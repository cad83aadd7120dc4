import { describe, expect, it } from 'vitest';
import { ladderWithSlowestTau, odeCases } from '../../scripts/bench-cases.js';

const relative = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);

describe('bench circuits (scripts/bench-cases.ts)', () => {
  it('one stage: tau = (R + driver) C, open output (RC time constant, common practice)', () => {
    for (const periods of [10, 1e4, 1e7]) {
      const l = ladderWithSlowestTau(1, periods);
      const [s] = l.stages;
      expect(relative((s.r + l.driverHigh) * s.c, periods * l.period)).toBeLessThan(1e-12);
    }
  });

  it('two stages: the slowest time constant from the 2x2 state matrix, by the quadratic formula', () => {
    // Node equations (Kirchhoff's current law), driver in series with R1, load on node 2:
    // A = [[-(g1 + g2)/C1, g2/C1], [g2/C2, -(g2 + gL)/C2]]; eigenvalues from
    // lambda^2 - tr(A) lambda + det(A) = 0; the slowest time constant is -1/lambda for the
    // eigenvalue nearest zero (textbook linear algebra).
    for (const periods of [10, 1e3, 1e7]) {
      const l = ladderWithSlowestTau(2, periods);
      const [s1, s2] = l.stages;
      const g1 = 1 / (s1.r + l.driverHigh);
      const g2 = 1 / s2.r;
      const gl = 1 / l.loadResistance!;
      const a = [-(g1 + g2) / s1.c, g2 / s1.c, g2 / s2.c, -(g2 + gl) / s2.c];
      const trace = a[0] + a[3];
      const det = a[0] * a[3] - a[1] * a[2];
      const slowest = (trace + Math.sqrt(trace * trace - 4 * det)) / 2;
      expect(relative(-1 / slowest, periods * l.period)).toBeLessThan(1e-9);
      expect(l.driverHigh).toBe(l.driverLow); // the mean driver is the driver
    }
  });

  it('ODE cases have a slowest time constant of a few tens of periods or less', () => {
    const [one] = odeCases;
    const s = one.ladder.stages[0];
    expect(s.r * s.c / one.ladder.period).toBeCloseTo(30, 9);
  });
});
