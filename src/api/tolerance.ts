import { toleranceStudy } from '../tolerance/index.js';
import { toleranceJson } from '../report/tolerance.js';
import { projectOf, type ProjectInput } from './projectOf.js';

export interface ToleranceApiOptions {
  /** Monte Carlo samples (default: tolerance.samples, else 10 000). */
  samples?: number;
  /** Random seed (default: tolerance.seed); the same seed gives the same result. */
  seed?: number;
  distribution?: 'normal' | 'uniform';
  /** Threads for the Monte Carlo run, this one included (default 1 here). */
  workers?: number;
}

/**
 * Worst case over the tolerance box and the seeded Monte Carlo yield: the object
 * `dacsmith tolerance FILE --format json` prints (worstCase, monteCarlo, limits, warnings, pass).
 * Asynchronous, since large runs may be spread over worker threads.
 *
 * Syntax: await tolerance(input[, { samples, seed, distribution, workers }])
 * Example: (await tolerance('board.yaml', { samples: 2000, seed: 7 })).monteCarlo.yield
 */
export async function tolerance(input: ProjectInput, options: ToleranceApiOptions = {}) {
  const project = projectOf(input, 'tolerance');
  const study = await toleranceStudy(project, undefined, { workers: 1, ...options });
  return toleranceJson(project, study);
}
