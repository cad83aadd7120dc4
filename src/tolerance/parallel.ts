import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { Worker } from 'node:worker_threads';
import type { Project } from '../project/types.js';
import { claimSlice } from './claimSlice.js';
import { evaluateSamples, type SampleTable } from './evaluateSamples.js';
import type { MetricPlan } from './metricPlan.js';
import { monteCarloResult, monteCarloSetup, type MonteCarloOptions, type MonteCarloResult } from './monteCarlo.js';
import type { ToleranceParameter } from './parameters.js';
import { isNetwork, type ToleranceCircuit } from './toleranceCircuit.js';

/**
 * What every worker evaluates: the samples in slices of `slice`, each slice taken by whichever
 * thread claims it first (claimSlice.ts; the calling thread claims too).
 */
export interface WorkerJob {
  /** The nominal ladder or network (plain data: structured cloning copies it). */
  circuit: ToleranceCircuit;
  parameters: ToleranceParameter[];
  plan: MetricPlan;
  /** All samples' deviates, on a SharedArrayBuffer (no copy per worker). */
  deviates: Float64Array;
  count: number;
  slice: number;
  /** On a SharedArrayBuffer: [next slice to claim]. */
  claims: Int32Array;
}

export type WorkerMessage = { kind: 'slice'; index: number; table: SampleTable } | { kind: 'done' };

export interface ParallelOptions extends MonteCarloOptions {
  /** Threads, the calling one included (default 1: the calling thread alone). */
  workers?: number;
  /** The worker script; default: tolerance-worker.js next to this module (the bundle), else worker.ts via tsx. */
  workerUrl?: URL;
  /**
   * Fewer samples per thread than this: fewer threads (default MIN_SAMPLES_PER_THREAD for a
   * ladder, MIN_NETWORK_SAMPLES_PER_THREAD for a network).
   */
  minSamplesPerThread?: number;
  /**
   * Other work for the calling thread, run once the workers are started and before this thread
   * takes its first samples (in a run without workers, before the samples); the workers' samples
   * go on meanwhile, and the slices even the threads out afterwards. An error it throws stops the
   * workers and is thrown on.
   */
  alongside?: () => void;
}

/**
 * Fewer samples than this per thread are not worth a worker: it loads its bundle and runs cold
 * (interpreted, then re-optimised) code beside this thread. Measured with `dacsmith tolerance` on
 * the fan sample (2 cores, whole process, wall; this thread plus one worker against this thread
 * alone): 10 000 samples 0.96 s against 0.74 s, 40 000 samples 1.34 s against 1.23 s, 100 000
 * samples 1.87 s against 2.30 s; the two cross near 26 000 samples per thread.
 */
export const MIN_SAMPLES_PER_THREAD = 30_000;

/**
 * The same threshold for a network (second PWM output, Sallen-Key stages): each sample runs the
 * general periodic engine, a hundred times or more the work of a ladder sample, so a worker's start
 * (about 0.2 s) pays off from a few hundred samples per thread.
 */
export const MIN_NETWORK_SAMPLES_PER_THREAD = 500;

/**
 * monteCarlo spread over `workers` threads: the calling thread and workers - 1 worker threads. The
 * deviates are drawn in the calling thread (on a SharedArrayBuffer the workers read) and the
 * samples are cut into slices that every thread claims in turn with one atomic counter (a thread
 * that runs faster, or has nothing else to do, takes more), each evaluated with the same code
 * (evaluateSamples) and put back in order, so the result is identical to the in-process run for
 * the same seed, whatever the number of threads and whoever took which slice. Runs in process when
 * workers <= 1, when there are fewer than minSamplesPerThread samples per thread (a smaller run
 * finishes sooner in one thread), or when no worker script is found.
 *
 * Syntax: await monteCarloParallel(project[, circuit, { workers, samples, seed, distribution, onProgress, alongside }])
 * Example: (await monteCarloParallel(p, undefined, { workers: 2 })).yield
 */
