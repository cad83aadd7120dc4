/** Bench section: one full analysis in process (analyzeProject). */
import { analyzeProject } from '../src/engine/analyze.js';
import { loadProject } from '../src/project/index.js';
import { sampleProjects } from './bench-cases.js';
import { timePerCall } from './bench-measure.js';
import type { BenchSection } from './bench-table.js';

export interface AnalyzeCost {
  name: string;
  file: string;
  stages: number;
  /** Median CPU time of one analyzeProject call, s, and the wall time. */
  perCall: number;
  wallPerCall: number;
}

/**
 * Time of one complete analysis (steady state on the 11-point duty grid, worst ripple by search,
 * DC transfer, settling, cutoff, attenuation, checks) of the one-stage and the two-stage sample.
 * analyzeProject builds a new ladder from the project at every call, so no engine cache carries
 * over from one call to the next.
 *
 * Syntax: analyzeCost()
 * Example: analyzeCost().data[1].perCall   // 4e-4 (s)
 */
export function analyzeCost(): { data: AnalyzeCost[]; section: BenchSection } {
  const cases = [
    { name: '1 stage', file: sampleProjects.oneStage },
    { name: '2 stages', file: sampleProjects.twoStage },
  ];
  const data = cases.map(({ name, file }) => {
    const project = loadProject(file);
    const { perCall, wallPerCall } = timePerCall(() => analyzeProject(project), { runs: 7, runSeconds: 0.1 });
    return { name, file, stages: project.filter.stages.length, perCall, wallPerCall };
  });
  return {
    data,
    section: {
      title: 'Full analysis in process (analyzeProject: 11-point duty grid, worst ripple, DC transfer, settling, cutoff)',
      columns: ['case', 'project', 'CPU (us)', 'wall (us)'],
      rows: data.map((d) => [d.name, d.file, d.perCall * 1e6, d.wallPerCall * 1e6]),
      notes: [],
    },
  };
}
