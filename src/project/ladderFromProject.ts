import type { Project } from './types.js';
import type { Ladder, Stage } from '../circuit/ladder.js';

/**
 * The engine's view of a project: its PWM source, ladder and load, optionally with other stages.
 *
 * Syntax: ladderFromProject(project[, stages])
 * Example: ladderFromProject(p).period  // 1 / p.pwm.frequency
 */
export function ladderFromProject(project: Project, stages: readonly Stage[] = project.filter.stages): Ladder {
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
