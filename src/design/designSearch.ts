import { partValueWarnings } from '../engine/index.js';
import { ladderFromProject } from '../project/ladderFromProject.js';
import type { Project } from '../project/types.js';
import { designProblem, type DesignProblem } from './designProblem.js';
import { DesignInputError } from './designInputError.js';
import { checkSearchDomain } from './checkSearchDomain.js';
import { explainInfeasible } from './explainInfeasible.js';
import { exactCandidate } from './exactCandidate.js';
import { rankCandidates } from './rankCandidates.js';
import { recheck } from './recheck.js';
import { bestDesigns } from './bestDesigns.js';
import type { ProblemOutcome } from './solveProblem.js';
import type { Admit } from './cornerScreen.js';
import type { Candidate, DesignOptions, DesignResult, ResolutionRow } from './types.js';

/**
 * Recommend standard-value RC filters for a project: the `top` best feasible designs of the
 * discrete space of project.search (stage counts, IEC 60063 series of resistors and of capacitors,
 * resistor and capacitor ranges, pin current limit, follower options), ranked by settling time,
 * then fewer stages, then smaller total capacitance. Feasible: worst ripple, droop, INL, gain error,
 * settling time and pin peak current each at least search.margin inside its limit. When nothing
 * is, but some designs meet the limits without the margin, the diagnosis says so and lists them. With pwm.clock and search.bits the resolution (and so the PWM frequency) is searched
 * too, LSB limits scaling with each resolution. Every figure of every candidate is the exact
 * engine's; the project's own `filter:` design is evaluated alongside for comparison.
 *
 * Method: per resolution, solveProblem.ts (bounded walk of the space with a fast exact model,
 * engine verification in bound order, proof of optimality by threshold); when nothing is
 * feasible, explainInfeasible.ts says which limit binds and which designs come closest.
 *
 * With `admit` only candidates it admits are verified and ranked (checked before the engine runs;
 * the ranking and its proof then hold among admitted designs): `design --robust worst-case`
 * screens with the tolerance box's corners (cornerScreen.ts).
 *
 * Syntax: designSearch(project[, { top, stageCounts, onProgress, compare, diagnose, admit }])
 * Example: designSearch(loadProject('sample-configs/design-tight-ripple.yaml')).candidates[0]
 *          // { stages: [{ r, c }, { r, c }], settlingTime, worstRipple, droop, pass: true, ... }
 */
