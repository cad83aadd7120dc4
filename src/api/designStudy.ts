import type { Project } from '../project/index.js';
import { designSearch, tradeoffCurves } from '../design/index.js';
import { robustDesigns } from '../design/robustDesigns.js';
import type { AnyCandidateStage, AnyDesignResult, DesignProgress, DesignResult } from '../design/types.js';
import { networkDesignStudy } from '../design/network/networkDesignStudy.js';
import { DesignInputError } from '../design/designInputError.js';
import type { TradeoffCurve } from '../design/tradeoffCurves.js';
import { TRADEOFF_EFFORT } from '../design/tradeoffEffort.js';
import type { RobustResult } from '../design/robustDesigns.js';
import { robustChecks } from '../tolerance/index.js';

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
  /**
   * Most fast-model evaluations one stage count's trade-off curve may take (default
   * TRADEOFF_EFFORT, tradeoffEffort.ts; Infinity: no limit). A curve that needs more is not drawn
   * and is listed in `tradeoffNotDrawn`; the others are.
   */
  curveEffort?: number;
}

export interface DesignStudy {
  result: AnyDesignResult;
  tradeoff?: TradeoffCurve<AnyCandidateStage>[];
  robust?: RobustResult;
  /** The curves were asked for but the deadline came first (before them, or while they ran). */
  tradeoffOutOfTime?: boolean;
  /** Stage counts whose curve needed more than the effort limit (curveEffort) and was not drawn. */
  tradeoffNotDrawn?: number[];
  /** The effort limit the curves were computed under, fast-model evaluations per curve (with tradeoffNotDrawn). */
  curveEffort?: number;
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
 * Syntax: designStudy(project[, { top, robust, tradeoff, onProgress, deadline, curveEffort }])
 * Example: designStudy(p, { top: 3, tradeoff: false }).result.candidates[0]
 */
export function designStudy(project: Project, options: DesignStudyOptions = {}): DesignStudy {
  if (project.network) return networkStudy(project, options);
  const top = options.top ?? 10;
  const charts = options.tradeoff ?? true;
  const report = options.onProgress;
  const share = charts ? 0.5 : 1;
  let result: DesignResult;
  let robust: RobustResult | undefined;
  if (options.robust) {
    robust = robustDesigns(project, options.robust, {
      checks: robustChecks,
      top,
      ...(options.deadline !== undefined && { deadline: options.deadline }),
      ...(report && { onProgress: (f: number) => report(share * f) }),
    });
    result = { ...robust.nominal, candidates: robust.candidates.map((r) => r.candidate), feasible: robust.candidates.length > 0, diagnosis: [] };
  } else {
    result = designSearch(project, {
      top,
      ...(options.deadline !== undefined && { deadline: options.deadline }),
      ...(report && { onProgress: (f: number, d?: DesignProgress) => report(share * f, d) }),
    });
  }
  let tradeoff: TradeoffCurve[] | undefined;
  let tradeoffOutOfTime = false;
  let notDrawn: number[] = [];
  const effort = options.curveEffort ?? TRADEOFF_EFFORT;
  // Nothing feasible: the explanation carries the numbers; curves would rerun many empty searches.
  // Out of time (--max-time): no curves either; the report says the search is incomplete.
  const inTime = options.deadline === undefined || (result.complete !== false && performance.now() < options.deadline);
  if (charts && result.feasible && !inTime) tradeoffOutOfTime = true;
  if (charts && result.feasible && inTime) {
    const best = result.candidates[0];
    const atBits = result.resolutions.length > 0 && best?.bits != null ? best.bits : undefined;
    const ripple = result.basis.limits.ripple;
    const lsbAt = result.resolutions.find((r) => r.bits === atBits)?.lsb;
    const inLsb = project.specInLsb?.ripple;
    const center = ripple === undefined ? best?.worstRipple : inLsb !== undefined && lsbAt !== undefined ? inLsb * lsbAt : ripple;
    if (center !== undefined && center > 0) {
      tradeoff = tradeoffCurves(project, result.basis.stageCounts, center, {
        ...(atBits !== undefined && { bits: atBits }),
        ...(options.deadline !== undefined && { deadline: options.deadline }),
        ...(effort !== Infinity && { effort }),
        ...(report && { onProgress: (f: number) => report(0.5 + 0.5 * f, { phase: 'curves' }) }),
      });
      // Given up at the deadline (they are [] then; the stage counts are never empty here).
      if (tradeoff.length === 0) {
        tradeoff = undefined;
        tradeoffOutOfTime = true;
      } else {
        // Beyond the effort limit: listed, not drawn (a curve without points would read as no design).
        notDrawn = tradeoff.filter((c) => c.effortExceeded).map((c) => c.stages);
        tradeoff = tradeoff.filter((c) => !c.effortExceeded);
        if (tradeoff.length === 0) tradeoff = undefined;
      }
    }
  }
  return {
    result,
    ...(tradeoff && { tradeoff }),
    ...(robust && { robust }),
    ...(tradeoffOutOfTime && { tradeoffOutOfTime }),
    ...(notDrawn.length > 0 && { tradeoffNotDrawn: notDrawn, curveEffort: effort }),
  };
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
