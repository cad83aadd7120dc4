import { curveValue, modalAverageOutput, modalLadderOf, periodicState, rippleAt, settlingLowerBound, steadySwing, type ModalLadder, type PeriodicState, type SteadySwing } from '../engine/index.js';
import type { Admit } from './cornerScreen.js';
import type { DesignProblem } from './designProblem.js';
import { designLimits } from './designLimits.js';
import { dcTransferMiss } from './dcTransferMiss.js';
import { droopFloor, droopFloorPlan, type DroopFloorPlan } from './droopFloor.js';
import { inlFloor, inlFloorPlan, type InlFloorPlan } from './inlFloor.js';
import { maximizeOverDuty } from './maximizeOverDuty.js';
import { rippleCeiling, rippleCeilingPlan, rippleFloorSharp, type RippleCeilingPlan } from './rippleCeiling.js';
import { rippleFloor, rippleFloorPlan, type RippleFloorPlan } from './rippleFloor.js';
import { tupleBounds, type TupleBounds } from './settlingBounds.js';
import { floorStepScale, NO_FLOOR, pointSettlingFloor, settlingFloor, settlingFloorPlan } from './settlingFloor.js';
import { slowestTimeConstant, twoSlowestTimeConstants } from './slowestTimeConstant.js';
import { LIST_SHARE, listTuples, timeIsUp, tupleFloor, tupleQueue } from './listTuples.js';
import { exceeds, REL } from './searchAllowance.js';
import { doubles, emptyDoubles } from '../numeric/dense.js';

/** Columns held back while no threshold is known, at most (their inner points are then walked). */
const DEFER_CAP = 100_000;
/** Absolute allowance on times, s. */
const ABS_T = 1e-12;
/**
 * Factor on the band above which the steady excursion at a target duty (steadySwing) certainly
 * leaves it in the settling bound's own figures too (steadyError, same state, other rounding).
 */
const NEVER_SETTLES = 1 + 1e-9;

/** A candidate the fast model could not rule out, with its settling lower bound. */
export interface FastEntry {
  r: number[];
  c: number[];
  /** Lower bound on the settling time, s (equal to it in the usual case). */
  lb: number;
  totalC: number;
  /** Fast worst ripple (a lower bound), V, once computed. */
  worst?: number;
  /** Ruled out by the fast worst ripple or worst droop. */
  ruledOut?: boolean;
  /** The search's screen (CollectState.admit) was asked and admitted it. */
  admitted?: boolean;
}

/** Shared state of one search (all stage counts of one problem). */
export interface CollectState {
  top: number;
  /** Candidates whose settling lower bound exceeds theta are not collected, s. */
  theta: number;
  /** Lower theta to the top-th best fast estimate as candidates come in. */
  dynamic: boolean;
  /** Ascending fast settling estimates of candidates that pass every fast check. */
  best: number[];
  entries: FastEntry[];
  /** Keys of candidates already collected (filled when `dynamic` ends: later rounds skip them). */
  seen: Set<string>;
  /** Candidates the fast model evaluated (ripple, droop or settling). */
  evaluated: number;
  /** Stop the walk once `evaluated` passes this (explanations' side searches); `cut` then tells. */
  budget?: number;
  /** The walk stopped at the budget: what was collected is not the whole bounded set. */
  cut?: boolean;
  /** Stop the walk once performance.now() passes this (ms; `design --max-time`); `cut` then tells. */
  deadline?: number;
  /**
   * Stop the walk once `evaluated` passes this, as at the deadline (the trade-off curves' effort
   * limit, tradeoffCurves.ts); `cut` then tells. Unlike `budget` every pruning stays: what a capped
   * walk collected is thrown away, so where the cut falls changes no answer.
   */
  cap?: number;
  /** Pareto mode (trade-off curves, paretoSearch.ts): several ripple limits in one walk. */
  pareto?: ParetoState;
  /**
   * Only candidates this admits count (SolveOptions.admit): one the screen rejects may not lower
   * theta, so theta tracks the top-th best admitted estimate and the walk is not redone wider.
   */
  admit?: Admit;
}

/**
 * Pareto mode: instead of one top list, the best fast settling bound per ripple limit. A
 * candidate is kept unless its settling bound exceeds the best already known for every limit its
 * ripple could meet (it is then dominated in (worst ripple, settling time)); theta is the largest
 * of those bests (the tightest limit's), so the walk's own cuts stay valid for every limit.
 */
export interface ParetoState {
  /** Ripple limits the search must meet, V, ascending (problem.searchLimits.ripple is the last). */
  limits: number[];
  /** Best fast settling bound of a candidate that passes every fast check under each limit, s. */
  best: number[];
}

/** A fresh state: theta starts at the settling-time limit (nothing slower is feasible). */
export function newCollectState(problem: DesignProblem, top: number): CollectState {
  const cap = problem.searchLimits.settlingTime;
  return {
    top,
    theta: cap === undefined ? Infinity : cap * (1 + REL) + ABS_T,
    dynamic: true,
    best: [],
    entries: [],
    seen: new Set(),
    evaluated: 0,
  };
}

/** Pareto mode: the settling threshold of a candidate whose worst ripple is at least `ripple`. */
function paretoThreshold(pareto: ParetoState, ripple: number): number {
  let out = -Infinity;
  for (let i = 0; i < pareto.limits.length; i++) {
    if (exceeds(ripple, pareto.limits[i])) continue;
    out = Math.max(out, pareto.best[i] * (1 + REL) + ABS_T);
  }
  return out;
}

