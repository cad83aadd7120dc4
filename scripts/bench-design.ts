/** Bench section: the standard-value design search (src/design), when that module is present. */
import { existsSync } from 'node:fs';
import { join } from 'node:path';
import { processStart } from './bench-process.js';
import { loadProject } from '../src/project/index.js';
import type { Project, SeriesName } from '../src/project/types.js';
import { sampleProjects, wideSearch } from './bench-cases.js';
import { median, timeOnce } from './bench-measure.js';
import type { BenchSection } from './bench-table.js';

/** The part of src/design's result the bench reads (imported by name at run time: the module may be absent). */
interface DesignRun {
  feasible: boolean;
  candidates: unknown[];
  stats: { space: number; evaluated: number; verified: number };
}
type DesignSearch = (project: Project, options?: { compare?: boolean }) => DesignRun;

export interface DesignCost {
  name: string;
  file: string;
  series: SeriesName;
  stages: 1 | 2;
  /** Median wall time and CPU time of one designSearch call, s. */
  seconds: number;
  cpu: number;
  space: number;
  evaluated: number;
  verified: number;
  feasible: boolean;
}

const MODULE = '../src/design/index.js';

/**
 * Time of designSearch over the wide space (R 100 ohm..1 Mohm, C 100 pF..100 uF): one stage from
 * E96 on the one-stage sample, two stages from E24 on the two-stage sample, each the median of 3
 * runs (wall and CPU time), with the candidates in the space, evaluated by the fast model and
 * verified by the engine.
 * `null` data and a "skipped" note when src/design/index.ts is not there (or lacks designSearch).
 *
 * Syntax: await designCost()
 * Example: (await designCost()).data?.[1].seconds   // 0.6
 */
export async function designCost(): Promise<{ data: DesignCost[] | null; section: BenchSection }> {
  const title = 'Design search, wide space (R 100 ohm..1 Mohm, C 100 pF..100 uF)';
  const columns = ['case', 'project', 'space', 'evaluated', 'engine-verified', 'feasible', 'wall (ms)', 'CPU (ms)'];
  const search = await loadDesignSearch();
  if (typeof search === 'string') return { data: null, section: { title, columns, rows: [], notes: [`skipped: ${search}`] } };
  const cases = [
    { name: '1 stage, E96', file: sampleProjects.oneStage, stages: 1 as const, series: 'E96' as const },
    { name: '2 stages, E24', file: sampleProjects.twoStage, stages: 2 as const, series: 'E24' as const },
  ];
  const data: DesignCost[] = [];
  for (const { name, file, stages, series } of cases) {
    const project = wideSearch(loadProject(file), stages, series);
    const runs = [];
    for (let i = 0; i < 3; i++) runs.push(await timeOnce(() => search(project, { compare: false })));
    const { stats, feasible } = runs[0].value;
    const { space, evaluated, verified } = stats;
    data.push({ name, file, series, stages, seconds: median(runs.map((r) => r.wall)), cpu: median(runs.map((r) => r.cpu)), space, evaluated, verified, feasible });
  }
  return {
    data,
    section: {
      title,
      columns,
      rows: data.map((d) => [d.name, d.file, d.space, d.evaluated, d.verified, d.feasible ? 'yes' : 'no', d.seconds * 1e3, d.cpu * 1e3]),
      notes: ["each project's own spec; designSearch with its default options, the project's own filter not compared"],
    },
  };
}

/** designSearch from src/design/index.ts, or why it is not available. */
async function loadDesignSearch(): Promise<DesignSearch | string> {
  const file = new URL('../src/design/index.ts', import.meta.url);
  if (!existsSync(file)) return 'module not present (src/design/index.ts)';
  const module = (await import(MODULE)) as { designSearch?: unknown };
  if (typeof module.designSearch !== 'function') return 'module not present (src/design/index.ts exports no designSearch)';
  return module.designSearch as DesignSearch;
}

/** Infeasible search spaces of the bench: invented fixtures where nothing meets every limit. */
const INFEASIBLE = [
  { name: '1-2 stages E12, bits 8..12, INL binds', file: join('test', 'fixtures', 'projects', 'infeasible-inl-bits.yaml') },
  { name: '1-3 stages E12, bits 8..12, ripple and settling bind', file: join('test', 'fixtures', 'projects', 'infeasible-ripple-three-stage.yaml') },
  { name: '1-2 stages E24, bits 8..12, INL binds', file: join('test', 'fixtures', 'projects', 'infeasible-inl-e24.yaml') },
  { name: '1-3 stages E24, bits 8..12, settling binds', file: join('test', 'fixtures', 'projects', 'slow-three-stage-e24.yaml') },
];

/**
 * Whole-process time of `dacsmith design FILE` (default report: explanation of the empty result,
 * nearest changes verified by side searches) on the infeasible fixtures: median of 3 runs each
 * (bench-process.ts; wall and child CPU time), exit code 1 expected.
 *
 * Syntax: infeasibleDesignCost(root)
 * Example: infeasibleDesignCost(process.cwd()).data[0].seconds   // 4.7
 */
