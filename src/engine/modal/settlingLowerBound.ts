import type { ModalLadder } from './modalLadder.js';
import { periodicState, type PeriodicState } from './periodicState.js';
import { reusedStepError, steadyError, type SteadyError } from './stepError.js';

/** Largest period index looked at (2^52: beyond it a period count is no longer exact). */
const MAX_PERIODS = 2 ** 52;

/**
 * A LOWER BOUND on the settling time (model.md definition; modalSettling computes the exact one)
 * after the duty steps from `from` to `to` at the start of a period, the ladder having been in
 * periodic steady state at `from`: the end of the last band violation in the violating period the
 * search lands on. Every instant it returns is a verified violation (to the 1e-12 T of the
 * crossing's root finder), so it never exceeds the settling time; it equals it whenever the last
 * violation lies in that period, the usual case (once the slowest mode dominates, the error
 * decays monotonically). Cheaper than modalSettling, it is what the design search prunes with.
 * Infinity when the steady state at `to` itself leaves the band (never settles); 0 when the output
 * never leaves it. Follower-free ladders only (modalLadderOf; a RangeError otherwise).
 *
 * Method: the error period by period in the modes of the period map (stepError.ts), each period
 * decided exactly (extremes of its phase curves). The search for the last violating period starts
 * at the slowest mode's estimate: its output at the start of period 1, lead_s zeta_s, decays as
 * mu_s^(k-1), and falls below the margin the steady ripple leaves in the band after
 * k = 1 + ln(margin / |lead_s zeta_s|) / ln mu_s periods. From there it gallops (steps 1, 2, 4, ...)
 * to a violating and a clean period, then bisects between them.
 *
 * Pass the periodic states at `from` and `to` when they are at hand. With a finite `ceiling` (s)
 * the bound may stop early: when the first period starting after the ceiling still holds a
 * violation, that violation's end is returned (above the ceiling, still a verified violation, so
 * still a lower bound), for callers that only compare the bound with the ceiling.
 *
 * Syntax: settlingLowerBound(modal, from, to, band[, source, target, ceiling])
 * Example: settlingLowerBound(modalLadderOf(circuit, r, c), 0.1, 0.9, 1.6e-3)  // s, at most the settling time
 */
export function settlingLowerBound(
  m: ModalLadder,
  from: number,
  to: number,
  band: number,
  source: PeriodicState = periodicState(m, from),
  target: PeriodicState = periodicState(m, to),
  ceiling = Infinity,
): number {
  if (!m.symmetric) throw new RangeError('settlingLowerBound: follower-free ladders only');
  // The steady error and the step's modes in objects kept from the last call (nothing allocated).
  const ss = steadyError(target, SS);
  if (ss.above > band || ss.below < -band) return Infinity;
  const err = reusedStepError(m, target, source, ss);
  if (err === null) return 0;
  const { n } = m;
  const { zeta, logMu, lead } = err;
  const margin = band - Math.max(ss.above, -ss.below, 0);

  /** The error curves of period k leave the band. */
  const leaves = (k: number): boolean => {
    err.setPeriod(k);
    return err.leaves(band, 0);
  };

  // A caller that only asks whether the bound passes `ceiling`: a violation in the first period
  // that starts after it answers yes (and is itself a verified violation, still a lower bound).
  const kCeiling = Math.floor(ceiling / m.period) + 1;
  if (kCeiling < MAX_PERIODS && leaves(kCeiling)) return err.lastExit(kCeiling, band);

  // Estimate from the slowest mode (the largest mu).
  let slow = 0;
  for (let j = 1; j < n; j++) if (logMu[j] > logMu[slow]) slow = j;
  const slowOut = lead[slow] * zeta[slow];
  let kEst = 0;
  if (Math.abs(slowOut) > margin && logMu[slow] < 0) {
    kEst = Math.min(MAX_PERIODS, Math.max(0, Math.floor(1 + Math.log(margin / Math.abs(slowOut)) / logMu[slow])));
  }

  let kv = -1; // a violating period
  let kn = MAX_PERIODS; // a clean period after kv
  if (leaves(kEst)) {
    kv = kEst;
    for (let step = 1; ; step *= 2) {
      const k = kv + step;
      if (k >= MAX_PERIODS) break;
      if (leaves(k)) kv = k;
      else {
        kn = k;
        break;
      }
    }
  } else {
    kn = kEst;
    for (let step = 1; kn > 0; step *= 2) {
      const k = Math.max(0, kn - step);
      if (leaves(k)) {
        kv = k;
        break;
      }
      kn = k;
    }
  }
  if (kv < 0) return 0;
  while (kn - kv > 1) {
    const mid = Math.floor((kv + kn) / 2);
    if (leaves(mid)) kv = mid;
    else kn = mid;
  }
  err.setPeriod(kv);
  return err.lastExit(kv, band);
}

/** The steady error of the last call, refilled by each. */
const SS: SteadyError = steadyError({
  duty: 0.5,
  t1: 0.5,
  t2: 0.5,
  start: [0.5],
  yStart: 0.5,
  meanOffset: 0.5,
  average: 0.5,
  high: { offset: 0.5, gain: [0.5], rate: [0.5], length: 0.5 },
  low: { offset: 0.5, gain: [0.5], rate: [0.5], length: 0.5 },
});
