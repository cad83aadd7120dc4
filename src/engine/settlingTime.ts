import type { Ladder } from '../circuit/ladder.js';
import type { Settling } from './types.js';
import { brentRoot } from '../numeric/brentRoot.js';
import { checkDuty } from './checkArguments.js';
import { vectorNormInf, type Vector } from '../numeric/dense.js';
import { dutyPlan, type DutyPlan } from './dutyPlan.js';
import { periodPowers } from './periodPowers.js';
import { periodTrajectory } from './periodTrajectory.js';
import { prepare, type Prepared } from './prepare.js';

/** Largest power of two (in periods) the search looks at: 2^62 periods. */
const MAX_DOUBLINGS = 62;

/**
 * Settling time after the duty steps from `from` to `to` at the start of a period, the circuit
 * having been in periodic steady state at `from`: the smallest t such that
 * |v(t') - average(to)| <= band for every t' >= t. `time` is null when the steady state at `to`
 * itself leaves the band (its ripple is too large); 0 when the output never leaves the band.
 *
 * Method: in period k after the step the state is x_s(to) + e_k + w(tau), e_k = M^k e_0 with
 * M = E_l E_h and e_0 = x_s(from) - x_s(to), so "period k leaves the band" is decided exactly by
 * the period's extremes (periodTrajectory.ts) without stepping through the periods in between.
 * M^(2^j) is kept as I + N (periodPowers.ts). The search is logarithmic in the time constant:
 * (1) the state maps are entrywise nonnegative with row sums <= 1 (A is a Metzler matrix with
 * non-positive row sums), so |c^T Phi e| <= ||e||_inf for all later times: the first 2^J with
 * ||e_(2^J)||_inf <= band - (largest steady-state excursion from the average) bounds the answer;
 * (2) binary search (descending powers of two) for the last period that leaves the band, confirmed
 * on the next periods and on periods 2^i later (repeated from any violation found);
 * (3) inside that period the output is monotone between turning points: Brent's method
 * (brentRoot.ts) on the exact output finds the last band crossing to ~1e-10 T.
 *
 * Syntax: settlingTime(ladder, from, to, band)
 * Example: settlingTime(ladder, 0.1, 0.9, 1.6e-3)  // { from: 0.1, to: 0.9, band: 0.0016, time: 0.0123 }
 */
export function settlingTime(ladder: Ladder, from: number, to: number, band: number): Settling {
  checkDuty(from, 'from');
  checkDuty(to, 'to');
  if (!(band > 0) || !Number.isFinite(band)) throw new RangeError(`band ${band} must be > 0 V`);
  return { from, to, band, time: settleSeconds(prepare(ladder), from, to, band) };
}

function settleSeconds(p: Prepared, from: number, to: number, band: number): number | null {
  const { n, period } = p;
  const out = p.system.output;
  const plan = dutyPlan(p, to);
  plan.extrema ??= periodTrajectory(p, plan);
  const above = plan.extrema.maxW - plan.meanOffset;
  const below = plan.meanOffset - plan.extrema.minW;
  if (above > band || below > band) return null;
  const margin = band - Math.max(above, below, 0);
  const e0 = dutyPlan(p, from).xStart.map((v, i) => v - plan.xStart[i]);
  if (vectorNormInf(e0) <= margin) return 0;

  const powers = periodPowers(plan.S, n);
  const leaves = (e: Vector): boolean => {
    if (vectorNormInf(e) <= margin) return false;
    const start = e[out] - plan.meanOffset;
    if (start > band || start < -band) return true;
    const tr = periodTrajectory(p, plan, e);
    return start + tr.maxW > band || start + tr.minW < -band;
  };

  // (1) an upper bound 2^top on the periods that can still leave the band
  let top = 0;
  let e: Vector = e0;
  while (top < MAX_DOUBLINGS) {
    e = powers.apply(top, e);
    top++;
    if (vectorNormInf(e) <= margin) break;
  }
  const limit = 2 ** top;

  // (2) last period that leaves the band, by descending powers of two from a leaving period
  const lastFrom = (k0: number, ek0: Vector): { k: number; e: Vector } => {
    let k = k0;
    let ek = ek0;
    for (let j = top - 1; j >= 0; j--) {
      if (k + 2 ** j >= limit) continue;
      const candidate = powers.apply(j, ek);
      if (leaves(candidate)) {
        k += 2 ** j;
        ek = candidate;
      }
    }
    return { k, e: ek };
  };
  let last = lastFrom(0, e0);
  if (last.k === 0 && !leaves(e0)) last = { k: -1, e: e0 };
  for (let round = 0; round < 8; round++) {
    const later = confirmLater(last.k, last.k < 0 ? e0 : last.e, limit, powers, leaves);
    if (!later) break;
    last = lastFrom(later.k, later.e);
  }
  if (last.k < 0) return 0;
  return last.k * period + lastCrossing(p, plan, last.e, band);
}

/** A period after k (k = -1: none yet, ek = e_0) that leaves the band: k+1..k+3, then k+1+2^j. */
function confirmLater(
  k: number,
  ek: Vector,
  limit: number,
  powers: ReturnType<typeof periodPowers>,
  leaves: (e: Vector) => boolean,
): { k: number; e: Vector } | null {
  const next = k + 1;
  const eNext = k < 0 ? ek : powers.apply(0, ek);
  let e = eNext;
  for (let i = 0; i < 3 && next + i < limit; i++) {
    if (leaves(e)) return { k: next + i, e };
    e = powers.apply(0, e);
  }
  for (let j = 2; next + 2 ** j < limit; j++) {
    const candidate = powers.apply(j, eNext);
    if (leaves(candidate)) return { k: next + 2 ** j, e: candidate };
  }
  return null;
}

/** Time within the period (from x_s + e) after which the output stays inside the band. */
function lastCrossing(p: Prepared, plan: DutyPlan, e: Vector, band: number): number {
  const out = p.system.output;
  const tr = periodTrajectory(p, plan, e);
  const offset = e[out] - plan.meanOffset;
  const err = (tau: number) => offset + tr.valueAt(tau);
  const knots = tr.knots;
  let fb = err(knots[knots.length - 1]);
  for (let i = knots.length - 2; i >= 0; i--) {
    const a = knots[i];
    const b = knots[i + 1];
    const fa = err(a);
    if (Math.abs(fb) > band) return b;
    if (Math.abs(fa) > band) {
      const level = fa > 0 ? band : -band;
      return brentRoot((t) => err(t) - level, a, b, p.period * 1e-12, fa - level, fb - level);
    }
    fb = fa;
  }
  // The period's grid saw a violation that the monotone pieces do not show (a missed pair of
  // turning points): fall back to the instant of the violating extreme.
  return Math.abs(offset + tr.maxW) > band ? tr.tMax : tr.tMin;
}
