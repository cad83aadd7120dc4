import type { Project } from '../project/types.js';
import { designProblem, followerOptions, withFollower, type DesignProblem } from './designProblem.js';
import { infeasibilityBounds } from './infeasibilityBounds.js';
import { rankCandidates } from './rankCandidates.js';
import { solveProblem } from './solveProblem.js';
import type { Candidate } from './types.js';

/** Fast evaluations shared by the side searches of one explanation (mutable). */
export interface SearchBudget {
  /** Evaluations left. */
  left: number;
  /** Most evaluations one problem (one resolution) may use. */
  perProblem: number;
  /** performance.now() in ms after which the searches stop as at the end of the budget (`design --max-time`). */
  deadline?: number;
}

/** What a side search found. */
export interface BoundedResult {
  /** The `top` best designs found, engine-verified, ranked. */
  designs: Candidate[];
  /** True when the answer is the search's full answer (no budget cut): an empty list is then proven. */
  complete: boolean;
  /** The problems searched (one per resolution). */
  problems: DesignProblem[];
}

/**
 * The design search of a project (possibly changed: a relaxed limit, another resolution, more
 * stages, wider ranges) at the resolutions `bitsList` (undefined: the project's own), with stage
 * counts proven infeasible by infeasibilityBounds.ts skipped and the walk cut at the budget.
 * Designs it returns meet every limit of that project (exact engine); when it was cut they are
 * feasible but perhaps not the best, and finding none proves nothing.
 *
 * Method: infeasibilityBounds per resolution, follower option (search.buffered) and stage count,
 * then solveProblem (top, budget) per resolution and option.
 *
 * Syntax: boundedSearch(project, stageCounts, bitsList, top, budget)
 * Example: boundedSearch(p, [2, 3], [7], 1, { left: 1e6, perProblem: 3e5 }).designs[0]?.settlingTime
 */
export function boundedSearch(
  project: Project,
  stageCounts: number[],
  bitsList: Array<number | undefined>,
  top: number,
  budget: SearchBudget,
): BoundedResult {
  const found: Candidate[] = [];
  let complete = true;
  const problems: DesignProblem[] = [];
  for (const bits of bitsList) {
    const problem = designProblem(project, bits);
    problems.push(problem);
    // Each follower option its own walk, as in bestDesigns.ts (a follower removes the load).
    for (const buffered of followerOptions(problem)) {
      const variant = withFollower(problem, buffered);
      const open = stageCounts.filter((n) => infeasibilityBounds(variant, n).misses.length === 0);
      if (open.length === 0) continue;
      if (budget.left <= 0 || (budget.deadline !== undefined && performance.now() > budget.deadline)) {
        complete = false;
        continue;
      }
      // A three-stage evaluation costs several two-stage ones (measured: about 4x): it counts so.
      const weight = open.includes(3) ? 4 : 1;
      const outcome = solveProblem(variant, top, open, undefined, {
        budget: Math.min(budget.left, budget.perProblem) / weight,
        ...(budget.deadline !== undefined && { deadline: budget.deadline }),
      });
      budget.left -= outcome.evaluated * weight;
      complete &&= outcome.complete;
      found.push(...outcome.feasible);
    }
  }
  return { designs: rankCandidates(found).slice(0, top), complete, problems };
}
