import { loadProject } from '../project/loadProject.js';
import { parseProject } from '../project/parseProject.js';
import { requireFilter } from '../project/requireFilter.js';
import type { Project } from '../project/types.js';

/** A project file's path, its YAML text with a label, or a project already loaded. */
export type ProjectInput = string | { text: string; label?: string } | Project;

/**
 * The project an API call works on: loaded from a path, parsed from text, or taken as given;
 * with `needsFilter`, a design-only file (no filter) is refused the way the command refuses it.
 *
 * Syntax: projectOf(input[, needsFilter])
 * Example: projectOf('board.yaml', 'analyze').filter.stages.length
 */
export function projectOf(input: ProjectInput, needsFilter?: string): Project {
  const project = typeof input === 'string' ? loadProject(input) : 'text' in input ? parseProject(input.text, input.label ?? '<text>') : input;
  return needsFilter ? requireFilter(project, needsFilter) : project;
}
