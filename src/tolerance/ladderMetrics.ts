import type { Ladder } from '../circuit/ladder.js';
import { dcTransfer, settlingTime, worstRipple, modalLadder, type ModalLadder, MAX_MODAL_CONDITION, rippleAt, modalAverageOutput as averageOutput, type PeriodicState, modalSettling, periodicState } from '../engine/index.js';
import type { MetricPlan } from './metricPlan.js';
import type { CircuitMetrics } from './metrics.js';
import { DUTY_XTOL, maximizeFromHints } from './dutySearch.js';
import type { Maximum } from '../numeric/maximizeOnInterval.js';
import { meetsLimit, passesLimits } from './passesLimits.js';

/** The figures of one ladder (metrics.ts; the name predates networks). */
export type LadderMetrics = CircuitMetrics;

export interface LadderMetricsOptions {
  /** Use the engine for every figure (a reference; slow). */
  engineOnly?: boolean;
}

/**
 * Worst ripple, droop, INL and settling time of one ladder, exactly, for tolerance studies.
 *
 * Method: the modal form of the ladder (engine/modal/modalLadder.ts; a cascade of sections when
 * followers sit inside it, engine/modal/cascadeLadder.ts) when it exists and its basis is as well
 * conditioned as the engine requires (MAX_MODAL_CONDITION), the engine otherwise (sections sharing
 * or nearly sharing a mode); settling of a cascade, or a step the modal search declines, also comes from the
 * engine. Worst ripple: Brent's maximization from the nominal ripple peaks in the plan
 * (maximizeFromHints, to DUTY_XTOL in duty), falling back to the engine's full grid search when a
 * peak has moved too far.
 * Droop and INL: with equal driver resistances average(D) is affine in D (the circuit is then
 * linear time-invariant, and its mean output is the DC gain times the mean pin voltage), so both
 * extremes are at the range ends; otherwise the same hinted search on the exact averages.
 * Settling: modalSettling per step, the slowest counts.
 *
 * Syntax: ladderMetrics(ladder, plan[, { engineOnly }])
 * Example: ladderMetrics(ladder, metricPlan(p, ladder)).worstRipple.ripple  // V
 */
export function ladderMetrics(ladder: Ladder, plan: MetricPlan, options: LadderMetricsOptions = {}): LadderMetrics {
  const modal = options.engineOnly ? null : modalLadder(ladder);
  // The engine's accuracy rule (engine/modalRoute.ts): a cascade whose sections nearly share a mode
  // has an ill-conditioned modal basis that loses digits the matrix exponentials keep.
  const m = modal !== null && modal.condition <= MAX_MODAL_CONDITION ? modal : null;
  if (m === null) return engineMetrics(ladder, plan);
  let usedEngine = false;
  let settling: number | null = 0;
  const states = new Map<number, PeriodicState>();
  for (const { from, to } of plan.steps) {
    let t = modalSettling(m, from, to, plan.band, states);
    if (t === undefined) {
      usedEngine = true;
      t = settlingTime(ladder, from, to, plan.band).time;
    }
    if (t === null) {
      settling = null;
      break;
    }
    settling = Math.max(settling, t);
  }
  const dc = modalDc(m, ladder, plan);
  return {
    worstRipple: modalWorstRipple(m, plan),
    droop: dc.droop,
    inl: dc.inl,
    gain: dc.gain,
    settlingTime: settling,
    usedEngine,
  };
}

/**
 * Whether one ladder meets every limit of the plan: passesLimits(ladderMetrics(ladder, plan), plan)
 * for every ladder, with less work (a yield counts nothing else).
 *
 * Method: the figures of ladderMetrics, each by the same calls, checked limit by limit in the
 * order that fails most often first (ripple, then the DC errors, then settling), stopping at the
 * first miss; a figure no limit checks is not computed. Settling asks modalSettling with the limit
 * as its ceiling: a step whose envelope proves it settles by the limit returns that upper bound
 * without the exact search, and the comparison with the limit is unchanged (settling.ts). A
 * ladder without a usable modal form takes the engine's figures, as ladderMetrics does.
 *
 * Syntax: ladderPasses(ladder, plan)
 * Example: ladderPasses(ladder, metricPlan(p, ladder))  // true
 */
