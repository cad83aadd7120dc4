import { zeros } from '../../numeric/dense.js';
import { brentRoot } from '../../numeric/brentRoot.js';
import type { ModalLadder } from './modalLadder.js';
import { curveExtrema, curveTurningPoints, curveValue, type PhaseCurve } from './phaseCurve.js';
import { periodicState, type PeriodicState } from './periodicState.js';
import { symmetricEigen } from '../../numeric/symmetricEigen.js';

/**
 * A safety net on the branch and bound: beyond this many period evaluations (never seen in
 * practice) the fast path gives up and the engine takes over.
 */
const MAX_PERIOD_EVALUATIONS = 4000;

/**
 * Settling time (s) after the duty steps from `from` to `to` at the start of a period, the ladder
 * having been in periodic steady state at `from`: the smallest t with |v(t') - average(to)| <= band
 * for all t' >= t (model.md). null when the steady state at `to` itself leaves the band; 0 when the
 * output never leaves it; undefined for a cascade (followers inside the ladder) or when the search
 * gives up (see MAX_PERIOD_EVALUATIONS): the caller must then use the engine.
 *
 * Method: in period k after the step the state deviation from the periodic orbit at `to` is
 * e_k = M^k e_0, M = E_l E_h. In high-phase modal coordinates M = X^T diag(e_l) X diag(e_h) is
 * similar to the symmetric D X^T diag(e_l) X D, D = diag(e_h)^(1/2); its difference from I,
 * N = -(diag(k_h) + D X^T diag(k_l) X D) (all k = -expm1(rate t) >= 0), is formed without
 * cancellation and diagonalized by Jacobi (symmetricEigen): N z_j = nu_j z_j, mu_j = 1 + nu_j.
 * Then e_0 = sum_j zeta_j q_j with zeta_j = z_j^T D e_0 and q_j = D^-1 z_j; to avoid D^-1 (huge for
 * a mode that dies within the phase) period k >= 1 uses e_k = sum_j zeta_j mu_j^(k-1) r_j with
 * r_j = M q_j = X^T diag(e_l) X D z_j, and period 0 uses e_0 itself; mu_j^k = exp(k log1p(nu_j)).
 * The error in a period is then s(tau) plus an exponential sum in tau (phaseCurve.ts), whose
 * extremes are exact.
 * Last violating period: branch and bound over period ranges [a, b], latest first. Over a range
 * each coefficient zeta_j mu_j^(k-1) moves monotonically between its end values, so
 * error <= s + sum_j m_j h_j + sum_j |zeta_j| H_j (end-value difference) / 2, m_j the mid value,
 * H_j >= max |h_j| (h_j the output of r_j through the period), and likewise from below; a range
 * whose bound stays inside the band is discarded, and a single period is decided exactly. The
 * search runs leftwards in blocks of 1, 2, 4, ... periods from the first period K where
 * sum_j |zeta_j| H_j mu_j^(K-1) fits in the margin the steady-state ripple leaves (nothing later
 * can leave the band). Inside the last violating period the error is monotone between turning
 * points, and Brent's method (brentRoot) finds the last band crossing.
 *
 * Pass a map to share periodic states between calls on the same ladder (keyed by duty).
 *
 * Syntax: modalSettling(modal, from, to, band[, states])
 * Example: modalSettling(modalLadder(ladder)!, 0.1, 0.9, 1.6e-3)  // s, or null
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
  // The period-map symmetrization below needs an orthogonal `mix` (a follower-free ladder).
  if (!m.symmetric) return undefined;

  const e0 = zeros(n);
  for (let i = 0; i < n; i++) e0[i] = source.start[i] - target.start[i];
  if (e0.every((v) => v === 0)) return 0;

  // The period map's modes, in the symmetric form.
  const kh = zeros(n);
  const half = zeros(n);
  const kl = zeros(n);
  const elow = zeros(n);
  for (let i = 0; i < n; i++) {
    kh[i] = -Math.expm1(hi.rate[i] * t1);
    half[i] = Math.exp(0.5 * hi.rate[i] * t1);
    kl[i] = -Math.expm1(lo.rate[i] * t2);
    elow[i] = Math.exp(lo.rate[i] * t2);
  }
  const N = zeros(n * n);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      let s = 0;
      for (let k = 0; k < n; k++) s += mix[k * n + i] * kl[k] * mix[k * n + j];
      N[i * n + j] = -(half[i] * s * half[j] + (i === j ? kh[i] : 0));
    }
  }
  const { values: nu, vectors: Z } = symmetricEigen(N, n, { vectors: true });
  const logMu = Array.from(nu, (v) => (v > -1 ? Math.log1p(v) : -Infinity));
  /** mu_j^(k-1) for period k >= 1. */
  const power = (j: number, k: number) => (k === 1 ? 1 : Math.exp((k - 1) * logMu[j]));

  // Output weights (per rate i) of a state w given in high-phase modal coordinates, in each phase.
  const highWeights = (w: number[], out: number[]) => {
    for (let i = 0; i < n; i++) out[i] = hi.out[i] * w[i];
  };
  const lowWeights = (w: number[], out: number[]) => {
    for (let i = 0; i < n; i++) {
      let s = 0; // low-phase coordinates of the state at the end of the high phase
      for (let k = 0; k < n; k++) s += mix[i * n + k] * half[k] * half[k] * w[k];
      out[i] = lo.out[i] * s;
    }
  };
  const zeta = zeros(n);
  const etaHigh: number[][] = [];
  const etaLow: number[][] = [];
  const bound = zeros(n);
  const r = zeros(n);
  const xr = zeros(n);
  for (let j = 0; j < n; j++) {
    let z = 0;
    for (let i = 0; i < n; i++) z += half[i] * Z[i * n + j] * e0[i];
    zeta[j] = z;
    // r_j = X^T diag(e_l) X D z_j
    for (let i = 0; i < n; i++) {
      let s = 0;
      for (let k = 0; k < n; k++) s += mix[i * n + k] * half[k] * Z[k * n + j];
      xr[i] = elow[i] * s;
    }
    for (let i = 0; i < n; i++) {
      let s = 0;
      for (let k = 0; k < n; k++) s += mix[k * n + i] * xr[k];
      r[i] = s;
    }
    const wh = zeros(n);
    const wl = zeros(n);
    highWeights(r, wh);
    lowWeights(r, wl);
    etaHigh.push(wh);
    etaLow.push(wl);
    bound[j] = Math.max(
      wh.reduce((a, v) => a + Math.abs(v), 0),
      wl.reduce((a, v) => a + Math.abs(v), 0),
    );
  }

  // Error curves of one period from the output weights of its starting state; the two curve
  // objects are refilled on each call (each is used up before the next call).
  const errHigh: PhaseCurve = { offset: 0, gain: zeros(n), rate: hi.rate, length: t1 };
  const errLow: PhaseCurve = { offset: 0, gain: zeros(n), rate: lo.rate, length: t2 };
  const bh = zeros(n);
  const bl = zeros(n);
  const curves = (): [PhaseCurve, PhaseCurve] => {
    let oHigh = ssHigh.offset;
    let oLow = ssLow.offset;
    for (let i = 0; i < n; i++) {
      errHigh.gain[i] = ssHigh.gain[i] + bh[i];
      errLow.gain[i] = ssLow.gain[i] + bl[i];
      oHigh += bh[i];
      oLow += bl[i];
    }
    errHigh.offset = oHigh;
    errLow.offset = oLow;
    return [errHigh, errLow];
  };
  const weightsFromModes = (c: number[]) => {
    for (let i = 0; i < n; i++) {
      let h = 0;
      let l = 0;
      for (let j = 0; j < n; j++) {
        h += c[j] * etaHigh[j][i];
        l += c[j] * etaLow[j][i];
      }
      bh[i] = h;
      bl[i] = l;
    }
  };
  const leavesWith = (slack: number): boolean => {
    const [ch, cl] = curves();
    const xh = curveExtrema(ch);
    const xl = curveExtrema(cl);
    return Math.max(xh.max, xl.max) + slack > band || Math.min(xh.min, xl.min) - slack < -band;
  };
  const firstPeriod = () => {
    highWeights(e0, bh);
    lowWeights(e0, bl);
  };

  const margin = Math.min(band - above, band + below);
  const envelope = (k: number) => {
    let s = 0;
    for (let j = 0; j < n; j++) s += Math.abs(zeta[j]) * bound[j] * power(j, k);
    return s;
  };
  let last = -1;
  if (envelope(1) > margin) {
    if (!(margin > 0)) return undefined;
    let low = 1;
    let high = 2;
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
      weightsFromModes(coef);
      return leavesWith(slack);
    };
    // Right-first branch and bound inside [a, b], whose bound leaves the band (exactly so when
    // a = b). A half whose bound leaves may still hold no violating period: then the other half.
    const lastLeaving = (a: number, b: number): number => {
      if (evaluations > MAX_PERIOD_EVALUATIONS) return Number.NaN;
      if (a === b) return a;
      const mid = Math.floor((a + b) / 2);
      if (leaves(mid + 1, b)) {
        const right = lastLeaving(mid + 1, b);
        if (right !== -1) return right;
      }
      return leaves(a, mid) ? lastLeaving(a, mid) : -1;
    };
    // Blocks of 1, 2, 4, ... periods leftwards from `safe`: the envelope bound is usually tight, so
    // the last violation is found within a few periods of it.
    for (let end = safe - 1, width = 1; end >= 1 && last === -1; width *= 2) {
      const start = Math.max(1, end - width + 1);
      // a block whose bound leaves the band may still hold no violating period: then go on left
      if (leaves(start, end)) last = lastLeaving(start, end);
      end = start - 1;
    }
    if (Number.isNaN(last)) return undefined;
  }
  if (last < 0) {
    firstPeriod();
    if (!leavesWith(0)) return 0;
    last = 0;
  } else {
    const coef = zeros(n);
    for (let j = 0; j < n; j++) coef[j] = zeta[j] * power(j, last);
    weightsFromModes(coef);
  }
  const [ch, cl] = curves();
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
