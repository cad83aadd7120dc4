import type { Duties, Network } from '../../circuit/network.js';
import { identity, matmul, matvec } from '../../numeric/dense.js';
import { luFactor, luSolve, solveLinear } from '../../numeric/lu.js';
import { brentRoot } from '../../numeric/brentRoot.js';
import { periodPowers, type PeriodPowers } from '../periodPowers.js';
import { networkCache } from './phaseFlows.js';
import { periodicOrbit, type PeriodicOrbit } from './periodicOrbit.js';
import { transientBound } from './phaseSeries.js';
import { advanceInPhase, periodTrajectoryPoints, type TrajectoryPoint } from './trajectory.js';

/** Result of a settling computation: s after the step, or null when the output never settles. */
export interface NetworkSettling {
  readonly time: number | null;
  /** Average at the new duties, V (what the output settles to). */
  readonly final: number;
}

/** Most sampled periods per scan of the transient (below the proven-safe period). */
const SCAN_SAMPLES = 1024;
/** Scratch: a scan's sampled deltas, n long each (periodicSettling does not re-enter). */
let SAMPLE_DELTAS: number[][] = [];

/**
 * Settling time after the duties change from `from` to `to` at a period start, the network having
 * been in periodic steady state at `from` (model.md): the smallest t_s with |y(t) - average_to| <=
 * band for every t >= t_s; null when the steady state at `to` leaves the band.
 *
 * Method: the deviation from the new periodic orbit at the start of period m is delta_m = M^m delta_0
 * (M = I - S, periodicOrbit.ts); inside a period it moves with the exact phase flows.
 * 1. A period m is proven safe when G ||delta_m||_P <= band - max|y_to(t) - average_to|, where
 *    ||.||_P is the norm of the discrete Lyapunov solution P - M^T P M = I (so ||delta_m||_P never
 *    grows) and G bounds |c Phi(t) delta| / ||delta||_P over the period's grid (times 1.25 for the
 *    points between grid points); the first safe period is found by doubling and bisection with
 *    powers of M (periodPowers.ts: I - S form while near the identity).
 * 2. Below it, periods are checked exactly (grid and turning points, trajectory.ts) on at most 1024
 *    samples, stepping by at most one period per 0.2 rad of the fastest Sallen-Key ringing, from the
 *    top down (a period whose transient provably stays within band - max|y_to(t) - average_to|
 *    by the series bound of phaseSeries.ts, max over the period of |c Phi(t) delta| <= U(delta),
 *    passes without its trajectory); the last violating sample is refined to a single period by
 *    bisection, and the
 *    crossing into the band inside it by Brent's root finder on the monotone piece after the last
 *    violating point.
 * This assumes one crossing between two samples (true for RC networks, whose per-period transient is
 * a sum of decaying exponentials in m, at the sample spacing used); tests compare with independent
 * time-domain integration.
 *
 * Syntax: periodicSettling(network, from, to, band)
 * Example: periodicSettling(n, { first: 0.1, second: null }, { first: 0.9, second: null }, 1e-3).time
 */
