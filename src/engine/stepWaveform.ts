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
 * been in periodic steady state at `from`: `samples` instants evenly spread over [0, duration]
 * (both ends included), exact at each instant. For a record on the per-period grid
 * t = k T + j T / m, stepWaveformOnGrid.ts costs one flow per offset instead of one per sample.
 *
 * Method: the deviation from the periodic steady state at `to` evolves homogeneously, so the output
 * at k T + tau is y_s(tau) + r(tau) . M^k e_0 with e_0 = x_s(from) - x_s(to) (periodSampler.ts:
 * one exact flow per instant); M^k e_0 from binary powers of the one-period map (periodPowers.ts),
 * advanced from one sampled period to the next. No time stepping, so the cost does not grow with
 * the number of periods.
 *
 * Syntax: stepWaveform(ladder, from, to, duration, samples)
 * Example: stepWaveform(ladder, 0.1, 0.9, 0.02, 500).v[0]  // steady-state output at 0.1, rising edge
 */
export function stepWaveform(ladder: Ladder, from: number, to: number, duration: number, samples: number): Waveform {
  checkDuty(from, 'from');
  checkDuty(to, 'to');
  checkCount(duration, 'duration', false);
  checkCount(samples, 'samples', true);
  const p = prepare(ladder);
  const plan = dutyPlan(p, to);
  const T = p.period;
  const t: number[] = [];
  const periods: number[] = [];
  const offsets: number[] = [];
  for (let i = 0; i < samples; i++) {
    const ti = samples === 1 ? 0 : (i * duration) / (samples - 1);
    const k = Math.floor(ti / T);
    t.push(ti);
    periods.push(k);
    offsets.push(ti - k * T);
  }
  const sampler = periodSampler(p, plan, offsets);
  const powers = periodPowers(plan.S, p.n);
  let k = 0;
  let e: Vector = dutyPlan(p, from).xStart.map((v, i) => v - plan.xStart[i]);
  const v: number[] = [];
  for (let i = 0; i < samples; i++) {
    if (periods[i] > k) {
      e = powers.applyPower(periods[i] - k, e);
      k = periods[i];
    }
    v.push(sampler.valueAt(i, e));
  }
  return { t, v };
}
