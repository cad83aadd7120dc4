import { describe, expect, it } from 'vitest';
import { axisFormatter } from '../../src/report/axis.js';
import { lineChart } from '../../src/report/lineChart.js';

describe('axisFormatter', () => {
  it('uses one SI prefix for the whole axis (SI Brochure prefixes) and enough decimals per step', () => {
    const f = axisFormatter(-2e-4, 2e-4, 8, 'V');
    expect(f(1e-4)).toBe('100 µV');
    expect(f(-2e-4)).toBe('-200 µV');
    expect(axisFormatter(0, 1, 6, 'V')(5 / 6)).toBe('0.83 V');
    const g = axisFormatter(1.6, 1.7, 10, 'V');
    expect(g(1.65)).toBe('1.650 V');
    expect(axisFormatter(-120, 0, 10, 'dB', false)(-60)).toBe('-60 dB');
  });
});

describe('lineChart', () => {
  const n = 41;
  const spike = Array.from({ length: n }, (_, i) => (i === 20 ? 1 : 0));
  const chart = lineChart([spike], {
    height: 6,
    yUnit: 'V',
    x: { start: 0, end: 40e-3, unit: 's' },
    markers: [{ x: 20e-3, symbol: 'S', label: 'the spike' }],
  });
  const lines = chart.split('\n');

  it('draws the marker under the column of the sample at that x', () => {
    const top = lines[0];
    const axis = lines.find((l) => l.includes('└'))!;
    const yAxis = [...top].findIndex((ch) => ch === '┤' || ch === '┼');
    const peakColumn = [...top].findIndex((ch, i) => i > yAxis && ch !== ' ');
    expect(peakColumn).toBeGreaterThan(yAxis + 10);
    expect([...axis].indexOf('S')).toBe(peakColumn);
  });

  it('labels the y axis in engineering units and the x range at both ends', () => {
    expect(lines[0]).toMatch(/^ *1\.0+ V [┤┼]/);
    expect(chart).toMatch(/\n *0 ms\s+40 ms\n/);
    expect(lines.at(-1)).toMatch(/S the spike$/);
  });

  it('clips values outside a fixed y range and survives non-finite values', () => {
    const c = lineChart([[0, 5, Number.NEGATIVE_INFINITY, 0.5]], {
      height: 4,
      yUnit: 'V',
      yRange: { min: 0, max: 1 },
      x: { start: 0, end: 3, unit: 's' },
    });
    expect(c.split('\n')[0]).toMatch(/^\s*1\.0+ V/);
    expect(c).not.toMatch(/NaN|Infinity/);
  });
});
