import type { Network } from '../../circuit/network.js';
import { networkEquations, type NetworkEquations, type PinStateKey } from '../../circuit/networkEquations.js';
import { solveLinear } from '../../numeric/lu.js';
import { matmul, normInf } from '../../numeric/dense.js';
import { doubleFlow, flow, type Flow } from '../flow.js';

/** Everything the engine keeps about one phase (pin state and length) of a network. */
export interface PhaseFlows {
  readonly key: PinStateKey;
  readonly duration: number;
  readonly A: readonly number[];
  /** DC state of the phase alone, x* = -A^{-1} b. */
  readonly xStar: readonly number[];
  /** Flow (E, K = I - E, J) over the whole phase; formed on first use. */
  readonly full: Flow;
  /**
   * E and K over the whole phase, without J (with J when composed from quanta): what the periodic
   * orbit needs when it does not ask for the average. Formed on first use from the grid cell's
   * flow (powerFlow), independently of `full`, so that a figure does not depend on what was asked
   * before.
   */
  readonly map: Flow;
  /**
   * Flows over the grid steps that cover the phase, in order (geometric start, then equal cells);
   * formed on first use (an average needs only the whole phase's flow).
   */
  readonly steps: readonly Flow[];
  /** c^T A: the output's rate is -(c^T A) (x* - x). */
  readonly outputRate: readonly number[];
  /** ||D A D^{-1}||_inf (D = diag(scale)): bounds every modal rate, 1/s. */
  readonly rate: number;
}

/** A network's equations and its phase flows, computed once per network object. */
export interface NetworkCache {
  readonly equations: NetworkEquations;
  /** Phase flows per pin state and length (numbers as keys: no string formatting per lookup). */
  readonly flows: Map<PinStateKey, Map<number, PhaseFlows>>;
  /** What each pin state needs whatever the phase length. */
  readonly states: Map<PinStateKey, PinStateFlows>;
  /**
   * With a fine output every phase length is a whole multiple of this quantum, s (the duties are
   * codes: multiples of 2^-max(B, b), edges at d or (1 -+ d) / 2); null otherwise.
   */
  readonly quantum: number | null;
}

/** One pin state's DC state, rates and, with a quantum, its flows over 2^j quanta. */
interface PinStateFlows {
  readonly xStar: readonly number[];
  readonly rate: number;
  readonly outputRate: readonly number[];
  /** Flows (with J) over 2^j quanta, j = 0, 1, ..., formed as needed. */
  readonly powers: Flow[];
}

const caches = new WeakMap<Network, NetworkCache>();
const FLOW_CACHE_SIZE = 256;

/**
 * The cache of a network (deeply immutable, so identity is a safe key).
 *
 * Syntax: networkCache(network)
 * Example: networkCache(n).equations.n  // number of states
 */
export function networkCache(network: Network): NetworkCache {
  let cache = caches.get(network);
  if (!cache) {
    const second = network.second;
    const quantum = second?.role === 'fine' ? network.period * 2 ** -(Math.max(second.bits!, second.coarseBits!) + 1) : null;
    cache = { equations: networkEquations(network), flows: new Map(), states: new Map(), quantum };
    caches.set(network, cache);
  }
  return cache;
}

/**
 * Flows of one phase of a network, remembered per (pin state, length).
 *
 * Method: the exact flow of x' = A x + b (flow.ts, augmented matrix exponential); with a fine output,
 * whose phase lengths are whole numbers of quanta, composed from the flows over 2^j quanta
 * (composedFlow, below), one matrix exponential per pin state and network. The grid that
 * locates turning points of the output: cells of length h with h * rate <= 1 where rate = ||A||_inf
 * bounds every modal rate, at least 4 and at most 64 cells; when a cell is still longer than the
 * fastest time scale, the first cell is marched on the geometric grid h 2^-K, ..., h/2, h so that
 * a turning point caused by a fast mode near the phase start is bracketed too. The grid's flows are
 * formed when `steps` is first read; `map` (E and K without J) is the cell's flow composed over the
 * cells, so an orbit without its average costs one matrix exponential per phase.
 *
 * Syntax: phaseFlows(network, key, duration)
 * Example: phaseFlows(n, 'hl', 0.25 * n.period).full.E
 */
export function phaseFlows(network: Network, key: PinStateKey, duration: number): PhaseFlows {
  const cache = networkCache(network);
  let byLength = cache.flows.get(key);
  if (!byLength) {
    byLength = new Map();
    cache.flows.set(key, byLength);
  }
  const hit = byLength.get(duration);
  if (hit) return hit;
  const eq = cache.equations;
  const n = eq.n;
  const { A } = eq.phases[key];
  const scale = eq.scale;
  const state = pinStateFlows(cache, key);
  const { xStar, rate, outputRate } = state;
  // A whole number of quanta to rounding (a few units in the last place of the duration).
  const quanta = cache.quantum === null ? NaN : Math.round(duration / cache.quantum);
  const onGrid = quanta > 0 && Math.abs(duration / cache.quantum! - quanta) < 1e-9;
  // With a quantum the composed flow is cheap and has J anyway.
  let full: Flow | null = onGrid ? composedFlow(state.powers, A, n, quanta, cache.quantum!, scale) : null;
  let map: Flow | null = full;
  let steps: Flow[] | null = null;
  // The grid's equal cells; the whole phase's E and K are the cell's flow composed `cells` times.
  const cells = Math.min(64, Math.max(4, Math.ceil(duration * rate)));
  let cell: Flow | null = null;
  const cellFlow = () => (cell ??= flow(A, n, duration / cells, false, scale));
  const result: PhaseFlows = {
    key,
    duration,
    A,
    xStar,
    get full() {
      return (full ??= flow(A, n, duration, true, scale));
    },
    get map() {
      return (map ??= powerFlow(cellFlow(), cells, n));
    },
    get steps() {
      return (steps ??= gridSteps(A, n, cellFlow(), cells, rate, scale));
    },
    outputRate,
    rate,
  };
  if (byLength.size >= FLOW_CACHE_SIZE) byLength.clear();
  byLength.set(duration, result);
  return result;
}

