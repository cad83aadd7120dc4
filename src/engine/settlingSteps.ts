import type { Project } from '../project/types.js';

/** The settling requirement of a project as every command evaluates it. */
export interface SettlingPlan {
  /** Half-width of the band around the final average, V. */
  band: number;
  /** Duty steps [from, to]; with several, the slowest counts. */
  steps: ReadonlyArray<readonly [number, number]>;
  /** True when the file gave no step: the full used range, rising and falling. */
  defaultStep: boolean;
}

/**
 * The settling steps and band of a project, chosen once for analyze, check, compare, tolerance and
 * design (model.md, "settling time" and "default step"): `spec.settling.from`/`to` when either is
 * given (a missing end is that end of the used duty range), else the full used range rising and
 * falling, the slower counting; the band is `spec.settling.band`, else 0.5 LSB when the resolution
 * is known, else 0.1 % of full scale (common practice).
 *
 * Syntax: settlingSteps(project)
 * Example: settlingSteps(p)   // { band: 0.00161, steps: [[0.05, 0.95], [0.95, 0.05]], defaultStep: true }
 */
export function settlingSteps(project: Project): SettlingPlan {
  const { min, max } = project.pwm.duty;
  const s = project.spec.settling;
  const given = s?.from !== undefined || s?.to !== undefined;
  const fullScale = Math.abs(project.pwm.high - project.pwm.low);
  const band = s?.band ?? (project.lsb !== undefined ? 0.5 * project.lsb : 1e-3 * fullScale);
  const steps: Array<[number, number]> = given
    ? [[s?.from ?? min, s?.to ?? max]]
    : [
        [min, max],
        [max, min],
      ];
  return { band, steps, defaultStep: !given };
}
