import { describe, expect, it } from 'vitest';
import { largestPinDriveStep, pinDriveStep } from '../../src/design/pinDriveStep.js';

// Hand-worked cases (derived here: a linear function of the node average m, least size at an end of
// [min(low, high, 0), max(low, high, 0)] unless it changes sign inside).
describe('pinDriveStep: the least size of the pin drive step over node averages', () => {
  it('is g (high - low) for equal drivers, whatever the node average', () => {
    expect(pinDriveStep({ driverHigh: 25, driverLow: 25, high: 3.3, low: 0 }, 475)).toBeCloseTo(3.3 / 500, 15);
    expect(pinDriveStep({ driverHigh: 40, driverLow: 40, high: 5, low: -5 }, 960)).toBeCloseTo(10 / 1000, 15);
  });

  it('takes the weaker phase at the worse end for unequal drivers (0 V low level)', () => {
    // m = 0: g_H 3.3; m = 3.3: g_L 3.3; the least is the smaller conductance's
    const gH = 1 / (40 + 460);
    const gL = 1 / (25 + 460);
    expect(pinDriveStep({ driverHigh: 40, driverLow: 25, high: 3.3, low: 0 }, 460)).toBeCloseTo(Math.min(gH, gL) * 3.3, 15);
  });

  it('is 0 when the step can vanish inside the node range (levels of one sign, unequal drivers)', () => {
    // high 5, low 1, range [0, 5]: g_H (5 - m) - g_L (1 - m) is 0 at m = (5 g_H - g_L) / (g_H - g_L) when that lies in [0, 5]
    const gH = 1 / 200;
    const gL = 1 / 20;
    const m = (5 * gH - gL) / (gH - gL);
    expect(m).toBeGreaterThan(0);
    expect(m).toBeLessThan(5);
    expect(pinDriveStep({ driverHigh: 200, driverLow: 20, high: 5, low: 1 }, 0)).toBe(0);
  });
});

describe('largestPinDriveStep: the largest size of the pin drive step over node averages', () => {
  it('is g (high - low) for equal drivers, and the stronger phase at the better end for unequal ones', () => {
    // hand-worked as above: m = 0 gives g_H 3.3, m = 3.3 gives g_L 3.3
    expect(largestPinDriveStep({ driverHigh: 25, driverLow: 25, high: 3.3, low: 0 }, 475)).toBeCloseTo(3.3 / 500, 15);
    expect(largestPinDriveStep({ driverHigh: 40, driverLow: 25, high: 3.3, low: 0 }, 460)).toBeCloseTo(3.3 / 485, 15);
  });

  it('takes the larger end where the step changes sign inside (high 5, low 1, range [0, 5])', () => {
    // m = 0: 5 g_H - g_L = 0.025 - 0.05 = -0.025; m = 5: g_L 4 = 0.2
    expect(largestPinDriveStep({ driverHigh: 200, driverLow: 20, high: 5, low: 1 }, 0)).toBeCloseTo(0.2, 15);
  });
});
