import type { Ladder } from '../circuit/ladder.js';
import type { Waveform } from './types.js';
import { checkCount, checkDuty } from './checkArguments.js';
import type { Vector } from './dense.js';
import { dutyPlan } from './dutyPlan.js';
import { periodPowers } from './periodPowers.js';
import { periodTrajectory, type PeriodTrajectory } from './periodTrajectory.js';
import { prepare } from './prepare.js';

/**
 * The output after the duty steps from `from` to `to` at t = 0 (a rising edge), the circuit having
 * been in periodic steady state at `from`: `samples` instants evenly spread over [0, duration]
 * (both ends included), exact at each instant.
 *
 * Method: the state at the start of period k is x_s(to) + M^k e_0 (binary powers of the one-period
 * map, periodPowers.ts), then the exact trajectory inside the period (periodTrajectory.ts); no time
 * stepping, so the cost does not grow with the number of periods.
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
  const out = p.system.output;
  const plan = dutyPlan(p, to);
  const powers = periodPowers(plan.S, p.n);
  const T = p.period;
  let k = 0;
  let e: Vector = dutyPlan(p, from).xStart.map((v, i) => v - plan.xStart[i]);
  let traj: PeriodTrajectory = periodTrajectory(p, plan, e);
  const t: number[] = [];
  const v: number[] = [];
  for (let i = 0; i < samples; i++) {
    const ti = samples === 1 ? 0 : (i * duration) / (samples - 1);
    const ki = Math.floor(ti / T);
    if (ki > k) {
      e = powers.applyPower(ki - k, e);
      k = ki;
      traj = periodTrajectory(p, plan, e);
    }
    const tau = Math.min(Math.max(ti - k * T, 0), T);
    t.push(ti);
    v.push(plan.yStart + e[out] + traj.valueAt(tau));
  }
  return { t, v };
}
