import { loadProject } from '../project/loadProject.js';
import { parseProject } from '../project/parseProject.js';
import { requireFilter } from '../project/requireFilter.js';
import { requireLadder } from '../project/requireLadder.js';
import type { Project } from '../project/types.js';

/** Commands that do not yet handle a second PWM output or an active stage. */
const LADDER_ONLY = new Set(['design']);

/** A project file's path, its YAML text with a label, or a project already loaded. */
export type ProjectInput = string | { text: string; label?: string } | Project;

/**
 * The project an API call works on: loaded from a path, parsed from text, or taken as given;
 * refused the way `command` refuses it: a design-only file (no filter) unless `filter` is false,
 * and, for the commands that handle only ladders (design), a file whose circuit is not a
 * ladder (second_pwm, an active stage; requireLadder.ts).
 *
 * Syntax: projectOf(input, command[, { filter }])
 * Example: projectOf('board.yaml', 'analyze').filter.stages.length
 */
export function projectOf(input: ProjectInput, command: string, options: { filter?: boolean } = {}): Project {
  const project = typeof input === 'string' ? loadProject(input) : 'text' in input ? parseProject(input.text, input.label ?? '<text>') : input;
  const checked = options.filter === false ? project : requireFilter(project, command);
  return LADDER_ONLY.has(command) ? requireLadder(checked, command) : checked;
}
