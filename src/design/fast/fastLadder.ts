import type { Ladder } from '../../circuit/ladder.js';
import { symmetricEigen } from '../../numeric/symmetricEigen.js';
import { zeros } from '../../numeric/dense.js';

/** One pin state (high or low) of an unbuffered ladder, in symmetric coordinates y = C^(1/2) x. */
export interface FastPhase {
  /** Decay rates 1/tau of the modes, ascending (slowest first), 1/s. */
  rate: number[];
  /** Orthonormal modes, row-major: mode[k * n + i] is node k of mode i. */
  mode: number[];
  /** Output (last node, in V) per unit of each mode's coordinate. */
  out: number[];
  /** DC state of this pin state alone, symmetric coordinates. */
  yEq: number[];
}

/** An unbuffered ladder prepared for fast exact evaluation (see fastSteadyState, fastSettlingBound). */
export interface FastLadder {
  n: number;
  period: number;
  high: number;
  low: number;
  /** Equal driver resistances: the circuit is linear time-invariant and both phases share modes. */
  lti: boolean;
  /** sqrt of the node capacitances (load capacitance included at the last node). */
  sqrtC: number[];
  pinHigh: FastPhase;
  pinLow: FastPhase;
  /** yEq(high) - yEq(low), formed without subtraction when the drivers are equal. */
  delta: number[];
}

/**
 * Prepare an unbuffered RC ladder (1 to 4 stages) for the design search's fast exact model: the
 * same circuit and definitions as the engine (model.md), specialised so that one steady state costs
 * microseconds.
 *
 * Method: nodal analysis C x' = -G_p x + b_p per pin state p (driver in series with R1, load at the
 * last node); with y = C^(1/2) x the system matrix becomes the symmetric S_p = C^(-1/2) G_p C^(-1/2),
 * a positive definite Jacobi (tridiagonal) matrix, so its eigenvalues are real, positive and
 * distinct and exp(-S_p t) = U exp(-Lambda t) U^T exactly (numeric/symmetricEigen.ts). DC states from the
 * tridiagonal solve G_p x = b_p (Thomas algorithm).
 *
 * Syntax: fastLadder(ladder)
 * Example: fastLadder({ period: 5e-5, high: 3.3, low: 0, driverHigh: 0, driverLow: 0,
 *            stages: [{ r: 1e3, c: 1e-6, buffered: false }], loadResistance: null, loadCapacitance: 0 })
 *          .pinHigh.rate   // [1000]
 */
export function fastLadder(ladder: Ladder): FastLadder {
  const n = ladder.stages.length;
  if (ladder.stages.some((s, k) => s.buffered && k < n - 1)) {
    throw new RangeError('fastLadder: buffered stages inside the ladder are not supported');
  }
  return fastLadderOf(
    ladder,
    ladder.stages.map((s) => s.r),
    ladder.stages.map((s) => s.c),
  );
}

/** The circuit around the ladder: everything of a Ladder but the stages. */
export type FastCircuit = Omit<Ladder, 'stages'>;

/**
 * fastLadder for a circuit and plain resistor and capacitor lists (pin side first), without
 * building a Ladder; the design search calls this for every candidate.
 *
 * Syntax: fastLadderOf(circuit, r, c)
 * Example: fastLadderOf(circuit, [4700, 47e3], [1e-6, 10e-9]).n   // 2
 */
export function fastLadderOf(ladder: FastCircuit, r: ArrayLike<number>, c: ArrayLike<number>): FastLadder {
  const n = r.length;
  if (n < 1 || n > 4) throw new RangeError(`fastLadder: 1 to 4 stages, got ${n}`);
  const sqrtC = zeros(n);
  for (let k = 0; k < n; k++) sqrtC[k] = Math.sqrt(c[k] + (k === n - 1 ? ladder.loadCapacitance : 0));
  const lti = ladder.driverHigh === ladder.driverLow;
  let pinHigh: FastPhase;
  let pinLow: FastPhase;
  let delta: number[];
  if (lti) {
    // One set of modes; DC states per volt of the source, so Delta needs no subtraction.
    const perVolt = phase(ladder, r, sqrtC, ladder.driverHigh, 1);
    pinHigh = { ...perVolt, yEq: scaled(perVolt.yEq, ladder.high) };
    pinLow = { ...perVolt, yEq: scaled(perVolt.yEq, ladder.low) };
    delta = scaled(perVolt.yEq, ladder.high - ladder.low);
  } else {
    pinHigh = phase(ladder, r, sqrtC, ladder.driverHigh, ladder.high);
    pinLow = phase(ladder, r, sqrtC, ladder.driverLow, ladder.low);
    delta = zeros(n);
    for (let i = 0; i < n; i++) delta[i] = pinHigh.yEq[i] - pinLow.yEq[i];
  }
  return { n, period: ladder.period, high: ladder.high, low: ladder.low, lti, sqrtC, pinHigh, pinLow, delta };
}

function scaled(v: number[], k: number): number[] {
  const out = zeros(v.length);
  for (let i = 0; i < v.length; i++) out[i] = v[i] * k;
  return out;
}

function phase(ladder: FastCircuit, r: ArrayLike<number>, sqrtC: number[], driver: number, source: number): FastPhase {
  const n = r.length;
  // Conductance matrix G (tridiagonal): g[k] links node k-1 (k = 0: the pin) to node k.
  const g = zeros(n);
  for (let k = 0; k < n; k++) g[k] = 1 / (r[k] + (k === 0 ? driver : 0));
  const gLoad = ladder.loadResistance === null ? 0 : 1 / ladder.loadResistance;
  const diag = zeros(n);
  const off = zeros(n); // off[k] = G[k][k+1]
  for (let k = 0; k < n; k++) {
    diag[k] = g[k] + (k < n - 1 ? g[k + 1] : gLoad);
    if (k < n - 1) off[k] = -g[k + 1];
  }
  const s = zeros(n * n);
  for (let k = 0; k < n; k++) {
    s[k * n + k] = diag[k] / (sqrtC[k] * sqrtC[k]);
    if (k < n - 1) {
      const v = off[k] / (sqrtC[k] * sqrtC[k + 1]);
      s[k * n + k + 1] = v;
      s[(k + 1) * n + k] = v;
    }
  }
  const { values, vectors } = symmetricEigen(s, n, { vectors: true });
  const out = zeros(n);
  for (let i = 0; i < n; i++) out[i] = vectors[(n - 1) * n + i] / sqrtC[n - 1];
  // DC state: G x = e_0 g_0 source (Thomas algorithm; G is an M-matrix, no pivoting needed).
  const cp = zeros(n);
  const dp = zeros(n);
  for (let k = 0; k < n; k++) {
    const rhs = k === 0 ? g[0] * source : 0;
    const lower = k > 0 ? off[k - 1] : 0;
    const denom = diag[k] - lower * (k > 0 ? cp[k - 1] : 0);
    cp[k] = k < n - 1 ? off[k] / denom : 0;
    dp[k] = (rhs - lower * (k > 0 ? dp[k - 1] : 0)) / denom;
  }
  const yEq = zeros(n);
  let next = 0;
  for (let k = n - 1; k >= 0; k--) {
    const x = dp[k] - cp[k] * next;
    next = x;
    yEq[k] = x * sqrtC[k];
  }
  return { rate: values, mode: vectors, out, yEq };
}
