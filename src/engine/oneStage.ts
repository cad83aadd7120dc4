import type { OperatingPoint } from './types.js';
import type { Prepared } from './prepare.js';
import { phi2 } from './phi2.js';

/**
 * Periodic steady state of a one-stage ladder in closed form (the fast path of steadyState).
 *
 * Method: the scalar case of dutyPlan.ts. With a_p the phase's rate (-1/tau_p), k_p = -expm1(a_p t_p),
 * e_p = exp(a_p t_p), j_p = -t_p z phi2(z) (z = a_p t_p, the integral of k over the phase):
 * u = e_l k_h Delta / (k_l + e_l k_h), the output rises by w_a = k_h (Delta - u) in the high phase
 * and falls back in the low phase, so the extremes are the phase boundaries and the ripple is
 * |w_a| = |Delta| k_h k_l / (k_l + e_l k_h) (the textbook RC result, with 1 - e^{-T/tau} written
 * as k_l + e_l k_h so it keeps its digits for tau >> T).
 *
 * Syntax: oneStageSteadyState(prepared, duty)
 * Example: oneStageSteadyState(prepare(ladder), 0.5).ripple  // V peak-to-peak
 */
export function oneStageSteadyState(p: Prepared, duty: number): OperatingPoint {
  const t1 = duty * p.period;
  const t2 = (1 - duty) * p.period;
  const aH = p.system.high.A[0];
  const aL = p.system.low.A[0];
  const zH = aH * t1;
  const zL = aL * t2;
  const kH = -Math.expm1(zH);
  const kL = -Math.expm1(zL);
  const eL = Math.exp(zL);
  const delta = p.delta[0];
  const denominator = kL + eL * kH;
  const u = (eL * kH * delta) / denominator;
  const vHigh = (kL * delta) / denominator; // Delta - u without the subtraction
  const wA = kH * vHigh;
  const vLow = -u - wA;
  const jH = -t1 * zH * phi2(zH);
  const jL = -t2 * zL * phi2(zL);
  const yStart = p.xLow[0] + u;
  const meanOffset = (jH * vHigh + t2 * wA + jL * vLow) / p.period;
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
