import { describe, expect, it } from 'vitest';
import { envelope } from '../../src/report/charts.js';

describe('envelope', () => {
  it('places samples by time, not by index: a record with a gap keeps its dense part at the left', () => {
    // Source: the chart's x axis is linear in time (lineChart.ts), column c at c tEnd / (columns - 1).
    const t = [...Array.from({ length: 11 }, (_, i) => i * 0.01), 10];
    const v = [...Array.from({ length: 11 }, (_, i) => i), -5];
    const { lower, upper } = envelope({ t, v }, 11);
    expect(lower[0]).toBe(0);
    expect(upper[0]).toBe(10);
    expect(lower[10]).toBe(-5);
    expect(upper[10]).toBe(-5);
    // columns 1..9 hold no sample: they repeat their left neighbour
    for (let c = 1; c < 10; c++) expect([lower[c], upper[c]]).toEqual([0, 10]);
  });

  it('puts an instant in the column where lineChart draws it (rounded to the nearest column)', () => {
    // Source: lineChart.ts places x at round((x - start) / (end - start) (n - 1)).
    // columns at 0, 0.25, 0.5, 0.75, 1: 0.12 rounds to the first, 0.13 to the second, ...
    const t = [0, 0.12, 0.13, 0.62, 0.63, 1];
    const v = [1, 2, 3, 4, 5, 6];
    const { lower, upper } = envelope({ t, v }, 5);
    expect(lower).toEqual([1, 3, 4, 5, 6]);
    expect(upper).toEqual([2, 3, 4, 5, 6]);
  });

  it('spans every sample of a column', () => {
    // Source: definition of an envelope (per-column min and max; common practice).
    const t = Array.from({ length: 101 }, (_, i) => i);
    const v = t.map((x) => Math.sin(x));
    const { lower, upper } = envelope({ t, v }, 10);
    v.forEach((x, i) => {
      const c = Math.round((i / 100) * 9);
      expect(lower[c]).toBeLessThanOrEqual(x);
      expect(upper[c]).toBeGreaterThanOrEqual(x);
    });
  });
});
