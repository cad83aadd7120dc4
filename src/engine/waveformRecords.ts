import type { Analysis } from './analyze.js';
import type { WaveformRecords } from './types.js';
import { settlingStepRecord } from './settlingStepRecord.js';
import { steadyRecord } from './steadyRecord.js';
import { ladderOf } from './ladderOf.js';
import { networkSteadyRecord } from './periodic/networkRecords.js';

/** Samples per period of the steady-state record written to CSV. */
const CSV_SAMPLES_PER_PERIOD = 200;

/**
 * The waveforms `analyze --csv` writes: two periods of the periodic steady state at the
 * worst-ripple duty (200 samples per period, t from a rising edge) and the settling step record
 * (settlingStepRecord.ts, t from the step).
 *
 * Method: the exact engine at every sample (steadyRecord.ts, settlingStepRecord.ts).
 *
 * Syntax: waveformRecords(analysis)
 * Example: waveformRecords(a).steady.wave.t.length   // 401
 */
export function waveformRecords(analysis: Analysis): WaveformRecords {
  return {
    steady: analysis.network
      ? networkSteadyRecord(analysis.network, analysis.worstRipple.duty, 2, CSV_SAMPLES_PER_PERIOD)
      : steadyRecord(ladderOf(analysis), analysis.worstRipple.duty, 2, CSV_SAMPLES_PER_PERIOD),
    step: settlingStepRecord(analysis),
  };
}
