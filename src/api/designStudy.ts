import { availableParallelism, loadavg } from 'node:os';
import type { Project } from '../project/index.js';
import { designProblem, designSearch, tradeoffCurves, tradeoffRipples } from '../design/index.js';
import { robustDesigns } from '../design/robustDesigns.js';
import type { AnyCandidateStage, AnyDesignResult, DesignProgress, DesignResult } from '../design/types.js';
import { networkDesignStudy } from '../design/network/networkDesignStudy.js';
import { DesignInputError } from '../design/designInputError.js';
import type { TradeoffCurve } from '../design/tradeoffCurves.js';
import type { RobustResult } from '../design/robustDesigns.js';
import { robustChecks } from '../tolerance/index.js';
import { tradeoffInWorker } from './tradeoffInWorker.js';

export interface DesignStudyOptions {
  /** Designs to list (default 10). */
  top?: number;
  /** Keep only designs that meet every limit at the worst case, or reach the yield target. */
  robust?: 'worst-case' | 'yield';
  /** Also compute the settling/ripple trade-off curves (default true, as the command). */
  tradeoff?: boolean;
  onProgress?: (fraction: number, detail?: DesignProgress) => void;
  /**
   * performance.now() in ms after which the search stops with the designs found so far
   * (`--max-time`): the result says `complete: false`, and no curves are computed past it.
   */
  deadline?: number;
}

export interface DesignStudy {
  result: AnyDesignResult;
  tradeoff?: TradeoffCurve<AnyCandidateStage>[];
  robust?: RobustResult;
}

/**
 * The standard-value search behind `dacsmith design` and the library's design(): the ranked
 * designs, with `robust` only those that survive the tolerance box, and the trade-off curves around
 * the spec's ripple limit (skipped when nothing is feasible: they would rerun many empty searches).
 *
 * A project with a second PWM output or an active stage (model.md 1.1) goes to the search over its
 * own topology (design/network/networkDesignSearch.ts) and its trade-off curves
 * (networkTradeoffCurves.ts); `robust` refuses it for now (the tolerance study does not take these
 * circuits yet).
 *
 * Syntax: designStudy(project[, { top, robust, tradeoff, onProgress, deadline }])
 * Example: designStudy(p, { top: 3, tradeoff: false }).result.candidates[0]
 */
export function designStudy(project: Project, options: DesignStudyOptions = {}): DesignStudy {
  if (project.network) return networkStudy(project, options);
  const result = studyResult(project, options);
  const plan = curvePlan(project, result.result, options);
  const tradeoff = plan ? drawCurves(project, plan, options) : undefined;
  return { ...result, ...(tradeoff && { tradeoff }) };
}

/**
 * designStudy with the trade-off curves of the largest stage count drawn in a worker thread beside
 * the search (tradeoffInWorker.ts), which is what `dacsmith design` runs: the same study, the same
 * numbers, in less wall time on a machine with a second core. The worker starts before the search
 * when the curves' centre and stage counts follow from the file alone (a ripple limit, no search
 * over the resolution; see expectedCurvePlan); otherwise, or when the worker cannot start or
 * fails, everything runs in this thread as designStudy does. Not used with a deadline (--max-time)
 * or for version 1.1 circuits.
 *
 * Syntax: await designStudyInParallel(project[, options][, { force, workerUrl }])
 * Example: (await designStudyInParallel(p)).tradeoff?.[1].points[4].settlingTime   // s
 */
