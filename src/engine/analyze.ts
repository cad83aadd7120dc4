import { ladderFromProject } from '../project/ladderFromProject.js';
import { networkFromProject } from '../project/networkFromProject.js';
import { analyzeNetwork } from './analyzeNetwork.js';
import type { Ladder } from '../circuit/ladder.js';
import type { Network } from '../circuit/network.js';
import type { Project } from '../project/types.js';
// The modules themselves, not index.ts: index.ts exports analyzeProject, so importing it here would
// make a cycle.
import { checkNumericalDomain } from './numericalDomain.js';
import { cutoff as cutoffFrequency } from './cutoff.js';
import { dcTransfer } from './dcTransfer.js';
import { defaultSettling } from './defaultSettling.js';
import { magnitude } from './magnitude.js';
import { pinPeakCurrent as pinPeak } from './pinPeakCurrent.js';
import { settlingTime } from './settlingTime.js';
import { steadyState } from './steadyState.js';
import { worstRipple as findWorstRipple } from './worstRipple.js';
import { specChecks, type Check } from './checks.js';
import { settlingSteps } from './settlingSteps.js';
import { plausibilityWarnings, type Warning } from './plausibilityWarnings.js';
import { warningFigures } from './warningFigures.js';
import { capacitorWorkingVoltage } from './capacitorWorkingVoltage.js';
import { CAPACITOR_DERATING, suggestedCapacitorRating } from './suggestedCapacitorRating.js';
import type { Analysis, AnalyzeOptions } from './analysisTypes.js';

export type { Check } from './checks.js';
export type { Warning } from './plausibilityWarnings.js';

export type { Analysis, AnalyzeOptions } from './analysisTypes.js';

/** Settling band when the spec gives none: 0.5 LSB, else 0.1 % of full scale (settlingSteps.ts). */
export function defaultBand(project: Project): number {
  return settlingSteps({ ...project, spec: { ...project.spec, settling: undefined } }).band;
}

/**
 * Analyse a project: operating points, worst ripple, DC transfer, settling, cutoff, attenuation at
 * the PWM frequency, pin current, time constants, the spec checks and the plausibility warnings.
 *
 * Method: every figure comes from the exact engine (src/engine); this function only chooses the
 * duties and the settling step and compares the results with the spec (see checks.ts).
 * Settling step: `spec.settling.from`/`to` when given (a missing end defaults to that end of the used
 * duty range), else the slower of the full-range rising and falling steps. Band: `spec.settling.band`,
 * else 0.5 LSB when `pwm.bits` is known, else 0.1 % of full scale.
 *
 * Syntax: analyzeProject(project[, { duties, grid }])
 * Example: analyzeProject(p, { duties: [0.25, 0.5] }).worstRipple.ripple   // V peak-to-peak
 */
export function analyzeProject(project: Project, options: AnalyzeOptions = {}): Analysis {
  const { min: dMin, max: dMax } = project.pwm.duty;
  const duties = options.duties ?? dutyGrid(dMin, dMax, options.grid ?? 11);
  for (const d of duties) {
    if (!(d >= 0 && d <= 1)) throw new RangeError(`duty ${d} is outside 0..1`);
  }
  // A second PWM output or an active stage: the general piecewise-linear engine.
  if (project.network) return analyzeNetwork(project, networkFromProject(project), duties);
  const ladder = ladderFromProject(project);
  checkNumericalDomain(ladder, project.file);

  const { band, steps, defaultStep } = settlingSteps(project);
  const settling = defaultStep ? defaultSettling(ladder, dMin, dMax, band) : settlingTime(ladder, steps[0][0], steps[0][1], band);

  const worstRipple = findWorstRipple(ladder, dMin, dMax);
  const dc = dcTransfer(ladder, dMin, dMax);
  const peak = pinPeak(ladder);
  const checks = specChecks(project, { worstRipple, dc, settling, pinPeakCurrent: peak });
  const figures = warningFigures(ladder, dMin, dMax);

  return {
    ladder,
    network: null,
    points: duties.map((d) => steadyState(ladder, d)),
    worstRipple,
    dc,
    settling,
    cutoff: cutoffFrequency(ladder),
    attenuation: -20 * Math.log10(magnitude(ladder, 1 / ladder.period)),
    pinPeakCurrent: peak,
    capacitorVoltage: {
      working: capacitorWorkingVoltage(ladder),
      factor: CAPACITOR_DERATING,
      rating: suggestedCapacitorRating(capacitorWorkingVoltage(ladder)),
    },
    timeConstants: figures.timeConstants,
    lsb: project.lsb ?? null,
    checks,
    pass: checks.every((c) => c.pass),
    warnings: plausibilityWarnings(project, figures),
    activeStages: [],
  };
}

/** `n` evenly spaced duties from `min` to `max` inclusive (one point when they coincide). */
export function dutyGrid(min: number, max: number, n: number): number[] {
  if (max <= min || n < 2) return [min];
  return Array.from({ length: n }, (_, i) => (i === n - 1 ? max : min + ((max - min) * i) / (n - 1)));
}
