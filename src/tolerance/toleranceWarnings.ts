import type { Warning } from '../engine/index.js';
import type { Project } from '../project/types.js';
import { secondSharesDrivers } from './parameters.js';
import { isNetwork, type ToleranceCircuit } from './toleranceCircuit.js';

/**
 * What a tolerance study holds fixed although the file suggests it varies: the second output's
 * driver resistances when second_pwm.driver sets them apart from pwm.driver, since
 * tolerance.driver gives the ranges of pwm's pin only (parameters.ts).
 *
 * Syntax: toleranceWarnings(project, circuit)
 * Example: toleranceWarnings(p, networkFromProject(p))  // [] when second_pwm.driver is left to its default
 */
export function toleranceWarnings(project: Project, circuit: ToleranceCircuit): Warning[] {
  if (!isNetwork(circuit) || circuit.second === null || !project.tolerance?.driver || secondSharesDrivers(circuit)) return [];
  return [
    {
      key: 'second_pwm.driver',
      message:
        'the second output has driver resistances of its own, and tolerance.driver gives the ranges of the pwm pin only: ' +
        'the tolerance study holds the second output\'s drivers at their nominal values',
    },
  ];
}