export function ladderPasses(ladder: Ladder, plan: MetricPlan): boolean {
  // The modal form and the periodic states are written into those of the previous call: each is
  // done with before the next ladder comes (nothing keeps them), so samples allocate none.
  const modal = modalLadder(ladder, SCRATCH.modal ?? undefined);
  if (modal !== null && modal.symmetric) SCRATCH.modal = modal;
  const m = modal !== null && modal.condition <= MAX_MODAL_CONDITION ? modal : null;
  if (m === null) return passesLimits(engineMetrics(ladder, plan), plan);
  const { limits } = plan;
  if (limits.ripple !== undefined && !meetsLimit('ripple', modalWorstRipple(m, plan).ripple, limits.ripple)) return false;
  const inl = limits.inl !== undefined && plan.inl;
  const gain = limits.gain !== undefined && plan.gain;
  if ((limits.droop !== undefined || inl || gain) && !modalDcPasses(m, ladder, plan)) return false;
  if (limits.settling !== undefined) {
    const states = SCRATCH.states;
    states.clear();
    let pooled = 0;
    for (const { from, to } of plan.steps) {
      for (let k = 0; k < 2; k++) {
        const d = k === 0 ? to : from;
        if (states.has(d)) continue;
        const st = periodicState(m, d, SCRATCH.pool[pooled]);
        SCRATCH.pool[pooled++] = st;
        states.set(d, st);
      }
    }
    for (const { from, to } of plan.steps) {
      let t = modalSettling(m, from, to, plan.band, states, limits.settling);
      if (t === undefined) t = settlingTime(ladder, from, to, plan.band).time;
      // never settling counts as Infinity, as in the sample table
      if (!meetsLimit('settling', t ?? Infinity, limits.settling)) return false;
    }
  }
  return true;
}

/** ladderPasses' modal form and periodic states from its last call (module scratch). */
const SCRATCH: { modal: ModalLadder | null; states: Map<number, PeriodicState>; pool: PeriodicState[] } = {
  modal: null,
  states: new Map(),
  pool: [],
};

function engineMetrics(ladder: Ladder, plan: MetricPlan): LadderMetrics {
  // matrix exponentials throughout: this is the independent check of the modal path (engineOnly)
  const dc = dcTransfer(ladder, plan.dutyMin, plan.dutyMax, 'expm');
  let settling: number | null = 0;
  for (const { from, to } of plan.steps) {
    const t = settlingTime(ladder, from, to, plan.band).time;
    if (t === null) {
      settling = null;
      break;
    }
    settling = Math.max(settling, t);
  }
  return {
    worstRipple: worstRipple(ladder, plan.dutyMin, plan.dutyMax, 'expm'),
    droop: dc.droop,
    inl: plan.inl ? dc.inl : null,
    gain: plan.gain ? dc.gainError / (ladder.high - ladder.low) : null,
    settlingTime: settling,
    usedEngine: true,
  };
}

function modalWorstRipple(m: ModalLadder, plan: MetricPlan): { duty: number; ripple: number } {
  const best = maximizeFromHints((d) => rippleAt(m, d), plan.dutyMin, plan.dutyMax, plan.rippleHints);
  return { duty: best.x, ripple: best.value };
}

function modalDc(
  m: ModalLadder,
  ladder: Ladder,
  plan: MetricPlan,
): { droop: { duty: number; error: number }; inl: { duty: number; error: number } | null; gain: number | null } {
  const dc = dcSearch(m, ladder, plan, true, plan.inl);
  const gain = plan.gain ? dc.gain : null;
  if (dc.affine) {
    const { errA, errB } = dc;
    const droop = Math.abs(errB) > Math.abs(errA) ? { duty: plan.dutyMax, error: errB } : { duty: plan.dutyMin, error: errA };
    return { droop, inl: plan.inl ? { duty: plan.dutyMin, error: 0 } : null, gain };
  }
  const droopAt = dc.droop!.x;
  const droop = { duty: droopAt, error: dc.error(droopAt) };
  if (!plan.inl) return { droop, inl: null, gain };
  const inlAt = dc.inl!.x;
  return { droop, inl: { duty: inlAt, error: dc.deviation(inlAt) }, gain };
}

