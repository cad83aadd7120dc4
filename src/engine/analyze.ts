import type { Project } from '../project/types.js';
// The modules themselves, not index.ts: index.ts exports analyzeProject, so importing it here would
// make a cycle.
import { circuitEngineOf } from './circuitEngine.js';
import { specChecks } from './checks.js';
import { settlingSteps } from './settlingSteps.js';
import { plausibilityWarnings } from './plausibilityWarnings.js';
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
 * Method: every figure comes from the exact engine for the project's circuit (circuitEngine.ts: the
 * ladder engine, or src/engine/periodic for a second PWM output or an active stage); this function
 * only chooses the duties and the settling step and compares the results with the spec (see checks.ts).
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
  const engine = circuitEngineOf(project);
  const { band, steps, defaultStep } = settlingSteps(project);
  const settling = defaultStep ? engine.defaultSettling(dMin, dMax, band) : engine.settling(steps[0][0], steps[0][1], band);
  const worstRipple = engine.worstRipple(dMin, dMax);
  const dc = engine.dcTransfer(dMin, dMax);
  const peak = engine.pinPeakCurrent();
  const checks = specChecks(project, { worstRipple, dc, settling, pinPeakCurrent: peak });
  const figures = engine.warningFigures(dMin, dMax);
  const working = engine.workingVoltage();

  return {
    ladder: engine.ladder,
    network: engine.network,
    points: duties.map((d) => engine.point(d)),
    worstRipple,
    dc,
    settling,
    cutoff: engine.cutoff(),
    attenuation: engine.attenuation(),
    pinPeakCurrent: peak,
    capacitorVoltage: { working, factor: CAPACITOR_DERATING, rating: suggestedCapacitorRating(working) },
    timeConstants: figures.timeConstants,
    lsb: project.lsb ?? null,
    checks,
    pass: checks.every((c) => c.pass),
    warnings: plausibilityWarnings(project, figures),
    activeStages: engine.activeStages(),
  };
}

/** `n` evenly spaced duties from `min` to `max` inclusive (one point when they coincide). */
export function dutyGrid(min: number, max: number, n: number): number[] {
  if (max <= min || n < 2) return [min];
  return Array.from({ length: n }, (_, i) => (i === n - 1 ? max : min + ((max - min) * i) / (n - 1)));
}
