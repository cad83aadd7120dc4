import type { DesignProblem } from './designProblem.js';
import { droopFloor, droopFloorPlan } from './droopFloor.js';
import { gainFloor } from './gainFloor.js';
import { exceeds } from './searchAllowance.js';
import { doubles } from '../numeric/dense.js';
import { tupleBounds, type TupleBounds } from './settlingBounds.js';
import { NO_FLOOR, scratchFloorPlan, settlingFloor, settlingFloorPlan } from './settlingFloor.js';
import { slowestTimeConstant, twoSlowestTimeConstants } from './slowestTimeConstant.js';

/** What the listing reads and writes of a search's state (collectCandidates.ts, CollectState). */
export interface ListingState {
  /** Tuples whose key is above this are not listed, s. */
  theta: number;
  /** performance.now() in ms after which the listing stops (`design --max-time`). */
  deadline?: number;
  /** Set when the listing stopped at the deadline. */
  cut?: boolean;
}

/** Share of a walk's progress (onProgress) that listing the resistor tuples stands for. */
export const LIST_SHARE = 0.1;

/** The walk's deadline (--max-time) has passed. */
export function timeIsUp(state: ListingState): boolean {
  return state.deadline !== undefined && performance.now() > state.deadline;
}

/** Time constants in scratch (tupleFloor). */
const TAUS = [0, 0];

/**
 * Lower bound on the settling time of every capacitor choice of resistor tuple `rs` (minC: the
 * smallest capacitor of the series at every stage) that meets tb's ripple limit: the proven floor
 * of settlingFloor.ts with the slowest time constant at least tb.tauMin (the ripple's) and both at
 * least their values at the smallest capacitors; with a ceiling, only sure to lie on the right
 * side of it. Budgeted walks keep the older tau_slow * factor - slack (settlingBounds.ts).
 *
 * Syntax: tupleFloor(problem, rs, minC, tb, budgeted[, ceiling])
 * Example: tupleFloor(problem, [470, 16e3], [1e-10, 1e-10], tupleBounds(problem, [470, 16e3]), false)   // s
 */
export function tupleFloor(problem: DesignProblem, rs: number[], minC: number[], tb: TupleBounds, budgeted: boolean, ceiling = Infinity): number {
  const { circuit } = problem;
  if (budgeted) return Math.max(tb.budgetTauMin, slowestTimeConstant(rs, minC, tb.driver, circuit.loadResistance, circuit.loadCapacitance)) * tb.factor - tb.slack;
  twoSlowestTimeConstants(rs, minC, tb.driver, circuit.loadResistance, circuit.loadCapacitance, TAUS);
  return settlingFloor(tb.floor, Math.max(tb.tauMin, TAUS[0]), TAUS[1], ceiling);
}

/** Resistor tuples to walk and their keys (tupleFloor), in listing order. */
export interface TupleList {
  tuples: number[][];
  keys: number[];
}

/**
 * Every `stages`-resistor tuple of the problem's series that passes the resistor-only checks of
 * collectCandidates (pin current, droop and gain floors from the resistors, with unequal drivers
 * the droop floor at the smallest capacitors, when `droopFloorCheck`: unequal drivers with a
 * droop limit) and whose key (tupleFloor) is at most state.theta. Only the tuples and their keys are
 * kept: a walk makes a tuple's bounds and plans again when it reaches the tuple (most listed tuples
 * never are), so a listing of millions of tuples holds a few numbers each (measured on a two- and
 * three-stage E96 space cut after 20 s: 1.6 GB with each tuple's bounds and droop plan kept, 0.31 GB
 * with neither).
 * A function (and file) of its own, not a loop inside collectCandidates: V8 then compiles this loop alone
 * when it turns hot, not the whole walk with it (measured: the walk's function was compiled three
 * times in a default design run, 55 to 81 ms each on the compiler thread).
 *
 * Syntax: listTuples(problem, stages, state, budgeted, droopFloorCheck[, onProgress])
 * Example: listTuples(problem, 2, newCollectState(problem, 10), false, false).tuples.length
 */