export async function designStudyInParallel(project: Project, options: DesignStudyOptions = {}, parallel: ParallelOptions = {}): Promise<DesignStudy> {
  const charts = options.tradeoff ?? true;
  const guess = project.network || !charts || options.deadline !== undefined ? null : expectedCurvePlan(project);
  if (!guess || guess.stageCounts.length < 2 || !(parallel.force ?? coreToSpare())) return designStudy(project, options);
  const heavy = guess.stageCounts[guess.stageCounts.length - 1];
  // The worker takes the loosest limits of the largest stage count's curve (their walks cost the
  // most) and this thread the rest after its search, so both finish together; after a robust scan,
  // which is longer than a search, the worker takes the whole curve.
  const ripples = tradeoffRipples(guess.center);
  const split = options.robust ? 0 : WORKER_SPLIT;
  const job = { project, stageCounts: [heavy], center: guess.center, ripples: ripples.slice(split), ...(guess.bits !== undefined && { bits: guess.bits }) };
  const run = tradeoffInWorker(job, parallel.workerUrl);
  if (!run) return designStudy(project, options);
  try {
    const result = studyResult(project, options);
    const plan = curvePlan(project, result.result, options);
    if (!plan) return result;
    if (!samePlan(plan, guess)) return { ...result, tradeoff: drawCurves(project, plan, options) };
    const report = options.onProgress;
    const light = plan.stageCounts.filter((n) => n !== heavy);
    const own = drawCurves(project, { ...plan, stageCounts: light }, options, [0.5, 0.65]);
    const ownPart = split > 0 ? drawCurves(project, { ...plan, stageCounts: [heavy] }, options, [0.65, 0.8], ripples.slice(0, split))[0] : null;
    let waiting: ReturnType<typeof setInterval> | undefined;
    if (report) waiting = setInterval(() => report(0.8 + 0.2 * run.progress(), { phase: 'curves' }), 100);
    const fromWorker = await run.curves.finally(() => clearInterval(waiting));
    parallel.onCurves?.(fromWorker ? 'worker' : 'this thread');
    const workerPart = fromWorker?.[0] ?? drawCurves(project, { ...plan, stageCounts: [heavy] }, options, [0.8, 1], job.ripples)[0];
    const heavyCurve: TradeoffCurve = { stages: heavy, points: [...(ownPart?.points ?? []), ...workerPart.points] };
    const byCount = new Map([...own, heavyCurve].map((c) => [c.stages, c]));
    return { ...result, tradeoff: plan.stageCounts.map((n) => byCount.get(n)!) };
  } finally {
    run.stop();
  }
}

/**
 * Limits of the largest stage count's curve (of tradeoffRipples' nine, tightest first) that this
 * thread draws itself after a plain search; the worker draws the rest, the loosest. Measured on
 * the wide E24 bench (two stages, warm, in process): the five tightest 70 ms and the four loosest
 * 125 ms, against 193 ms for the nine in one walk; this thread's search and one-stage curve come
 * first, so the split evens out the two threads' wall time.
 */
const WORKER_SPLIT = 5;

export interface ParallelOptions {
  /** True: use the worker whatever the machine's load; false: never (`design --workers 1`); default: only with a core to spare. */
  force?: boolean;
  /** The worker script (tests: the TypeScript source); default dist/design-worker.js beside the bundle. */
  workerUrl?: URL;
  /** Told where the largest stage count's curves were drawn, once they are (tests, diagnostics). */
  onCurves?: (drawnIn: 'worker' | 'this thread') => void;
}

/**
 * A worker pays only on a core that would otherwise idle: on a machine whose cores are all busy it
 * shares one with this thread and adds its start-up and cold code to the wall time (measured: 1.07x
 * the wall time of the single-thread run, on two cores kept busy by two other jobs). The signal is
 * the one-minute load average (Linux: runnable and waiting tasks), as for `make -l`: below the
 * number of cores, one is free on average. Its own earlier runs count in it too, so the bound is
 * the core count itself, not one less, lest a command run back to back switch its worker off.
 */
function coreToSpare(): boolean {
  const cores = availableParallelism();
  return cores > 1 && loadavg()[0] < cores;
}

/** Stage counts, centre (V) and resolution of the trade-off curves. */
interface CurvePlan {
  stageCounts: number[];
  center: number;
  bits?: number;
}

const samePlan = (a: CurvePlan, b: CurvePlan) =>
  a.center === b.center && a.bits === b.bits && a.stageCounts.length === b.stageCounts.length && a.stageCounts.every((n, i) => n === b.stageCounts[i]);

