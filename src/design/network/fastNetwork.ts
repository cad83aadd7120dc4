import type { Duties, Network } from '../../circuit/network.js';
import { networkEquations, type NetworkEquations, type PinStateKey } from '../../circuit/networkEquations.js';
import { solveLinear } from '../../numeric/lu.js';
import { flow, periodStart, pinSchedule } from '../../engine/index.js';

/** One phase of a period: its pin state, length and exact flow. */
export interface FastPhase {
  readonly key: PinStateKey;
  readonly duration: number;
  /** e^{t A} and K = I - e^{t A} over the phase (row-major n x n), K formed without cancellation. */
  readonly E: readonly number[];
  readonly K: readonly number[];
  /** DC state of the phase, x* = -A^{-1} b. */
  readonly xStar: readonly number[];
}

/** Per pin state: the DC state and the row c^T A^{-1} that turns a state change into an output integral. */
interface PinState {
  readonly A: readonly number[];
  readonly xStar: readonly number[];
  /** r = c^T A^{-1}: the integral of the output over a phase is t c.x* + r.(x(t) - x(0)). */
  readonly row: readonly number[];
}

/**
 * The pruning-only model of a network (a version 1.1 circuit) for the design search: exact states
 * at the phase boundaries of the periodic steady state and the exact time average, without the
 * engine's turning-point grid. Every figure it gives is a value of the exact solution at an
 * instant, or an exact average, so a maximum over its samples is a lower bound on the engine's
 * extrema (see networkBounds.ts).
 */
export interface FastNetwork {
  readonly network: Network;
  readonly equations: NetworkEquations;
  readonly n: number;
  /** The flows of one phase, remembered per (pin state, length). */
  phase(key: PinStateKey, duration: number): FastPhase;
  /** c^T A_p^{-1} of a pin state: the integral of the output over a phase is t c.x* + row.(x(t) - x(0)). */
  row(key: PinStateKey): readonly number[];
}

/**
 * The fast model of one network: its state equations (circuit/networkEquations.ts) and, on demand,
 * the exact flow of each phase.
 *
 * Method: x' = A_p x + b_p in each pin state p; over a phase of length t, x(t) = x*_p + E (x(0) -
 * x*_p) with E = e^{t A_p} and K = I - E from the engine's flow (flow.ts: Higham's scaling and
 * squaring on the augmented matrix, balanced by sqrt of the capacitances), so K keeps its digits
 * when t is far below the time constants.
 *
 * Syntax: fastNetwork(network)
 * Example: fastNetwork(n).phase('hl', 0.5 * n.period).E
 */
export function fastNetwork(network: Network): FastNetwork {
  const equations = networkEquations(network);
  const n = equations.n;
  const states = new Map<PinStateKey, PinState>();
  const flows = new Map<string, FastPhase>();
  const pinState = (key: PinStateKey): PinState => {
    let s = states.get(key);
    if (!s) {
      const { A, b } = equations.phases[key];
      const xStar = solveLinear(A, n, b.map((v) => -v));
      // r A = c, i.e. A^T r^T = c^T.
      const At = new Array<number>(n * n);
      for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) At[i * n + j] = A[j * n + i];
      const row = solveLinear(At, n, equations.output);
      if (!xStar || !row) throw new RangeError('fastNetwork: the circuit has no DC state (singular state matrix)');
      s = { A, xStar, row };
      states.set(key, s);
    }
    return s;
  };
  return {
    network,
    equations,
    n,
    phase(key, duration) {
      const id = `${key}:${duration}`;
      let p = flows.get(id);
      if (!p) {
        const s = pinState(key);
        const f = flow(s.A, n, duration, false, equations.scale);
        p = { key, duration, E: f.E, K: f.K, xStar: s.xStar };
        flows.set(id, p);
      }
      return p;
    },
    row: (key) => pinState(key).row,
  };
}

/** The periodic steady state of a network at one pair of duties, at the phase boundaries. */
export interface FastOrbit {
  readonly duties: Duties;
  readonly phases: readonly FastPhase[];
  /** State at the period start. */
  readonly start: readonly number[];
  /** S = I - M, M the one-period map of deviations (for powers of M, engine/periodPowers.ts). */
  readonly S: readonly number[];
  /** Output at the period start, V. */
  readonly yStart: number;
  /** Exact time average of the output over the period, V. */
  readonly average: number;
}

