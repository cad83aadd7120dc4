import { ladderFromProject } from '../project/ladderFromProject.js';
import type { Project } from '../project/types.js';
import { designProblem, type DesignProblem } from './designProblem.js';
import { DesignInputError } from './designInputError.js';
import { explainInfeasible } from './explainInfeasible.js';
import { exactCandidate } from './exactCandidate.js';
import { rankCandidates } from './rankCandidates.js';
import { solveProblem, type ProblemOutcome } from './solveProblem.js';
import type { Candidate, DesignOptions, DesignResult, ResolutionRow } from './types.js';

/**
 * Recommend standard-value RC filters for a project: the `top` best feasible designs of the
 * discrete space of project.search (stage counts, IEC 60063 series, resistor and capacitor
 * ranges, pin current limit), ranked by settling time, then fewer stages, then smaller total
 * capacitance. Feasible: worst ripple, droop, INL, settling time and pin peak current all meet
 * the spec. With pwm.clock and search.bits the resolution (and so the PWM frequency) is searched
 * too, LSB limits scaling with each resolution. Every figure of every candidate is the exact
 * engine's; the project's own `filter:` design is evaluated alongside for comparison.
 *
 * Method: per resolution, solveProblem.ts (bounded walk of the space with a fast exact model,
 * engine verification in bound order, proof of optimality by threshold); when nothing is
 * feasible, explainInfeasible.ts says which limit binds and which designs come closest.
 *
 * Syntax: designSearch(project[, { top, stageCounts, onProgress, compare, diagnose }])
 * Example: designSearch(loadProject('sample-configs/design-tight-ripple.yaml')).candidates[0]
 *          // { stages: [{ r, c }, { r, c }], settlingTime, worstRipple, droop, pass: true, ... }
 */
export function designSearch(project: Project, options: DesignOptions = {}): DesignResult {
  const started = performance.now();
  const top = options.top ?? 10;
  if (!Number.isInteger(top) || top < 1) throw new DesignInputError(`top must be a whole number >= 1, got ${top}`);
  const base = designProblem(project);
  const stageCounts = options.stageCounts ?? base.stageCounts;
  const bitsRange = project.search?.bits;
  const problems: DesignProblem[] =
    bitsRange && project.pwm.clock !== undefined
      ? range(bitsRange.min, bitsRange.max).map((b) => designProblem(project, b))
      : [base];

  const outcomes: ProblemOutcome[] = problems.map((problem, i) =>
    solveProblem(problem, top, stageCounts, (f) => options.onProgress?.((i + f) / problems.length)),
  );
  const candidates = rankCandidates(outcomes.flatMap((o) => o.feasible)).slice(0, top);
  const resolutions: ResolutionRow[] =
    problems.length > 1 || bitsRange
      ? problems.map((p, i) => ({ bits: p.bits ?? 0, frequency: p.frequency, lsb: p.lsb ?? 0, best: outcomes[i].feasible[0] ?? null }))
      : [];

  const current: Candidate | null =
    (options.compare ?? true) && project.filter.stages.length > 0 ? exactCandidate(base, ladderFromProject(project)) : null;

  const feasible = candidates.length > 0;
  let shown = candidates;
  let diagnosis: string[] = [];
  if (!feasible && (options.diagnose ?? true)) {
    const explained = explainInfeasible(project, problems, stageCounts);
    diagnosis = explained.lines;
    shown = explained.closest;
  }
  const evaluated = outcomes.reduce((s, o) => s + o.evaluated, 0);
  const verified = outcomes.reduce((s, o) => s + o.verified, 0);
  const space = outcomes.reduce((s, o) => s + o.space, 0);
  options.onProgress?.(1);
  return {
    candidates: shown,
    feasible,
    stats: { space, evaluated, verified, elapsed: (performance.now() - started) / 1000 },
    current,
    resolutions,
    diagnosis,
    basis: {
      stageCounts,
      series: base.series,
      resistance: { min: base.rValues[0], max: base.rValues[base.rValues.length - 1] },
      capacitance: { min: base.cValues[0], max: base.cValues[base.cValues.length - 1] },
      limits: base.limits,
      band: base.band,
      steps: base.steps,
      lsb: base.lsb,
    },
  };
}

function range(min: number, max: number): number[] {
  const out: number[] = [];
  for (let b = min; b <= max; b++) out.push(b);
  return out;
}