export async function monteCarloParallel(
  project: Project,
  circuit?: ToleranceCircuit,
  options: ParallelOptions = {},
): Promise<MonteCarloResult> {
  const setup = monteCarloSetup(project, circuit, options);
  const { samples, parameters } = setup;
  const perThread = options.minSamplesPerThread ?? (isNetwork(setup.circuit) ? MIN_NETWORK_SAMPLES_PER_THREAD : MIN_SAMPLES_PER_THREAD);
  const workers = Math.min(options.workers ?? 1, Math.floor(samples / perThread));
  const script = workers <= 1 ? null : options.workerUrl ? { url: options.workerUrl, viaTsx: false } : findWorkerScript();
  const progress = options.onProgress;
  if (workers <= 1 || script === null) {
    options.alongside?.();
    const table = evaluateSamples(setup.circuit, parameters, setup.plan, setup.deviates, 0, samples, progress && ((d) => progress(d, samples)));
    return monteCarloResult(setup, table);
  }
  // Slices small enough to even out the threads' ends (the workers start cold, this thread warm),
  // large enough that claiming and messages cost nothing: about 48 per thread, at most 64 network
  // samples (about 1 ms each) or 4 096 ladder samples (about 10 us each).
  const slice = Math.max(1, Math.min(Math.ceil(samples / (workers * 48)), isNetwork(setup.circuit) ? 64 : 4096));
  const shared = new Float64Array(new SharedArrayBuffer(setup.deviates.length * Float64Array.BYTES_PER_ELEMENT));
  shared.set(setup.deviates);
  const claims = new Int32Array(new SharedArrayBuffer(Int32Array.BYTES_PER_ELEMENT));
  const job: WorkerJob = { circuit: setup.circuit, parameters, plan: setup.plan, deviates: shared, count: samples, slice, claims };
  const tables: SampleTable[] = [];
  let done = 0;
  const finished = (index: number, table: SampleTable) => {
    tables[index] = table;
    done += table.worstRipple.length;
    progress?.(done, samples);
  };
  // Workers first, so that they load while this thread works.
  const started: Worker[] = [];
  const inWorkers = Array.from({ length: workers - 1 }, () => {
    return new Promise<void>((resolve, reject) => {
      // The TypeScript source needs tsx's loader registered inside the worker first.
      const worker = script.viaTsx
        ? new Worker(
            `import('tsx/esm/api').then(({ register }) => { register(); return import(${JSON.stringify(script.url.href)}); })`,
            { workerData: job, eval: true },
          )
        : new Worker(script.url, { workerData: job });
      started.push(worker);
      worker.on('message', (m: WorkerMessage) => {
        if (m.kind === 'slice') finished(m.index, m.table);
        else {
          resolve();
          void worker.terminate();
        }
      });
      worker.on('error', reject);
      worker.on('exit', (code) => {
        if (code !== 0) reject(new Error(`tolerance worker stopped with exit code ${code}`));
      });
    });
  });
  // Observed from the start: a worker that fails while this thread still works (or after the run
  // was stopped and its workers terminated) must not surface as an unhandled rejection; the
  // Promise.all below still throws its error.
  for (const running of inWorkers) running.catch(() => undefined);
  try {
    options.alongside?.();
    // This thread claims slices too, yielding between them so the workers' messages get through.
    for (let s = claimSlice(claims, slice, samples); s !== null; s = claimSlice(claims, slice, samples)) {
      finished(s.index, evaluateSamples(setup.circuit, parameters, setup.plan, setup.deviates, s.first, s.last));
      await new Promise<void>((resolve) => setImmediate(resolve));
    }
    await Promise.all(inWorkers);
  } catch (error) {
    for (const worker of started) void worker.terminate();
    throw error;
  }
  return monteCarloResult(setup, concatTables(tables));
}

function concatTables(tables: SampleTable[]): SampleTable {
  const join = (pick: (t: SampleTable) => Float64Array) => {
    const out = new Float64Array(tables.reduce((n, t) => n + pick(t).length, 0));
    let at = 0;
    for (const t of tables) {
      out.set(pick(t), at);
      at += pick(t).length;
    }
    return out;
  };
  return {
    worstRipple: join((t) => t.worstRipple),
    droop: join((t) => t.droop),
    inl: tables[0].inl ? join((t) => t.inl!) : null,
    gain: tables[0].gain ? join((t) => t.gain!) : null,
    settlingTime: join((t) => t.settlingTime),
    engineSamples: tables.reduce((n, t) => n + t.engineSamples, 0),
  };
}

/**
 * The worker entry: `tolerance-worker.js` beside this module (the esbuild bundle puts it beside
 * dist/cli.cjs), else the TypeScript source run through tsx (development and tests).
 */
function findWorkerScript(): { url: URL; viaTsx: boolean } | null {
  const bundled = new URL('./tolerance-worker.js', import.meta.url);
  if (existsSync(fileURLToPath(bundled))) return { url: bundled, viaTsx: false };
  const source = new URL('./worker.ts', import.meta.url);
  if (existsSync(fileURLToPath(source))) return { url: source, viaTsx: true };
  return null;
}
