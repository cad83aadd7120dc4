import type { Ladder } from '../circuit/ladder.js';
import type { Waveform } from './types.js';
import { checkCount, checkDuty } from './checkArguments.js';
import type { Vector } from '../numeric/dense.js';
import { dutyPlan } from './dutyPlan.js';
import { periodPowers } from './periodPowers.js';
import { periodSampler } from './periodSampler.js';
import { prepare } from './prepare.js';

/**
 * The output after the duty steps from `from` to `to` at t = 0 (a rising edge), the circuit having
 * been in periodic steady state at `from`, sampled on the per-period grid t = k T + j T / perPeriod
 * (j = 0 .. perPeriod - 1) for every t < duration, plus t = duration itself; exact at each instant.
 * When that is more than `maxSamples` samples, only a subset of periods is sampled, spread evenly
 * from the first to the last (each with all its perPeriod samples, so every sampled period shows its
 * own ripple), and `t` has gaps between them.
 *
 * Method: y(k T + tau_j) = y_s(tau_j) + r_j . e_k with e_k = M^k e_0, e_0 = x_s(from) - x_s(to):
 * the deviation from the steady state at `to` evolves homogeneously (periodSampler.ts gives y_s and
 * r_j once per offset), and e_k comes from binary powers of the one-period map (periodPowers.ts).
 * The cost is one flow per offset plus O(n^2 log k) per sampled period: nothing is time-stepped.
 *
 * Syntax: stepWaveformOnGrid(ladder, from, to, duration, perPeriod[, maxSamples])
 * Example: stepWaveformOnGrid(ladder, 0.1, 0.9, 0.02, 16, 20000).v.at(-1)  // output at t = 20 ms
 */
export function stepWaveformOnGrid(
  ladder: Ladder,
  from: number,
  to: number,
  duration: number,
  perPeriod: number,
  maxSamples = Infinity,
): Waveform {
  checkDuty(from, 'from');
  checkDuty(to, 'to');
  checkCount(duration, 'duration', false);
  checkCount(perPeriod, 'perPeriod', true);
  if (!(maxSamples >= 2)) throw new RangeError(`maxSamples ${maxSamples} must be at least 2`);
  const p = prepare(ladder);
  const plan = dutyPlan(p, to);
  const T = p.period;
  const m = perPeriod;
  const step = T / m;
  // Grid instants i T / m strictly before the end (the end gets its own exact sample).
  const gridCount = Math.max(1, Math.ceil((duration / step) * (1 - 1e-12)));
  const lastGridPeriod = Math.floor((gridCount - 1) / m);
  const periods = stridedPeriods(lastGridPeriod, gridCount + 1 <= maxSamples ? Infinity : Math.floor((maxSamples - 1) / m));
  if (periods.length === 0) {
    throw new RangeError(`maxSamples ${maxSamples} is too small for ${m} samples per period`);
  }
  let endPeriod = Math.max(lastGridPeriod, Math.floor(duration / T));
  if (duration - endPeriod * T < 0) endPeriod = lastGridPeriod;
  const offsets = Array.from({ length: m }, (_, j) => j * step);
  offsets.push(duration - endPeriod * T);
  const sampler = periodSampler(p, plan, offsets);
  const powers = periodPowers(plan.S, p.n);

  let e: Vector = dutyPlan(p, from).xStart.map((v, i) => v - plan.xStart[i]);
  let k = 0;
  const t: number[] = [];
  const v: number[] = [];
  for (const kp of periods) {
    e = powers.applyPower(kp - k, e);
    k = kp;
    const jEnd = Math.min(m, gridCount - kp * m);
    for (let j = 0; j < jEnd; j++) {
      t.push((kp * m + j) * step);
      v.push(sampler.valueAt(j, e));
    }
  }
  e = powers.applyPower(endPeriod - k, e);
  t.push(duration);
  v.push(sampler.valueAt(m, e));
  return { t, v };
}

/**
 * Periods 0..last, or `count` of them spread evenly (first and last included) when there are more;
 * empty when count < 2 would be needed but not enough room is given.
 */
function stridedPeriods(last: number, count: number): number[] {
  if (last + 1 <= count) return Array.from({ length: last + 1 }, (_, i) => i);
  if (count < 2) return [];
  return Array.from({ length: count }, (_, s) => Math.round((s * last) / (count - 1)));
}