/**
 * Collect every `stages`-stage candidate of the problem's discrete space that the fast model cannot
 * rule out and whose settling lower bound is at most state.theta (which may fall as candidates
 * come in). Ruled out, each by a lower bound on the engine's figure: pin peak current over the
 * limit (R1 only); droop over the limit (resistors only, below; with unequal drivers also the
 * fast droop maximised over the duty, and first the droop floor from the resistors and the first
 * two capacitors, droopFloor.ts); gain error over the limit (resistors only, gainFloor.ts:
 * R_s / (R_L + R_s) of full scale for equal drivers, the DC divider of the series resistance and
 * the load; with unequal drivers also the fast model's exact endpoint averages); the ripple at the duty nearest 50 % over the limit; never
 * settling; settling lower bound over the time limit.
 *
 * The droop floor from the resistors alone (the listing's, resistiveDroop.ts: DC current balance,
 * droop >= ideal S / (R_L + S) with S the driver and series resistance) rules out whole tuples.
 *
 * Every limit is problem.searchLimits (the file's, less search.margin). With a follower after the
 * last stage (problem.buffered) the ladder is unloaded (problem.circuit) and every bound here
 * holds for that unloaded ladder unchanged.
 *
 * Method: resistor tuples in ascending order of a lower bound on their best settling time
 * (settlingBounds.ts; listTuples.ts lists them, tupleQueue gives them in that order, finishing
 * each bound lazily); the walk stops when that bound passes theta. For each tuple, capacitor
 * space by monotone structure: the ripple falls when any capacitor grows, so the feasible region
 * of the last two capacitors is bounded below by a staircase, walked once per tuple (last
 * capacitor from the previous column's step upward, columns from the largest first capacitor
 * down); the settling lower bound tau_slow * factor - slack grows with every capacitor (Rayleigh
 * quotient, slowestTimeConstant.ts), which cuts each column and ends the walk. Staircase points
 * are evaluated first, so theta falls before the inner points are visited. From three stages on,
 * the capacitors before the last two are looped over, and a slice of the innermost of them whose
 * staircase box (boxOf) has its far corner ripple-infeasible holds nothing; one ripple check at a
 * larger value of that capacitor with this slice's corner rules out every slice in between
 * (deadThrough), so runs of such slices cost a bisection, not a check each; and the steps of the
 * last staircase walked at a smaller value of it bound this staircase's steps from above. Every
 * ripple check from three stages on first bounds the ripple from below by the output at four
 * instants of the period, and DC checks read the periodic state's average alone. A point then gets the
 * cheaper bound tau_slow ln(z0 / (band + excursion)) from its own steady states (equal drivers), its
 * own floor (pointSettlingFloor, settlingFloor.ts: the proven floor with its target orbit's
 * excursions), and only then the exact settling lower bound (the engine's settlingLowerBound). The fast model is the engine's
 * modal form of each candidate (modalLadderOf): steady states from steadySwing (scalar code for one
 * and two stages), periodicState for settling.
 *
 * `onProgress(fraction)` reports the share done: listing the resistor tuples counts for its first
 * tenth (a three-stage E96 space has 17 million tuples and takes seconds to list), each tuple
 * walked for its part of the rest.
 *
 * Syntax: collectCandidates(problem, stages, state[, onProgress])
 * Example: collectCandidates(problem, 2, newCollectState(problem, 10)); state.entries.length
 */
