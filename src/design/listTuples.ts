import type { DesignProblem } from './designProblem.js';
import { droopFloor, droopFloorPlan } from './droopFloor.js';
import { gainFloor } from './gainFloor.js';
import { resistiveDroop, resistiveDroopFloor } from './resistiveDroop.js';
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
 * Resistor tuples to walk, in listing order, stored compactly (a three-stage E96 space lists up to
 * 17 million): each tuple's series indices, and a lower bound on its key (tupleFloor): the key
 * itself for budgeted walks; otherwise the quick floor of settlingFloorQuick from the ripple's
 * tauMin alone (tupleQueue finishes the key, and the droop floor at the smallest capacitors, only
 * for the tuples a walk reaches). tupleOf gives a tuple's resistor values.
 */
export interface TupleList {
  /** Tuples listed. */
  count: number;
  stages: number;
  /** Series index (problem.rValues) of each tuple's resistors, `stages` entries a tuple, pin side first. */
  indices: Uint16Array;
  /** Lower bound on each tuple's key (equal to it when `exact`), s. */
  floors: Float64Array;
  /** floors are the keys themselves (budgeted walks), and the droop floor was checked. */
  exact: boolean;
}

/**
 * The resistor values (ohm, pin side first) of tuple `i` of a listing, in a fresh array.
 *
 * Syntax: tupleOf(problem, list, i)
 * Example: tupleOf(problem, listTuples(problem, 2, { theta: Infinity }, false, false), 0)   // [r1, r2]
 */
export function tupleOf(problem: DesignProblem, list: TupleList, i: number): number[] {
  const rs = doubles(list.stages);
  for (let k = 0; k < list.stages; k++) rs[k] = problem.rValues[list.indices[i * list.stages + k]];
  return rs;
}

/**
 * Every `stages`-resistor tuple of the problem's series that passes the resistor-only checks of
 * collectCandidates (pin current, droop and gain floors from the resistors; for budgeted walks
 * also, with `droopFloorCheck` (unequal drivers with a droop limit), the droop floor at the
 * smallest capacitors, which tupleQueue checks for the others) and whose floor (TupleList) is at
 * most state.theta. Only each tuple's series indices and floor are kept: a walk makes a tuple's
 * bounds and plans again when it reaches the tuple (most listed tuples never are), so a listing
 * of millions of tuples holds a few numbers each (measured on a two- and three-stage E96 space cut
 * after 20 s: 1.6 GB with each tuple's bounds and droop plan kept, 0.31 GB with neither).
 * A function (and file) of its own, not a loop inside collectCandidates: V8 then compiles this loop alone
 * when it turns hot, not the whole walk with it (measured: the walk's function was compiled three
 * times in a default design run, 55 to 81 ms each on the compiler thread).
 *
 * Syntax: listTuples(problem, stages, state, budgeted, droopFloorCheck[, onProgress])
 * Example: listTuples(problem, 2, newCollectState(problem, 10), false, false).count
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
  // The droop floor of the series resistance (resistiveDroop.ts), where it applies.
  const seriesDroop = limits.droop !== undefined ? resistiveDroop(circuit, problem.dutyMin, problem.dutyMax) : null;
  const gainFloorApplies = loadR !== null && limits.gain !== undefined;
  const minC = doubles(stages).fill(problem.cValues[0]);
  // (typed arrays grown by doubling: a JS array per tuple cost seconds of garbage collection on
  // a three-stage E96 space)
  // (no series over a physical range comes near 65 536 values: E192 over 1 mohm..1 Tohm is 2 880)
  if (nR > 0x10000) throw new RangeError(`listTuples: ${nR} resistor values, more than a tuple's 16-bit indices hold`);
  let count = 0;
  let indices = new Uint16Array(1024 * stages);
  let floors = new Float64Array(1024);
  const at = new Uint16Array(stages);
  const scratch = doubles(stages);
  const keyPlan = scratchFloorPlan();
  const total = nR ** stages;
  // Subtree sizes: tuples that share their first k + 1 resistors.
  const below: number[] = [];
  for (let k = 0; k < stages; k++) below.push(nR ** (stages - 1 - k));
  let nextReport = 0xffff;
  const minSeries = (depth: number): number => {
    // the series resistance with the later resistors at their smallest, summed as for a whole tuple
    let series = seriesDroop!.driver;
    for (let k = 0; k < stages; k++) series += k <= depth ? scratch[k] : R[0];
    return series;
  };
  const droopOver = (series: number) => exceeds(resistiveDroopFloor(seriesDroop!, series), limits.droop);
  // Depth-first in the order of the tuples' index (the first resistor most significant), so the
  // list comes out in the same order as a plain count through every tuple. A subtree whose checks
  // fail for every tuple in it is skipped whole: the pin current depends on the first resistor
  // alone, and the droop floor of the series resistance only grows with each resistor (a larger
  // value, or a later resistor above the smallest).
  const visit = (depth: number, first: number): void => {
    for (let i = 0; i < nR; i++) {
      const position = first + i * below[depth];
      if (position >= nextReport) {
        nextReport = (Math.floor(position / 0x10000) + 1) * 0x10000 - 1;
        onProgress?.((LIST_SHARE * (position + 1)) / total);
        // Out of time while still listing: the walk then stops at once (cut).
        if (timeIsUp(state)) {
          state.cut = true;
          return;
        }
      }
      scratch[depth] = R[i];
      at[depth] = i;
      if (depth === 0 && limits.pinCurrent !== undefined && exceeds(span / (Math.min(pwm.driver.high, pwm.driver.low) + scratch[0]), limits.pinCurrent)) continue;
      // (every later value of this resistor only raises the series resistance)
      if (seriesDroop !== null && droopOver(minSeries(depth))) return;
      if (depth < stages - 1) {
        visit(depth + 1, position);
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
    if (count === floors.length) {
      const wider = new Float64Array(2 * count);
      wider.set(floors);
      floors = wider;
      const more = new Uint16Array(2 * count * stages);
      more.set(indices);
      indices = more;
    }
    indices.set(at, count * stages);
    floors[count++] = floor;
  };
  visit(0, 0);
  return { count, stages, indices, floors, exact: budgeted };
}

/** The tuples of a listing in a walk's order (tupleQueue). */
export interface TupleQueue {
  /**
   * The tuple of least key at most theta not yet taken (its resistor values, a fresh array, and
   * its key), or null when none is left.
   */
  take: (theta: number) => { rs: number[]; key: number } | null;
}

