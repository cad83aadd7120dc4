import type { Analysis } from './analyze.js';
import { ladderOf } from './ladderOf.js';

/**
 * Length of the record drawn or written for the settling step: 1.25 x the settling time, or, when
 * the output never settles, 8 x the sum of the time constants; at least 4 PWM periods.
 *
 * Method: a choice of display (common practice: show the whole transient and a little after it;
 * 8 tau leaves e^-8 = 3e-4 of a first-order step).
 *
 * Syntax: stepRecordDuration(analysis)
 * Example: stepRecordDuration(a)   // s
 */
export function stepRecordDuration(analysis: Analysis): number {
  const period = analysis.network ? analysis.network.period : ladderOf(analysis).period;
  const tauSum = analysis.timeConstants.reduce((a, b) => a + b, 0);
  const base = analysis.settling.time !== null ? 1.25 * analysis.settling.time : 8 * tauSum;
  return Math.max(4 * period, base);
}
