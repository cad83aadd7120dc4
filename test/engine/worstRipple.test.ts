import { describe, expect, it } from 'vitest';
import { worstRipple } from '../../src/engine/worstRipple.js';
import { steadyState } from '../../src/engine/steadyState.js';
import { ladder, oneStageWithRatio, relative, stage } from './ladders.js';

describe('worstRipple', () => {
  it('one stage, equal drivers: the maximum is at D = 1/2 with the closed-form ripple', () => {
    // Source: the one-stage closed form V (1-e^(-DT/tau))(1-e^(-(1-D)T/tau))/(1-e^(-T/tau)) is
    // symmetric in D <-> 1 - D and unimodal, so its maximum is at D = 1/2:
    // V tanh(T/(4 tau)) (from the same formula; textbook RC result).
    for (const ratio of [0.5, 10, 1e4]) {
      const w = worstRipple(oneStageWithRatio(ratio), 0.05, 0.95);
      expect(Math.abs(w.duty - 0.5)).toBeLessThan(1e-4);
      expect(relative(w.ripple, 3.3 * Math.tanh(1 / (4 * ratio)))).toBeLessThan(1e-9);
    }
  });

  it('a range away from 1/2 peaks at its end nearest 1/2', () => {
    // Source: same closed form, increasing on [0, 1/2].
    const w = worstRipple(oneStageWithRatio(10), 0.6, 0.9);
    expect(w.duty).toBe(0.6);
    expect(w.ripple).toBe(steadyState(oneStageWithRatio(10), 0.6).ripple);
  });

  it('matches a fine duty grid on a loaded two-stage ladder with unequal drivers', () => {
    // Source: definition (largest ripple over the range), checked against 401 grid duties: the
    // search may only do better than the grid, and by little.
    const l = ladder([stage(1e3, 220e-9), stage(4.7e3, 47e-9)], { driverHigh: 60, driverLow: 20, loadResistance: 22e3 });
    const w = worstRipple(l, 0.05, 0.95);
    let best = 0;
    for (let i = 0; i <= 400; i++) best = Math.max(best, steadyState(l, 0.05 + (0.9 * i) / 400).ripple);
    expect(w.ripple).toBeGreaterThanOrEqual(best);
    expect(w.ripple).toBeLessThan(best * (1 + 1e-6));
  });

  it('rejects a backwards range', () => {
    expect(() => worstRipple(oneStageWithRatio(1), 0.9, 0.1)).toThrow(RangeError);
  });
});
