import { zeros } from './zeros.js';
import { brentRoot } from '../../engine/brentRoot.js';
import type { ModalLadder } from './modalLadder.js';
import { curveExtrema, curveTurningPoints, curveValue, type PhaseCurve } from './phaseCurve.js';
import { periodicState, type PeriodicState } from './periodicState.js';
import { symmetricEigen } from './symmetricEigen.js';

/**
 * The fast path stops (returns undefined) when a mode decays by more than e^-40 within the high
 * phase: its eigenvector of the period map would then need factors above e^20, too ill-conditioned
 * to call exact. The engine then takes over. Also when the search needs more than this many
 * period evaluations (never seen in practice; a safety net).
 */
const MAX_HALF_PHASE_DECAY = 20;
const MAX_PERIOD_EVALUATIONS = 4000;

/**
 * Settling time (s) after the duty steps from `from` to `to` at the start of a period, the ladder
 * having been in periodic steady state at `from`: the smallest t with |v(t') - average(to)| <= band
 * for all t' >= t (model.md). null when the steady state at `to` itself leaves the band; 0 when the
 * output never leaves it; undefined when this fast path does not apply (see MAX_HALF_PHASE_DECAY)
 * and the caller must use the engine.
 *
 * Method: in period k after the step the state deviation from the periodic orbit at `to` is
 * M^k e_0, M = E_l E_h. In high-phase modal coordinates M = X^T diag(e_l) X diag(e_h) is similar to
 * the symmetric D X^T diag(e_l) X D, D = diag(e_h)^(1/2); its difference from I,
 * N = -(diag(k_h) + D X^T diag(k_l) X D) (all k = -expm1(rate t) >= 0), is formed without
 * cancellation and diagonalized by Jacobi (symmetricEigen), so M^k = sum_j mu_j^k q_j p_j^T with
 * mu_j^k = exp(k log1p(nu_j)) exact for any k. The error in period k is then
 * s(tau) + sum_j zeta_j mu_j^k h_j(tau), exponential sums in tau (phaseCurve.ts).
 * Last violating period: branch and bound over period ranges [a, b], latest first. Over a range
 * each coefficient zeta_j mu_j^k moves monotonically between its end values, so
 * error <= s + sum_j m_j h_j + sum_j |zeta_j| H_j (mu_j^a - mu_j^b) / 2 with m_j the mid value and
 * H_j >= max |h_j| (and likewise from below); a range whose bound stays inside the band is
 * discarded, and a single period (a = b) is decided exactly. The search starts below the first
 * period K where sum_j |zeta_j| H_j mu_j^K fits in the margin the steady-state ripple leaves, after
 * which nothing can leave the band. Inside the last violating period the error is monotone between
 * turning points, and Brent's method (brentRoot) finds the last band crossing.
 *
 * Pass a map to share periodic states between calls on the same ladder (keyed by duty).
 *
 * Syntax: modalSettling(modal, from, to, band[, states])
 * Example: modalSettling(modalLadder(ladder)!, 0.1, 0.9, 1.6e-3)  // s, or null, or undefined
 */
