import { ladderFromProject } from '../project/ladderFromProject.js';
import type { Ladder } from '../circuit/ladder.js';
import { checkNumericalDomain, plausibilityWarnings, warningFigures, type Warning } from '../engine/index.js';
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
  /** Plausibility warnings of the nominal project (never change `pass`). */
  warnings: Warning[];
}

/**
 * The full tolerance study behind `dacsmith tolerance`: worst case over the tolerance box (each
 * worst point confirmed by the engine), the Monte Carlo yield and the plausibility warnings of the
 * nominal circuit.
 *
 * Method: worstCase and monteCarloParallel (see there); plausibilityWarnings.
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
  // The command's study covers the gain check too (model.md 1.1), as analyze and check do.
  const wc = worstCase(project, ladder, { confirmWithEngine: true, gain: true });
  const mc = await monteCarloParallel(project, ladder, { ...options, gain: true });
  const warnings = plausibilityWarnings(project, warningFigures(ladder, project.pwm.duty.min, project.pwm.duty.max));
  return { worstCase: wc, monteCarlo: mc, pass: wc.pass && mc.pass, warnings };
}