export function periodicSettling(network: Network, from: Duties, to: Duties, band: number): NetworkSettling {
  const { equations } = networkCache(network);
  const n = equations.n;
  const c = equations.output;
  const scale = equations.scale;
  const T = network.period;
  const orbitTo = periodicOrbit(network, to);
  // Only its start state is needed: no extrema, no average.
  const orbitFrom = periodicOrbit(network, from, false, false);
  const avg = orbitTo.average;
  const steadyExcursion = Math.max(orbitTo.max - avg, avg - orbitTo.min);
  if (steadyExcursion > band) return { time: null, final: avg };
  const delta0 = orbitFrom.start.map((v, i) => v - orbitTo.start[i]);
  const slack = band - steadyExcursion;

  // Per-period check: the trajectory from start + delta, as deviations from orbitTo.start.
  const trajectory = (delta: readonly number[]) => periodTrajectoryPoints(orbitTo.phases, c, orbitTo.start, delta, scale);
  const offset = orbitTo.yStart - avg; // e(t) = offset + w(t)
  const violates = (pts: readonly TrajectoryPoint[]) => pts.some((p) => Math.abs(offset + p.w) > band);
  // A period whose transient provably stays inside the slack needs no trajectory (phaseSeries.ts).
  const bound = transientBound(orbitTo.phases, c, scale);
  const violatesFrom = (delta: readonly number[]) => (bound !== null && bound(delta, slack) <= slack ? false : violates(trajectory(delta)));

  const powers = periodPowers([...orbitTo.S], n);
  const safeFrom = firstSafePeriod(orbitTo, powers, delta0, slack, n, c);
  const ringing = fastestRinging(network);
  let step = Math.max(1, Math.ceil(safeFrom / SCAN_SAMPLES));
  if (ringing > 0) step = Math.min(step, Math.max(1, Math.floor(0.2 / (ringing * T))));
  // Sample periods 0, step, 2 step, ... below safeFrom, keeping each delta: M^step is formed once
  // (its columns by binary powering, periodPowers.ts), then one product per sample. Sample i is
  // period i step, its delta in SAMPLE_DELTAS[i] (arrays kept from scan to scan: none per sample).
  const stepMap = stepMatrix(powers, step, n);
  const most = 4 * SCAN_SAMPLES + 9;
  if (SAMPLE_DELTAS.length === 0 || SAMPLE_DELTAS[0].length !== n) SAMPLE_DELTAS = [new Array<number>(n).fill(0)];
  const deltas = SAMPLE_DELTAS;
  let count = 0;
  for (let i = 0; i < n; i++) deltas[0][i] = delta0[i];
  for (let m = 0; m < safeFrom; m += step) {
    count++;
    if (count >= most || m + step >= safeFrom) break;
    if (deltas.length === count) deltas.push(new Array<number>(n).fill(0));
    matvec(stepMap, deltas[count - 1], n, deltas[count]);
  }
  let last = -1;
  for (let i = count - 1; i >= 0; i--) {
    if (violatesFrom(deltas[i])) {
      last = i;
      break;
    }
  }
  if (last < 0) return { time: 0, final: avg };
  // Refine to the last violating period in [m_last, next sample).
  let lo = last * step;
  let loDelta = deltas[last].slice();
  let hi = last + 1 < count ? (last + 1) * step : safeFrom;
  while (hi - lo > 1) {
    const mid = Math.floor((lo + hi) / 2);
    const midDelta = powers.applyPower(mid - lo, loDelta);
    if (violatesFrom(midDelta)) {
      lo = mid;
      loDelta = midDelta;
    } else hi = mid;
  }
  const pts = trajectory(loDelta);
  let k = -1;
  for (let i = pts.length - 1; i >= 0; i--) {
    if (Math.abs(offset + pts[i].w) > band) {
      k = i;
      break;
    }
  }
  if (k === pts.length - 1) return { time: (lo + 1) * T, final: avg };
  const a = pts[k];
  const b = pts[k + 1];
  const sign = offset + a.w > 0 ? 1 : -1;
  // Between a and b the output is monotone and inside one phase (a may be that phase's start).
  const ph = orbitTo.phases[b.phase];
  const aTau = b.phase === a.phase ? a.tau : 0;
  const f = (dt: number) => sign * (offset + advanceInPhase(ph, orbitTo.start, a.d, dt, c, scale)) - band;
  const span = b.tau - aTau;
  const tau = a.t + brentRoot(f, 0, span, span * 1e-12, sign * (offset + a.w) - band, sign * (offset + b.w) - band);
  return { time: lo * T + tau, final: avg };
}

/** M^k as a matrix (row-major), its columns M^k e_j by binary powering. */
function stepMatrix(powers: PeriodPowers, k: number, n: number): number[] {
  const out = new Array<number>(n * n).fill(0);
  for (let j = 0; j < n; j++) {
    const e = new Array<number>(n).fill(0);
    e[j] = 1;
    const col = powers.applyPower(k, e);
    for (let i = 0; i < n; i++) out[i * n + j] = col[i];
  }
  return out;
}

