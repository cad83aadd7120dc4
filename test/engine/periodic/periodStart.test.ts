import { describe, expect, it } from 'vitest';
import { periodStart } from '../../../src/engine/periodic/periodStart.js';

describe('periodStart', () => {
  it('one RC stage under a square wave: the textbook start value V e2 (1 - e1) / (1 - e1 e2)', () => {
    // First-order low-pass driven high for t1, low for t2 (textbook RC charging and discharging,
    // e.g. Horowitz & Hill, The Art of Electronics, ch. 1; written from memory): at the rising
    // edge x_s = V (1 - e1) e2 / (1 - e1 e2), e_i = exp(-t_i / RC).
    const V = 3.3;
    const tau = 1e-3;
    for (const [t1, t2] of [[2e-5, 3e-5], [1e-6, 9e-5], [4e-3, 1e-3]]) {
      const e1 = Math.exp(-t1 / tau);
      const e2 = Math.exp(-t2 / tau);
      const phases = [
        { duration: t1, xStar: [V], E: [e1], K: [-Math.expm1(-t1 / tau)] },
        { duration: t2, xStar: [0], E: [e2], K: [-Math.expm1(-t2 / tau)] },
      ];
      const { start, S } = periodStart(phases, 1, t1 + t2);
      expect(start[0]).toBeCloseTo((V * (1 - e1) * e2) / (1 - e1 * e2), 12);
      expect(S[0]).toBeCloseTo(1 - e1 * e2, 14); // I - M
    }
  });

  it('two coupled states, three phases: a fixed point of the period map found by plain iteration', () => {
    // Independent method: iterate x <- x* + E (x - x*) phase by phase until it stops moving.
    const E = (a: number, b: number, c: number, d: number) => [a, b, c, d];
    const phases = [
      { duration: 1, xStar: [2, 1], E: E(0.7, 0.1, 0.05, 0.8) },
      { duration: 2, xStar: [0, 0.5], E: E(0.5, 0.2, 0.1, 0.6) },
      { duration: 1.5, xStar: [1, -1], E: E(0.9, 0.02, 0.03, 0.85) },
    ].map((p) => ({ ...p, K: [1 - p.E[0], -p.E[1], -p.E[2], 1 - p.E[3]] }));
    let x = [0, 0];
    for (let k = 0; k < 2000; k++) {
      for (const p of phases) {
        const d = [x[0] - p.xStar[0], x[1] - p.xStar[1]];
        x = [p.xStar[0] + p.E[0] * d[0] + p.E[1] * d[1], p.xStar[1] + p.E[2] * d[0] + p.E[3] * d[1]];
      }
    }
    const { start } = periodStart(phases, 2, 4.5);
    expect(start[0]).toBeCloseTo(x[0], 12);
    expect(start[1]).toBeCloseTo(x[1], 12);
  });
});
