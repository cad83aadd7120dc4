import type { Ladder } from '../circuit/ladder.js';
import type { Waveform } from './types.js';
import { checkCount, checkDuty } from './checkArguments.js';
import { dutyPlan } from './dutyPlan.js';
import { periodTrajectory } from './periodTrajectory.js';
import { prepare } from './prepare.js';

/**
 * The periodic steady-state output sampled at t = i T / samplesPerPeriod, i = 0 .. periods *
 * samplesPerPeriod (both ends included), t = 0 at a rising edge. Values are exact at the sample
 * instants (nothing is interpolated).
 *
 * Method: the exact trajectory of one period (periodTrajectory.ts; x(t) = x_s + K(t)(x_p - x_s)
 * per phase) evaluated at each distinct instant, repeated for the other periods.
 *
 * Syntax: steadyWaveform(ladder, duty, periods, samplesPerPeriod)
 * Example: steadyWaveform(ladder, 0.5, 2, 100).v.length  // 201
 */
export function steadyWaveform(ladder: Ladder, duty: number, periods: number, samplesPerPeriod: number): Waveform {
  checkDuty(duty, 'duty');
  checkCount(periods, 'periods', false);
  checkCount(samplesPerPeriod, 'samplesPerPeriod', true);
  const p = prepare(ladder);
  const plan = dutyPlan(p, duty);
  plan.extrema ??= periodTrajectory(p, plan);
  const traj = plan.extrema as ReturnType<typeof periodTrajectory>;
  const T = p.period;
  const one: number[] = [];
  for (let i = 0; i < samplesPerPeriod; i++) one.push(plan.yStart + traj.valueAt((i * T) / samplesPerPeriod));
  const count = Math.floor(periods * samplesPerPeriod + 1e-9) + 1;
  const t: number[] = [];
  const v: number[] = [];
  for (let i = 0; i < count; i++) {
    t.push((i * T) / samplesPerPeriod);
    v.push(one[i % samplesPerPeriod]);
  }
  return { t, v };
}
