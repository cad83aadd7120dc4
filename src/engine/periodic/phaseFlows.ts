import type { Network } from '../../circuit/network.js';
import { networkEquations, type NetworkEquations, type PinStateKey } from '../../circuit/networkEquations.js';
import { solveLinear } from '../../numeric/lu.js';
import { normInf } from '../../numeric/dense.js';
import { flow, type Flow } from '../flow.js';

/** Everything the engine keeps about one phase (pin state and length) of a network. */
export interface PhaseFlows {
  readonly key: PinStateKey;
  readonly duration: number;
  readonly A: readonly number[];
  /** DC state of the phase alone, x* = -A^{-1} b. */
  readonly xStar: readonly number[];
  /** Flow (E, K = I - E, J) over the whole phase. */
  readonly full: Flow;
  /** Flows over the grid steps that cover the phase, in order (geometric start, then equal cells). */
  readonly steps: readonly Flow[];
  /** c^T A: the output's rate is -(c^T A) (x* - x). */
  readonly outputRate: readonly number[];
  /** ||D A D^{-1}||_inf (D = diag(scale)): bounds every modal rate, 1/s. */
  readonly rate: number;
}

/** A network's equations and its phase flows, computed once per network object. */
export interface NetworkCache {
  readonly equations: NetworkEquations;
  readonly flows: Map<string, PhaseFlows>;
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
    cache = { equations: networkEquations(network), flows: new Map() };
    caches.set(network, cache);
  }
  return cache;
}

/**
 * Flows of one phase of a network, remembered per (pin state, length).
 *
 * Method: the exact flow of x' = A x + b (flow.ts, augmented matrix exponential). The grid that
 * locates turning points of the output: cells of length h with h * rate <= 1 where rate = ||A||_inf
 * bounds every modal rate, at least 4 and at most 64 cells; when a cell is still longer than the
 * fastest time scale, the first cell is marched on the geometric grid h 2^-K, ..., h/2, h so that
 * a turning point caused by a fast mode near the phase start is bracketed too.
 *
 * Syntax: phaseFlows(network, key, duration)
 * Example: phaseFlows(n, 'hl', 0.25 * n.period).full.E
 */
export function phaseFlows(network: Network, key: PinStateKey, duration: number): PhaseFlows {
  const cache = networkCache(network);
  const id = `${key}:${duration}`;
  const hit = cache.flows.get(id);
  if (hit) return hit;
  const eq = cache.equations;
  const n = eq.n;
  const { A, b } = eq.phases[key];
  const xStar = solveLinear(A, n, b.map((v) => -v));
  if (!xStar) throw new RangeError('phaseFlows: the circuit has no DC state (singular state matrix)');
  const scale = eq.scale;
  const full = flow(A, n, duration, true, scale);
  const rate = normInf(scaled(A, n, scale), n);
  const outputRate = new Array<number>(n).fill(0);
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) outputRate[j] += eq.output[i] * A[i * n + j];
  let steps: Flow[] | null = null;
  const result: PhaseFlows = {
    key,
    duration,
    A,
    xStar,
    full,
    get steps() {
      return (steps ??= gridSteps(A, n, duration, rate, scale));
    },
    outputRate,
    rate,
  };
  if (cache.flows.size >= FLOW_CACHE_SIZE) cache.flows.clear();
  cache.flows.set(id, result);
  return result;
}

function gridSteps(A: readonly number[], n: number, duration: number, rate: number, scale: readonly number[]): Flow[] {
  const cells = Math.min(64, Math.max(4, Math.ceil(duration * rate)));
  const h = duration / cells;
  const steps: Flow[] = [];
  const fine = h * rate > 1 ? Math.min(60, Math.ceil(Math.log2(h * rate))) : 0;
  if (fine > 0) {
    const geometric: Flow[] = [];
    for (let j = fine; j >= 1; j--) geometric.push(flow(A, n, h * 2 ** -j, false, scale));
    steps.push(geometric[0], ...geometric);
    const cell = flow(A, n, h, false, scale);
    for (let i = 1; i < cells; i++) steps.push(cell);
  } else {
    const cell = flow(A, n, h, false, scale);
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
