import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { capacitorWorkingVoltage } from '../../src/engine/capacitorWorkingVoltage.js';
import { steadyState } from '../../src/engine/index.js';
import { steadyWaveform } from '../../src/engine/steadyWaveform.js';
import { suggestedCapacitorRating } from '../../src/engine/suggestedCapacitorRating.js';
import { ladderArb } from './arbitraries.js';
import { ladder, stage } from './ladders.js';

describe('suggestedCapacitorRating', () => {
  // Standard ratings 6.3/10/16/25/35/50/63/100 V and the 1.5x derating: common practice (from memory).
  it.each([
    [3.3, 6.3], // 4.95 V needed
    [4.2, 6.3], // exactly 6.3 V needed: that rating suffices
    [5, 10], // 7.5 V
    [12, 25], // 18 V
    [24, 50], // 36 V
    [48, 100], // 72 V
  ])('working %s V -> %s V', (working, rating) => {
    expect(suggestedCapacitorRating(working)).toBe(rating);
  });

  it('takes a larger factor and the magnitude of a negative level, and gives up above 1 kV', () => {
    expect(suggestedCapacitorRating(5, 2)).toBe(10);
    expect(suggestedCapacitorRating(5.1, 2)).toBe(16);
    expect(suggestedCapacitorRating(-12)).toBe(25);
    expect(suggestedCapacitorRating(700)).toBeNull();
  });
});

describe('capacitorWorkingVoltage', () => {
  it('is reached at 100 % duty by an open ladder (every node charges to the high level)', () => {
    const l = ladder([stage(1e3, 1e-6), stage(10e3, 100e-9)], { high: 5 });
    expect(capacitorWorkingVoltage(l)).toBe(5);
    expect(steadyState(l, 1).average).toBeCloseTo(5, 9);
  });

  it('bounds the output of random ladders at every sampled instant (maximum principle of RC networks)', () => {
    fc.assert(
      fc.property(ladderArb, fc.double({ min: 0, max: 1, noNaN: true }), (l, duty) => {
        const bound = capacitorWorkingVoltage(l);
        const w = steadyWaveform(l, duty, 1, 16);
        // 1e-9 of full scale: rounding of the exact solution.
        return w.v.every((v) => Math.abs(v) <= bound * (1 + 1e-9));
      }),
      { numRuns: 100 },
    );
  });
});
