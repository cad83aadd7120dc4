import { loadProject } from '../project/loadProject.js';
import { parseProject } from '../project/parseProject.js';
import { requireFilter } from '../project/requireFilter.js';
import type { Project } from '../project/types.js';

/** A project file's path, its YAML text with a label, or a project already loaded. */
export type ProjectInput = string | { text: string; label?: string } | Project;

/**
 * The project an API call works on: loaded from a path, parsed from text, or taken as given;
 * refused the way `command` refuses it: a design-only file (no filter) unless `filter` is false.
 *
 * Syntax: projectOf(input, command[, { filter }])
 * Example: projectOf('board.yaml', 'analyze').filter.stages.length
 */
export function projectOf(input: ProjectInput, command: string, options: { filter?: boolean } = {}): Project {
  const project = typeof input === 'string' ? loadProject(input) : 'text' in input ? parseProject(input.text, input.label ?? '<text>') : input;
  return options.filter === false ? project : requireFilter(project, command);
}
