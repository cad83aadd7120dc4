import type { Ladder } from '../circuit/ladder.js';
import { checkLadder } from '../circuit/checkLadder.js';
import type { OperatingPoint } from './types.js';
import { phi2 } from '../numeric/phi.js';

/**
 * Periodic steady state of a one-stage ladder in closed form (the fast path of steadyState; it
 * needs no cached preparation, so a fresh ladder per call costs about a microsecond).
 *
 * Method: the scalar case of dutyPlan.ts. The node sees conductance g_p = 1/(R + R_d,p) to the
 * pin and g_L = 1/R_L to ground (none when open or behind a follower), so a_p = -(g_p + g_L)/C and
 * the DC state is x_p = V_p g_p / (g_p + g_L) (Ohm's law). With k_p = -expm1(a_p t_p),
 * e_p = exp(a_p t_p), j_p = -t_p z phi2(z) (z = a_p t_p, the integral of k over the phase):
 * u = e_l k_h Delta / (k_l + e_l k_h), the output rises by w_a = k_h (Delta - u) in the high phase
 * and falls back in the low phase, so the extremes are the phase boundaries and the ripple is
 * |w_a| = |Delta| k_h k_l / (k_l + e_l k_h) (the textbook RC result, with 1 - e^{-T/tau} written
 * as k_l + e_l k_h so it keeps its digits for tau >> T).
 *
 * Syntax: oneStageSteadyState(ladder, duty)
 * Example: oneStageSteadyState(ladder, 0.5).ripple  // V peak-to-peak
 */
export function oneStageSteadyState(ladder: Ladder, duty: number): OperatingPoint {
  checkLadder(ladder);
  const { r, c, buffered } = ladder.stages[0];
  const cap = c + (buffered ? 0 : ladder.loadCapacitance);
  const gLoad = !buffered && ladder.loadResistance !== null ? 1 / ladder.loadResistance : 0;
  const gHigh = 1 / (r + ladder.driverHigh);
  const gLow = 1 / (r + ladder.driverLow);
  const xLow = (ladder.low * gLow) / (gLow + gLoad);
  const xHigh = (ladder.high * gHigh) / (gHigh + gLoad);
  const delta =
    ladder.driverHigh === ladder.driverLow ? ((ladder.high - ladder.low) * gHigh) / (gHigh + gLoad) : xHigh - xLow;
  const t1 = duty * ladder.period;
  const t2 = (1 - duty) * ladder.period;
  const zH = (-(gHigh + gLoad) / cap) * t1;
  const zL = (-(gLow + gLoad) / cap) * t2;
  const kH = -Math.expm1(zH);
  const kL = -Math.expm1(zL);
  const eL = Math.exp(zL);
  const denominator = kL + eL * kH;
  const u = (eL * kH * delta) / denominator;
  const vHigh = (kL * delta) / denominator; // Delta - u without the subtraction
  const wA = kH * vHigh;
  const vLow = -u - wA;
  const jH = -t1 * zH * phi2(zH);
  const jL = -t2 * zL * phi2(zL);
  const yStart = duty > 0.5 ? xHigh - vHigh : xLow + u; // the smaller correction
  const meanOffset = (jH * vHigh + t2 * wA + jL * vLow) / ladder.period;
  const rises = wA >= 0;
  return {
    duty,
    average: yStart + meanOffset,
    min: rises ? yStart : yStart + wA,
    max: rises ? yStart + wA : yStart,
    ripple: Math.abs(wA),
    tMin: rises ? 0 : t1,
    tMax: rises && wA > 0 ? t1 : 0,
  };
}
