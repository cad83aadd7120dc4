import { describe, expect, it } from 'vitest';
import { interleavedTimePerCall, median, timePerCall } from '../../scripts/bench-measure.js';
import { formatNumber } from '../../scripts/bench-table.js';

describe('bench helpers', () => {
  it('median: middle value, or the mean of the middle two (definition, common practice)', () => {
    expect(median([5, 1, 3])).toBe(3);
    expect(median([4, 1, 3, 2])).toBe(2.5);
    expect(median([7])).toBe(7);
    expect(() => median([])).toThrow(RangeError);
  });

  it('timePerCall counts every timed call and reports one figure per run', () => {
    let calls = 0;
    const t = timePerCall(() => calls++, { runs: 3, runSeconds: 0.001, warmup: false });
    expect(t.runs).toHaveLength(3);
    expect(t.calls).toBe(calls);
    expect(t.perCall).toBe(median(t.runs));
  });

  it('interleavedTimePerCall keeps each piece of work apart and runs them in turn', () => {
    const order: string[] = [];
    const counts = { a: 0, b: 0 };
    const works = (['a', 'b'] as const).map((k) => () => {
      if (order.at(-1) !== k) order.push(k);
      counts[k]++;
    });
    const [a, b] = interleavedTimePerCall(works, { runs: 2, runSeconds: 0.001, warmup: false });
    expect(order).toEqual(['a', 'b', 'a', 'b']);
    expect([a.calls, b.calls]).toEqual([counts.a, counts.b]);
    expect(a.runs).toHaveLength(2);
  });

  it('formatNumber: three significant digits, exponent outside 1e-3..1e6', () => {
    expect(formatNumber(1234.567)).toBe('1230');
    expect(formatNumber(0.012345)).toBe('0.0123');
    expect(formatNumber(42)).toBe('42');
    expect(formatNumber(2.5e7)).toBe('2.50e+7');
    expect(formatNumber(1e-6)).toBe('1.00e-6');
  });
});
