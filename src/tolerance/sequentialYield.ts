import type { Ladder } from '../circuit/ladder.js';
import { wilsonInterval } from '../numeric/statistics.js';
import type { Project } from '../project/types.js';
import { countPassing } from './countPassing.js';
import { drawDeviates, type Distribution } from './deviates.js';
import { monteCarloSetup } from './monteCarlo.js';

export interface SequentialYield {
  /** Passing share of the samples drawn, 0..1. */
  yield: number;
  /** Samples evaluated (at most the cap). */
  samples: number;
  pass: boolean;
  /** Wilson interval of the yield (z = SEQUENTIAL_Z) when sampling stopped. */
  interval: [number, number];
  /** Sampling stopped before the cap because the interval cleared the target. */
  early: boolean;
}

/** Samples per look (at least; larger caps take larger batches, so there are at most LOOKS looks). */
export const SEQUENTIAL_BATCH = 250;
const LOOKS = 8;
/**
 * Normal quantile of each look's interval: 3 gives 99.73 % two-sided per look; over at most 8
 * looks the chance that any look's interval misses the true yield is at most 8 x 0.27 % = 2.2 %
 * (Bonferroni's inequality), so every early verdict holds with at least 97 % confidence.
 */
export const SEQUENTIAL_Z = 3;

/**
 * Monte Carlo yield of one design against a target with a sequential stopping rule: samples are
 * evaluated in batches, and sampling stops as soon as the confidence interval of the yield lies
 * wholly above the target (pass) or wholly below it (fail); at the cap the point estimate decides,
 * exactly as one run of `cap` samples would (the same seeded deviates, drawn up front).
 *
 * Method: Wilson score interval (E. B. Wilson, "Probable inference, the law of succession, and
 * statistical inference", JASA 22(158), 1927; numeric/statistics.ts) at z = 3 after each batch
 * (250 samples, or cap / 8 when larger), with a Bonferroni bound over the looks (SEQUENTIAL_Z). A group-sequential test with a
 * constant boundary, conservative against repeated looks; samples from monteCarloSetup (the
 * project's seed and distribution), counted as monteCarlo.ts would count them (countPassing).
 *
 * Syntax: sequentialYield(project, ladder, target, cap)
 * Example: sequentialYield(p, ladder, 0.99, 2000)   // { yield: 1, samples: 1000, pass: true, early: true, ... }
 */
export function sequentialYield(project: Project, ladder: Ladder, target: number, cap: number): SequentialYield {
  const setup = monteCarloSetup(project, ladder, { samples: cap }, sharedDraw);
  let passed = 0;
  let n = 0;
  const batch = Math.max(SEQUENTIAL_BATCH, Math.ceil(cap / LOOKS));
  while (n < cap) {
    const last = Math.min(cap, n + batch);
    // the count alone: summarizeSamples(evaluateSamples(...)).passed, with less work (countPassing.ts)
    passed += countPassing(setup.circuit, setup.parameters, setup.plan, setup.deviates, n, last);
    n = last;
    const interval = wilsonInterval(passed, n, SEQUENTIAL_Z);
    const early = n < cap && (interval[0] >= target || interval[1] < target);
    if (early || n === cap) {
      const share = passed / n;
      return { yield: share, samples: n, pass: early ? interval[0] >= target : share >= target, interval, early };
    }
  }
  throw new Error('sequentialYield: cap must be a whole number >= 1');
}

/**
 * drawDeviates with the last table kept: the robust search checks design after design with the
 * same cap, parameter count, seed and distribution, so each gets the same table (read only; the
 * samples never write it) without drawing it again.
 */
function sharedDraw(count: number, width: number, seed: number, distribution: Distribution): Float64Array {
  const k = LAST_DRAW;
  if (k.table === null || k.count !== count || k.width !== width || k.seed !== seed || k.distribution !== distribution) {
    k.table = drawDeviates(count, width, seed, distribution);
    k.count = count;
    k.width = width;
    k.seed = seed;
    k.distribution = distribution;
  }
  return k.table;
}

const LAST_DRAW: { table: Float64Array | null; count: number; width: number; seed: number; distribution: Distribution } = {
  table: null,
  count: 0,
  width: 0,
  seed: 0,
  distribution: 'normal',
};
