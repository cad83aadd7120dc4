import { InputError } from '../units/index.js';
import type { Project } from './types.js';

/**
 * The project, if its circuit is a `Ladder` (one PWM output, RC stages only); a file with
 * `second_pwm` or an active stage (model.md 1.1) is refused with an InputError that names the key
 * and the command, so that no command computes such a circuit as if it were a ladder. One call
 * per command: lift it for a command once that command runs on the engine for these circuits.
 *
 * Syntax: requireLadder(project, command)
 * Example: requireLadder(loadProject('board.yaml'), 'analyze')   // the project, or throws for second_pwm
 */
export function requireLadder(project: Project, command: string): Project {
  const { network } = project;
  if (!network) return project;
  const active = network.stages.findIndex((s) => s.kind !== 'rc');
  const [key, what] = network.second
    ? ['second_pwm', `a second PWM output (second_pwm, role ${network.second.role})`]
    : [`filter.stages[${active}].active`, 'an active stage (active: sallen-key)'];
  throw new InputError(
    `'${command}' does not yet handle ${what}; it will with the engine for these circuits (until then the file is refused, not computed as a plain RC ladder)`,
    key,
    project.file,
  );
}
