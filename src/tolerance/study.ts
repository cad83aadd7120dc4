import { ladderFromProject } from '../circuit/fromProject.js';
import type { Ladder } from '../circuit/ladder.js';
import { checkNumericalDomain } from '../engine/index.js';
import type { Project } from '../project/types.js';
import type { MonteCarloResult } from './monteCarlo.js';
import { monteCarloParallel, type ParallelOptions } from './parallel.js';
import { worstCase, type WorstCaseResult } from './worstCase.js';

/** Worst case and Monte Carlo of one ladder. */
export interface ToleranceStudyResult {
  worstCase: WorstCaseResult;
  monteCarlo: MonteCarloResult;
  /** Every limited figure passes at its worst case, and the yield meets its target. */
  pass: boolean;
}

/**
 * The full tolerance study behind `dacsmith tolerance`: worst case over the tolerance box (each
 * worst point confirmed by the engine) and the Monte Carlo yield.
 *
 * Method: worstCase and monteCarloParallel (see there).
 *
 * Syntax: await toleranceStudy(project[, ladder, { samples, seed, distribution, workers, onProgress }])
 * Example: (await toleranceStudy(p)).pass
 */
export async function toleranceStudy(
  project: Project,
  ladder: Ladder = ladderFromProject(project),
  options: ParallelOptions = {},
): Promise<ToleranceStudyResult> {
  checkNumericalDomain(ladder, project.file);
  const wc = worstCase(project, ladder, { confirmWithEngine: true });
  const mc = await monteCarloParallel(project, ladder, options);
  return { worstCase: wc, monteCarlo: mc, pass: wc.pass && mc.pass };
}
