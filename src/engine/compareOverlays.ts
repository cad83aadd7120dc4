import type { Analysis } from './analyze.js';
import type { CompareOverlays, Overlay, Waveform } from './types.js';
import { checkCount } from './checkArguments.js';
import { steadyWaveform } from './steadyWaveform.js';
import { stepRecordDuration } from './stepRecordDuration.js';
import { stepWaveform } from './stepWaveform.js';
import { ladderOf } from './ladderOf.js';
import { networkIdeal } from './periodic/networkCodes.js';
import { networkStepRecord, networkSteadyRecord } from './periodic/networkRecords.js';

/** Linear interpolation of a sampled waveform at time t (held flat beyond its ends). */
function valueAt(w: Waveform, t: number): number {
  const { t: ts, v } = w;
  if (t <= ts[0]) return v[0];
  if (t >= ts[ts.length - 1]) return v[v.length - 1];
  let lo = 0;
  let hi = ts.length - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (ts[mid] <= t) lo = mid;
    else hi = mid;
  }
  const f = (t - ts[lo]) / (ts[hi] - ts[lo] || 1);
  return v[lo] + f * (v[hi] - v[lo]);
}

const grid = (end: number, n: number) => Array.from({ length: n }, (_, i) => (end * i) / (n - 1));

/** Output minus ideal of one side's steady state at `duty`, on the shared grid `t`. */
function steadySide(analysis: Analysis, duty: number, t: number[], window: number, columns: number): number[] {
  const network = analysis.network;
  if (network) {
    const periods = Math.max(1, Math.ceil(window / network.period - 1e-9));
    const wave = networkSteadyRecord(network, duty, periods, Math.max(200, columns)).wave;
    const ideal = networkIdeal(network, duty);
    return t.map((x) => valueAt(wave, x) - ideal);
  }
  const ladder = ladderOf(analysis);
  const periods = Math.max(1, Math.ceil(window / ladder.period - 1e-9));
  // A multiple of (columns - 1) samples per period puts every grid instant on a sample
  // whenever the window holds a whole number of this side's periods (then nothing is interpolated).
  const m = Math.max(1, Math.min(Math.ceil(200 / (columns - 1)), Math.floor(20_000 / (periods * (columns - 1)))));
  const wave = steadyWaveform(ladder, duty, periods, (columns - 1) * m);
  const ideal = ladder.low + duty * (ladder.high - ladder.low);
  return t.map((x) => valueAt(wave, x) - ideal);
}

/**
 * The two overlays `compare` draws, base and head on one shared time grid of `columns` instants:
 * (1) both steady states at the head's worst-ripple duty over two periods of the slower PWM, as
 * output minus ideal (ideal = low + D (high - low)), so that ripple and DC error both show;
 * (2) both responses to the head's settling step, output in V, over a time long enough for the
 * slower (stepRecordDuration.ts: 1.25 x its settling time, or 8 x its summed time constants; at
 * least 4 periods).
 *
 * Method: exact engine waveforms (steadyWaveform.ts, stepWaveform.ts); the steady states are
 * sampled densely per period and read on the grid by linear interpolation (exact whenever the
 * window holds whole periods of that side), the step responses exactly at the grid instants.
 *
 * Syntax: compareOverlays(base, head, columns)
 * Example: compareOverlays(analyzeProject(a), analyzeProject(b), 72).steady.head.length   // 72
 */
export function compareOverlays(base: Analysis, head: Analysis, columns: number): CompareOverlays {
  checkCount(columns, 'columns', true);
  if (columns < 2) throw new RangeError(`columns ${columns} must be at least 2`);
  const duty = head.worstRipple.duty;
  const { from, to } = head.settling;

  const periodOf = (a: Analysis) => (a.network ? a.network.period : ladderOf(a).period);
  const window = 2 * Math.max(periodOf(base), periodOf(head));
  const tSteady = grid(window, columns);
  const steady: Overlay & { duty: number } = {
    duty,
    t: tSteady,
    base: steadySide(base, duty, tSteady, window, columns),
    head: steadySide(head, duty, tSteady, window, columns),
  };

  const duration = Math.max(stepRecordDuration(base), stepRecordDuration(head));
  const tStep = grid(duration, columns);
  // stepWaveform samples exactly the grid instants i duration / (columns - 1): nothing to interpolate.
  const stepSide = (a: Analysis) => {
    if (!a.network) return stepWaveform(ladderOf(a), from, to, duration, columns).v;
    // The general engine samples on a per-period grid; read it at the shared instants.
    const record = networkStepRecord(a.network, from, to, { duration, perPeriod: 16, maxSamples: 20_000, band: 0, time: null });
    return tStep.map((x) => valueAt(record.wave, x));
  };
  const step: Overlay & { from: number; to: number } = { from, to, t: tStep, base: stepSide(base), head: stepSide(head) };
  return { steady, step };
}
