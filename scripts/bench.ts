/**
 * `npm run bench [-- --json]`: how fast dacsmith is, on this machine. Prints a table (or, with
 * --json, one JSON object) of medians over several runs: the full analysis in process, the exact
 * engine against ODE time-stepping, settling cost against the time constant, the design search,
 * Monte Carlo throughput, and the whole `dacsmith analyze` process against a bare Node start;
 * then the project's targets and whether this run met them. Progress goes to standard error.
 * Runs through tsx (TypeScript sources); the whole-process figure uses the bundle, rebuilt first.
 */
import { cpus, loadavg, platform, release } from 'node:os';
import { performance } from 'node:perf_hooks';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { analyzeCost } from './bench-analyze.js';
import { designAnswersCost, designCost, infeasibleDesignCost } from './bench-design.js';
import { monteCarloRate } from './bench-monte-carlo.js';
import { networkToleranceCost } from './bench-network-tolerance.js';
import { engineVersusOde } from './bench-ode-race.js';
import { processStart } from './bench-process.js';
import { settlingCost } from './bench-settling.js';
import { benchTable, formatNumber, type BenchReport, type BenchSection, type BenchTarget } from './bench-table.js';
import { buildCli } from './build.mjs';

const root = join(dirname(fileURLToPath(import.meta.url)), '..');
const SAMPLE = join('sample-configs', 'greenhouse-heater.yaml');

/**
 * Run every bench section and return the report (machine, sections, targets, raw data).
 *
 * Syntax: await runBench()
 * Example: (await runBench()).targets.map((t) => t.met)   // [true, true, true, false, true]
 */