/**
 * The exact periodic steady state of a network at given duties: the state at the period start
 * and the time-average output, as the engine's periodicOrbit.ts computes them but without the
 * trajectory grid.
 *
 * Method: deviation form about r, the duty-weighted mean of the phase DC states: S (x_s - r) =
 * sum_p P_p K_p (x*_p - r) with S = I - E_N...E_1 accumulated as S_p = K_p + E_p S_{p-1}
 * (periodicOrbit.ts; no subtraction of nearly equal matrices). The average: over a phase, x - x* =
 * A^{-1} x', so the integral of c.x is t c.x* + (c^T A^{-1}) (x(t) - x(0)), with x(t) - x(0) =
 * K (x* - x(0)) formed from K.
 *
 * Syntax: fastOrbit(model, duties)
 * Example: fastOrbit(fastNetwork(n), { first: 0.5, second: null }).average
 */
export function fastOrbit(model: FastNetwork, duties: Duties): FastOrbit {
  const { network, n, equations } = model;
  const T = network.period;
  const phases = pinSchedule(network, duties).map((p) => model.phase(p.key, p.duration));
  // The engine's fixed point of the period map (periodic/periodStart.ts), on this model's flows.
  const { start, S } = periodStart(phases, n, T);
  const c = equations.output;
  let integral = 0;
  let x = start.slice();
  for (const ph of phases) {
    const row = model.row(ph.key);
    const change = new Array<number>(n).fill(0);
    for (let i = 0; i < n; i++) {
      let s = 0;
      for (let j = 0; j < n; j++) s += ph.K[i * n + j] * (ph.xStar[j] - x[j]);
      change[i] = s;
    }
    let cx = 0;
    let rc = 0;
    for (let i = 0; i < n; i++) {
      cx += c[i] * ph.xStar[i];
      rc += row[i] * change[i];
    }
    integral += ph.duration * cx + rc;
    for (let i = 0; i < n; i++) x[i] += change[i];
  }
  let yStart = 0;
  for (let i = 0; i < n; i++) yStart += c[i] * start[i];
  return { duties, phases, start, S, yStart, average: integral / T };
}

/**
 * The output at `perPhase` evenly spaced instants of every phase of a periodic orbit (the phase
 * ends included) and at the period start: exact values of the steady-state output, so their
 * largest and smallest are within the true extremes, and max - min is a lower bound on the ripple.
 *
 * Method: within a phase x(t + h) = x* + e^{h A} (x(t) - x*), with e^{h A} from the engine's flow
 * for h = t_p / perPhase; the last step lands on the phase end.
 *
 * Syntax: sampledOutput(model, orbit[, perPhase])
 * Example: sampledOutput(m, fastOrbit(m, d), 8)   // { min, max } in V
 */
export function sampledOutput(model: FastNetwork, orbit: FastOrbit, perPhase = 8): { min: number; max: number } {
  let min = Infinity;
  let max = -Infinity;
  eachSample(model, orbit, orbit.start, perPhase, (_, y) => {
    if (y < min) min = y;
    if (y > max) max = y;
  });
  return { min, max };
}

/**
 * Visits the output of one period started from `state` (the orbit's phases and DC states) at the
 * period start and at `perPhase` evenly spaced instants of every phase, the phase ends included:
 * visit(t, y) with t in s from the period start and y in V. The samples of sampledOutput and of the
 * settling bound's refinement (networkBounds.ts).
 *
 * Method: within a phase x(t + h) = x* + e^{h A} (x(t) - x*), written x + K (x* - x) with
 * K = I - e^{h A} from the engine's flow for h = t_p / perPhase.
 *
 * Syntax: eachSample(model, orbit, state, perPhase, visit)
 * Example: eachSample(m, o, o.start, 8, (t, y) => console.log(t, y))
 */
export function eachSample(
  model: FastNetwork,
  orbit: FastOrbit,
  state: readonly number[],
  perPhase: number,
  visit: (t: number, y: number) => void,
): void {
  const { n, equations } = model;
  const c = equations.output;
  let x = state.slice();
  let y0 = 0;
  for (let i = 0; i < n; i++) y0 += c[i] * x[i];
  visit(0, y0);
  let t = 0;
  for (const ph of orbit.phases) {
    const h = ph.duration / perPhase;
    const step = model.phase(ph.key, h);
    for (let k = 0; k < perPhase; k++) {
      const next = new Array<number>(n);
      let y = 0;
      for (let i = 0; i < n; i++) {
        let s = 0;
        for (let j = 0; j < n; j++) s += step.K[i * n + j] * (ph.xStar[j] - x[j]);
        next[i] = x[i] + s;
        y += c[i] * next[i];
      }
      x = next;
      t += h;
      visit(t, y);
    }
  }
}
