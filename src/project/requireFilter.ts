import { ProjectError } from './projectError.js';
import type { Project } from './types.js';

/**
 * The project, if it has a filter to evaluate; a design-only file (a `search:` block and no
 * `filter:`) is refused with a message that names the key, for the commands that need a filter.
 *
 * Syntax: requireFilter(project, command)
 * Example: requireFilter(loadProject('board.yaml'), 'analyze').filter.stages.length   // >= 1
 */
export function requireFilter(project: Project, command: string): Project {
  // A file whose stages are all active has no RC stage in filter.stages but still has a filter.
  if (project.filter.stages.length > 0 || (project.network?.stages.length ?? 0) > 0) return project;
  throw new ProjectError([
    {
      file: project.file,
      path: 'filter',
      message: `missing: '${command}' needs filter.stages (1 to 4 RC stages); this file only describes a design search (run 'dacsmith design' on it)`,
    },
  ]);
}