export function designSearch(project: Project, options: DesignSearchOptions = {}): DesignResult {
  // A second PWM output or an active stage: design/network/networkDesignSearch.ts (designStudy routes it).
  if (project.network) throw new RangeError('designSearch: a version 1.1 circuit goes to networkDesignSearch');
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
  checkSearchDomain(problems, stageCounts);

  // Stage counts proven out of reach at a resolution (infeasibilityBounds.ts) are not walked
  // (bestDesigns filters them per follower option: a follower removes the load the bounds use).
  let best: number | null = null;
  const outcomes: ProblemOutcome[] = problems.map((problem, i) =>
    bestDesigns(problem, top, stageCounts, (f, d) => {
      if (d?.best != null && (best === null || d.best < best)) best = d.best;
      options.onProgress?.((i + f) / problems.length, { phase: 'search', stages: d?.stages, bits: problem.bits, frequency: problem.frequency, best });
    }, { ...(options.deadline !== undefined && { deadline: options.deadline }), ...(options.admit && { admit: options.admit }) }),
  );
  const complete = outcomes.every((o) => o.complete);
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
  let explained;
  // Out of time: no explanation either (it runs searches of its own).
  if (!feasible && complete && (options.diagnose ?? true)) {
    const without = base.margin > 0 ? designsWithoutMargin(project, problems, top, stageCounts, options.deadline) : { designs: [], complete: true };
    const withoutMargin = without.designs;
    if (withoutMargin.length > 0) {
      const count = withoutMargin.length === top || !without.complete ? `at least ${withoutMargin.length}` : String(withoutMargin.length);
      diagnosis = [
        `no design keeps the ${percentText(base.margin)} margin (search.margin) to every limit; ${count} design${withoutMargin.length > 1 ? 's' : ''} meet the limits themselves (listed below with their margins${without.complete ? '' : '; that search stopped at its budget, so better ones may exist'}): lower search.margin to accept them, or widen the search`,
      ];
      shown = withoutMargin;
    } else {
      options.onProgress?.(1, { phase: 'explain' });
      explained = explainInfeasible(project, problems, stageCounts, undefined, options.deadline);
      diagnosis = explained.lines;
      shown = explained.closest;
    }
  }
  const evaluated = outcomes.reduce((s, o) => s + o.evaluated, 0);
  const verified = outcomes.reduce((s, o) => s + o.verified, 0);
  // The whole space, stage counts proven out of reach included.
  const space = problems.reduce((s, p) => s + stageCounts.reduce((t, n) => t + (p.rValues.length * p.cValues.length) ** n, 0), 0);
  options.onProgress?.(1, { phase: 'search', best: candidates[0]?.settlingTime ?? null });
  return {
    candidates: shown,
    feasible,
    stats: { space, evaluated, verified, elapsed: (performance.now() - started) / 1000 },
    current,
    resolutions,
    diagnosis,
    warnings: partValueWarnings(project),
    complete,
    ...(explained && { fixes: explained.fixes, proven: explained.proven }),
    basis: {
      stageCounts,
      series: base.series,
      resistorSeries: base.resistorSeries,
      capacitorSeries: base.capacitorSeries,
      margin: base.margin,
      buffered: [...new Set(project.search?.buffered ?? [false])],
      resistance: { min: base.rValues[0], max: base.rValues[base.rValues.length - 1] },
      capacitance: { min: base.cValues[0], max: base.cValues[base.cValues.length - 1] },
      limits: base.limits,
      band: base.band,
      steps: base.steps,
      lsb: base.lsb,
    },
  };
}

/** DesignOptions and a screen of the candidates (cornerScreen.ts). */
export interface DesignSearchOptions extends DesignOptions {
  admit?: Admit;
}

/**
 * Fast-model evaluations the search without the margin may make per resolution: like the
 * explanation's side searches (explainInfeasible.ts EXPLAIN_BUDGET) it only explains a failure, so
 * it gets a budget rather than the whole time limit. Measured: a three-stage E24 space with a 30 %
 * margin that no design keeps (an invented project of the fuzz runs) searched without the margin
 * until the 60 s default time limit; the searches of the tests and samples stay far below it.
 */
export const WITHOUT_MARGIN_BUDGET = 200_000;

/**
 * The best designs that meet every limit when the margin is 0 (checked with the real margin:
 * keepsMargin false); `complete` false when a search stopped at its budget or the deadline (the
 * designs found are then real, not proven the best).
 */
function designsWithoutMargin(project: Project, problems: DesignProblem[], top: number, stageCounts: number[], deadline?: number): { designs: Candidate[]; complete: boolean } {
  const bare: Project = { ...project, search: { ...project.search!, margin: 0 } };
  const solve = { budget: WITHOUT_MARGIN_BUDGET, ...(deadline !== undefined && { deadline }) };
  const outcomes = problems.map((p) => bestDesigns(designProblem(bare, problems.length > 1 || project.search?.bits ? (p.bits ?? undefined) : undefined), top, stageCounts, undefined, solve));
  const designs = rankCandidates(outcomes.flatMap((o) => o.feasible))
    .slice(0, top)
    .map((c) => recheck(problems.find((p) => p.bits === c.bits) ?? problems[0], c));
  return { designs, complete: outcomes.every((o) => o.complete) };
}

const percentText = (x: number) => `${Number((x * 100).toPrecision(4))} %`;

function range(min: number, max: number): number[] {
  const out: number[] = [];
  for (let b = min; b <= max; b++) out.push(b);
  return out;
}
