import { checkNumericalDomain, OutsideDomainError } from '../engine/index.js';
import { ladderFromProject } from '../project/ladderFromProject.js';
import { DesignInputError } from './designInputError.js';
import type { DesignProblem } from './designProblem.js';

/**
 * Refuse a design search whose space reaches circuits outside the engine's numerical domain
 * (numericalDomain.ts), and a project whose own filter lies outside it, as input errors naming
 * the key, before any search: an absurd load (2.6e-123 ohm) or range would otherwise surface as
 * an internal error deep in a root finder, or as a figure that is not exact.
 *
 * Method: the domain's bounds are on time constants, which grow with every R and C; the corners of
 * the space (every stage at the smallest R and C, and at the largest) carry its fastest and slowest
 * time constants, so checking both corners for the fewest and the most stages covers the space.
 *
 * Syntax: checkSearchDomain(problems, stageCounts)
 * Example: checkSearchDomain([designProblem(p)], [1, 2])   // throws DesignInputError outside the domain
 */
export function checkSearchDomain(problems: readonly DesignProblem[], stageCounts: readonly number[]): void {
  const project = problems[0].project;
  if (project.filter.stages.length > 0) checkNumericalDomain(ladderFromProject(project), project.file);
  const counts = [Math.min(...stageCounts), Math.max(...stageCounts)];
  for (const p of problems) {
    const rs = [p.rValues[0], p.rValues[p.rValues.length - 1]];
    const cs = [p.cValues[0], p.cValues[p.cValues.length - 1]];
    for (const n of counts) {
      for (const corner of [0, 1]) {
        try {
          checkNumericalDomain(p.ladderOf(new Array<number>(n).fill(rs[corner]), new Array<number>(n).fill(cs[corner])));
        } catch (error) {
          if (!(error instanceof OutsideDomainError)) throw error;
          throw new DesignInputError(
            `the ${corner === 0 ? 'smallest' : 'largest'} ${n}-stage design of the space${p.bits !== null ? ` at ${p.bits} bits` : ''} is outside what the engine computes exactly: ${error.detail}`,
            'search',
            project.file,
          );
        }
      }
    }
  }
}
