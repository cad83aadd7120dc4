import type { Analysis } from './analyze.js';
import type { ChartSeries } from './types.js';
import { checkCount } from './checkArguments.js';
import { dcErrorAcrossDuty } from './dcErrorAcrossDuty.js';
import { magnitudeResponse } from './magnitudeResponse.js';
import { settlingStepRecord } from './settlingStepRecord.js';
import { steadyRecord } from './steadyRecord.js';
import { ladderOf } from './ladderOf.js';
import { networkDcErrorAcrossDuty, networkMagnitudeResponse, networkSteadyRecord } from './periodic/networkRecords.js';

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
  const { ladder, network } = analysis;
  const perPeriod = Math.max(1, Math.round(columns / 2));
  const duty = analysis.worstRipple.duty;
  const steady = network ? networkSteadyRecord(network, duty, 2, perPeriod) : steadyRecord(ladderOf(analysis), duty, 2, perPeriod);
  return {
    columns,
    steady: {
      duty: steady.duty,
      average: steady.average,
      t: steady.wave.t,
      deviation: steady.wave.v.map((v) => v - steady.average),
    },
    step: settlingStepRecord(analysis),
    magnitude: network ? networkMagnitudeResponse(network, columns, analysis.cutoff) : magnitudeResponse(ladderOf(analysis), columns, analysis.cutoff),
    dcError: network
      ? networkDcErrorAcrossDuty(network, dutyRange.min, dutyRange.max, columns)
      : dcErrorAcrossDuty(ladder ?? ladderOf(analysis), dutyRange.min, dutyRange.max, columns),
  };
}
