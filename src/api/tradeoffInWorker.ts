import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { Worker } from 'node:worker_threads';
import type { TradeoffCurve } from '../design/tradeoffCurves.js';
import type { Project } from '../project/index.js';

/** What the worker draws: tradeoffCurves(project, stageCounts, center, { bits, ripples }). */
export interface TradeoffJob {
  project: Project;
  stageCounts: number[];
  center: number;
  bits?: number;
  /** The ripple limits to draw (part of tradeoffRipples(center) when the caller draws the rest). */
  ripples?: number[];
}

export type TradeoffMessage = { kind: 'progress'; fraction: number } | { kind: 'done'; curves: TradeoffCurve[] };

/** A job running in a worker thread. */
export interface TradeoffRun {
  readonly job: TradeoffJob;
  /** The curves, or null when the worker failed (the caller then draws them itself). */
  readonly curves: Promise<TradeoffCurve[] | null>;
  /** Latest progress fraction the worker reported (read after an await). */
  progress(): number;
  /** Stop the worker (its curves are not wanted). */
  stop(): void;
}

/**
 * Start drawing trade-off curves in a worker thread, so that they are computed beside the calling
 * thread's own search: the same tradeoffCurves on a structured copy of the project, so the curves
 * are the very numbers the calling thread would get. Returns null when no worker script is found
 * (running from the TypeScript sources without `workerUrl`).
 *
 * The worker script is dist/design-worker.js beside the bundle, or `workerUrl`; a TypeScript
 * source is run through tsx's loader (tests).
 *
 * Syntax: tradeoffInWorker(job[, workerUrl])
 * Example: await tradeoffInWorker({ project, stageCounts: [2], center: 1.6e-3 })?.curves
 */
export function tradeoffInWorker(job: TradeoffJob, workerUrl?: URL): TradeoffRun | null {
  const url = workerUrl ?? new URL('./design-worker.js', import.meta.url);
  if (url.protocol === 'file:' && !existsSync(fileURLToPath(url))) return null;
  const viaTsx = url.pathname.endsWith('.ts');
  // The TypeScript source needs tsx's loader registered inside the worker first.
  const worker = viaTsx
    ? new Worker(`import('tsx/esm/api').then(({ register }) => { register(); return import(${JSON.stringify(url.href)}); })`, {
        eval: true,
        workerData: job,
      })
    : new Worker(url, { workerData: job });
  let fraction = 0;
  let settled = false;
  const curves = new Promise<TradeoffCurve[] | null>((resolve) => {
    const finish = (value: TradeoffCurve[] | null) => {
      if (settled) return;
      settled = true;
      resolve(value);
      void worker.terminate();
    };
    worker.on('message', (m: TradeoffMessage) => {
      if (m.kind === 'progress') fraction = m.fraction;
      else finish(m.curves);
    });
    worker.on('error', () => finish(null));
    worker.on('exit', () => finish(null));
  });
  return {
    job,
    curves,
    progress: () => fraction,
    stop: () => {
      settled = true;
      void worker.terminate();
    },
  };
}