/** The search (or robust) part of a study: designs, and robust verdicts when asked. */
function studyResult(project: Project, options: DesignStudyOptions): { result: DesignResult; robust?: RobustResult } {
  const top = options.top ?? 10;
  const report = options.onProgress;
  const share = (options.tradeoff ?? true) ? 0.5 : 1;
  if (options.robust) {
    const robust = robustDesigns(project, options.robust, { checks: robustChecks, top, ...(report && { onProgress: (f: number) => report(share * f) }) });
    const result = { ...robust.nominal, candidates: robust.candidates.map((r) => r.candidate), feasible: robust.candidates.length > 0, diagnosis: [] };
    return { result, robust };
  }
  const result = designSearch(project, {
    top,
    ...(options.deadline !== undefined && { deadline: options.deadline }),
    ...(report && { onProgress: (f: number, d?: DesignProgress) => report(share * f, d) }),
  });
  return { result };
}

/**
 * The curves a result gets: around the spec's ripple limit (at the best design's resolution when
 * the search varied it), or null: no curves asked, nothing feasible (the explanation carries the
 * numbers; curves would rerun many empty searches), or out of time (--max-time: the report says
 * the search is incomplete).
 */
function curvePlan(project: Project, result: DesignResult, options: DesignStudyOptions): CurvePlan | null {
  if (!(options.tradeoff ?? true) || !result.feasible) return null;
  const inTime = options.deadline === undefined || (result.complete !== false && performance.now() < options.deadline);
  if (!inTime) return null;
  const best = result.candidates[0];
  const atBits = result.resolutions.length > 0 && best?.bits != null ? best.bits : undefined;
  const ripple = result.basis.limits.ripple;
  const lsbAt = result.resolutions.find((r) => r.bits === atBits)?.lsb;
  const inLsb = project.specInLsb?.ripple;
  const center = ripple === undefined ? best?.worstRipple : inLsb !== undefined && lsbAt !== undefined ? inLsb * lsbAt : ripple;
  if (center === undefined || !(center > 0)) return null;
  return { stageCounts: result.basis.stageCounts, center, ...(atBits !== undefined && { bits: atBits }) };
}

/**
 * The plan curvePlan will give for a feasible result, known from the file alone when the file
 * states a ripple limit and the search keeps the resolution (no search.bits): then the centre is
 * that limit and the stage counts the search's (designSearch's basis). Null otherwise.
 */
function expectedCurvePlan(project: Project): CurvePlan | null {
  if (project.search?.bits) return null;
  let problem;
  try {
    problem = designProblem(project);
  } catch {
    return null; // the search reports it
  }
  const ripple = problem.limits.ripple;
  return ripple !== undefined && ripple > 0 ? { stageCounts: problem.stageCounts, center: ripple } : null;
}

/** The curves of a plan (or of its `ripples` only), reporting progress over [from, to] of the study. */
function drawCurves(project: Project, plan: CurvePlan, options: DesignStudyOptions, span: [number, number] = [0.5, 1], ripples?: number[]): TradeoffCurve[] {
  const report = options.onProgress;
  const [from, to] = span;
  return tradeoffCurves(project, plan.stageCounts, plan.center, {
    ...(plan.bits !== undefined && { bits: plan.bits }),
    ...(ripples && { ripples }),
    ...(report && { onProgress: (f: number) => report(from + (to - from) * f, { phase: 'curves' }) }),
  });
}

/** designStudy for a version 1.1 circuit (design/network/networkDesignStudy.ts). */
function networkStudy(project: Project, options: DesignStudyOptions): DesignStudy {
  if (options.robust) {
    throw new DesignInputError(
      `--robust ${options.robust} does not yet handle a file with second_pwm or an active stage: the tolerance study does not take these circuits yet; run design without --robust`,
      project.network!.second ? 'second_pwm' : 'filter.stages',
      project.file,
    );
  }
  return networkDesignStudy(project, {
    ...(options.top !== undefined && { top: options.top }),
    ...(options.tradeoff !== undefined && { tradeoff: options.tradeoff }),
    ...(options.deadline !== undefined && { deadline: options.deadline }),
    ...(options.onProgress && { onProgress: options.onProgress }),
  });
}