export function collectCandidates(
  problem: DesignProblem,
  stages: number,
  state: CollectState,
  onProgress?: (fraction: number) => void,
): void {
  const { rValues: R, cValues: C, searchLimits: limits, project, circuit } = problem;
  const { pwm } = project;
  const lti = pwm.driver.high === pwm.driver.low;
  const nR = R.length;
  const nC = C.length;
  // The load as the ladder sees it: none behind a follower (designProblem.ts, circuit).
  const loadR = circuit.loadResistance;
  const loadC = circuit.loadCapacitance;
  const dNear = Math.min(problem.dutyMax, Math.max(problem.dutyMin, 0.5));
  const toDuties = [...new Set(problem.steps.map((s) => s[1]))];
  const checkTo = limits.ripple === undefined || problem.band * 2 < limits.ripple;
  // Unequal drivers with an INL limit: a floor on the INL from the resistors and the first two
  // capacitors (inlFloor.ts), per resistor tuple; a point it rules out is one the fast INL check
  // (dcTransferMiss.ts, same duties, same allowance) rules out too, without a steady state.
  const inlPlans = new WeakMap<number[], InlFloorPlan | null>();
  const inlApplies = limits.inl !== undefined && !lti;
  // A walk with a budget (the explanations' side searches) is cut after so many fast evaluations,
  // and its answer is whatever it found by then: the prunings that skip points without evaluating
  // them (the droop floor, whole slices by deadThrough, the DC floors on whole columns and slices,
  // the staircase's skipped columns and prior steps) would move that cut and change the answer, so
  // such a walk goes without them (it is short anyway).
  const budgeted = state.budget !== undefined;
  const inlOver = (rs: number[], cs: number[]): boolean => {
    if (!inlApplies) return false;
    let plan = inlPlans.get(rs);
    if (plan === undefined) {
      plan = inlFloorPlan(problem, rs);
      inlPlans.set(rs, plan);
    }
    return plan !== null && inlFloor(plan, cs) > limits.inl! * (1 + REL) + 1e-15;
  };
  // Unequal drivers with a droop limit: likewise a floor on the droop (droopFloor.ts), per resistor
  // tuple; it rules out only points the fast droop check (same grid duties, same allowance) rules
  // out, without a model. Where the droop binds (a load, unequal drivers) it decides most points.
  const droopPlans = new WeakMap<number[], DroopFloorPlan | null>();
  const droopApplies = !lti && limits.droop !== undefined && !budgeted;
  const droopOver = (rs: number[], cs: number[]): boolean => {
    if (!droopApplies) return false;
    let plan = droopPlans.get(rs);
    if (plan === undefined) {
      plan = droopFloorPlan(problem, rs);
      droopPlans.set(rs, plan);
    }
    return plan !== null && exceeds(droopFloor(plan, cs), limits.droop);
  };
  /**
   * A floor of the DC transfer (INL or droop) rules the point out. Both floors never fall when any
   * capacitor grows, so every point with capacitors at least these is ruled out too.
   */
  const dcOver = (rs: number[], cs: number[]): boolean => inlOver(rs, cs) || droopOver(rs, cs);

  /**
   * Lower bound on the settling time of the point from its capacitors (never falls when one grows):
   * the proven floor of settlingFloor.ts from the fast ladder's two slowest time constants; exact to
   * 1e-9 without a ceiling, and with one only sure to lie on the right side of it. Budgeted walks
   * keep the older tau_slow * factor - slack (settlingBounds.ts), so their cut stays where it was.
   */
  const taus = [0, 0];
  const settlingBoundOf = (rs: number[], cs: number[], tb: TupleBounds, ceiling: number): number => {
    if (budgeted) return slowestTimeConstant(rs, cs, tb.driver, loadR, loadC) * tb.factor - tb.slack;
    twoSlowestTimeConstants(rs, cs, tb.driver, loadR, loadC, taus);
    return settlingFloor(tb.floor, taus[0], taus[1], ceiling);
  };
  /**
   * Lower bound on the settling time of every capacitor choice of a resistor tuple that meets
   * tb's ripple limit: the bound above with the slowest time constant at least tb.tauMin (the
   * ripple's) and both at least their values at the smallest capacitors; with a ceiling, only sure
   * to lie on the right side of it (settlingFloor).
   */
  const minC = doubles(stages).fill(C[0]);
  // floorStepScale of the last tuple asked (resistors only)
  let scaleR: number[] = [];
  let scale = 0;
  const stepScaleOf = (rs: number[]): number => {
    if (!sameAs(rs, scaleR)) {
      scale = floorStepScale(problem, rs);
      scaleR = rs.slice();
    }
    return scale;
  };
  const tupleKey = (rs: number[], tb: TupleBounds, ceiling: number): number => tupleFloor(problem, rs, minC, tb, budgeted, ceiling);

  // Resistor tuples that pass the resistor-only checks (listTuples), taken in ascending order of
  // their keys (tupleQueue, which finishes a key only as the walk gets near it).
  const list = listTuples(problem, stages, state, budgeted, droopApplies, onProgress);
  const queue = tupleQueue(problem, list, droopApplies);

  // Pareto mode: each ripple limit with the problem's other limits (per-limit tuple bounds).
  const paretoLimits = state.pareto ? state.pareto.limits.map((ripple) => designLimits({ ...limits, ripple })) : [];
  // Pareto mode: points already evaluated, by a number made of their value indices (no strings).
  const paretoSeen = new Set<number>();
  // The index of a value of R or C (both ascending, seriesValues) by bisection, cheaper than a Map
  // keyed by doubles (indexCode was 3 % of a default design run with Maps, profiled).
  const indexIn = (values: number[], v: number): number => firstTrue(values.length, (i) => values[i] >= v);
  const indexCode = (rs: number[], cs: number[]): number => {
    let code = 0;
    for (let k = 0; k < rs.length; k++) code = (code * nR + indexIn(R, rs[k])) * nC + indexIn(C, cs[k]);
    return code;
  };

  // One-entry model cache: the staircase check is usually followed by the full evaluation. With it
  // the candidate's steady states by duty (its checks below, the INL grid, the droop grid and the
  // settling steps share duties): the figures of the cheap checks, and the full state for settling.
  let lastR = doubles(stages);
  const lastC = doubles(stages);
  let model: ModalLadder | null = null;
  // Valid for slots 0..slots-1; the objects of earlier candidates are kept by slot (pools) and the
  // engine writes the next candidate's figures into them: no allocation per candidate.
  let slots = 0;
  // (double arrays from the start, emptied: slots append, and the kind of array never changes)
  const steadyDuty = emptyDoubles();
  const steadyOf: Array<PeriodicState | null> = [];
  const swingOf: Array<SteadySwing | null> = [];
  /** Ripple alone (rippleAt) and time average alone (averageOutput) by slot, where no swing is known; NaN: not yet. */
  const rippleAtSlot = emptyDoubles();
  const averageAtSlot = emptyDoubles();
  const steadyPool: Array<PeriodicState | undefined> = [];
  const swingPool: Array<SteadySwing | undefined> = [];
  const sameAs = (x: number[], y: number[]) => {
    if (x.length !== y.length) return false;
    for (let k = 0; k < x.length; k++) if (x[k] !== y[k]) return false;
    return true;
  };
  const copyInto = (to: number[], from: number[]) => {
    if (to.length !== from.length) to.length = from.length;
    for (let k = 0; k < from.length; k++) to[k] = from[k];
  };
  const use = (rs: number[], cs: number[]): ModalLadder => {
    if (model === null || !sameAs(rs, lastR) || !sameAs(cs, lastC)) {
      lastR = rs;
      copyInto(lastC, cs);
      // one and two stages: written over the last candidate's model (its states go with it)
      model = modalLadderOf(problem.circuit, rs, cs, model ?? undefined);
      slots = 0;
    }
    return model;
  };
  /** Slot of a duty in the steady states of the model last used. */
  const slot = (d: number): number => {
    for (let k = 0; k < slots; k++) if (steadyDuty[k] === d) return k;
    steadyDuty[slots] = d;
    steadyOf[slots] = null;
    swingOf[slots] = null;
    rippleAtSlot[slots] = Number.NaN;
    averageAtSlot[slots] = Number.NaN;
    return slots++;
  };
  /** Periodic state of the model last used at a duty (computed once). */
  const steady = (d: number): PeriodicState => {
    const k = slot(d);
    return (steadyOf[k] ??= steadyPool[k] = periodicState(model!, d, steadyPool[k]));
  };
  /** Steady-state figures of the model last used at a duty (computed once): scalar code for one and two stages. */
  const swing = (d: number): SteadySwing => {
    const k = slot(d);
    return (swingOf[k] ??= swingPool[k] = stages <= 2 ? steadySwing(model!, d, undefined, swingPool[k]) : steadySwing(model!, d, steady(d), swingPool[k]));
  };

  // Count each candidate the fast model looks at once (consecutive looks are at the same candidate).
  let seenR = doubles(stages);
  const seenC = doubles(stages);
  const touch = (rs: number[], cs: number[]) => {
    if (sameAs(rs, seenR) && sameAs(cs, seenC)) return;
    seenR = rs;
    copyInto(seenC, cs);
    state.evaluated++;
  };

  /**
   * The ripple at duty d is over `limit`. From three stages on, where the exact extremes cost a
   * root search per phase, the output at four instants of the steady period first (both edges, the
   * middle of each phase): their spread is at most the ripple (max - min over the period), so a
   * spread over the limit (with twice the allowance) rules the point out as the exact check would.
   */
  const rippleOver = (rs: number[], cs: number[], d: number, limit: number | undefined): boolean => {
    if (limit === undefined) return false;
    if (floorOver(rs, cs, d, limit)) return true;
    if (ceilingUnder(rs, cs, d, limit)) return false;
    touch(rs, cs);
    use(rs, cs);
    if (stages >= 3 && swingOf[slot(d)] === null) {
      const s = steady(d);
      const mid1 = curveValue(s.high, 0.5 * s.t1);
      const mid2 = curveValue(s.low, 0.5 * s.t2);
      const hi = Math.max(0, s.low.offset, mid1, mid2);
      const lo = Math.min(0, s.low.offset, mid1, mid2);
      if (hi - lo > limit * (1 + 2 * REL) + 1e-300) return true;
    }
    return exceeds(rippleOf(rs, cs, d), limit);
  };

  /**
   * The ripple floor (rippleFloor.ts: from the pin's fundamental, a few operations, no model) at
   * duty d is over `limit`: the exact ripple is then over it too. Many points a staircase search
   * asks about lie well below the staircase, and this decides them (28 to 30 % of the ripple checks
   * of the wide E24 bench searches, counted). It pays where a model is dear: three stages (a third
   * fewer fast models on the E12 bench); a two-stage model costs about what it saves. Budgeted
   * walks go without it (their cut counts fast evaluations; see above).
   */
  let floorR: number[] = [];
  let floorPlan: RippleFloorPlan | null = null;
  const floorOver = (rs: number[], cs: number[], d: number, limit: number): boolean => {
    if (budgeted) return false;
    // From three stages on, the sharper floor on the ceiling's plan (the near-sine outputs there)
    const sharp = stages >= 3 ? ceilingPlanOf(rs) : null;
    if (sharp !== null) return exceeds(rippleFloorSharp(sharp, cs, d, limit * (1 + REL) + 1e-300), limit);
    if (floorPlan === null || !sameAs(rs, floorR)) {
      floorPlan = rippleFloorPlan(problem, rs);
      floorR = rs.slice();
    }
    return exceeds(rippleFloor(floorPlan, cs, d), limit);
  };

  /**
   * From three stages on, the ripple ceiling (rippleCeiling.ts: the output's harmonics, a few
   * continuants, no model) at duty d is within `limit`: the exact ripple is then within it too.
   * Most ripple checks of a three-stage walk pass (the staircases' steps and the corners of
   * deadThrough), and a passing check needs no model unless the point is then evaluated; the
   * ceiling decides most of them. Budgeted walks go without it (their cut counts fast evaluations).
   */
  let ceilingR: number[] = [];
  let ceilingPlan: RippleCeilingPlan | null = null;
  /** The ceiling's plan of a tuple (null for one stage), made once per tuple. */
  const ceilingPlanOf = (rs: number[]): RippleCeilingPlan | null => {
    if (ceilingPlan === null || !sameAs(rs, ceilingR)) {
      ceilingPlan = rippleCeilingPlan(problem, rs);
      ceilingR = rs.slice();
    }
    return ceilingPlan;
  };
  /** The ripple ceiling at duty d, or NaN where it is not used (budgeted walks, one and two stages). */
  const ceilingOf = (rs: number[], cs: number[], d: number): number => {
    if (budgeted || stages < 3) return Number.NaN;
    const plan = ceilingPlanOf(rs);
    return plan === null ? Number.NaN : rippleCeiling(plan, cs, d);
  };
  const ceilingUnder = (rs: number[], cs: number[], d: number, limit: number): boolean => ceilingOf(rs, cs, d) <= limit;

  /** Steady-state figures for the cheap checks. */
  const lite = (rs: number[], cs: number[], d: number): SteadySwing => {
    touch(rs, cs);
    use(rs, cs);
    return swing(d);
  };

  /** lite(rs, cs, d).ripple, without the time average when no swing is known (one and two stages: rippleAt). */
  const rippleOf = (rs: number[], cs: number[], d: number): number => {
    touch(rs, cs);
    use(rs, cs);
    if (stages > 2) return swing(d).ripple;
    const k = slot(d);
    const known = swingOf[k];
    if (known !== null) return known.ripple;
    if (Number.isNaN(rippleAtSlot[k])) rippleAtSlot[k] = rippleAt(model!, d);
    return rippleAtSlot[k];
  };

  /** lite(rs, cs, d).average, without the extremes when no swing is known (one and two stages: averageOutput). */
  const averageOf = (rs: number[], cs: number[], d: number): number => {
    touch(rs, cs);
    use(rs, cs);
    // three stages on: the periodic state's average, without the extremes it does not need
    if (stages > 2) return steady(d).average;
    const k = slot(d);
    const known = swingOf[k];
    if (known !== null) return known.average;
    if (Number.isNaN(averageAtSlot[k])) averageAtSlot[k] = modalAverageOutput(model!, d);
    return averageAtSlot[k];
  };

  // The ripple limit of the staircase: the problem's, or in Pareto mode each limit's in turn.
  let rippleLimit = limits.ripple;
  // Pareto mode: the staircases of one tuple ask about the same points; remember each point's
  // ripple near 50 % (NaN: its ripple at a target duty rules settling out).
  const nearMemo = new Map<number, number>();
  // Pareto mode: points whose target-duty ripple has been checked (NaN in nearMemo if it failed).
  const toChecked = new Set<number>();
  const rippleOk = (rs: number[], cs: number[]): boolean => {
    if (state.pareto) {
      const code = indexCode(rs, cs);
      let near = nearMemo.get(code);
      if (near === undefined) {
        // (no memo then: a looser limit asks again)
        if (rippleLimit !== undefined && floorOver(rs, cs, dNear, rippleLimit)) return false;
        // A ceiling within this limit stands for the value: the limits come tightest first, so
        // every later one in this tuple passes on it too.
        const top = rippleLimit !== undefined ? ceilingOf(rs, cs, dNear) : Number.NaN;
        near = top <= rippleLimit! ? top : rippleOf(rs, cs, dNear);
        nearMemo.set(code, near);
      }
      if (Number.isNaN(near) || exceeds(near, rippleLimit)) return false;
      // The target duties' ripple only once the ripple near 50 % passes (the looser limits share it).
      if (checkTo && !toChecked.has(code)) {
        toChecked.add(code);
        for (const d of toDuties) {
          if (ceilingOf(rs, cs, d) <= 2 * problem.band) continue;
          if (floorOver(rs, cs, d, 2 * problem.band) || exceeds(rippleOf(rs, cs, d), 2 * problem.band)) {
            nearMemo.set(code, Number.NaN);
            return false;
          }
        }
      }
      return true;
    }
    if (rippleOver(rs, cs, dNear, rippleLimit)) return false;
    if (checkTo) for (const d of toDuties) if (rippleOver(rs, cs, d, 2 * problem.band)) return false;
    return true;
  };

  // Evaluation count at the last reading of the clock.
  let clockRead = state.evaluated;
  const overBudget = () => {
    if (state.cut) return true;
    // The clock is read once 256 evaluations have passed since the last reading: a few
    // milliseconds late at most. (Reading it only when the count was a multiple of 256 missed
    // most multiples, since ripple checks count between calls: a two-stage walk never read it.)
    let late = false;
    if (state.evaluated - clockRead >= 256) {
      clockRead = state.evaluated;
      late = timeIsUp(state);
    }
    if (!late && (state.budget === undefined || state.evaluated <= state.budget) && (state.cap === undefined || state.evaluated <= state.cap)) return false;
    state.cut = true;
    return true;
  };
  // Droop grid index (0..8) where the last candidate missed its droop limit.
  let droopMissAt = 8;
  // Index into problem.steps of the step whose settling bound was largest for the last candidate.
  let slowStep = 0;
  // The candidate evaluate is looking at, for the duty functions below (made once, not per call).
  let evalR: number[] = [];
  let evalC: number[] = [];
  const averageNow = (d: number) => averageOf(evalR, evalC, d);
  const rippleNow = (d: number) => rippleOf(evalR, evalC, d);
  const droopError = (d: number) => Math.abs(pwm.low + d * (pwm.high - pwm.low) - averageOf(evalR, evalC, d));
  const gridDuty = (i: number) => problem.dutyMin + ((problem.dutyMax - problem.dutyMin) * i) / 8;
  const checkDroop = !lti && limits.droop !== undefined;
  const evaluate = (rs: number[], cs: number[], tb: TupleBounds): void => {
    if (overBudget()) return;
    evalR = rs;
    evalC = cs;
    let theta = state.theta;
    const key = state.dynamic ? '' : keyOf(rs, cs);
    if (!state.dynamic && state.seen.has(key)) return;
    if (dcOver(rs, cs)) return;
    if (state.pareto) {
      // Several staircases (one per limit) share points: evaluate each once.
      const code = indexCode(rs, cs);
      if (paretoSeen.has(code)) return;
      paretoSeen.add(code);
      // This point's own threshold: the best of the limits its ripple can meet.
      theta = Math.min(theta, paretoThreshold(state.pareto, rippleOf(rs, cs, dNear)));
      // Dominated already by the capacitors' settling floor (before any costlier bound).
      if (settlingBoundOf(rs, cs, tb, theta) > theta) return;
    }
    // Unequal drivers: droop depends on the capacitors and may peak inside the range. Its largest
    // value on a 9-point duty grid (a lower bound: values at some duties) rules a candidate out
    // before settling; the full maximum is taken before the candidate may lower theta.
    // INL and gain error (endpoint fit) from fast averages: only the engine checked them, so a
    // space where they bind was verified candidate by candidate (dcTransferMiss.ts). Steady
    // states are kept per duty meanwhile: the droop grid and the INL grid share duties.
    // Every check below only rules out, so their order changes the cost, never the answer: the one
    // more likely to decide first goes first. With an INL limit (unequal drivers) the INL check,
    // middle duty first; then the droop grid's duty where the last candidate missed (neighbours in
    // the walk miss alike); the rest of the droop grid (eight more steady states) only after the
    // settling bounds, which rule out most of the points that pass that one duty.
    let miss = inlApplies && dcTransferMiss(problem, averageNow) !== null;
    if (checkDroop && !miss) miss = exceeds(droopError(gridDuty(droopMissAt)), limits.droop);
    if (!inlApplies && !miss) miss = dcTransferMiss(problem, averageNow) !== null;
    if (miss) return;
    // Cheap bound first, for equal drivers (settlingBounds.ts, method: proven there for a
    // time-invariant ladder): tau_slow ln(z0 / (band + excursion)); unequal drivers go on to the
    // model's bound below, which holds for both. A steady state at the target that itself leaves
    // the band never settles (settlingLowerBound says Infinity): its excursions about the average,
    // from the same steady state (rounding apart, hence NEVER_SETTLES), decide that without the
    // settling bound's period map.
    // The targets first, each once: of the points that pass the floor, many never settle (4 654 of
    // 9 683 in the wide E24 bench's two-stage curve walk), and a step's start needs no steady
    // state to tell.
    for (let j = 0; j < toDuties.length; j++) {
      const b = lite(rs, cs, toDuties[j]);
      if (Math.max(b.above, b.below) > problem.band * NEVER_SETTLES) return;
    }
    if (lti) {
      const tau = slowestTimeConstant(rs, cs, tb.driver, loadR, loadC);
      for (let j = 0; j < problem.steps.length; j++) {
        const step = problem.steps[j];
        const a = lite(rs, cs, step[0]);
        const b = lite(rs, cs, step[1]);
        const z0 = Math.abs(b.yStart - a.yStart);
        const excursion = b.yStart > a.yStart ? b.above : b.below;
        if (z0 > problem.band + excursion && tau * Math.log(z0 / (problem.band + excursion)) > theta) return;
      }
    }
    // Then this point's own floor (pointSettlingFloor: the proven floor with its target orbit's
    // excursions, for unequal drivers too), which spares most of the exact bounds below that rule
    // a point out: 2 323 of 3 075 in the wide E24 bench's two-stage curve walk (counted), where
    // on 154 sampled points it came within 0.5 % of the engine's settling time. Budgeted walks go
    // without it (their partial answers stay where they were).
    if (!budgeted) {
      twoSlowestTimeConstants(rs, cs, tb.driver, loadR, loadC, taus);
      const scale = stepScaleOf(rs);
      for (let j = 0; j < problem.steps.length; j++) {
        const from = problem.steps[j][0];
        const to = problem.steps[j][1];
        const b = lite(rs, cs, to);
        // The output comes from below when the duty and the levels rise together (the files
        // require high > low; the comparison's error has that sign, settlingFloor.ts).
        const rising = to > from === problem.circuit.high > problem.circuit.low;
        // (the step's start state only where it gives the head: equal drivers)
        const head = lti ? Math.abs(b.yStart - lite(rs, cs, from).yStart) : -Infinity;
        const t = pointSettlingFloor(problem.period, Math.abs(to - from) * scale, head, problem.band, rising ? b.above : b.below, rising ? b.below : b.above, taus[0], taus[1], theta);
        if (t > theta) return;
      }
    }
    const model = use(rs, cs);
    let lb = 0;
    // The step that was slower for the last candidate first: its bound alone often rules the point out.
    for (let j = 0; j < problem.steps.length; j++) {
      const step = problem.steps[j === 0 ? slowStep : j <= slowStep ? j - 1 : j];
      const from = step[0];
      const to = step[1];
      // Only whether the bound passes theta matters for a point that cannot enter (early stop).
      const t = settlingLowerBound(model, from, to, problem.band, steady(from), steady(to), theta);
      if (t > lb) {
        lb = t;
        if (j > 0) slowStep = j <= slowStep ? j - 1 : j;
      }
      if (lb === Infinity || exceeds(lb, limits.settlingTime) || lb > theta) return;
    }
    for (let i = 0; checkDroop && i <= 8; i++) {
      if (i !== droopMissAt && exceeds(droopError(gridDuty(i)), limits.droop)) {
        droopMissAt = i;
        return;
      }
    }
    let totalC = 0;
    for (const c of cs) totalC += c;
    const entry: FastEntry = { r: rs.slice(), c: cs.slice(), lb, totalC };
    const pareto = state.pareto;
    if (pareto) {
      // The ripple near 50 % is a lower bound on the worst: a first, cheap dominance test.
      if (lb > paretoThreshold(pareto, rippleOf(rs, cs, dNear))) return;
      entry.worst = maximizeOverDuty(rippleNow, problem.dutyMin, problem.dutyMax);
      const droop = checkDroop ? maximizeOverDuty(droopError, problem.dutyMin, problem.dutyMax) : 0;
      if (exceeds(droop, limits.droop) || lb > paretoThreshold(pareto, entry.worst)) return;
      state.entries.push(entry);
      let theta = -Infinity;
      for (let i = 0; i < pareto.limits.length; i++) {
        if (!exceeds(entry.worst, pareto.limits[i]) && lb < pareto.best[i]) pareto.best[i] = lb;
        theta = Math.max(theta, pareto.best[i] * (1 + REL) + ABS_T);
      }
      state.theta = Math.min(state.theta, theta);
      return;
    }
    if (!state.dynamic) state.seen.add(key);
    state.entries.push(entry);
    if (state.dynamic && (state.best.length < state.top || lb < state.best[state.top - 1])) {
      // Before this candidate may lower theta: its worst ripple and (unequal drivers) worst droop.
      entry.worst = maximizeOverDuty(rippleNow, problem.dutyMin, problem.dutyMax);
      const droop = checkDroop ? maximizeOverDuty(droopError, problem.dutyMin, problem.dutyMax) : 0;
      if (exceeds(entry.worst, limits.ripple) || exceeds(droop, limits.droop)) {
        entry.ruledOut = true;
        return;
      }
      if (state.admit) {
        if (!state.admit(problem, entry.r, entry.c)) {
          entry.ruledOut = true;
          return;
        }
        entry.admitted = true;
      }
      let at = state.best.length;
      while (at > 0 && state.best[at - 1] > lb) at--;
      state.best.splice(at, 0, lb);
      if (state.best.length > state.top) state.best.length = state.top;
      if (state.best.length === state.top) state.theta = Math.min(state.theta, state.best[state.top - 1] * (1 + REL) + ABS_T);
    }
  };

  /** Inner points of a column: capacitor `p` from index `from` upward while the bound allows. */
  interface Column {
    rs: number[];
    cs: number[];
    p: number;
    from: number;
    within: (cs: number[]) => boolean;
    tb: TupleBounds;
  }
  const deferred: Column[] = [];
  const finishColumn = (col: Column): void => {
    // (out of time or budget: evaluate would look at nothing more, so neither does the column)
    for (let b = col.from; b < nC && !state.cut; b++) {
      const v = col.cs.slice();
      v[col.p] = C[b];
      if (!col.within(v)) break;
      // The DC floors only grow along a column (larger capacitor): nothing further passes.
      if (dcOver(col.rs, v)) break;
      evaluate(col.rs, v, col.tb);
    }
  };

  const walk = (rs: number[], tb: TupleBounds, key: number): Column[] => {
    if (!budgeted && tb.floor === NO_FLOOR) tb.floor = settlingFloorPlan(problem, rs, limits);
    const pareto = state.pareto;
    // (no threshold yet, Infinity: every point is within it, and the floor need not be computed)
    if (!pareto) return walkUnder(rs, tb, (cs) => state.theta === Infinity || settlingBoundOf(rs, cs, tb, state.theta) <= state.theta);
    // Pareto mode: the union of each limit's region (its staircase, its own threshold), so a
    // loose limit's long columns stop at its own best, not at the tightest limit's. A limit whose
    // own tuple bound (its ripple limit's tauMin and log factor; the tuple order used the loosest
    // limit's) already passes its threshold has an empty region in this tuple: no staircase.
    const columns: Column[] = [];
    nearMemo.clear();
    toChecked.clear();
    pareto.limits.forEach((limit, i) => {
      const cap = () => Math.min(state.theta, pareto.best[i] * (1 + REL) + ABS_T);
      const limitCap = cap();
      // The walk's key (the loosest limit's) is at most this limit's own: a tighter ripple limit
      // only raises the tuple's tauMin, its log factor and its floor (settlingBounds.ts).
      if (key > limitCap) return;
      const own = tupleBounds(problem, rs, paretoLimits[i], undefined, budgeted);
      if (tupleKey(rs, own, limitCap) > limitCap) return;
      rippleLimit = limit;
      columns.push(
        ...walkUnder(rs, tb, (cs) => {
          const ceiling = cap();
          return ceiling === Infinity || settlingBoundOf(rs, cs, own, ceiling) <= ceiling;
        }),
      );
    });
    rippleLimit = limits.ripple;
    return columns;
  };

  /** The walk of one resistor tuple's capacitor space under a threshold test `within`. */
  const walkUnder = (rs: number[], tb: TupleBounds, within: (cs: number[]) => boolean): Column[] => {
    const columns: Column[] = [];
    if (stages === 1) {
      const s = firstTrue(nC, (i) => rippleOk(rs, [C[i]]));
      if (s < nC && within([C[s]])) {
        evaluate(rs, [C[s]], tb);
        columns.push({ rs, cs: [C[s]], p: 0, from: s + 1, within, tb });
      }
      return columns;
    }
    // Outer capacitors (three stages: the first) by plain loop, inner two by staircase walk.
    const cs = doubles(stages).fill(C[0]);
    const outer = stages - 2;
    const recurse = (depth: number): void => {
      if (depth < outer) {
        // Innermost outer capacitor: slices up to `dead` hold no ripple-feasible point (deadThrough).
        let dead = -1;
        for (let i = 0; i < nC; i++) {
          cs[depth] = C[i];
          for (let k = depth + 1; k < stages; k++) cs[k] = C[0];
          if (!within(cs)) break;
          // The DC floors grow with every capacitor: a larger outer capacitor only raises them.
          if (!budgeted && dcOver(rs, cs)) break;
          if (depth === outer - 1 && !budgeted) {
            dead = deadThrough(rs, cs, depth, within);
            // On past the dead slices at once: they hold nothing, and the bounds above, which grow
            // with the outer capacitor, are asked again at the first slice after them.
            if (i <= dead) {
              i = dead;
              continue;
            }
          }
          recurse(depth + 1);
        }
        return;
      }
      walkLastTwo(rs, cs, outer, within, columns, tb);
    };
    recurse(0);
    return columns;
  };

  /** The steps of the last staircase walked, by column, with what they were walked with (walkLastTwo). */
  let lastSteps: { rs: number[]; limit: number | undefined; before: number[]; at: number; steps: Int32Array } = { rs: [], limit: undefined, before: [], at: 0, steps: new Int32Array(0) };

  /**
   * The box of the staircase over capacitors p, p + 1 (cs[0..p-1] fixed, cs[p..] at their smallest):
   * the largest index of capacitor p whose column can still be within theta and pass the DC floors
   * (-1: none), and the largest index of capacitor p + 1 within theta (both bounds grow with every
   * capacitor). Every point the staircase may evaluate lies in it.
   */
  const boxAt = doubles(stages);
  /**
   * What a walk learnt at one slice (resistors, threshold test, capacitors cs[0..depth]) and the
   * count of kept candidates then. Thresholds only move when a candidate is kept, and the bounds
   * grow with every capacitor while theta only falls, so what held at a slice still holds, only
   * tighter, at a later one: the same tuple, test and cs[0..depth-1] with cs[depth] at least as
   * large (the slices of one tuple come in ascending order). sliceRelation tells which: 'same'
   * (nothing moved since), 'later' (what was learnt caps the search), or null.
   */
  interface SliceMemo {
    rs: number[] | null;
    within: ((cs: number[]) => boolean) | null;
    depth: number;
    kept: number;
    before: number[];
  }
  const sliceMemo = (): SliceMemo => ({ rs: null, within: null, depth: -2, kept: -1, before: [] });
  const sliceRelation = (m: SliceMemo, rs: number[], within: (cs: number[]) => boolean, depth: number, cs: number[]): 'same' | 'later' | null => {
    if (m.rs !== rs || m.within !== within || m.depth !== depth) return null;
    for (let k = 0; k < depth; k++) if (m.before[k] !== cs[k]) return null;
    if (depth < 0 || m.before[depth] === cs[depth]) return m.kept === state.entries.length ? 'same' : 'later';
    return m.before[depth] < cs[depth] ? 'later' : null;
  };
  const remember = (m: SliceMemo, rs: number[], within: (cs: number[]) => boolean, depth: number, cs: number[]): void => {
    m.rs = rs;
    m.within = within;
    m.depth = depth;
    m.kept = state.entries.length;
    m.before = cs.slice(0, depth + 1);
  };
  // The last staircase box over capacitors p, p + 1 (a slice of capacitor p - 1): a slice's
  // deadThrough and its staircase (walkLastTwo) ask for the same one.
  const lastBox = { memo: sliceMemo(), box: [0, 0] as [number, number] };
  const boxOf = (rs: number[], cs: number[], p: number, within: (cs: number[]) => boolean): [number, number] => {
    const relation = sliceRelation(lastBox.memo, rs, within, p - 1, cs);
    if (relation === 'same') return lastBox.box;
    const caps = relation === 'later' ? lastBox.box : null;
    const box = boxOfNew(rs, cs, p, within, caps === null ? nC : caps[0] + 1, caps === null ? nC : caps[1] + 1);
    remember(lastBox.memo, rs, within, p - 1, cs);
    lastBox.box = box;
    return box;
  };
  /** The box, its first index searched up to topCap and its second up to bCap (those indices known to fail; nC: none known). */
  const boxOfNew = (rs: number[], cs: number[], p: number, within: (cs: number[]) => boolean, topCap: number, bCap: number): [number, number] => {
    // (one scratch point: the threshold test and the DC floors keep nothing of it)
    const at = (a: number, b: number) => {
      copyInto(boxAt, cs);
      boxAt[p] = C[a];
      boxAt[p + 1] = C[b];
      return boxAt;
    };
    // Each test only turns true as its index grows (the bounds grow with every capacitor).
    const beyond = (i: number) => !within(at(i, 0)) || (!budgeted && dcOver(rs, at(i, 0)));
    const beyondB = (b: number) => !within(at(0, b));
    // Below a cap (known to fail there) the box moved little since the last one: down from the cap.
    const top = (topCap < nC ? lastTrueDown(topCap, beyond) : firstTrue(nC, beyond)) - 1;
    const bMax = (bCap < nC ? lastTrueDown(bCap, beyondB) : firstTrue(nC, beyondB)) - 1;
    return [top, bMax];
  };

  /**
   * The slice of outer capacitor q = cs[q] (the one just before the staircase, the later ones at
   * their smallest) and the slices of larger values of it after it: the last index of that
   * capacitor up to which every slice is proven to hold no ripple-feasible point of the staircase
   * box (index - 1 when this slice is not).
   *
   * Method: the staircase of a slice evaluates nothing when the ripple check fails at the far
   * corner of its box (the lowest ripple there is at the corner: the ripple falls when any
   * capacitor grows). Boxes only shrink as the outer capacitor grows (the bounds grow with every
   * capacitor, and theta only falls), so a later slice j's corner is at most this slice's corner
   * (top, bMax), and its ripple is at least that of the point (C_j; top, bMax). Hence the ripple check
   * failing at (C_j; top, bMax) rules out every slice from this one to j; the largest such j is found
   * by bisection (that point's ripple falls as C_j grows), starting with the last slice of the loop.
   */
  const sliceAt = doubles(stages);
  // The first slice that failed the loop's test (deadThrough, below), at the slice it was found.
  const lastEnd = { memo: sliceMemo(), failAt: 0 };
  const deadThrough = (rs: number[], cs: number[], q: number, within: (cs: number[]) => boolean): number => {
    const i = C.indexOf(cs[q]);
    const [top, bMax] = boxOf(rs, cs, q + 1, within);
    if (top < 0) return i - 1;
    // (one scratch point: the threshold, ripple and DC tests keep nothing of it)
    const slice = (j: number) => {
      copyInto(sliceAt, cs);
      sliceAt[q] = C[j];
      return sliceAt;
    };
    const corner = (j: number) => {
      const v = slice(j);
      v[q + 1] = C[top];
      v[q + 2] = C[bMax];
      return v;
    };
    // The last slice the loop visits (within theta and the DC floors at the smallest later
    // capacitors). That test only turns false as the slice grows and theta falls: the first slice
    // that failed it at an earlier slice caps the search, and is the answer itself while no
    // candidate was kept since (the test is then the same, and this slice lies before it).
    const relation = sliceRelation(lastEnd.memo, rs, within, q, cs);
    const failAt = relation === null ? nC : lastEnd.failAt;
    const unmoved = relation !== null && lastEnd.memo.kept === state.entries.length;
    const first = unmoved ? Math.max(i, failAt) : i + firstTrue(Math.max(0, failAt - i), (k) => !within(slice(i + k)) || dcOver(rs, slice(i + k)));
    remember(lastEnd.memo, rs, within, q, cs);
    lastEnd.failAt = first;
    const last = first - 1;
    // One check at the last slice with this corner: when it fails, every slice from here on is dead.
    // For the first slice that is the whole tuple's box at once, which rules out most tuples: first.
    if (i === 0 && last > i && !rippleOk(rs, corner(last))) return last;
    // This slice's own corner: when it passes, the staircase starts with the same check (the model is kept).
    if (rippleOk(rs, corner(i))) return i - 1;
    if (i > 0 && last > i && !rippleOk(rs, corner(last))) return last;
    // The slices whose box is this one's (no check needed to find them: the bounds alone).
    const end = i - 1 + firstTrue(last - i + 1, (k) => {
      const v = slice(i + k);
      v[q + 1] = C[top];
      if (!within(v) || dcOver(rs, v)) return true;
      v[q + 1] = C[0];
      v[q + 2] = C[bMax];
      return !within(v);
    });
    if (end <= i) return i;
    if (!rippleOk(rs, corner(end))) return end;
    // corner(i) fails and corner(end) passes: the first slice in between whose corner passes.
    return i + firstTrue(end - i - 1, (k) => rippleOk(rs, corner(i + 1 + k)));
  };

  /**
   * The staircase walk over capacitors a = cs[p], b = cs[p + 1] with cs[0..p-1] fixed: evaluates
   * the lowest ripple-feasible point of each column and returns the columns for their inner points.
   */
  const lookAt = doubles(stages);
  const walkLastTwo = (rs: number[], cs: number[], p: number, within: (cs: number[]) => boolean, columns: Column[], tb: TupleBounds): void => {
    const at = (a: number, b: number) => {
      const v = cs.slice();
      v[p] = C[a];
      v[p + 1] = C[b];
      return v;
    };
    // The point for a look that keeps nothing (the threshold and ripple tests copy what they keep).
    const look = (a: number, b: number) => {
      copyInto(lookAt, cs);
      lookAt[p] = C[a];
      lookAt[p + 1] = C[b];
      return lookAt;
    };
    if (!within(look(0, 0))) return;
    // Largest first capacitor whose column can still be within theta, and largest staircase step:
    // a step s with at(0, s) beyond theta ends the walk below, so no step above bMax is sought
    // (theta only falls meanwhile, and the bound grows with every capacitor). Columns whose lowest
    // point a DC floor rules out hold nothing (the floors grow with every capacitor).
    const [top, bMax] = boxOf(rs, cs, p, within);
    // Steps of the last staircase walked with the same capacitors before p - 1 and a smaller one at
    // p - 1: each is at least this staircase's step in its column (the ripple falls when capacitor
    // p - 1 grows), so a search stops there without a check, and needs none when the step so far
    // already reached it.
    const prior = !budgeted && p >= 1 && lastSteps.rs === rs && lastSteps.limit === rippleLimit && sameAs(lastSteps.before, cs.slice(0, p - 1)) && lastSteps.at < cs[p - 1] ? lastSteps.steps : null;
    // (kept for the next slice's staircase; two stages have no slices: none)
    const steps = p >= 1 ? new Int32Array(nC).fill(-1) : null;
    if (steps !== null) lastSteps = { rs, limit: rippleLimit, before: cs.slice(0, p - 1), at: cs[p - 1], steps };
    // The threshold test at (0, s) and at (a, s) as last asked: a column whose step does not move
    // asks each twice, and the next column asks (0, s) again. The same point under the same
    // threshold gives the same answer, and thresholds move only when a candidate is kept, so the
    // kept count is part of the key (the evaluation counts stay as they were). Thresholds only
    // fall: even a stale "beyond" would stay true, and a stale "within" would only cost a look.
    let at0Step = -1;
    let at0Kept = -1;
    let at0Within = false;
    const within0 = (step: number): boolean => {
      if (step !== at0Step || state.entries.length !== at0Kept) {
        at0Step = step;
        at0Kept = state.entries.length;
        at0Within = within(look(0, step));
      }
      return at0Within;
    };
    let atColumn = -1;
    let atStep = -1;
    let atKept = -1;
    let atWithin = false;
    const withinAt = (column: number, step: number): boolean => {
      if (column !== atColumn || step !== atStep || state.entries.length !== atKept) {
        atColumn = column;
        atStep = step;
        atKept = state.entries.length;
        atWithin = within(look(column, step));
      }
      return atWithin;
    };
    let s = -1;
    for (let a = top; a >= 0; a--) {
      const u = prior !== null && prior[a] >= 0 && prior[a] <= bMax ? prior[a] : -1;
      // One look at the top of the range first: a slice with no ripple-feasible step there has none.
      if (s < 0) {
        // From the prior step down, doubling the stride: the step moves little from one slice to the next.
        if (u >= 0) s = lastTrueDown(u, (b) => rippleOk(rs, look(a, b)));
        else s = rippleOk(rs, look(a, bMax)) ? firstTrue(bMax + 1, (b) => rippleOk(rs, look(a, b))) : nC;
      } else {
        if (!budgeted && !within0(s)) break; // every remaining column starts at or above s
        // A column whose point at the step so far is beyond theta has nothing within it (the bound
        // grows with b, and its own step is at or above s): no search; s stays a valid start below.
        if (!budgeted && !withinAt(a, s)) continue;
        if (u >= s) while (s < u && !rippleOk(rs, look(a, s))) s++;
        else while (s <= bMax && !rippleOk(rs, look(a, s))) s++;
      }
      if (s <= bMax && steps !== null) steps[a] = s;
      if (s > bMax) break; // smaller first capacitors only raise the ripple
      if (!within0(s)) break; // every remaining column starts at or above s
      if (withinAt(a, s)) {
        const point = at(a, s);
        evaluate(rs, point, tb);
        columns.push({ rs, cs: point, p: p + 1, from: s + 1, within, tb });
      }
    }
  };

  // Staircase points first; inner points at once when theta is finite, else once it is (or at the end).
  // (nothing to walk when the listing ran out of time)
  for (let k = 0; !state.cut; k++) {
    const next = queue.take(state.theta);
    if (next === null || overBudget()) break;
    // (the tuple's bounds made again here, as the listing made them for its key: it keeps none)
    const columns = walk(next.rs, tupleBounds(problem, next.rs, limits, NO_FLOOR, budgeted), next.key);
    if (state.theta === Infinity) {
      for (const col of columns) deferred.push(col);
      // No threshold yet after many columns (no settling limit, nothing feasible so far): finish
      // them now rather than hold them all (a three-stage walk ran out of memory that way).
      if (deferred.length > DEFER_CAP) while (deferred.length > 0) finishColumn(deferred.pop()!);
    } else {
      while (deferred.length > 0) finishColumn(deferred.pop()!);
      for (const col of columns) finishColumn(col);
    }
    onProgress?.(LIST_SHARE + ((1 - LIST_SHARE) * (k + 1)) / list.count);
  }
  while (deferred.length > 0) finishColumn(deferred.pop()!);
  onProgress?.(1);
}

/** Identity of a candidate across collection rounds. */
export function keyOf(r: ArrayLike<number>, c: ArrayLike<number>): string {
  let key = '';
  for (let k = 0; k < r.length; k++) key += `${r[k]}/${c[k]};`;
  return key;
}

/**
 * Smallest i in [0, hi] with pred(i) true for a predicate false...false true...true that holds at
 * hi (not asked there): strides down from hi doubling until pred fails, then bisection between.
 */
function lastTrueDown(hi: number, pred: (i: number) => boolean): number {
  let lo = -1;
  for (let stride = 1; hi - stride >= 0; stride *= 2) {
    if (!pred(hi - stride)) {
      lo = hi - stride;
      break;
    }
    hi -= stride;
  }
  return lo + 1 + firstTrue(hi - lo - 1, (k) => pred(lo + 1 + k));
}

/** Smallest i in [0, n) with pred(i) true for a predicate false...false true...true; n if none. */
function firstTrue(n: number, pred: (i: number) => boolean): number {
  let lo = 0;
  let hi = n;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (pred(mid)) hi = mid;
    else lo = mid + 1;
  }
  return lo;
}
