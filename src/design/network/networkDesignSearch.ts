import type { Network } from '../../circuit/network.js';
import { partValueWarnings } from '../../engine/index.js';
import { networkFromProject } from '../../project/networkFromProject.js';
import type { Project } from '../../project/types.js';
import { formatEng } from '../../units/index.js';
import { DesignInputError } from '../designInputError.js';
import { rankCandidates } from '../rankCandidates.js';
import { recheck } from '../recheck.js';
import type { AnyCandidateStage, AnyDesignResult, Candidate, DesignOptions } from '../types.js';
import { checkNetworkSpaceDomain } from './checkNetworkSpaceDomain.js';
import { networkCandidate } from './networkCandidate.js';
import { networkProblem, type NetworkProblem } from './networkProblem.js';
import { solveNetwork, type NetworkOutcome, type NetworkWalk } from './solveNetwork.js';

/**
 * Recommend standard values for a version 1.1 circuit (a second PWM output, Sallen-Key stages;
 * model.md 1.1): the file's topology with every part chosen from the IEC 60063 series
 * (networkProblem.ts), the `top` best designs that keep search.margin to every limit, ranked as the
 * passive search ranks (rankCandidates.ts: settling time, then smaller total capacitance, total
 * resistance, part values). Every figure is the exact engine's; the file's own values are
 * evaluated alongside. When nothing keeps the margin, the designs that meet the limits without it
 * are listed, else the closest designs the engine evaluated, with what ruled the others out.
 *
 * Method: solveNetwork.ts (proven lower bounds on ripple, settling and the DC figures from the
 * exact period map, exact evaluation in the order of the settling bound, stop once the bound passes
 * the top-th best settling time).
 *
 * With options.walk (walkNetworkSpace of the same project) the space is not walked again.
 *
 * Syntax: networkDesignSearch(project[, { top, onProgress, compare, diagnose, deadline, walk }])
 * Example: networkDesignSearch(loadProject('sample-configs/design-sallen-key.yaml')).candidates[0].stages[1]
 *          // { active: 'sallen-key', r1, r2, c1, c2 }
 */
export function networkDesignSearch(project: Project, options: DesignOptions & { walk?: NetworkWalk } = {}): AnyDesignResult {
  const started = performance.now();
  const top = options.top ?? 10;
  if (!Number.isInteger(top) || top < 1) throw new DesignInputError(`top must be a whole number >= 1, got ${top}`);
  if (options.stageCounts && !(options.stageCounts.length === 1 && options.stageCounts[0] === project.network?.stages.length)) {
    throw new DesignInputError('a file with second_pwm or an active stage keeps its own stages; the search chooses their parts', 'search.stages', project.file);
  }
  const problem = networkProblem(project);
  checkNetworkSpaceDomain(problem);
  const outcome = solveNetwork(problem, top, {
    ...(options.walk && { walk: options.walk }),
    ...(options.deadline !== undefined && { deadline: options.deadline }),
    ...(options.onProgress && { onProgress: (f: number, best: number | null) => options.onProgress!(f, { phase: 'search', stages: problem.template.stages.length, bits: problem.base.bits, frequency: problem.base.frequency, best }) }),
  });
  const current: Candidate<AnyCandidateStage> | null = (options.compare ?? true) ? networkCandidate(problem, networkFromProject(project)) : null;

  const feasible = outcome.feasible.length > 0;
  let shown = outcome.feasible;
  let diagnosis: string[] = [];
  if (!feasible && outcome.complete && (options.diagnose ?? true)) {
    options.onProgress?.(1, { phase: 'explain' });
    const bare = problem.base.margin > 0 ? solveNetwork(networkProblem({ ...project, search: { ...project.search!, margin: 0 } }), top) : null;
    if (bare && bare.feasible.length > 0) {
      shown = bare.feasible.map((c) => recheck(problem.base, c));
      diagnosis = [
        `no design keeps the ${percentText(problem.base.margin)} margin (search.margin) to every limit; ${bare.feasible.length === top ? `at least ${top}` : bare.feasible.length} design${bare.feasible.length > 1 ? 's' : ''} meet the limits themselves (listed below with their margins): lower search.margin to accept them, or widen the search`,
      ];
    } else {
      diagnosis = explainEmpty(problem, outcome);
      shown = closest(outcome.failing, top);
    }
  }
  return {
    candidates: shown,
    feasible,
    stats: { space: outcome.space, evaluated: outcome.evaluated, verified: outcome.verified, elapsed: (performance.now() - started) / 1000 },
    current,
    resolutions: [],
    diagnosis,
    warnings: partValueWarnings(project),
    complete: outcome.complete,
    basis: {
      stageCounts: [problem.template.stages.length],
      series: problem.base.series,
      resistorSeries: problem.base.resistorSeries,
      capacitorSeries: problem.base.capacitorSeries,
      margin: problem.base.margin,
      buffered: [false],
      resistance: { min: problem.rValues[0], max: problem.rValues[problem.rValues.length - 1] },
      capacitance: { min: problem.cValues[0], max: problem.cValues[problem.cValues.length - 1] },
      limits: problem.base.limits,
      band: problem.base.band,
      steps: problem.base.steps,
      lsb: problem.base.lsb,
      network: {
        topology: topologyText(networkFromProject(project)),
        ...(problem.template.stages.some((s) => s.kind === 'sallen-key') && { q: { ...problem.q } }),
        ...(problem.secondRange && {
          secondPwm: {
            role: problem.template.second!.role,
            r: problem.secondRange.r,
            ...(problem.secondRange.c && { c: problem.secondRange.c }),
          },
        }),
      },
    },
  };
}

