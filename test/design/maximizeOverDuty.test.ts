import { describe, expect, it } from 'vitest';
import { maximizeOverDuty } from '../../src/design/maximizeOverDuty.js';

describe('maximizeOverDuty', () => {
  it('finds the largest D (1 - D), 1/4 at D = 1/2 (closed form: the one-stage ripple shape)', () => {
    expect(maximizeOverDuty((d) => d * (1 - d), 0.05, 0.95)).toBeCloseTo(0.25, 12);
  });

  it('is a lower bound: never above the true maximum, and at an end when f is monotone', () => {
    // |sin(7 d)| peaks at d = pi/14 + k pi/7 with value 1 (closed form)
    const v = maximizeOverDuty((d) => Math.abs(Math.sin(7 * d)), 0, 1);
    expect(v).toBeLessThanOrEqual(1);
    expect(v).toBeGreaterThan(1 - 1e-12);
    expect(maximizeOverDuty((d) => d, 0.1, 0.9)).toBe(0.9);
    expect(maximizeOverDuty((d) => 1 - d, 0.1, 0.9)).toBe(0.9);
  });

  it('returns f(dutyMin) on a single duty', () => {
    expect(maximizeOverDuty((d) => 2 * d, 0.4, 0.4)).toBe(0.8);
  });
});
