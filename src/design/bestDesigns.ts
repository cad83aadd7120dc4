import { followerOptions, withFollower, type DesignProblem } from './designProblem.js';
import { rankCandidates } from './rankCandidates.js';
import { infeasibilityBounds } from './infeasibilityBounds.js';
import { solveProblem, type ProblemOutcome, type ProblemProgress, type SolveOptions } from './solveProblem.js';

/**
 * The `top` best designs of one design problem (one resolution) over every follower option the
 * project allows (search.buffered: without, and with an ideal unity-gain follower after the last
 * stage), ranked together (rankCandidates.ts; at equal settling time the design without a
 * follower comes first).
 *
 * Method: one exact search (solveProblem.ts) per option, each proven optimal over its own space,
 * so the merged top list is optimal over the union. The follower variant is the same ladder
 * unloaded (designProblem.ts `buffered`): the fast model and every bound apply to it unchanged.
 *
 * Syntax: bestDesigns(problem, top[, stageCounts][, onProgress][, { budget, deadline }])
 * Example: bestDesigns(designProblem(p), 5).feasible.filter((c) => c.needsFollower).length
 */
export function bestDesigns(
  problem: DesignProblem,
  top: number,
  stageCounts: number[] = problem.stageCounts,
  onProgress?: (fraction: number, detail?: ProblemProgress) => void,
  solve: SolveOptions = {},
): ProblemOutcome {
  const options = followerOptions(problem);
  // Stage counts proven out of reach for this variant (infeasibilityBounds.ts) are not walked.
  const open = (p: DesignProblem) => stageCounts.filter((n) => infeasibilityBounds(p, n).misses.length === 0);
  if (options.length === 1 && options[0] === problem.buffered) return solveProblem(problem, top, open(problem), onProgress, solve);
  const outcomes = options.map((buffered, i) => {
    const variant = withFollower(problem, buffered);
    return solveProblem(variant, top, open(variant), (f, d) => onProgress?.((i + f) / options.length, d), solve);
  });
  return {
    feasible: rankCandidates(outcomes.flatMap((o) => o.feasible)).slice(0, top),
    failing: outcomes.flatMap((o) => o.failing),
    evaluated: outcomes.reduce((s, o) => s + o.evaluated, 0),
    verified: outcomes.reduce((s, o) => s + o.verified, 0),
    space: outcomes.reduce((s, o) => s + o.space, 0),
    complete: outcomes.every((o) => o.complete),
  };
}
