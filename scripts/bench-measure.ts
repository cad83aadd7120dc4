/** Timing helpers of `npm run bench`: medians of repeated runs, in seconds. */
import { performance } from 'node:perf_hooks';

export interface TimingOptions {
  /** Timed runs; the median is reported (default 7). */
  runs?: number;
  /** Each run repeats the call until this much time has passed, s (default 0.05). */
  runSeconds?: number;
  /** Untimed calls first, so that the JIT has compiled the code (default: one run's worth). */
  warmup?: boolean;
}

export interface Timing {
  /** Median over the runs of the time per call, s. */
  perCall: number;
  /** Every run's time per call, s. */
  runs: number[];
  /** Calls made in all timed runs. */
  calls: number;
}

/**
 * Time per call of `work`, the median over several runs. Each run calls `work` back to back until
 * `runSeconds` have passed and divides, so short calls are not lost in the timer's resolution.
 * `work` should build what it needs fresh (e.g. a new ladder object) so that caches keyed on
 * object identity cannot answer from an earlier call.
 *
 * Method: median of per-run means (robust against runs slowed down by other processes).
 *
 * Syntax: timePerCall(work[, { runs, runSeconds, warmup }])
 * Example: timePerCall(() => steadyState(freshLadder(), 0.5)).perCall   // 2.1e-5 (s)
 */
export function timePerCall(work: () => unknown, options: TimingOptions = {}): Timing {
  const runs = options.runs ?? 7;
  const runSeconds = options.runSeconds ?? 0.05;
  if (options.warmup ?? true) oneRun(work, runSeconds);
  const perRun: number[] = [];
  let calls = 0;
  for (let r = 0; r < runs; r++) {
    const run = oneRun(work, runSeconds);
    perRun.push(run.seconds / run.calls);
    calls += run.calls;
  }
  return { perCall: median(perRun), runs: perRun, calls };
}

function oneRun(work: () => unknown, runSeconds: number): { seconds: number; calls: number } {
  let calls = 0;
  let sink: unknown;
  const start = performance.now();
  let elapsed = 0;
  do {
    sink = work();
    calls++;
    elapsed = (performance.now() - start) / 1000;
  } while (elapsed < runSeconds);
  keep(sink);
  return { seconds: elapsed, calls };
}

let kept: unknown;
/** Hold on to a result so that the work producing it cannot be optimised away. */
function keep(value: unknown): void {
  kept = value;
}
export const lastKept = (): unknown => kept;

/**
 * Wall time of one call, s, with the call's result.
 *
 * Syntax: timeOnce(work)
 * Example: timeOnce(() => designSearch(p)).seconds   // 0.42
 */
export function timeOnce<T>(work: () => T): { seconds: number; value: T } {
  const start = performance.now();
  const value = work();
  return { seconds: (performance.now() - start) / 1000, value };
}

/** Median of a non-empty list (mean of the middle two for an even count). */
export function median(values: readonly number[]): number {
  if (values.length === 0) throw new RangeError('median of an empty list');
  const sorted = [...values].sort((a, b) => a - b);
  const mid = sorted.length >> 1;
  return sorted.length % 2 === 1 ? sorted[mid] : (sorted[mid - 1] + sorted[mid]) / 2;
}