export function modalSettling(
  m: ModalLadder,
  from: number,
  to: number,
  band: number,
  states?: Map<number, PeriodicState>,
): number | null | undefined {
  const { n, period, hi, lo, mix } = m;
  const stateAt = (d: number) => {
    let st = states?.get(d);
    if (!st) {
      st = periodicState(m, d);
      states?.set(d, st);
    }
    return st;
  };
  const target = stateAt(to);
  const source = stateAt(from);
  const { t1, t2, meanOffset } = target;
  const ssHigh: PhaseCurve = { ...target.high, offset: target.high.offset - meanOffset };
  const ssLow: PhaseCurve = { ...target.low, offset: target.low.offset - meanOffset };
  const eh = curveExtrema(ssHigh);
  const el = curveExtrema(ssLow);
  const above = Math.max(eh.max, el.max);
  const below = Math.min(eh.min, el.min);
  if (above > band || below < -band) return null;

  const e0 = zeros(n);
  for (let i = 0; i < n; i++) e0[i] = source.start[i] - target.start[i];
  if (e0.every((v) => v === 0)) return 0;

  let fastest = 0;
  for (let i = 0; i < n; i++) fastest = Math.max(fastest, -hi.rate[i] * t1 * 0.5);
  if (fastest > MAX_HALF_PHASE_DECAY) return undefined;

  // The period map's modes: N = M - I in the symmetric form, then q_j = D^-1 z_j, p_j = D z_j.
  const kh = zeros(n);
  const half = zeros(n);
  const kl = zeros(n);
  for (let i = 0; i < n; i++) {
    kh[i] = -Math.expm1(hi.rate[i] * t1);
    half[i] = Math.exp(0.5 * hi.rate[i] * t1);
    kl[i] = -Math.expm1(lo.rate[i] * t2);
  }
  const N = zeros(n * n);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      let s = 0;
      for (let k = 0; k < n; k++) s += mix[k * n + i] * kl[k] * mix[k * n + j];
      N[i * n + j] = -(half[i] * s * half[j] + (i === j ? kh[i] : 0));
    }
  }
  const { values: nu, vectors: Z } = symmetricEigen(N, n);
  const logMu = Array.from(nu, (v) => (v > -1 ? Math.log1p(v) : -Infinity));
  const power = (j: number, k: number) => (k === 0 ? 1 : Math.exp(k * logMu[j]));
  const zeta = zeros(n);
  const etaHigh = zeros(n * n); // [j * n + i]: mode j's output weight on rate i
  const etaLow = zeros(n * n);
  const bound = zeros(n);
  for (let j = 0; j < n; j++) {
    let z = 0;
    for (let i = 0; i < n; i++) z += half[i] * Z[i * n + j] * e0[i];
    zeta[j] = z;
    let sumHigh = 0;
    let sumLow = 0;
    for (let i = 0; i < n; i++) {
      const w = hi.out[i] * (Z[i * n + j] / half[i]);
      etaHigh[j * n + i] = w;
      sumHigh += Math.abs(w);
      let s = 0; // low-phase coordinates of the state at the end of the high phase
      for (let k = 0; k < n; k++) s += mix[i * n + k] * half[k] * Z[k * n + j];
      etaLow[j * n + i] = lo.out[i] * s;
      sumLow += Math.abs(etaLow[j * n + i]);
    }
    bound[j] = Math.max(sumHigh, sumLow);
  }

  // Error curves of one period for mode coefficients c_j (zeta_j mu_j^k, or a mid value); the two
  // curve objects are refilled on each call (each is used up before the next call).
  const errHigh: PhaseCurve = { offset: 0, gain: zeros(n), rate: hi.rate, length: t1 };
  const errLow: PhaseCurve = { offset: 0, gain: zeros(n), rate: lo.rate, length: t2 };
  const curves = (c: number[]): [PhaseCurve, PhaseCurve] => {
    let oHigh = ssHigh.offset;
    let oLow = ssLow.offset;
    for (let i = 0; i < n; i++) {
      let bh = 0;
      let bl = 0;
      for (let j = 0; j < n; j++) {
        bh += c[j] * etaHigh[j * n + i];
        bl += c[j] * etaLow[j * n + i];
      }
      errHigh.gain[i] = ssHigh.gain[i] + bh;
      errLow.gain[i] = ssLow.gain[i] + bl;
      oHigh += bh;
      oLow += bl;
    }
    errHigh.offset = oHigh;
    errLow.offset = oLow;
    return [errHigh, errLow];
  };

  const margin = Math.min(band - above, band + below);
  const envelope = (k: number) => {
    let s = 0;
    for (let j = 0; j < n; j++) s += Math.abs(zeta[j]) * bound[j] * power(j, k);
    return s;
  };
  if (envelope(0) <= margin) return 0;
  if (!(margin > 0)) return undefined;
  let low = 0;
  let high = 1;
  while (envelope(high) > margin) {
    low = high;
    high *= 2;
    if (high > 2 ** 52) return undefined;
  }
  while (high - low > 1) {
    const mid = Math.floor((low + high) / 2);
    if (envelope(mid) > margin) low = mid;
    else high = mid;
  }
  const safe = high; // no period from here on can leave the band

  let evaluations = 0;
  const coef = zeros(n);
  const leaves = (a: number, b: number): boolean => {
    evaluations++;
    let slack = 0;
    for (let j = 0; j < n; j++) {
      const pa = power(j, a);
      const pb = power(j, b);
      coef[j] = zeta[j] * 0.5 * (pa + pb);
      slack += Math.abs(zeta[j]) * bound[j] * 0.5 * (pa - pb);
    }
    const [ch, cl] = curves(coef);
    const xh = curveExtrema(ch);
    const xl = curveExtrema(cl);
    return (
      Math.max(xh.max, xl.max) + slack > band || Math.min(xh.min, xl.min) - slack < -band
    );
  };
  // Right-first branch and bound inside [a, b], which is known to leave the band somewhere.
  const lastLeaving = (a: number, b: number): number => {
    if (evaluations > MAX_PERIOD_EVALUATIONS) return Number.NaN;
    if (a === b) return a;
    const mid = Math.floor((a + b) / 2);
    if (leaves(mid + 1, b)) return lastLeaving(mid + 1, b);
    return leaves(a, mid) ? lastLeaving(a, mid) : -1;
  };
  // Blocks of 1, 2, 4, ... periods leftwards from `safe`: the envelope bound is usually tight, so
  // the last violation is found within a few periods of it.
  let last = -1;
  for (let end = safe - 1, width = 1; end >= 0; width *= 2) {
    const start = Math.max(0, end - width + 1);
    if (leaves(start, end)) {
      last = lastLeaving(start, end);
      break;
    }
    end = start - 1;
  }
  if (Number.isNaN(last)) return undefined;
  if (last < 0) return 0;

  for (let j = 0; j < n; j++) coef[j] = zeta[j] * power(j, last);
  const [ch, cl] = curves(coef);
  const inLow = lastExit(cl, band, period);
  if (inLow >= 0) return last * period + t1 + inLow;
  const inHigh = lastExit(ch, band, period);
  return last * period + Math.max(inHigh, 0);
}

/** The time in [0, length] after which |curve| stays within band, or -1 if it never leaves it. */
function lastExit(c: PhaseCurve, band: number, period: number): number {
  if (!(c.length > 0)) return -1;
  const ends = [0, ...curveTurningPoints(c), c.length];
  const values = ends.map((t) => curveValue(c, t));
  for (let k = ends.length - 1; k > 0; k--) {
    const va = values[k - 1];
    const vb = values[k];
    if (Math.abs(vb) > band) return ends[k];
    if (Math.abs(va) > band) {
      const level = va > 0 ? band : -band;
      return brentRoot((t) => curveValue(c, t) - level, ends[k - 1], ends[k], 1e-12 * period);
    }
  }
  return -1;
}
