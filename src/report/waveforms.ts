import { type Analysis, stepWaveformOnGrid, steadyState, steadyWaveform, type Waveform } from '../engine/index.js';

/** Longest step record drawn or written, samples (keeps reports quick on very slow filters). */
const MAX_STEP_SAMPLES = 20_000;

/**
 * Length of the step record shown for the settling step: 1.25 x the settling time, or, when the
 * output never settles, 8 x the sum of the time constants; at least 4 PWM periods.
 *
 * Syntax: stepDuration(analysis)
 * Example: stepDuration(a)   // s
 */
export function stepDuration(analysis: Analysis): number {
  const period = analysis.ladder.period;
  const tauSum = analysis.timeConstants.reduce((a, b) => a + b, 0);
  const base = analysis.settling.time !== null ? 1.25 * analysis.settling.time : 8 * tauSum;
  return Math.max(4 * period, base);
}

/** The settling step as a record: waveform plus what it should settle to. */
export interface StepRecord {
  wave: Waveform;
  from: number;
  to: number;
  /** Steady-state average at `to`, V. */
  final: number;
  band: number;
  time: number | null;
}

/** Samples per PWM period in the step record (enough to draw the ripple of each period). */
const STEP_SAMPLES_PER_PERIOD = 16;

/**
 * Sample the settling step of an analysis on the per-period grid t = k T + j T / m (engine
 * `stepWaveformOnGrid`), m = 16 or more so that the record has at least `minSamples` samples, plus
 * the exact end of the record (stepDuration). Longer records than 20 000 samples keep every sample
 * of an evenly spread subset of periods, so each drawn period still shows its true ripple; `t` then
 * has gaps and charts must place samples by time.
 *
 * Syntax: stepRecord(analysis[, minSamples])
 * Example: stepRecord(a).wave.v.at(-1)   // close to stepRecord(a).final
 */
export function stepRecord(analysis: Analysis, minSamples = 600): StepRecord {
  const { ladder, settling } = analysis;
  const duration = stepDuration(analysis);
  const perPeriod = Math.max(STEP_SAMPLES_PER_PERIOD, Math.ceil((minSamples * ladder.period) / duration));
  return {
    wave: stepWaveformOnGrid(ladder, settling.from, settling.to, duration, perPeriod, MAX_STEP_SAMPLES),
    from: settling.from,
    to: settling.to,
    final: steadyState(ladder, settling.to).average,
    band: settling.band,
    time: settling.time,
  };
}

/** Two periods of the periodic steady state at the worst-ripple duty. */
export function worstRippleWave(analysis: Analysis, samplesPerPeriod: number): Waveform {
  return steadyWaveform(analysis.ladder, analysis.worstRipple.duty, 2, samplesPerPeriod);
}
