import type { MetricPlan } from './metricPlan.js';
import type { SampleTable } from './evaluateSamples.js';
import { percentiles, wilsonInterval, type Percentiles } from '../numeric/statistics.js';
import { meetsLimit, type SpecName } from './passesLimits.js';

export type { SpecName };

/** Yield and distribution figures of a Monte Carlo run. */
export interface SampleSummary {
  /** Samples meeting every spec limit / all samples (1 when the project sets no limit). */
  yield: number;
  passed: number;
  /** 95 % confidence interval of the yield (Wilson score). */
  yieldInterval: [number, number];
  /** Yield against each limit alone. */
  yieldBySpec: Partial<Record<SpecName, number>>;
  /**
   * Of worst ripple (V), |droop| (V), |INL| (V), |gain error| (fraction of full scale) and settling
   * time (s; Infinity = never settles).
   */
  percentiles: {
    worstRipple: Percentiles;
    droop: Percentiles;
    inl: Percentiles | null;
    gain: Percentiles | null;
    settlingTime: Percentiles;
  };
  /** Samples that never settle. */
  neverSettles: number;
}

/**
 * Yield overall and per spec, its confidence interval, and percentiles of each figure.
 *
 * Method: a sample passes a limit by meetsLimit (passesLimits.ts: at most the limit, |droop|,
 * |INL|, |gain error|; a step that never settles fails), as analyze's checks do; the yield is the passing fraction, with a
 * Wilson score interval (statistics.ts); percentiles by Hyndman-Fan definition 7.
 *
 * Syntax: summarizeSamples(table, plan)
 * Example: summarizeSamples(table, plan).yieldBySpec.ripple  // 0.9987
 */
export function summarizeSamples(table: SampleTable, plan: MetricPlan): SampleSummary {
  const n = table.worstRipple.length;
  const { limits } = plan;
  // One column per spec (INL and gain error only when computed); meetsLimit is the one rule.
  const columns: Array<[SpecName, number | undefined, Float64Array | null]> = [
    ['ripple', limits.ripple, table.worstRipple],
    ['droop', limits.droop, table.droop],
    ['inl', limits.inl, table.inl],
    ['gain', limits.gain, table.gain],
    ['settling', limits.settling, table.settlingTime],
  ];
  const tests: Array<[SpecName, (i: number) => boolean]> = [];
  for (const [name, limit, column] of columns) {
    if (limit !== undefined && column) tests.push([name, (i) => meetsLimit(name, column[i], limit)]);
  }
  const perSpec = new Array<number>(tests.length).fill(0);
  let passed = 0;
  let never = 0;
  for (let i = 0; i < n; i++) {
    let all = true;
    for (let t = 0; t < tests.length; t++) {
      if (tests[t][1](i)) perSpec[t]++;
      else all = false;
    }
    if (all) passed++;
    if (!Number.isFinite(table.settlingTime[i])) never++;
  }
  const yieldBySpec: SampleSummary['yieldBySpec'] = {};
  tests.forEach(([name], t) => (yieldBySpec[name] = n > 0 ? perSpec[t] / n : 1));
  return {
    yield: n > 0 ? passed / n : 1,
    passed,
    yieldInterval: wilsonInterval(passed, n),
    yieldBySpec,
    percentiles: {
      worstRipple: percentiles(table.worstRipple),
      droop: percentiles(table.droop.map(Math.abs)),
      inl: table.inl ? percentiles(table.inl.map(Math.abs)) : null,
      gain: table.gain ? percentiles(table.gain.map(Math.abs)) : null,
      settlingTime: percentiles(table.settlingTime),
    },
    neverSettles: never,
  };
}