/** First period m from which the transient provably stays inside the slack (step 1 of the method). */
function firstSafePeriod(
  orbit: PeriodicOrbit,
  powers: PeriodPowers,
  delta0: readonly number[],
  slack: number,
  n: number,
  c: readonly number[],
): number {
  const S = orbit.S;
  // P - M^T P M = S^T P + P S - S^T P S = I, as an n^2 x n^2 linear system in P (row-major).
  const nn = n * n;
  const L = new Array<number>(nn * nn).fill(0);
  for (let a = 0; a < n; a++) {
    for (let b = 0; b < n; b++) {
      const col = a * n + b; // P = e_a e_b^T
      for (let i = 0; i < n; i++) {
        for (let j = 0; j < n; j++) {
          // (S^T E)_ij = S_ai [j = b]; (E S)_ij = [i = a] S_bj; (S^T E S)_ij = S_ai S_bj
          let v = -S[a * n + i] * S[b * n + j];
          if (j === b) v += S[a * n + i];
          if (i === a) v += S[b * n + j];
          L[(i * n + j) * nn + col] = v;
        }
      }
    }
  }
  const rhs = new Array<number>(nn).fill(0);
  for (let i = 0; i < n; i++) rhs[i * n + i] = 1;
  const P = solveLinear(L, nn, rhs);
  if (!P) return 1 << 30;
  const pNorm = (d: readonly number[]) => {
    let s = 0;
    for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) s += d[i] * P[i * n + j] * d[j];
    return Math.sqrt(Math.max(s, 0));
  };
  // G: max over the grid of sqrt(v^T P^{-1} v), v = Phi(t)^T c, Phi marched along the grid.
  const Pf = luFactor(P, n);
  let Phi = identity(n);
  let G = dualNorm(Phi, c, Pf, n);
  for (const ph of orbit.phases) {
    for (const st of ph.steps) {
      Phi = matmul(st.E, Phi, n);
      G = Math.max(G, dualNorm(Phi, c, Pf, n));
    }
  }
  G *= 1.25;
  const safe = (delta: readonly number[]) => G * pNorm(delta) <= slack;
  if (safe(delta0)) return 0;
  // Doubling: find the first power of two that is safe.
  let j = 0;
  let m = 1;
  let delta = powers.apply(0, [...delta0]);
  let prevM = 0;
  let prevDelta = delta0.slice();
  while (!safe(delta)) {
    if (m >= 2 ** 52) return m;
    prevM = m;
    prevDelta = delta;
    delta = powers.apply(j, delta); // delta_2m = M^m delta_m
    j++;
    m *= 2;
  }
  // Bisection in (prevM, m]: prevM unsafe, m safe; the P-norm is monotone, so is `safe`.
  let lo = prevM;
  let loDelta = prevDelta;
  let hi = m;
  while (hi - lo > 1) {
    const mid = Math.floor((lo + hi) / 2);
    const midDelta = powers.applyPower(mid - lo, loDelta);
    if (safe(midDelta)) hi = mid;
    else {
      lo = mid;
      loDelta = midDelta;
    }
  }
  return hi;
}

function dualNorm(Phi: readonly number[], c: readonly number[], Pf: ReturnType<typeof luFactor>, n: number): number {
  const v = new Array<number>(n).fill(0);
  for (let j = 0; j < n; j++) for (let i = 0; i < n; i++) v[j] += c[i] * Phi[i * n + j];
  const z = luSolve(Pf, v);
  let s = 0;
  for (let i = 0; i < n; i++) s += v[i] * z[i];
  return Math.sqrt(Math.max(s, 0));
}

/** Largest undamped natural frequency of the Sallen-Key stages, rad/s (0 when none). */
function fastestRinging(network: Network): number {
  let w = 0;
  for (const s of network.stages) if (s.kind === 'sallen-key') w = Math.max(w, 1 / Math.sqrt(s.r1 * s.r2 * s.c1 * s.c2));
  return w;
}
