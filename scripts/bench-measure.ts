/** Timing helpers of `npm run bench`: medians of repeated runs, in seconds. */
import { performance } from 'node:perf_hooks';

export interface TimingOptions {
  /** Timed runs; the median is reported (default 7). */
  runs?: number;
  /** Each run repeats the call until this much wall time has passed, s (default 0.05). */
  runSeconds?: number;
  /** Untimed calls first, so that the JIT has compiled the code (default: one run's worth). */
  warmup?: boolean;
}

export interface Timing {
  /** Median over the runs of the CPU time per call (process user + system), s. */
  perCall: number;
  /** Median over the runs of the wall time per call, s. */
  wallPerCall: number;
  /** Every run's CPU time per call, s. */
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
 * The figure is CPU time (process.cpuUsage: user + system of the whole process): on a machine
 * shared with other work, wall time also counts the time the process waits for a core, which
 * says nothing about the code. On an idle machine the two agree for single-threaded work; the
 * wall-time median is kept beside it.
 *
 * Method: median of per-run means (robust against runs disturbed by other processes or GC).
 *
 * Syntax: timePerCall(work[, { runs, runSeconds, warmup }])
 * Example: timePerCall(() => steadyState(freshLadder(), 0.5)).perCall   // 2.1e-5 (s)
 */
export function timePerCall(work: () => unknown, options: TimingOptions = {}): Timing {
  const runs = options.runs ?? 7;
  const runSeconds = options.runSeconds ?? 0.05;
  if (options.warmup ?? true) oneRun(work, runSeconds);
  const cpu: number[] = [];
  const wall: number[] = [];
  let calls = 0;
  for (let r = 0; r < runs; r++) {
    const run = oneRun(work, runSeconds);
    cpu.push(run.cpu / run.calls);
    wall.push(run.wall / run.calls);
    calls += run.calls;
  }
  return { perCall: median(cpu), wallPerCall: median(wall), runs: cpu, calls };
}

/**
 * timePerCall for several pieces of work at once, their runs interleaved (run r of every piece,
 * then run r + 1 of every piece), so that a change in machine load during the measurement hits all
 * pieces alike instead of tilting the comparison. Warm-up: one run of each, in the same order.
 *
 * Syntax: interleavedTimePerCall(works[, { runs, runSeconds, warmup }])
 * Example: interleavedTimePerCall([() => f(10), () => f(1e7)]).map((t) => t.perCall)   // [2.1e-5, 2.3e-5]
 */
export function interleavedTimePerCall(works: Array<() => unknown>, options: TimingOptions = {}): Timing[] {
  const runs = options.runs ?? 7;
  const runSeconds = options.runSeconds ?? 0.05;
  if (options.warmup ?? true) for (const work of works) oneRun(work, runSeconds);
  const cpu = works.map((): number[] => []);
  const wall = works.map((): number[] => []);
  const calls = works.map(() => 0);
  for (let r = 0; r < runs; r++) {
    works.forEach((work, k) => {
      const run = oneRun(work, runSeconds);
      cpu[k].push(run.cpu / run.calls);
      wall[k].push(run.wall / run.calls);
      calls[k] += run.calls;
    });
  }
  return works.map((_, k) => ({ perCall: median(cpu[k]), wallPerCall: median(wall[k]), runs: cpu[k], calls: calls[k] }));
}

function oneRun(work: () => unknown, runSeconds: number): { wall: number; cpu: number; calls: number } {
  let calls = 0;
  let sink: unknown;
  const cpuStart = process.cpuUsage();
  const start = performance.now();
  let wall = 0;
  do {
    sink = work();
    calls++;
    wall = (performance.now() - start) / 1000;
  } while (wall < runSeconds);
  const used = process.cpuUsage(cpuStart);
  keep(sink);
  return { wall, cpu: (used.user + used.system) / 1e6, calls };
}

let kept: unknown;
/** Hold on to a result so that the work producing it cannot be optimised away. */
function keep(value: unknown): void {
  kept = value;
}
export const lastKept = (): unknown => kept;

/**
 * Wall time and CPU time (process user + system, all threads of this process) of one call, s,
 * with the call's result. Work in worker threads counts in `cpu`, so `cpu` may exceed `wall`.
 *
 * Syntax: await timeOnce(work)
 * Example: (await timeOnce(() => designSearch(p))).wall   // 0.42
 */
export async function timeOnce<T>(work: () => T | Promise<T>): Promise<{ wall: number; cpu: number; value: T }> {
  const cpuStart = process.cpuUsage();
  const start = performance.now();
  const value = await work();
  const wall = (performance.now() - start) / 1000;
  const used = process.cpuUsage(cpuStart);
  return { wall, cpu: (used.user + used.system) / 1e6, value };
}

/** Median of a non-empty list (mean of the middle two for an even count). */
export function median(values: readonly number[]): number {
  if (values.length === 0) throw new RangeError('median of an empty list');
  const sorted = [...values].sort((a, b) => a - b);
  const mid = sorted.length >> 1;
  return sorted.length % 2 === 1 ? sorted[mid] : (sorted[mid - 1] + sorted[mid]) / 2;
}