/** The file's circuit in words: 'RC + Sallen-Key, complement output into stage 1 through R and C'. */
function topologyText(network: Network): string {
  const stages = network.stages.map((s) => (s.kind === 'rc' ? `RC${s.buffered ? ' +follower' : ''}` : 'Sallen-Key')).join(' + ');
  const s = network.second;
  if (!s) return stages;
  const path = s.c !== null ? 'R and C in series' : 'R';
  return `${stages}; ${s.role} output${s.role === 'fine' ? ` (${s.bits} bits)` : ''} into stage ${s.stage + 1} through ${path}`;
}

/** What ruled the space out, in words: the counts of the bounds, and the fastest bound left. */
function explainEmpty(problem: NetworkProblem, o: NetworkOutcome): string[] {
  const r = o.ruledOut;
  const lines: string[] = [];
  const of = (n: number, what: string) => (n > 0 ? `${n} by ${what}` : null);
  const parts = [
    of(r.pinCurrent, 'the pin current limit'),
    of(r.settling, 'a settling time bound over the limit'),
    of(r.ripple, 'a ripple bound over the limit'),
    of(r.dc, 'a droop, INL or gain bound over the limit'),
    of(r.domain, "lying outside the engine's numerical domain"),
  ].filter((s): s is string => s !== null);
  lines.push(
    `no design of the ${o.space} in the space keeps every limit with the ${percentText(problem.base.margin)} margin; ruled out before the exact engine: ${parts.length > 0 ? parts.join(', ') : 'none'}; ${o.verified} evaluated exactly, none passing`,
  );
  if (o.fastest !== null && problem.base.searchLimits.settlingTime !== undefined) {
    lines.push(`the fastest settling any candidate meeting the ripple bound can reach is at least ${formatEng(o.fastest, 's', 3)}`);
  }
  lines.push('widen search.resistance or search.capacitance, take a finer search.series, or relax the binding limit');
  return lines;
}

/** The failing designs closest to passing: smallest worst miss over their checks (a relative overshoot), then ranked. */
function closest(list: readonly Candidate<AnyCandidateStage>[], top: number): Candidate<AnyCandidateStage>[] {
  const miss = (c: Candidate<AnyCandidateStage>) => Math.max(0, ...Object.values(c.margins).map((m) => (m === null ? Infinity : -m)));
  const sorted = rankCandidates(list);
  return sorted.map((c, i) => ({ c, i, m: miss(c) })).sort((a, b) => a.m - b.m || a.i - b.i).slice(0, top).map((x) => x.c);
}

const percentText = (x: number) => `${Number((x * 100).toPrecision(4))} %`;