export function listTuples(
  problem: DesignProblem,
  stages: number,
  state: ListingState,
  budgeted: boolean,
  droopFloorCheck: boolean,
  onProgress?: (fraction: number) => void,
): TupleList {
  const { rValues: R, searchLimits: limits, project, circuit } = problem;
  const { pwm } = project;
  const span = Math.abs(pwm.high - pwm.low);
  const nR = R.length;
  const loadR = circuit.loadResistance;
  const droopFloorApplies = pwm.driver.high >= pwm.driver.low && pwm.low >= 0 && loadR !== null && limits.droop !== undefined;
  const gainFloorApplies = loadR !== null && limits.gain !== undefined;
  const idealTop = Math.max(pwm.low + problem.dutyMin * (pwm.high - pwm.low), pwm.low + problem.dutyMax * (pwm.high - pwm.low));
  const minC = doubles(stages).fill(problem.cValues[0]);
  const tuples: number[][] = [];
  const keys: number[] = [];
  const scratch = doubles(stages);
  const keyPlan = scratchFloorPlan();
  const total = nR ** stages;
  // Subtree sizes: tuples that share their first k + 1 resistors.
  const below: number[] = [];
  for (let k = 0; k < stages; k++) below.push(nR ** (stages - 1 - k));
  let nextReport = 0xffff;
  const minSeries = (depth: number): number => {
    // the series resistance with the later resistors at their smallest, summed as for a whole tuple
    let series = pwm.driver.low;
    for (let k = 0; k < stages; k++) series += k <= depth ? scratch[k] : R[0];
    return series;
  };
  const droopOver = (series: number) => exceeds((idealTop * series) / (loadR! + series), limits.droop);
  // Depth-first in the order of the tuples' index (the first resistor most significant), so the
  // list comes out in the same order as a plain count through every tuple. A subtree whose checks
  // fail for every tuple in it is skipped whole: the pin current depends on the first resistor
  // alone, and the droop floor of the series resistance only grows with each resistor (a larger
  // value, or a later resistor above the smallest).
  const visit = (depth: number, first: number): void => {
    for (let i = 0; i < nR; i++) {
      const count = first + i * below[depth];
      if (count >= nextReport) {
        nextReport = (Math.floor(count / 0x10000) + 1) * 0x10000 - 1;
        onProgress?.((LIST_SHARE * (count + 1)) / total);
        // Out of time while still listing: the walk then stops at once (cut).
        if (timeIsUp(state)) {
          state.cut = true;
          return;
        }
      }
      scratch[depth] = R[i];
      if (depth === 0 && limits.pinCurrent !== undefined && exceeds(span / (Math.min(pwm.driver.high, pwm.driver.low) + scratch[0]), limits.pinCurrent)) continue;
      // (every later value of this resistor only raises the series resistance)
      if (droopFloorApplies && droopOver(minSeries(depth))) return;
      if (depth < stages - 1) {
        visit(depth + 1, count);
        if (state.cut) return;
      } else consider(scratch);
    }
  };
  const consider = (rs: number[]): void => {
    if (gainFloorApplies && exceeds(gainFloor(circuit, rs, problem.dutyMin, problem.dutyMax), limits.gain)) return;
    // Unequal drivers: the droop floor at the smallest capacitors holds for every capacitor choice.
    if (droopFloorCheck) {
      const droopPlan = droopFloorPlan(problem, rs);
      if (droopPlan !== null && exceeds(droopFloor(droopPlan, minC), limits.droop)) return;
    }
    // The floor plan in scratch for the key, and a tuple's own only when it is walked (walk):
    // most tuples of a wide space are never walked, and a plan for each kept one doubled the
    // collector's time in a three-stage E24 search (measured). Budgeted walks use no plan.
    const tb = tupleBounds(problem, rs, limits, budgeted ? NO_FLOOR : settlingFloorPlan(problem, rs, limits, keyPlan));
    const key = tupleFloor(problem, rs, minC, tb, budgeted);
    // Beyond the threshold already: the walk would stop before it (theta only falls in a round).
    if (key > state.theta) return;
    tuples.push(rs.slice());
    keys.push(key);
  };
  visit(0, 0);
  return { tuples, keys };
}
