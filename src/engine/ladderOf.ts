import type { Ladder } from '../circuit/ladder.js';
import type { Analysis } from './analyze.js';

/**
 * The passive ladder of an analysis; throws when the analysis is of a general network (a caller
 * that reaches here has forgotten to route the network to src/engine/periodic).
 *
 * Syntax: ladderOf(analysis)
 * Example: ladderOf(analyzeProject(plain)).stages.length
 */
export function ladderOf(analysis: Pick<Analysis, 'ladder'>): Ladder {
  if (!analysis.ladder) throw new Error('internal: this analysis is of a general network, not a ladder');
  return analysis.ladder;
}
