import { designJson } from '../report/design.js';
import { designStudy } from './designStudy.js';
import { projectOf, type ProjectInput } from './projectOf.js';

export interface DesignApiOptions {
  /** Designs to list (default 10), as `--top`. */
  top?: number;
  /** As `--robust`: only designs that survive the `tolerance:` box ('worst-case') or reach its yield target ('yield'). */
  robust?: 'worst-case' | 'yield';
  /** Compute the trade-off curves (default true, as the command; false as `--no-charts`). */
  tradeoff?: boolean;
  /** Most fast-model evaluations one trade-off curve may take, as `--curve-effort` (default 500 000). */
  curveEffort?: number;
}

/**
 * Recommend standard-value filters from the project's `search:`: the object
 * `dacsmith design FILE --format json` prints (pass, candidates best first, diagnosis, fixes,
 * tradeoff, basis, ...), SI units.
 *
 * Syntax: design(input[, { top, robust, tradeoff, curveEffort }])
 * Example: design('sample-configs/design-tight-ripple.yaml', { top: 3 }).candidates[0].settlingTime
 */
export function design(input: ProjectInput, options: DesignApiOptions = {}) {
  // The study's other fields are the report's options by the same names (as the command passes them).
  const { result, ...figures } = designStudy(projectOf(input, 'design', { filter: false }), options);
  return designJson(result, figures);
}
