import { zeros } from '../../numeric/dense.js';
import type { ModalLadder } from './modalLadder.js';
import { periodicState, type PeriodicState } from './periodicState.js';
import { reusedStepError, steadyError, type SteadyError } from './stepError.js';

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
 * Method: the error after the step period by period in the modes of the period map (stepError.ts:
 * period k >= 1 is the steady error s(tau) plus sum_j zeta_j mu_j^(k-1) times the output of mode
 * j's state r_j, period 0 comes from the starting deviation itself; exact extremes per period).
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
 * With a finite `ceiling` (s), for callers that only compare the settling time with it (a yield
 * verdict): when the envelope already shows that no period from `safe` on leaves the band, and
 * safe * T (1 + 1e-9) <= ceiling, that figure is returned instead of the exact time. It is an
 * upper bound by the code alone: without the ceiling the result would be the last exit inside a
 * period before `safe` (k T + t1 + tau <= safe T up to rounding, covered by the 1e-9), and the
 * branch and bound could not give up (it makes at most 2 safe + 64 period evaluations; the
 * shortcut is taken only below MAX_PERIOD_EVALUATIONS). So `result <= ceiling` is the exact time's
 * verdict, and a result above the ceiling is the exact time itself.
 *
 * Syntax: modalSettling(modal, from, to, band[, states, ceiling])
 * Example: modalSettling(modalLadder(ladder)!, 0.1, 0.9, 1.6e-3)  // s, or null
 */
export function modalSettling(
  m: ModalLadder,
  from: number,
  to: number,
  band: number,
  states?: Map<number, PeriodicState>,
  ceiling = Infinity,
): number | null | undefined {
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
  // The steady error and the step's modes in objects kept from the last call: both are read only
  // inside this call, so nothing of them is allocated per call (values as stepError's).
  const ss = (SS = steadyError(target, SS));
  if (ss.above > band || ss.below < -band) return null;
  // The period-map symmetrization needs an orthogonal `mix` (a follower-free ladder).
  if (!m.symmetric) return undefined;
  const err = reusedStepError(m, target, source, ss);
  if (err === null) return 0;
  const { n } = m;
  const { zeta, bound } = err;

  const margin = Math.min(band - ss.above, band + ss.below);
  const envelope = (k: number) => {
    let s = 0;
    for (let j = 0; j < n; j++) s += Math.abs(zeta[j]) * bound[j] * err.power(j, k);
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
    // Blocks over [1, safe - 1] (at most 2 + log2(safe) of them, one evaluation each) and the
    // branch and bound inside them (at most 2 (width - 1) evaluations each): under 2 safe + 64.
    if (ceiling < Infinity && 2 * safe + 64 <= MAX_PERIOD_EVALUATIONS) {
      const upper = safe * m.period * (1 + 1e-9);
      if (upper <= ceiling) return upper;
    }

    let evaluations = 0;
    const coef = zeros(n);
    const leaves = (a: number, b: number): boolean => {
      evaluations++;
      let slack = 0;
      for (let j = 0; j < n; j++) {
        const pa = err.power(j, a);
        const pb = err.power(j, b);
        coef[j] = zeta[j] * 0.5 * (pa + pb);
        slack += Math.abs(zeta[j]) * bound[j] * 0.5 * (pa - pb);
      }
      err.setModes(coef);
      return err.leaves(band, slack);
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
    err.setFirstPeriod();
    if (!err.leaves(band, 0)) return 0;
    last = 0;
  } else {
    const coef = zeros(n);
    for (let j = 0; j < n; j++) coef[j] = zeta[j] * err.power(j, last);
    err.setModes(coef);
  }
  return err.lastExit(last, band);
}

/** The steady error of the last call, refilled by each (created by the first). */
let SS: SteadyError | undefined;
