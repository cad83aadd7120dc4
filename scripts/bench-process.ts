/** Whole-process timing of the command line against a bare Node start. */
import { spawnSync } from 'node:child_process';
import { performance } from 'node:perf_hooks';
import { median } from './bench-measure.js';

export interface ProcessTiming {
  /** Median wall time of `node <args>`, s. */
  command: number;
  /** Median wall time of `node -e ''`, s. */
  bare: number;
  /** command / bare. */
  ratio: number;
  /** Every run, s. */
  commandRuns: number[];
  bareRuns: number[];
  /** Exit code of the command's first run. */
  exitCode: number | null;
}

/**
 * Wall time of a whole `node <args>` process (start, load, run, exit) against `node -e ''`, each
 * the median of `runs` runs, the two interleaved so that a change in machine load hits both.
 * Both run with the same environment, minus NODE_OPTIONS and NODE_EXTRA_CA_CERTS: they add work to
 * every Node start (a certificate file is read) that is no part of either program.
 *
 * Method: child_process.spawnSync, timed with performance.now() around each call; one untimed
 * run of each first (file cache).
 *
 * Syntax: processStart(args[, { runs, cwd }])
 * Example: processStart(['bin/dacsmith.js', 'analyze', 'sample-configs/greenhouse-heater.yaml']).ratio   // 2.7
 */
export function processStart(args: string[], options: { runs?: number; cwd?: string } = {}): ProcessTiming {
  const runs = options.runs ?? 7;
  const env = { ...process.env };
  delete env.NODE_OPTIONS;
  delete env.NODE_EXTRA_CA_CERTS;
  const once = (argv: string[]) => {
    const start = performance.now();
    const result = spawnSync(process.execPath, argv, { cwd: options.cwd, env, stdio: ['ignore', 'ignore', 'pipe'] });
    const seconds = (performance.now() - start) / 1000;
    if (result.error) throw result.error;
    return { seconds, status: result.status, stderr: result.stderr?.toString() ?? '' };
  };
  const bareArgs = ['-e', ''];
  once(bareArgs);
  const first = once(args);
  if (first.status !== 0 && first.status !== 1) {
    throw new Error(`node ${args.join(' ')} exited with ${first.status}: ${first.stderr.trim()}`);
  }
  const commandRuns: number[] = [];
  const bareRuns: number[] = [];
  for (let i = 0; i < runs; i++) {
    bareRuns.push(once(bareArgs).seconds);
    commandRuns.push(once(args).seconds);
  }
  const command = median(commandRuns);
  const bare = median(bareRuns);
  return { command, bare, ratio: command / bare, commandRuns, bareRuns, exitCode: first.status };
}
