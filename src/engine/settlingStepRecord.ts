import type { Analysis } from './analyze.js';
import type { StepRecord } from './types.js';
import { steadyState } from './steadyState.js';
import { stepRecordDuration } from './stepRecordDuration.js';
import { stepWaveformOnGrid } from './stepWaveformOnGrid.js';
import { ladderOf } from './ladderOf.js';
import { networkStepRecord } from './periodic/networkRecords.js';

/** Longest step record drawn or written, samples (keeps reports quick on very slow filters). */
const MAX_STEP_SAMPLES = 20_000;

/** Samples per PWM period in the step record (enough to draw the ripple of each period). */
const STEP_SAMPLES_PER_PERIOD = 16;

/**
 * The settling step of an analysis as a record: the output on the per-period grid
 * t = k T + j T / m (stepWaveformOnGrid.ts), m = 16 or more so that the record has at least
 * `minSamples` samples, plus the exact end of the record (stepRecordDuration.ts); with the final
 * value (steady-state average at `to`), the band and the settling instant of the analysis.
 * Records longer than 20 000 samples keep every sample of an evenly spread subset of periods, so
 * each kept period still shows its true ripple; `t` then has gaps and charts must place samples by
 * time.
 *
 * Method: the exact engine (per-period sampler and binary powers of the one-period map): the cost
 * grows with the samples kept, not with the length of the record.
 *
 * Syntax: settlingStepRecord(analysis[, minSamples])
 * Example: settlingStepRecord(a).wave.v.at(-1)   // close to settlingStepRecord(a).final
 */
export function settlingStepRecord(analysis: Analysis, minSamples = 600): StepRecord {
  const { network, settling } = analysis;
  const duration = stepRecordDuration(analysis);
  const period = network ? network.period : ladderOf(analysis).period;
  const perPeriod = Math.max(STEP_SAMPLES_PER_PERIOD, Math.ceil((minSamples * period) / duration));
  if (network) {
    return networkStepRecord(network, settling.from, settling.to, {
      duration,
      perPeriod,
      maxSamples: MAX_STEP_SAMPLES,
      band: settling.band,
      time: settling.time,
    });
  }
  const ladder = ladderOf(analysis);
  return {
    wave: stepWaveformOnGrid(ladder, settling.from, settling.to, duration, perPeriod, MAX_STEP_SAMPLES),
    from: settling.from,
    to: settling.to,
    final: steadyState(ladder, settling.to).average,
    band: settling.band,
    time: settling.time,
  };
}
