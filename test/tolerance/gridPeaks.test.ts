import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { gridPeaks, maximizeFromHints } from '../../src/tolerance/dutySearch.js';

describe('gridPeaks', () => {
  it('finds both interior peaks of sin 3x + sin(7x)/2 on [0, 3] that its grid sees (mpmath findroot on f\')', () => {
    // local maxima at 0.30349, 0.97963, 2.16196, 2.83811 (kernels.references.py); the 16-cell grid
    // (step 0.1875) resolves the two large ones and the one at 2.838; 0.9796 is a shoulder
    // between grid points and may be merged.
    const peaks = gridPeaks((x) => Math.sin(3 * x) + 0.5 * Math.sin(7 * x), 0, 3);
    expect(peaks.some((p) => Math.abs(p - 0.3034860055224039) < 1e-7)).toBe(true);
    expect(peaks.some((p) => Math.abs(p - 2.161958042660804) < 1e-7)).toBe(true);
    for (const p of peaks) expect(p > 0 && p < 3).toBe(true);
  });

  it('reports no interior peak for a monotone function or an empty range', () => {
    expect(gridPeaks((x) => x, 0, 1)).toEqual([]);
    expect(gridPeaks((x) => -x * x, 0.5, 0.5)).toEqual([]);
  });

  it('finds the peak of D (1 - D) at 1/2 (closed form)', () => {
    const peaks = gridPeaks((d) => d * (1 - d), 0, 1);
    expect(peaks).toHaveLength(1);
    expect(peaks[0]).toBeCloseTo(0.5, 8);
  });
});

describe('maximizeFromHints with the end values given', () => {
  it('is the same search as without them: the same maximum, bit for bit (random sums of sines, random hints)', () => {
    // The reference is the same function evaluating f(a) and f(b) itself (common practice: a cache
    // of values must not change a deterministic search).
    fc.assert(
      fc.property(
        fc.array(fc.tuple(fc.double({ min: -1, max: 1, noNaN: true }), fc.double({ min: 0.5, max: 12, noNaN: true })), { minLength: 1, maxLength: 3 }),
        fc.array(fc.double({ min: 0, max: 1, noNaN: true }), { maxLength: 3 }),
        fc.boolean(),
        (terms, hints, none) => {
          const f = (x: number) => terms.reduce((s, [amp, k]) => s + amp * Math.sin(k * x), 0);
          const a = 0.05;
          const b = 0.95;
          const h = none ? null : hints;
          expect(maximizeFromHints(f, a, b, h, 1e-9, { fa: f(a), fb: f(b) })).toEqual(maximizeFromHints(f, a, b, h, 1e-9));
        },
      ),
      { numRuns: 300, seed: 5 },
    );
  });
});
