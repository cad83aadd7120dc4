import type { Network } from '../../circuit/network.js';
import { networkEquations, type NetworkEquations, type PinStateKey } from '../../circuit/networkEquations.js';
import { solveLinear } from '../../numeric/lu.js';
import { normInf } from '../../numeric/dense.js';
import { addFlows, doubleFlow, flow, type Flow } from '../flow.js';
import { quantaTable, tableFlow, type QuantaTable } from './quantaFlows.js';

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

/** One pin state's DC state, rates and, with a quantum, its flows over whole numbers of quanta. */
interface PinStateFlows {
  readonly xStar: readonly number[];
  readonly rate: number;
  readonly outputRate: readonly number[];
  /** Flows (with J) over k quanta (quantaFlows.ts), formed on first use. */
  quanta: QuantaTable | null;
  /** Flows (without J) over k quarter quanta: the grid cells of a phase cut in 4. */
  quarters: QuantaTable | null;
}

/** Quarter quanta per quantum: a phase of k quanta cut in 4 grid cells has cells of k quarters. */
const QUARTERS = 4;

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
 * whose phase lengths are whole numbers of quanta, from the pin state's table of flows over whole
 * quanta (quantaFlows.ts; grid cells of whole quarter quanta likewise), one matrix exponential per
 * pin state and network. The grid that
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
  const state = pinStateFlows(cache, key);
  // A whole number of quanta to rounding (a few units in the last place of the duration).
  const q = cache.quantum;
  const quanta = q === null ? NaN : Math.round(duration / q);
  const onGrid = quanta > 0 && Math.abs(duration / q! - quanta) < 1e-9;
  const result = new LazyPhaseFlows(key, duration, eq.phases[key].A, eq.n, eq.scale, state, q, onGrid ? quanta : 0, q === null ? 0 : Math.round(network.period / q));
  if (byLength.size >= FLOW_CACHE_SIZE) byLength.clear();
  byLength.set(duration, result);
  return result;
}

/**
 * PhaseFlows of one phase, its flows formed on first use (one object per phase: no closures). With
 * a quantum and a whole number of quanta (`quanta` > 0) the flows come from the pin state's tables
 * (no matrix exponential per phase); the grid's equal cells, and the whole phase's E and K are the
 * cell's flow composed `cells` times.
 */
class LazyPhaseFlows implements PhaseFlows {
  readonly xStar: readonly number[];
  readonly outputRate: readonly number[];
  readonly rate: number;
  /** Grid cells of the phase: h * rate <= 1, at least 4 and at most 64. */
  private readonly cells: number;
  private fullFlow: Flow | null;
  private mapFlow: Flow | null;
  private stepFlows: Flow[] | null = null;
  private cell: Flow | null = null;

  constructor(
    readonly key: PinStateKey,
    readonly duration: number,
    readonly A: readonly number[],
    private readonly n: number,
    private readonly scale: readonly number[],
    private readonly state: PinStateFlows,
    private readonly quantum: number | null,
    private readonly quanta: number,
    private readonly maxQuanta: number,
  ) {
    this.xStar = state.xStar;
    this.outputRate = state.outputRate;
    this.rate = state.rate;
    this.cells = Math.min(64, Math.max(4, Math.ceil(duration * state.rate)));
    this.fullFlow = quanta > 0 ? tableFlow(this.table(), quanta) : null;
    this.mapFlow = this.fullFlow;
  }

  get full(): Flow {
    return (this.fullFlow ??= flow(this.A, this.n, this.duration, true, this.scale));
  }

  get map(): Flow {
    return (this.mapFlow ??= powerFlow(this.cellFlow(), this.cells, this.n));
  }

  get steps(): readonly Flow[] {
    return (this.stepFlows ??= gridSteps(this.A, this.n, this.cellFlow(), this.cells, this.rate, this.scale));
  }

  /** The pin state's table of flows over whole quanta. */
  private table(): QuantaTable {
    return (this.state.quanta ??= quantaTable(flow(this.A, this.n, this.quantum!, true, this.scale), this.n, this.maxQuanta));
  }

  private cellFlow(): Flow {
    if (this.cell) return this.cell;
    const { A, n, quanta, cells, scale, state } = this;
    if (quanta > 0 && (QUARTERS * quanta) % cells === 0) {
      state.quarters ??= quantaTable(flow(A, n, this.quantum! / QUARTERS, false, scale), n, QUARTERS * this.maxQuanta);
      this.cell = tableFlow(state.quarters, (QUARTERS * quanta) / cells);
    } else this.cell = flow(A, n, this.duration / cells, false, scale);
    return this.cell;
  }
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
  state = { xStar, rate: normInf(scaled(A, n, eq.scale), n), outputRate, quanta: null, quarters: null };
  cache.states.set(key, state);
  return state;
}

/**
 * The flow over k steps of f (k >= 1) by binary powering with the flow sums (E and K; J too when f
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
