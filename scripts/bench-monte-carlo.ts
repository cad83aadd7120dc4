/** Bench section: Monte Carlo tolerance samples per second (src/tolerance), when that module is present. */
import { existsSync } from 'node:fs';
import { availableParallelism } from 'node:os';
import { performance } from 'node:perf_hooks';
import { loadProject } from '../src/project/index.js';
import type { Project } from '../src/project/types.js';
import { sampleProjects } from './bench-cases.js';
import { median, timeOnce } from './bench-measure.js';
import type { BenchSection } from './bench-table.js';

interface RunOptions {
  samples?: number;
  seed?: number;
  workers?: number;
  workerUrl?: URL;
}
/** The parts of src/tolerance the bench calls (imported by name at run time: the module may be absent). */
interface ToleranceModule {
  monteCarlo: (project: Project, ladder?: undefined, options?: RunOptions) => { yield: number };
  monteCarloParallel?: (project: Project, ladder?: undefined, options?: RunOptions) => Promise<{ yield: number }>;
}

export interface MonteCarloRate {
  name: string;
  file: string;
  /** In the calling thread: samples per CPU second (median of 3 runs of RATE_SAMPLES). */
  rate: number;
  /** The same per wall-clock second. */
  wallRate: number;
  /** 100 000 samples with monteCarloParallel on every core (null when it is not exported), wall s. */
  hundredThousand: number | null;
  workers: number;
  /** The worker script: the bundled dist/tolerance-worker.js, or null for the module's default. */
  worker: string | null;
}

const RATE_SAMPLES = 10_000;
const MODULE = '../src/tolerance/index.js';

/** Whole 100 000-sample parallel runs per case; the median is reported (one run moved by 0.5 s on a shared machine). */
const PARALLEL_RUNS = 3;

/**
 * Monte Carlo throughput on the one-stage and the two-stage sample (their own tolerances, seed 1):
 * samples per CPU second of monteCarlo in the calling thread, and the wall time of a 100 000-sample
 * run spread over all cores by monteCarloParallel, its workers running the bundled worker script
 * (dist/tolerance-worker.js, as `dacsmith` does) when `bundledWorker` exists. `null` data and a
 * "skipped" note when src/tolerance/index.ts is not there (or lacks monteCarlo).
 *
 * Syntax: await monteCarloRate([bundledWorker])
 * Example: (await monteCarloRate(new URL('../dist/tolerance-worker.js', import.meta.url))).data?.[0].rate   // 6e4
 */
export async function monteCarloRate(bundledWorker?: URL): Promise<{ data: MonteCarloRate[] | null; section: BenchSection }> {
  const title = 'Monte Carlo tolerance analysis (exact figures per sample)';
  const columns = ['case', 'project', 'samples/CPU s (1 thread)', '100 000 samples, wall (s)', 'threads'];
  const tolerance = await loadTolerance();
  if (typeof tolerance === 'string') return { data: null, section: { title, columns, rows: [], notes: [`skipped: ${tolerance}`] } };
  const workers = availableParallelism();
  const workerUrl = bundledWorker && existsSync(bundledWorker) ? bundledWorker : undefined;
  const cases = [
    { name: '1 stage', file: sampleProjects.oneStage },
    { name: '2 stages', file: sampleProjects.twoStage },
  ];
  const data: MonteCarloRate[] = [];
  for (const { name, file } of cases) {
    const project = loadProject(file);
    tolerance.monteCarlo(project, undefined, { samples: 1000, seed: 1 }); // warm-up
    const runs = [];
    for (let i = 0; i < 3; i++) runs.push(await timeOnce(() => tolerance.monteCarlo(project, undefined, { samples: RATE_SAMPLES, seed: 1 })));
    let hundredThousand: number | null = null;
    if (tolerance.monteCarloParallel) {
      const walls: number[] = [];
      for (let i = 0; i < PARALLEL_RUNS; i++) {
        const start = performance.now();
        await tolerance.monteCarloParallel(project, undefined, { samples: 100_000, seed: 1, workers, workerUrl });
        walls.push((performance.now() - start) / 1000);
      }
      hundredThousand = median(walls);
    }
    const rate = RATE_SAMPLES / median(runs.map((r) => r.cpu));
    const worker = workerUrl ? 'dist/tolerance-worker.js' : null;
    data.push({ name, file, rate, wallRate: RATE_SAMPLES / median(runs.map((r) => r.wall)), hundredThousand, workers, worker });
  }
  return {
    data,
    section: {
      title,
      columns,
      rows: data.map((d) => [d.name, d.file, d.rate, d.hundredThousand ?? 'n/a', d.workers]),
      notes: [
        `samples/CPU s: monteCarlo in the calling thread, ${RATE_SAMPLES} samples, median of 3 runs;`,
        `100 000 samples: monteCarloParallel on every core, median of ${PARALLEL_RUNS} runs (this thread and worker threads, including their start-up; ` +
          `worker script ${workerUrl ? 'dist/tolerance-worker.js' : "the module's default"}).`,
      ],
    },
  };
}

async function loadTolerance(): Promise<ToleranceModule | string> {
  const file = new URL('../src/tolerance/index.ts', import.meta.url);
  if (!existsSync(file)) return 'module not present (src/tolerance/index.ts)';
  const module = (await import(MODULE)) as Partial<ToleranceModule>;
  if (typeof module.monteCarlo !== 'function') return 'module not present (src/tolerance/index.ts exports no monteCarlo)';
  return module as ToleranceModule;
}