export async function runBench(): Promise<BenchReport> {
  const started = performance.now();
  const loadBefore = loadavg()[0];
  const step = (what: string) => process.stderr.write(`bench: ${what}\n`);
  const sections: BenchSection[] = [];
  const data: Record<string, unknown> = {};

  // The bundle first: the Monte Carlo workers and the whole-process figure use it.
  step('build the bundle (node scripts/build.mjs)');
  let buildError: string | null = null;
  try {
    await buildCli();
  } catch (error) {
    buildError = `build failed: ${(error as Error).message.split('\n')[0]}`;
  }

  step('full analysis in process');
  const analyze = analyzeCost();
  sections.push(analyze.section);
  data.analyze = analyze.data;

  step('exact engine against ODE time-stepping (a few seconds)');
  const ode = await engineVersusOde();
  sections.push(ode.section);
  data.ode = ode.data;

  step('settling cost against the time constant');
  const settling = settlingCost();
  sections.push(settling.section);
  data.settling = settling.data;

  step('design search');
  const design = await designCost();
  sections.push(design.section);
  data.design = design.data;

  step('infeasible design searches (whole process)');
  const infeasible = buildError ? null : infeasibleDesignCost(root);
  if (infeasible) sections.push(infeasible.section);
  data.infeasibleDesign = infeasible?.data ?? null;

  step('design answers, whole process (the three-stage search takes a few seconds a run)');
  const designRows = buildError ? null : designAnswersCost(root);
  if (designRows) sections.push(designRows.section);
  data.designAnswers = designRows?.data ?? null;

  step('Monte Carlo');
  const monteCarlo = await monteCarloRate(buildError ? undefined : new URL('../dist/tolerance-worker.js', import.meta.url));
  sections.push(monteCarlo.section);
  data.monteCarlo = monteCarlo.data;

  step('tolerance of version 1.1 circuits (whole process, tens of seconds a run)');
  const networkTolerance = buildError ? null : networkToleranceCost(root);
  if (networkTolerance) sections.push(networkTolerance.section);
  data.networkTolerance = networkTolerance?.data ?? null;

  step('whole process: dacsmith against node -e ""');
  const dacsmith = join('bin', 'dacsmith.cjs');
  const commands = [
    [dacsmith, 'analyze', SAMPLE],
    [dacsmith, 'analyze', SAMPLE, '--no-charts'],
    [dacsmith, 'analyze', SAMPLE, '--format', 'json'],
    [dacsmith, '--help'],
  ];
  const PROCESS_RUNS = 15;
  let start: ReturnType<typeof processStart> | string;
  try {
    if (buildError) throw new Error(buildError);
    start = processStart(commands, { runs: PROCESS_RUNS, cwd: root });
  } catch (error) {
    start = `failed: ${(error as Error).message.split('\n')[0]}`;
  }
  sections.push({
    title: `Whole process (spawnSync, ${PROCESS_RUNS} runs each, interleaved; medians)`,
    columns: ['command', 'wall (ms)', 'x bare node', 'CPU (ms)', 'x bare node (CPU)'],
    rows:
      typeof start === 'string'
        ? []
        : [...start.commands, start.bare].map((c) => [
            `node ${c.args.map((a) => a || "''").join(' ')}`,
            c.median * 1e3,
            c.ratio,
            c.cpu === null ? 'n/a' : c.cpu * 1e3,
            c.cpuRatio ?? 'n/a',
          ]),
    notes:
      typeof start === 'string'
        ? [start]
        : [
            'NODE_OPTIONS and NODE_EXTRA_CA_CERTS removed from every environment; the first row is the target.',
            'CPU: user + system of the child, all threads, 10 ms ticks (Linux /proc). On a loaded machine wall',
            'ratios shrink toward 1 (every process waits for a core alike); the CPU ratio does not.',
          ],
  });
  data.process = start;

  const two = design.data?.find((d) => d.stages === 2);
  const slowestMc = monteCarlo.data?.map((d) => d.hundredThousand).filter((s): s is number => s !== null);
  const worstRatio = ode.data.every((d) => d.ratio !== null) ? Math.min(...ode.data.map((d) => d.ratio!)) : null;
  const growth = Math.max(settling.data.relativePerDecade.oneStage, settling.data.relativePerDecade.twoStage);
  const targets: BenchTarget[] = [
    {
      name: 'exact engine vs ODE route',
      goal: '>= 1000x faster at matched accuracy',
      measured: worstRatio === null ? 'ODE route did not match' : `${formatNumber(worstRatio)}x (slowest case)`,
      met: worstRatio === null ? null : worstRatio >= 1000,
    },
    {
      name: 'settling cost vs tau',
      goal: 'flat over 10..1e7 periods (grows <= 10 % of the median per decade)',
      measured: `${(100 * growth).toFixed(1)} % per decade (larger of 1 and 2 stages)`,
      met: growth <= 0.1,
    },
    {
      name: 'design search, 2 stages E24 wide',
      goal: '< 1 s',
      measured: two ? `${formatNumber(two.seconds)} s wall, ${formatNumber(two.cpu)} s CPU` : 'skipped',
      met: two ? two.seconds < 1 : null,
    },
    {
      name: 'infeasible design search, answered with an explanation',
      goal: '< 10 s whole process',
      measured: infeasible ? `${formatNumber(Math.max(...infeasible.data.map((d) => d.seconds)))} s wall (slowest case)` : 'skipped',
      met: infeasible ? Math.max(...infeasible.data.map((d) => d.seconds)) < 10 : null,
    },
    {
      name: 'Monte Carlo, 100 000 samples',
      goal: '< 2 s',
      measured: slowestMc && slowestMc.length > 0 ? `${formatNumber(Math.max(...slowestMc))} s (slower case)` : 'skipped',
      met: slowestMc && slowestMc.length > 0 ? Math.max(...slowestMc) < 2 : null,
    },
    {
      name: 'tolerance of version 1.1 circuits, 10 000 samples',
      goal: '< 5 s whole process',
      measured: networkTolerance ? `${formatNumber(Math.max(...networkTolerance.data.map((d) => d.seconds)))} s wall (slowest sample)` : 'skipped',
      met: networkTolerance ? Math.max(...networkTolerance.data.map((d) => d.seconds)) < 5 : null,
    },
    {
      name: 'dacsmith analyze, whole process',
      goal: '<= 3x bare node (wall and CPU)',
      measured:
        typeof start === 'string'
          ? start
          : `${formatNumber(start.commands[0].ratio)}x wall` + (start.commands[0].cpuRatio === null ? '' : `, ${formatNumber(start.commands[0].cpuRatio)}x CPU`),
      // Both must hold: under load the wall ratio alone flatters.
      met: typeof start === 'string' ? null : start.commands[0].ratio <= 3 && (start.commands[0].cpuRatio ?? 0) <= 3,
    },
    ...(designRows?.data.rows.flatMap((row): BenchTarget[] => (row.goal === null ? [] : [{
      name: row.name,
      goal: `<= ${row.goal}x bare node (wall)`,
      measured: `${formatNumber(row.ratio)}x wall` + (row.cpuRatio === null ? '' : `, ${formatNumber(row.cpuRatio)}x CPU`),
      met: row.ratio <= row.goal,
    }])) ?? []),
  ];

  const model = cpus()[0]?.model.trim() ?? 'unknown CPU';
  return {
    machine: { cpu: model, cores: cpus().length, node: process.version, platform: `${platform()} ${release()}`, loadBefore, loadAfter: loadavg()[0] },
    sections,
    targets,
    seconds: (performance.now() - started) / 1000,
    data,
  };
}

const report = await runBench();
process.stdout.write(process.argv.includes('--json') ? `${JSON.stringify(report, null, 2)}\n` : benchTable(report));
