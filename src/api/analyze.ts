import { analyzeProject } from '../engine/index.js';
import { analysisJson } from '../report/json.js';
import { projectOf, type ProjectInput } from './projectOf.js';

export interface AnalyzeApiOptions {
  /** Duties to evaluate, fractions 0..1 (default: 11 over the used range), as `--duty`. */
  duties?: number[];
}

/**
 * Analyse a project's filter: the object `dacsmith analyze FILE --format json` prints, SI units
 * (points, worstRipple, settling, cutoff, checks, pass, dc, warnings, inputs, ...). Throws the
 * loader's ProjectError (with file, key path and line) for a file that is not a valid project.
 *
 * Syntax: analyze(input[, { duties }])
 * Example: analyze('sample-configs/greenhouse-heater.yaml').worstRipple.ripple   // volts
 */
export function analyze(input: ProjectInput, options: AnalyzeApiOptions = {}) {
  const project = projectOf(input, 'analyze');
  return analysisJson(project, analyzeProject(project, options.duties ? { duties: options.duties } : {}));
}
