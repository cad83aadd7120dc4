import { describe, expect, it } from 'vitest';
import { E_SERIES, E_SERIES_NAMES, nearestInSeries, seriesValues, type ESeries } from '../../src/units/index.js';

const N: Record<ESeries, number> = { E3: 3, E6: 6, E12: 12, E24: 24, E48: 48, E96: 96, E192: 192 };

describe('E-series tables of IEC 60063:2015', () => {
  it('hold N values per decade, ascending, from 1.0 up to below 10', () => {
    for (const name of E_SERIES_NAMES) {
      const table = E_SERIES[name];
      expect(table).toHaveLength(N[name]);
      expect([...table].sort((a, b) => a - b)).toEqual(table);
      expect(table[0]).toBe(N[name] <= 24 ? 10 : 100);
    }
  });

  it('E3..E24: as published (typed from memory of IEC 60063), each a subset of the next', () => {
    // IEC 60063 E24 (two significant figures), from memory of the standard's table.
    expect(E_SERIES.E24).toEqual([10, 11, 12, 13, 15, 16, 18, 20, 22, 24, 27, 30, 33, 36, 39, 43, 47, 51, 56, 62, 68, 75, 82, 91]);
    expect(E_SERIES.E12).toEqual([10, 12, 15, 18, 22, 27, 33, 39, 47, 56, 68, 82]);
    expect(E_SERIES.E6).toEqual([10, 15, 22, 33, 47, 68]);
    expect(E_SERIES.E3).toEqual([10, 22, 47]);
    // Structure described by the standard: E(N/2) is every second value of E(N).
    expect(E_SERIES.E24.filter((_, i) => i % 2 === 0)).toEqual(E_SERIES.E12);
    expect(E_SERIES.E12.filter((_, i) => i % 2 === 0)).toEqual(E_SERIES.E6);
    expect(E_SERIES.E6.filter((_, i) => i % 2 === 0)).toEqual(E_SERIES.E3);
  });

  it('E24 departs from round(10^(i/24), 2 figures) exactly at the historic values of IEC 60063', () => {
    // The E24 (and hence E12, E6, E3) values predate the formula; IEC 60063 keeps them. These
    // eight are the ones that differ: 2.7 3.0 3.3 3.6 3.9 4.3 4.7 8.2.
    const differing = E_SERIES.E24.filter((v, i) => v !== Math.round(10 * 10 ** (i / 24)));
    expect(differing).toEqual([27, 30, 33, 36, 39, 43, 47, 82]);
  });

  it('E48, E96, E192 follow round(10^(i/N), 3 figures), the rule IEC 60063 gives, except E192 9.20', () => {
    // IEC 60063 lists 9.20 in E192 where the rule gives 9.19 (10^(185/192) = 9.1948...).
    for (const name of ['E48', 'E96', 'E192'] as const) {
      const table = E_SERIES[name];
      const differing = table
        .map((v, i) => ({ i, v, rule: Math.round(100 * 10 ** (i / N[name])) }))
        .filter((x) => x.v !== x.rule);
      expect(differing).toEqual(name === 'E192' ? [{ i: 185, v: 920, rule: 919 }] : []);
    }
    expect(E_SERIES.E192.filter((_, i) => i % 2 === 0)).toEqual(E_SERIES.E96);
    expect(E_SERIES.E96.filter((_, i) => i % 2 === 0)).toEqual(E_SERIES.E48);
  });
});

describe('seriesValues', () => {
  it('lists values over decades, bounds included, as the doubles nearest the nominal values', () => {
    expect(seriesValues('E6', 1e-9, 10e-9)).toEqual([1e-9, 1.5e-9, 2.2e-9, 3.3e-9, 4.7e-9, 6.8e-9, 1e-8]);
    expect(seriesValues('E3', 1, 1000)).toEqual([1, 2.2, 4.7, 10, 22, 47, 100, 220, 470, 1000]);
    expect(seriesValues('E12', 3.9e3, 5.6e3)).toEqual([3900, 4700, 5600]);
    // 4.7e-9 must be the literal's double, not 4.7 * 1e-9 (which is 4.7000000000000004e-9).
    expect(seriesValues('E24', 4e-9, 5e-9)).toContain(4.7e-9);
  });

  it('has N values per decade over many decades, each a literal double', () => {
    for (const name of E_SERIES_NAMES) {
      const values = seriesValues(name, 1e-12, 0.99e-6);
      expect(values).toHaveLength(6 * N[name]);
      for (const v of values) expect(v).toBe(Number(v.toPrecision(3)));
    }
  });

  it('tolerates computed bounds that miss a value by rounding (relative slack 1e-9), no more', () => {
    expect(seriesValues('E12', 4.7e-9 * (1 + 1e-12), 5e-9)).toEqual([4.7e-9]);
    expect(seriesValues('E12', 4e-9, 4.7e-9 * (1 - 1e-12))).toEqual([4.7e-9]);
    expect(seriesValues('E12', 4.7e-9 * (1 + 1e-6), 5e-9)).toEqual([]);
  });

  it('refuses empty or meaningless ranges', () => {
    expect(() => seriesValues('E12', 0, 1)).toThrow(RangeError);
    expect(() => seriesValues('E12', 2, 1)).toThrow(RangeError);
    expect(() => seriesValues('E7' as ESeries, 1, 2)).toThrow(/unknown series/);
  });
});

describe('nearestInSeries', () => {
  it('picks the nearest value by ratio', () => {
    expect(nearestInSeries(5000, 'E12')).toBe(4700);
    expect(nearestInSeries(9.6e-9, 'E24')).toBe(1e-8);
    expect(nearestInSeries(1.04e5, 'E96')).toBe(1.05e5);
    expect(nearestInSeries(0.33, 'E6')).toBe(0.33);
    // By ratio, not difference: between 10 and 15 the geometric midpoint is sqrt(150) = 12.25.
    expect(nearestInSeries(12.2, 'E6')).toBe(10);
    expect(nearestInSeries(12.3, 'E6')).toBe(15);
  });

  it('crosses decade boundaries', () => {
    expect(nearestInSeries(9.9, 'E3')).toBe(10);
    expect(nearestInSeries(0.99e-6, 'E192')).toBe(0.988e-6);
  });

  it('refuses values that are not positive', () => {
    expect(() => nearestInSeries(0, 'E12')).toThrow(RangeError);
    expect(() => nearestInSeries(-1, 'E12')).toThrow(RangeError);
  });
});
