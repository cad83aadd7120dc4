import type { Ladder } from '../circuit/ladder.js';
import { averageOutput } from './averageOutput.js';
import { prepare } from './prepare.js';
import { timeConstants } from './timeConstants.js';
import type { WarningFigures } from './plausibilityWarnings.js';

/**
 * The figures the plausibility warnings need, for callers that have no full analysis
 * (tolerance): the time constants and the output span average(dutyMax) - average(dutyMin).
 *
 * Method: timeConstants.ts and the exact averages of averageOutput.ts.
 *
 * Syntax: warningFigures(ladder, dutyMin, dutyMax)
 * Example: warningFigures(ladderFromProject(p), 0.05, 0.95).outputSpan   // V
 */
export function warningFigures(ladder: Ladder, dutyMin: number, dutyMax: number): WarningFigures {
  const p = prepare(ladder);
  return {
    timeConstants: timeConstants(ladder),
    outputSpan: averageOutput(ladder, p, dutyMax) - averageOutput(ladder, p, dutyMin),
  };
}