/**
 * The listed tuples (listTuples) in ascending order of their key (tupleFloor; ties in listing
 * order), each at most the walk's threshold when taken, finishing keys (and, with
 * `droopFloorCheck`, the droop floor at the smallest capacitors) only as the walk gets near them:
 * the same tuples in the same order as sorting every key first.
 *
 * Method: lazy best-first order with two binary heaps. One holds every listed tuple by its floor
 * (a lower bound on its key; heapified at once, O(n), where a sort of a three-stage E96 listing
 * took seconds); the tuples whose floor is at most the least finished key are finished and moved
 * to the other, by key: no unfinished tuple can then come before that heap's top (its key is at
 * least its floor, above that top). Ties in both heaps go by listing order. Theta only falls, so a
 * tuple over it stays over it.
 *
 * Syntax: tupleQueue(problem, list, droopFloorCheck)
 * Example: tupleQueue(problem, listTuples(problem, 2, state, false, false), false).take(state.theta)?.key
 */
export function tupleQueue(problem: DesignProblem, list: TupleList, droopFloorCheck: boolean): TupleQueue {
  const { count: n, floors, exact, stages } = list;
  const limits = problem.searchLimits;
  const minC = doubles(stages).fill(problem.cValues[0]);
  const plan = scratchFloorPlan();
  // By floor: every listed tuple.
  const byFloor = new Int32Array(n);
  for (let i = 0; i < n; i++) byFloor[i] = i;
  let floorSize = n;
  const floorFirst = (a: number, b: number) => floors[a] < floors[b] || (floors[a] === floors[b] && a < b);
  for (let k = (n >> 1) - 1; k >= 0; k--) siftDown(byFloor, floorSize, k, floorFirst);
  // By key: the finished tuples, by slot (their listing index and key, appended as they finish).
  let byKey = new Int32Array(64);
  let keySize = 0;
  let slotIndex = new Int32Array(64);
  let slotKey = new Float64Array(64);
  let slots = 0;
  const keyFirst = (a: number, b: number) => slotKey[a] < slotKey[b] || (slotKey[a] === slotKey[b] && slotIndex[a] < slotIndex[b]);
  const finish = (i: number, theta: number): void => {
    let key = floors[i];
    if (!exact) {
      const rs = tupleOf(problem, list, i);
      if (droopFloorCheck) {
        const droopPlan = droopFloorPlan(problem, rs);
        if (droopPlan !== null && exceeds(droopFloor(droopPlan, minC), limits.droop)) return;
      }
      key = tupleFloor(problem, rs, minC, tupleBounds(problem, rs, limits, settlingFloorPlan(problem, rs, limits, plan), false), false);
    }
    if (key > theta) return;
    if (slots === slotKey.length) {
      const wider = new Float64Array(2 * slots);
      wider.set(slotKey);
      slotKey = wider;
      const more = new Int32Array(2 * slots);
      more.set(slotIndex);
      slotIndex = more;
      const heap = new Int32Array(2 * slots);
      heap.set(byKey);
      byKey = heap;
    }
    slotIndex[slots] = i;
    slotKey[slots] = key;
    byKey[keySize] = slots++;
    siftUp(byKey, keySize++, keyFirst);
  };
  return {
    take: (theta: number) => {
      while (floorSize > 0 && (keySize === 0 || floors[byFloor[0]] <= slotKey[byKey[0]])) {
        const i = byFloor[0];
        // every floor left is at least this one: none of those tuples can be taken any more
        if (floors[i] > theta) {
          floorSize = 0;
          break;
        }
        byFloor[0] = byFloor[--floorSize];
        siftDown(byFloor, floorSize, 0, floorFirst);
        finish(i, theta);
      }
      if (keySize === 0) return null;
      const slot = byKey[0];
      if (slotKey[slot] > theta) return null;
      byKey[0] = byKey[--keySize];
      siftDown(byKey, keySize, 0, keyFirst);
      return { rs: tupleOf(problem, list, slotIndex[slot]), key: slotKey[slot] };
    },
  };
}

/** Binary heap (first(a, b): a goes before b): move the entry at `at` down to its place. */
function siftDown(heap: Int32Array, size: number, at: number, first: (a: number, b: number) => boolean): void {
  const item = heap[at];
  for (;;) {
    let child = 2 * at + 1;
    if (child >= size) break;
    if (child + 1 < size && first(heap[child + 1], heap[child])) child++;
    if (!first(heap[child], item)) break;
    heap[at] = heap[child];
    at = child;
  }
  heap[at] = item;
}

/** Binary heap: move the entry at `at` up to its place. */
function siftUp(heap: Int32Array, at: number, first: (a: number, b: number) => boolean): void {
  const item = heap[at];
  while (at > 0) {
    const up = (at - 1) >> 1;
    if (!first(item, heap[up])) break;
    heap[at] = heap[up];
    at = up;
  }
  heap[at] = item;
}
