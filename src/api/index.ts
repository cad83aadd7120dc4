/**
 * The library API of dacsmith: `import { loadProject, analyze, design, tolerance, compare } from 'dacsmith'`.
 * Each function returns the very object the command prints with `--format json` (numbers in SI
 * units), built by the same code. Invalid input throws the loader's ProjectError (file, key path,
 * line) or an InputError.
 */
// From their own files, not project/index.ts: the declarations a user's compiler reads must not
// reach modules that are not installed with the package (yaml, ajv).
export { loadProject } from '../project/loadProject.js';
export { parseProject } from '../project/parseProject.js';
export { ProjectError, type ProjectIssue } from '../project/projectError.js';
export type { Project } from '../project/types.js';
export { InputError } from '../units/index.js';
export { analyze, type AnalyzeApiOptions } from './analyze.js';
export { design, type DesignApiOptions } from './design.js';
export { tolerance, type ToleranceApiOptions } from './tolerance.js';
export { compare } from './compare.js';
export type { ProjectInput } from './projectOf.js';
