import type { Analysis } from './analyze.js';
import type { ChartSeries } from './types.js';
import { checkCount } from './checkArguments.js';
import { dcErrorAcrossDuty } from './dcErrorAcrossDuty.js';
import { magnitudeResponse } from './magnitudeResponse.js';
import { settlingStepRecord } from './settlingStepRecord.js';
import { steadyRecord } from './steadyRecord.js';

/** Plot columns of the analysis charts when the caller names none. */
export const CHART_COLUMNS = 72;

/**
 * Every series the analysis report draws, computed once so that the report only formats:
 * (a) the steady state over two periods at the worst-ripple duty, as output minus its average,
 * columns/2 samples per period; (b) the settling step record with its band and settling instant
 * (settlingStepRecord.ts); (c) the magnitude response in dB on `columns` log-spaced frequencies
 * with the cutoff and the PWM frequency (magnitudeResponse.ts); (d) the DC error ideal - average
 * at `columns` duties across the used range (dcErrorAcrossDuty.ts).
 *
 * Method: the exact engine for every sample; only called when charts are drawn (the step record
 * and the 2 x columns steady states are most of a chart's cost).
 *
 * Syntax: chartSeries(analysis, dutyRange[, { columns }])
 * Example: chartSeries(a, p.pwm.duty).dcError.error.length   // 72
 */
export function chartSeries(
  analysis: Analysis,
  dutyRange: { min: number; max: number },
  options: { columns?: number } = {},
): ChartSeries {
  const columns = options.columns ?? CHART_COLUMNS;
  checkCount(columns, 'columns', true);
  const { ladder } = analysis;
  const steady = steadyRecord(ladder, analysis.worstRipple.duty, 2, Math.max(1, Math.round(columns / 2)));
  return {
    columns,
    steady: {
      duty: steady.duty,
      average: steady.average,
      t: steady.wave.t,
      deviation: steady.wave.v.map((v) => v - steady.average),
    },
    step: settlingStepRecord(analysis),
    magnitude: magnitudeResponse(ladder, columns, analysis.cutoff),
    dcError: dcErrorAcrossDuty(ladder, dutyRange.min, dutyRange.max, columns),
  };
}
