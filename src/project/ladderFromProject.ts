import type { Project } from './types.js';
import type { Ladder, Stage } from '../circuit/ladder.js';
import { requireLadder } from './requireLadder.js';

/**
 * The engine's view of a project: its PWM source, ladder and load, optionally with other stages.
 * A project with `network` (second_pwm, an active stage) is refused (requireLadder.ts): its
 * circuit is not a ladder.
 *
 * Syntax: ladderFromProject(project[, stages])
 * Example: ladderFromProject(p).period  // 1 / p.pwm.frequency
 */
export function ladderFromProject(project: Project, stages: readonly Stage[] = project.filter.stages): Ladder {
  requireLadder(project, 'ladderFromProject');
  const { pwm, load } = project;
  return {
    period: 1 / pwm.frequency,
    high: pwm.high,
    low: pwm.low,
    driverHigh: pwm.driver.high,
    driverLow: pwm.driver.low,
    stages,
    loadResistance: load.resistance ?? null,
    loadCapacitance: load.capacitance,
  };
}