function pinStateFlows(cache: NetworkCache, key: PinStateKey): PinStateFlows {
  let state = cache.states.get(key);
  if (state) return state;
  const eq = cache.equations;
  const n = eq.n;
  const { A, b } = eq.phases[key];
  const xStar = solveLinear(A, n, b.map((v) => -v));
  if (!xStar) throw new RangeError('phaseFlows: the circuit has no DC state (singular state matrix)');
  const outputRate = new Array<number>(n).fill(0);
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) outputRate[j] += eq.output[i] * A[i * n + j];
  state = { xStar, rate: normInf(scaled(A, n, eq.scale), n), outputRate, powers: [] };
  cache.states.set(key, state);
  return state;
}

/**
 * The flow over k quanta (k a whole number) from the flows over 2^j quanta: one matrix exponential
 * for the quantum (flow.ts), then doublings (doubleFlow) and sums over the binary digits of k with
 * E(a + b) = E(a) E(b), K(a + b) = K(a) + E(a) K(b), J(a + b) = J(a) + b K(a) + E(a) J(b) (from
 * K(a + s) = K(a) + E(a) K(s)): every term keeps its relative accuracy, as in scaling and squaring.
 */
function composedFlow(powers: Flow[], A: readonly number[], n: number, k: number, quantum: number, scale: readonly number[]): Flow {
  if (powers.length === 0) powers.push(flow(A, n, quantum, true, scale));
  let sum: Flow | null = null;
  for (let j = 0; k > 0; j++, k = Math.floor(k / 2)) {
    while (powers.length <= j) powers.push(doubleFlow(powers[powers.length - 1], n));
    if (k % 2 === 1) sum = sum === null ? powers[j] : addFlows(sum, powers[j], n);
  }
  return sum!;
}

/**
 * The flow over k steps of f (k >= 1) by binary powering with the same sums (E and K; J too when f
 * has it): the flow over a phase from the flow over one of its grid cells, without a second
 * matrix exponential.
 */
function powerFlow(f: Flow, k: number, n: number): Flow {
  let sum: Flow | null = null;
  let power = f;
  for (;;) {
    if (k % 2 === 1) sum = sum === null ? power : addFlows(sum, power, n);
    k = Math.floor(k / 2);
    if (k === 0) return sum!;
    power = doubleFlow(power, n);
  }
}

/** The flow over a.t + b.t from the flows over a.t and b.t (J when both have it). */
function addFlows(a: Flow, b: Flow, n: number): Flow {
  const nn = n * n;
  const E = matmul(a.E, b.E, n);
  const EK = matmul(a.E, b.K, n);
  const K = new Array<number>(nn);
  for (let i = 0; i < nn; i++) K[i] = a.K[i] + EK[i];
  if (!a.J || !b.J) return { t: a.t + b.t, E, K, J: null };
  const EJ = matmul(a.E, b.J, n);
  const J = new Array<number>(nn);
  for (let i = 0; i < nn; i++) J[i] = a.J[i] + b.t * a.K[i] + EJ[i];
  return { t: a.t + b.t, E, K, J };
}

function gridSteps(A: readonly number[], n: number, cell: Flow, cells: number, rate: number, scale: readonly number[]): Flow[] {
  const h = cell.t;
  const steps: Flow[] = [];
  const fine = h * rate > 1 ? Math.min(60, Math.ceil(Math.log2(h * rate))) : 0;
  if (fine > 0) {
    const geometric: Flow[] = [];
    for (let j = fine; j >= 1; j--) geometric.push(flow(A, n, h * 2 ** -j, false, scale));
    steps.push(geometric[0], ...geometric);
    for (let i = 1; i < cells; i++) steps.push(cell);
  } else {
    for (let i = 0; i < cells; i++) steps.push(cell);
  }
  return steps;
}

/**
 * D A D^{-1} for D = diag(d): the balanced form of a phase's matrix.
 *
 * Syntax: scaled(A, n, d)
 * Example: scaled([-1, 1, 2, -3], 2, [1, 2])  // [-1, 0.5, 4, -3]
 */
export function scaled(A: readonly number[], n: number, d: readonly number[]): number[] {
  const out = new Array<number>(n * n);
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) out[i * n + j] = (A[i * n + j] * d[i]) / d[j];
  return out;
}
