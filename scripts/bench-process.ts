/** Whole-process timing of the command line against a bare Node start. */
import { spawnSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { performance } from 'node:perf_hooks';
import { median } from './bench-measure.js';

export interface CommandTiming {
  /** Arguments after `node`. */
  args: string[];
  /** Median wall time, s. */
  median: number;
  /** median / the bare start's median. */
  ratio: number;
  /** Every run, s. */
  runs: number[];
  /** Median CPU time of the child (user + system, all its threads), s; null where /proc is missing. */
  cpu: number | null;
  /** cpu / the bare start's cpu. */
  cpuRatio: number | null;
  /** Exit code of the untimed first run. */
  exitCode: number | null;
}

export interface ProcessTiming {
  /** `node -e ''`. */
  bare: CommandTiming;
  commands: CommandTiming[];
}

/**
 * Wall time of whole `node <args>` processes (start, load, run, exit) against `node -e ''`, each
 * the median of `runs` runs, all interleaved so that a change in machine load hits every one.
 * All run with the same environment, minus NODE_OPTIONS and NODE_EXTRA_CA_CERTS: they add work to
 * every Node start (a certificate file is read) that is no part of any program measured. A
 * command that exits with anything but 0 or 1 (spec pass / fail) is an error.
 *
 * Wall time counts waiting for a core too: on a loaded machine it grows for every process by about
 * the same amount, which pulls ratios toward 1. The child's CPU time is taken as well (Linux: the
 * cutime + cstime fields of /proc/self/stat, which count reaped children, in USER_HZ = 1/100 s
 * ticks; proc(5)), a load-independent second opinion.
 *
 * Method: child_process.spawnSync, timed with performance.now() around each call; one untimed
 * run of each first (file cache).
 *
 * Syntax: processStart(commands[, { runs, cwd }])
 * Example: processStart([['bin/dacsmith.cjs', 'analyze', 'sample-configs/greenhouse-heater.yaml']]).commands[0].ratio   // 2.7
 */
export function processStart(commands: string[][], options: { runs?: number; cwd?: string } = {}): ProcessTiming {
  const runs = options.runs ?? 7;
  const env = { ...process.env };
  delete env.NODE_OPTIONS;
  delete env.NODE_EXTRA_CA_CERTS;
  const once = (args: string[]) => {
    const cpuBefore = childrenCpu();
    const start = performance.now();
    const result = spawnSync(process.execPath, args, { cwd: options.cwd, env, stdio: ['ignore', 'ignore', 'pipe'] });
    const seconds = (performance.now() - start) / 1000;
    const cpuAfter = childrenCpu();
    if (result.error) throw result.error;
    const cpu = cpuBefore === null || cpuAfter === null ? null : cpuAfter - cpuBefore;
    return { seconds, cpu, status: result.status, stderr: result.stderr?.toString() ?? '' };
  };
  const all = [['-e', ''], ...commands];
  const exitCodes = all.map((args) => {
    const first = once(args);
    if (first.status !== 0 && first.status !== 1) {
      throw new Error(`node ${args.join(' ')} exited with ${first.status}: ${first.stderr.trim()}`);
    }
    return first.status;
  });
  const times = all.map((): number[] => []);
  const cpus = all.map((): Array<number | null> => []);
  for (let i = 0; i < runs; i++) {
    all.forEach((args, k) => {
      const run = once(args);
      times[k].push(run.seconds);
      cpus[k].push(run.cpu);
    });
  }
  const cpuMedian = (k: number) => (cpus[k].every((c) => c !== null) ? median(cpus[k] as number[]) : null);
  const bareMedian = median(times[0]);
  const bareCpu = cpuMedian(0);
  const timing = (k: number): CommandTiming => {
    const cpu = cpuMedian(k);
    return {
      args: all[k],
      median: median(times[k]),
      ratio: median(times[k]) / bareMedian,
      runs: times[k],
      cpu,
      cpuRatio: cpu !== null && bareCpu ? cpu / bareCpu : null,
      exitCode: exitCodes[k],
    };
  };
  return { bare: timing(0), commands: commands.map((_, i) => timing(i + 1)) };
}

/** CPU time of this process's reaped children so far, s (Linux /proc/self/stat), else null. */
function childrenCpu(): number | null {
  try {
    const stat = readFileSync('/proc/self/stat', 'utf8');
    // Fields after the command name (which may hold spaces) start at field 3 (state).
    const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
    const cutime = Number(fields[16 - 3]);
    const cstime = Number(fields[17 - 3]);
    return Number.isFinite(cutime) && Number.isFinite(cstime) ? (cutime + cstime) / 100 : null;
  } catch {
    return null;
  }
}
