import { engineOfCircuit, plausibilityWarnings, type Warning } from '../engine/index.js';
import type { Project } from '../project/types.js';
import type { MonteCarloResult } from './monteCarlo.js';
import { monteCarloParallel, type ParallelOptions } from './parallel.js';
import { toleranceCircuitOf, type ToleranceCircuit } from './toleranceCircuit.js';
import { toleranceWarnings } from './toleranceWarnings.js';
import { worstCase, type WorstCaseResult } from './worstCase.js';

/** Worst case and Monte Carlo of one circuit. */
export interface ToleranceStudyResult {
  worstCase: WorstCaseResult;
  monteCarlo: MonteCarloResult;
  /** Every limited figure passes at its worst case, and the yield meets its target. */
  pass: boolean;
  /** Plausibility warnings of the nominal project, and what the study leaves fixed (never change `pass`). */
  warnings: Warning[];
}

/**
 * The full tolerance study behind `dacsmith tolerance`: worst case over the tolerance box (each
 * worst point confirmed by the engine), the Monte Carlo yield and the plausibility warnings of the
 * nominal circuit, for a ladder or a network (second PWM output, Sallen-Key stages; model.md 1.1).
 *
 * Method: the circuit's engine refuses a circuit outside the numerical domain first
 * (engineOfCircuit); worstCase and monteCarloParallel (see there), the worst case on this thread
 * while the Monte Carlo workers start (monteCarloParallel's `alongside`); plausibilityWarnings and
 * toleranceWarnings.
 *
 * Syntax: await toleranceStudy(project[, circuit, { samples, seed, distribution, workers, onProgress }])
 * Example: (await toleranceStudy(p)).pass
 */
export async function toleranceStudy(
  project: Project,
  circuit: ToleranceCircuit = toleranceCircuitOf(project),
  options: ParallelOptions = {},
): Promise<ToleranceStudyResult> {
  const engine = engineOfCircuit(circuit, project.file);
  // The command's study covers the gain check too (model.md 1.1), as analyze and check do. The
  // worst case runs on this thread while the Monte Carlo workers start and take samples.
  let wc: WorstCaseResult | undefined;
  const mc = await monteCarloParallel(project, circuit, {
    ...options,
    gain: true,
    alongside: () => {
      options.alongside?.();
      wc = worstCase(project, circuit, { confirmWithEngine: true, gain: true });
    },
  });
  if (!wc) throw new Error('toleranceStudy: the worst case did not run');
  const warnings = [
    ...plausibilityWarnings(project, engine.warningFigures(project.pwm.duty.min, project.pwm.duty.max)),
    ...toleranceWarnings(project, circuit),
  ];
  return { worstCase: wc, monteCarlo: mc, pass: wc.pass && mc.pass, warnings };
}