export function infeasibleDesignCost(root: string): { data: Array<{ name: string; file: string; seconds: number; cpu: number | null; exitCode: number | null }>; section: BenchSection } {
  const timing = processStart(
    INFEASIBLE.map((c) => [join('bin', 'dacsmith.cjs'), 'design', c.file]),
    { runs: 3, cwd: root },
  );
  const data = INFEASIBLE.map((c, i) => ({ ...c, seconds: timing.commands[i].median, cpu: timing.commands[i].cpu, exitCode: timing.commands[i].exitCode }));
  return {
    data,
    section: {
      title: 'Infeasible design search, whole process (dacsmith design FILE, 3 runs each; medians)',
      columns: ['case', 'project', 'exit', 'wall (ms)', 'CPU (ms)'],
      rows: data.map((d) => [d.name, d.file, d.exitCode ?? 'n/a', d.seconds * 1e3, d.cpu === null ? 'n/a' : d.cpu * 1e3]),
      notes: ['goal: under 10 s with the explanation (binding limit, figure reached, nearest verified change)'],
    },
  };
}

/** The design answers users wait for (issue targets as multiples of a bare Node start). */
const ANSWERS = [
  { name: 'design, wide E24, trade-off curves (default)', args: ['design', 'scripts/bench-projects/wide-e24.yaml'], goal: 8 },
  // No goal: the same answer without the curves, so the table shows what the curves cost in a fresh process.
  { name: 'design, wide E24, --no-charts (no goal: the curves\' share)', args: ['design', 'scripts/bench-projects/wide-e24.yaml', '--no-charts'], goal: null },
  { name: 'design --robust worst-case, wide E24, 1 %/10 %', args: ['design', 'scripts/bench-projects/wide-e24.yaml', '--robust', 'worst-case'], goal: 15 },
  { name: 'design --robust yield, wide E24, 1 %/10 %', args: ['design', 'scripts/bench-projects/wide-e24.yaml', '--robust', 'yield'], goal: 30 },
  { name: 'design, three stages, wide E12 (--no-charts)', args: ['design', 'scripts/bench-projects/wide-e12-three.yaml', '--no-charts'], goal: 20 },
  // Version 1.1 circuits (design/network): the demo samples as shipped, trade-off curve included.
  { name: 'design, RC + Sallen-Key sample (38 493 candidates)', args: ['design', 'sample-configs/design-sallen-key.yaml'], goal: 60 },
  { name: 'design, complement sample (40 500 candidates)', args: ['design', 'sample-configs/design-complement.yaml'], goal: 60 },
  { name: 'design, fine-output sample (23 800 candidates)', args: ['design', 'sample-configs/design-fine.yaml'], goal: 60 },
];

/**
 * Whole-process time of the design answers (bench-process.ts: medians of 5 interleaved runs with a
 * bare `node -e ''` start in the same runs): default design with its trade-off curves, both robust
 * modes, and a three-stage search, all on the wide space (R 100 ohm..1 Mohm, C 100 pF..100 uF) of
 * the greenhouse sample (scripts/bench-projects/).
 *
 * Syntax: designAnswersCost(root)
 * Example: designAnswersCost(process.cwd()).data.rows[0].ratio   // x bare node
 */
export function designAnswersCost(root: string): {
  data: { bare: number; rows: Array<{ name: string; goal: number | null; seconds: number; ratio: number; cpu: number | null; cpuRatio: number | null }> };
  section: BenchSection;
} {
  const timing = processStart(
    ANSWERS.map((a) => [join('bin', 'dacsmith.cjs'), ...a.args]),
    { runs: 5, cwd: root },
  );
  const rows = ANSWERS.map((a, i) => {
    const c = timing.commands[i];
    return { name: a.name, goal: a.goal, seconds: c.median, ratio: c.ratio, cpu: c.cpu, cpuRatio: c.cpuRatio };
  });
  return {
    data: { bare: timing.bare.median, rows },
    section: {
      title: "Design answers, whole process (5 runs each, interleaved with node -e ''; medians)",
      columns: ['case', 'wall (ms)', 'x bare node', 'CPU (ms)', 'x bare node (CPU)', 'goal (x)'],
      rows: [
        ...rows.map((r) => [r.name, r.seconds * 1e3, r.ratio, r.cpu === null ? 'n/a' : r.cpu * 1e3, r.cpuRatio ?? 'n/a', r.goal ?? '-']),
        ["node -e ''", timing.bare.median * 1e3, 1, timing.bare.cpu === null ? 'n/a' : timing.bare.cpu * 1e3, 1, ''],
      ],
      notes: ['projects: scripts/bench-projects/*.yaml (the greenhouse sample over the wide space, tolerance 1 %/10 %, yield 99 %) and the version 1.1 design samples'],
    },
  };
}