/**
 * The DC limits of the plan (droop, INL, gain; those the plan computes) met by a ladder with a
 * modal form: the verdict of modalDc's figures, by the same searches. The largest |DC error| and
 * |INL| a search finds is its value at the duty modalDc reports (the same function, so the same
 * number), which saves evaluating the error there once more.
 */
function modalDcPasses(m: ModalLadder, ladder: Ladder, plan: MetricPlan): boolean {
  const { limits } = plan;
  const inl = limits.inl !== undefined && plan.inl;
  const dc = dcSearch(m, ladder, plan, limits.droop !== undefined, inl);
  if (limits.gain !== undefined && plan.gain && !meetsLimit('gain', dc.gain, limits.gain)) return false;
  if (dc.affine) {
    const { errA, errB } = dc;
    const droop = Math.abs(errB) > Math.abs(errA) ? errB : errA;
    if (limits.droop !== undefined && !meetsLimit('droop', droop, limits.droop)) return false;
    return !(inl && !meetsLimit('inl', 0, limits.inl!));
  }
  // the searched maxima of |DC error| and |INL|
  if (limits.droop !== undefined && !meetsLimit('droop', dc.droop!.value, limits.droop)) return false;
  return !(inl && !meetsLimit('inl', dc.inl!.value, limits.inl!));
}

interface DcSearch {
  errA: number;
  errB: number;
  /** Endpoint-fit gain error, a fraction of full scale (0 when the range is one duty). */
  gain: number;
  /** Equal drivers (or a one-duty range): the extremes are at the range ends, no search. */
  affine: boolean;
  /** Largest |DC error| and |INL| (searched when asked for and not affine). */
  droop: Maximum | null;
  inl: Maximum | null;
  error: (d: number) => number;
  deviation: (d: number) => number;
}

function dcSearch(m: ModalLadder, ladder: Ladder, plan: MetricPlan, droop: boolean, inl: boolean): DcSearch {
  const { dutyMin: a, dutyMax: b } = plan;
  const span = ladder.high - ladder.low;
  const average = (d: number) => averageOutput(m, d);
  const error = (d: number) => ladder.low + d * span - average(d);
  const yA = average(a);
  const yB = average(b);
  const errA = ladder.low + a * span - yA;
  const errB = ladder.low + b * span - yB;
  // endpoint fit as in dcTransfer.ts: the ideal slope when the range is one duty
  const gain = b > a ? (span - (yB - yA) / (b - a)) / span : 0;
  const slope = (yB - yA) / (b - a);
  // fit - average, the sign of dcTransfer.ts (README "Sign convention")
  const deviation = (d: number) => yA + slope * (d - a) - average(d);
  const affine = ladder.driverHigh === ladder.driverLow || !(b > a);
  if (affine) return { errA, errB, gain, affine, droop: null, inl: null, error, deviation };
  // |error| and |deviation| at the ends from the averages already at hand (the same expressions)
  const droopMax = droop ? maximizeFromHints((d) => Math.abs(error(d)), a, b, plan.droopHints, DUTY_XTOL, { fa: Math.abs(errA), fb: Math.abs(errB) }) : null;
  const inlMax = inl
    ? maximizeFromHints((d) => Math.abs(deviation(d)), a, b, plan.inlHints, DUTY_XTOL, {
        fa: Math.abs(yA + slope * (a - a) - yA),
        fb: Math.abs(yA + slope * (b - a) - yB),
      })
    : null;
  return { errA, errB, gain, affine, droop: droopMax, inl: inlMax, error, deviation };
}
