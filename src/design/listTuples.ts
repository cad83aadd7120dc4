import type { DesignProblem } from './designProblem.js';
import { droopFloor, droopFloorPlan } from './droopFloor.js';
import { gainFloor } from './gainFloor.js';
import { exceeds } from './searchAllowance.js';
import { doubles } from '../numeric/dense.js';
import { tupleBounds, type TupleBounds } from './settlingBounds.js';
import { NO_FLOOR, scratchFloorPlan, settlingFloor, settlingFloorPlan, settlingFloorQuick } from './settlingFloor.js';
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

/**
 * Resistor tuples to walk, in listing order, with a lower bound on each one's key (tupleFloor):
 * the key itself for budgeted walks; otherwise the quick floor of settlingFloorQuick from the
 * ripple's tauMin alone (tupleQueue finishes the key, and the droop floor at the smallest
 * capacitors, only for the tuples a walk reaches).
 */
export interface TupleList {
  tuples: number[][];
  /** Lower bound on each tuple's key (equal to it when `exact`), s. */
  floors: number[];
  /** Each tuple's tauMin (tupleBounds), s: what its key is finished from. */
  tauMins: number[];
  /** floors are the keys themselves (budgeted walks), and the droop floor was checked. */
  exact: boolean;
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
  const floors: number[] = [];
  const tauMins: number[] = [];
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
    // Unequal drivers: the droop floor at the smallest capacitors holds for every capacitor choice
    // (budgeted walks here; the others when tupleQueue reaches the tuple).
    if (droopFloorCheck && budgeted) {
      const droopPlan = droopFloorPlan(problem, rs);
      if (droopPlan !== null && exceeds(droopFloor(droopPlan, minC), limits.droop)) return;
    }
    // The floor plan in scratch for the key, and a tuple's own only when it is walked (walk):
    // most tuples of a wide space are never walked, and a plan for each kept one doubled the
    // collector's time in a three-stage E24 search (measured). Budgeted walks use no plan.
    const tb = tupleBounds(problem, rs, limits, budgeted ? NO_FLOOR : settlingFloorPlan(problem, rs, limits, keyPlan), budgeted);
    // Most listed tuples are never walked (three-stage E12 bench: 3 087 of 12 476): the key's own
    // floor (two time constants, a root) waits for tupleQueue; a quick floor below it orders them.
    const floor = budgeted ? tupleFloor(problem, rs, minC, tb, true) : settlingFloorQuick(tb.floor, tb.tauMin);
    // Beyond the threshold already: the walk would stop before it (theta only falls in a round).
    if (floor > state.theta) return;
    tuples.push(rs.slice());
    floors.push(floor);
    tauMins.push(tb.tauMin);
  };
  visit(0, 0);
  return { tuples, floors, tauMins, exact: budgeted };
}

/** The tuples of a listing in a walk's order (tupleQueue). */
export interface TupleQueue {
  /** Index (into the listing) of the tuple of least key at most theta not yet taken; -1 when none is left. */
  next: (theta: number) => number;
  /** The key (tupleFloor) of a tuple `next` gave, s. */
  key: (i: number) => number;
}

/**
 * The listed tuples (listTuples) in ascending order of their key (tupleFloor; ties in listing
 * order), each at most the walk's threshold when taken, finishing keys (and, with
 * `droopFloorCheck`, the droop floor at the smallest capacitors) only as the walk gets near them:
 * the same tuples in the same order as sorting every key first.
 *
 * Method: lazy best-first order. The tuples sorted by their floors (lower bounds on their keys)
 * feed a binary heap of finished keys: every tuple whose floor is at most the heap's least key is
 * finished first, so no unfinished tuple can come before the heap's top (its key is at least its
 * floor, above that top). Theta only falls, so a tuple over it stays over it.
 *
 * Syntax: tupleQueue(problem, list, droopFloorCheck)
 * Example: const q = tupleQueue(problem, listTuples(problem, 2, state, false, false), false); q.next(state.theta)
 */
export function tupleQueue(problem: DesignProblem, list: TupleList, droopFloorCheck: boolean): TupleQueue {
  const { tuples, floors, tauMins, exact } = list;
  const limits = problem.searchLimits;
  const n = tuples.length;
  const stages = n > 0 ? tuples[0].length : 0;
  const minC = doubles(stages).fill(problem.cValues[0]);
  const byFloor = new Int32Array(n);
  for (let i = 0; i < n; i++) byFloor[i] = i;
  // (stable: equal floors keep the listing order)
  byFloor.sort((a, b) => floors[a] - floors[b] || a - b);
  const keys = exact ? floors : new Float64Array(n).fill(Number.NaN);
  const plan = scratchFloorPlan();
  const bounds: TupleBounds = { driver: Math.min(problem.project.pwm.driver.high, problem.project.pwm.driver.low), factor: 0, slack: 0, tauMin: 0, budgetTauMin: 0, floor: plan };
  // Binary min-heap of finished tuples by (key, listing index).
  const heap = new Int32Array(n);
  let size = 0;
  const before = (a: number, b: number) => keys[a] < keys[b] || (keys[a] === keys[b] && a < b);
  const push = (i: number) => {
    let at = size++;
    while (at > 0) {
      const up = (at - 1) >> 1;
      if (!before(i, heap[up])) break;
      heap[at] = heap[up];
      at = up;
    }
    heap[at] = i;
  };
  const pop = (): number => {
    const top = heap[0];
    const last = heap[--size];
    if (size === 0) return top;
    let at = 0;
    for (;;) {
      let child = 2 * at + 1;
      if (child >= size) break;
      if (child + 1 < size && before(heap[child + 1], heap[child])) child++;
      if (!before(heap[child], last)) break;
      heap[at] = heap[child];
      at = child;
    }
    heap[at] = last;
    return top;
  };
  const finish = (i: number): boolean => {
    if (exact) return true;
    const rs = tuples[i];
    if (droopFloorCheck) {
      const droopPlan = droopFloorPlan(problem, rs);
      if (droopPlan !== null && exceeds(droopFloor(droopPlan, minC), limits.droop)) return false;
    }
    settlingFloorPlan(problem, rs, limits, plan);
    bounds.tauMin = tauMins[i];
    keys[i] = tupleFloor(problem, rs, minC, bounds, false);
    return true;
  };
  let fed = 0;
  return {
    next: (theta: number): number => {
      while (fed < n && (size === 0 || floors[byFloor[fed]] <= keys[heap[0]])) {
        const i = byFloor[fed++];
        if (floors[i] > theta) {
          fed = n;
          break;
        }
        if (finish(i) && keys[i] <= theta) push(i);
      }
      if (size === 0 || keys[heap[0]] > theta) return -1;
      return pop();
    },
    key: (i: number) => keys[i],
  };
}
