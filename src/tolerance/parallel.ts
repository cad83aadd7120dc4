import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { Worker } from 'node:worker_threads';
import type { Project } from '../project/types.js';
import { evaluateSamples, type SampleTable } from './evaluateSamples.js';
import type { MetricPlan } from './metricPlan.js';
import { monteCarloResult, monteCarloSetup, type MonteCarloOptions, type MonteCarloResult } from './monteCarlo.js';
import type { ToleranceParameter } from './parameters.js';
import { isNetwork, type ToleranceCircuit } from './toleranceCircuit.js';

/** What one worker evaluates. */
export interface WorkerJob {
  /** The nominal ladder or network (plain data: structured cloning copies it). */
  circuit: ToleranceCircuit;
  parameters: ToleranceParameter[];
  plan: MetricPlan;
  deviates: Float64Array;
  count: number;
}

export type WorkerMessage = { kind: 'progress'; done: number } | { kind: 'done'; table: SampleTable };

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

/** Samples the calling thread evaluates between two looks at the workers' messages. */
const OWN_SLICE = 2000;

/**
 * monteCarlo spread over `workers` threads: the calling thread and workers - 1 worker threads. The
 * deviates are drawn in the calling thread and each thread evaluates one contiguous block with the
 * same code (evaluateSamples), so the result is identical to the in-process run for the same seed,
 * whatever the number of threads. Runs in
 * process when workers <= 1, when there are fewer than minSamplesPerThread samples per thread (a
 * smaller run finishes sooner in one thread), or when no worker script is found.
 *
 * Syntax: await monteCarloParallel(project[, circuit, { workers, samples, seed, distribution, onProgress }])
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
    const table = evaluateSamples(setup.circuit, parameters, setup.plan, setup.deviates, 0, samples, progress && ((d) => progress(d, samples)));
    return monteCarloResult(setup, table);
  }
  const width = parameters.length;
  const bounds = Array.from({ length: workers + 1 }, (_, w) => Math.round((samples * w) / workers));
  const done = new Array<number>(workers).fill(0);
  const report = () => progress?.(done.reduce((a, b) => a + b, 0), samples);
  // Blocks 1.. go to worker threads, started first so that they load while this thread works.
  const inWorkers = bounds.slice(1, -1).map((first, i) => {
    const w = i + 1;
    const count = bounds[w + 1] - first;
    const job: WorkerJob = {
      circuit: setup.circuit,
      parameters,
      plan: setup.plan,
      deviates: setup.deviates.slice(first * width, (first + count) * width),
      count,
    };
    return new Promise<SampleTable>((resolve, reject) => {
      const options = { workerData: job, transferList: [job.deviates.buffer as ArrayBuffer] };
      // The TypeScript source needs tsx's loader registered inside the worker first.
      const worker = script.viaTsx
        ? new Worker(
            `import('tsx/esm/api').then(({ register }) => { register(); return import(${JSON.stringify(script.url.href)}); })`,
            { ...options, eval: true },
          )
        : new Worker(script.url, options);
      worker.on('message', (m: WorkerMessage) => {
        if (m.kind === 'progress') {
          done[w] = m.done;
          report();
        } else {
          resolve(m.table);
          void worker.terminate();
        }
      });
      worker.on('error', reject);
      worker.on('exit', (code) => {
        if (code !== 0) reject(new Error(`tolerance worker stopped with exit code ${code}`));
      });
    });
  });
  // Block 0 in this thread, in slices, yielding between them so the workers' messages get through.
  const own: SampleTable[] = [];
  for (let first = 0; first < bounds[1]; first += OWN_SLICE) {
    const last = Math.min(bounds[1], first + OWN_SLICE);
    own.push(evaluateSamples(setup.circuit, parameters, setup.plan, setup.deviates, first, last));
    done[0] = last;
    report();
    await new Promise<void>((resolve) => setImmediate(resolve));
  }
  const tables = [...own, ...(await Promise.all(inWorkers))];
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
