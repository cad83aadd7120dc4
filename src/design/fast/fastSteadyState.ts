import type { FastLadder, FastPhase } from './fastLadder.js';
import { expSumRoots } from '../../numeric/expSumRoots.js';
import { luFactor, luSolve } from '../../numeric/lu.js';
import { matmul, matvec, spectralMatrix, transposeMatvec, zeros } from '../../numeric/dense.js';
import { oneMinusPhi1 } from '../../numeric/phi.js';

/** One phase of a period at a given duty, ready to be evaluated at any time inside it. */
export interface PhaseAtDuty {
  ph: FastPhase;
  /** Length, s. */
  t: number;
  /** exp(-rate t) and 1 - exp(-rate t) per mode. */
  decay: number[];
  gone: number[];
}

/** Periodic steady state at one duty, output quantities relative to the output at the rising edge. */
export interface FastSteady {
  duty: number;
  high: PhaseAtDuty;
  low: PhaseAtDuty;
  /** y_s - yEq(low): state at the rising edge, symmetric coordinates, as a deviation. */
  u: number[];
  /** Output at the rising edge, V. */
  yStart: number;
  /** Output deviation in the high phase: sum_i wHigh_i (1 - exp(-rate_i s)). */
  wHigh: number[];
  /** Output deviation at the falling edge. */
  aOut: number;
  /** State deviation at the falling edge, symmetric coordinates. */
  a: number[];
  /** Output deviation in the low phase: aOut + sum_i wLow_i (1 - exp(-rate_i s)). */
  wLow: number[];
  /** Largest and smallest output deviation over the period (from yStart), V. */
  maxDev: number;
  minDev: number;
  /** average - yStart, V. */
  meanOffset: number;
  ripple: number;
  average: number;
}

/**
 * Periodic steady state of an unbuffered ladder at duty D (high phase first, as in model.md):
 * ripple, average and the per-phase output coefficients, in deviations so that a ripple of 1e-9
 * of the level keeps its digits.
 *
 * Method: with Phi_p = exp(-S_p t_p) and Psi_p = I - Phi_p from the modes (expm1, no
 * cancellation), the rising-edge deviation u = y_s - yEq(low) solves (Psi_l + Phi_l Psi_h) u =
 * Phi_l Psi_h Delta, i.e. the fixed point of the one-period map written without I - M. In each
 * phase the output is a constant plus a sum of n exponentials; its extremes are at the phase ends
 * or at zeros of the derivative (numeric/expSumRoots.ts). The average integrates the exponentials exactly.
 *
 * Syntax: fastSteadyState(model, duty)
 * Example: fastSteadyState(fastLadder(ladder), 0.5).ripple   // V peak-to-peak
 */
export function fastSteadyState(model: FastLadder, duty: number): FastSteady {
  const { n, period } = model;
  const high = phaseAt(model.pinHigh, duty * period);
  const low = phaseAt(model.pinLow, (1 - duty) * period);
  const psiH = spectralMatrix(high.ph.mode, high.gone, n);
  const phiL = spectralMatrix(low.ph.mode, low.decay, n);
  const phiLpsiH = matmul(phiL, psiH, n);
  const sys = spectralMatrix(low.ph.mode, low.gone, n);
  for (let i = 0; i < n * n; i++) sys[i] += phiLpsiH[i];
  const u = luSolve(luFactor(sys, n), matvec(phiLpsiH, model.delta, n));

  const last = n - 1;
  // High phase: y(s) - y_s = Psi_h(s) (Delta - u).
  const vHigh = zeros(n);
  for (let i = 0; i < n; i++) vHigh[i] = model.delta[i] - u[i];
  const cHigh = transposeMatvec(high.ph.mode, vHigh, n);
  const wHigh = zeros(n);
  const a = zeros(n);
  for (let i = 0; i < n; i++) wHigh[i] = cHigh[i] * high.ph.out[i];
  for (let k = 0; k < n; k++) {
    let s = 0;
    for (let i = 0; i < n; i++) s += high.ph.mode[k * n + i] * high.gone[i] * cHigh[i];
    a[k] = s;
  }
  const aOut = a[last] / model.sqrtC[last];
  // Low phase: y(s) - y_s = a + Psi_l(s) (-u - a).
  const vLow = zeros(n);
  for (let i = 0; i < n; i++) vLow[i] = -u[i] - a[i];
  const cLow = transposeMatvec(low.ph.mode, vLow, n);
  const wLow = zeros(n);
  for (let i = 0; i < n; i++) wLow[i] = cLow[i] * low.ph.out[i];

  const ext = [Math.max(0, aOut), Math.min(0, aOut)];
  if (high.t > 0) scanPhase(wHigh, high.ph.rate, high.t, 0, n, ext);
  if (low.t > 0) scanPhase(wLow, low.ph.rate, low.t, aOut, n, ext);
  const maxDev = ext[0];
  const minDev = ext[1];

  let integral = aOut * low.t;
  for (let i = 0; i < n; i++) {
    integral += wHigh[i] * high.t * oneMinusPhi1(high.ph.rate[i] * high.t);
    integral += wLow[i] * low.t * oneMinusPhi1(low.ph.rate[i] * low.t);
  }
  const meanOffset = integral / period;
  const yStart = (model.pinLow.yEq[last] + u[last]) / model.sqrtC[last];
  return {
    duty,
    high,
    low,
    u,
    yStart,
    wHigh,
    aOut,
    a,
    wLow,
    maxDev,
    minDev,
    meanOffset,
    ripple: maxDev - minDev,
    average: yStart + meanOffset,
  };
}

/** Extremes of offset + sum_i w_i (1 - exp(-rate_i s)) at its turning points in (0, t), into ext. */
function scanPhase(w: number[], rate: number[], t: number, offset: number, n: number, ext: number[]): void {
  // derivative sum_i w_i r_i exp(-r_i s): exponents -r_i in expSumRoots' convention
  const slope = zeros(n);
  const exponent = zeros(n);
  for (let i = 0; i < n; i++) {
    slope[i] = w[i] * rate[i];
    exponent[i] = -rate[i];
  }
  for (const s of expSumRoots(slope, exponent, t)) {
    let v = offset;
    for (let i = 0; i < n; i++) v -= w[i] * Math.expm1(-rate[i] * s);
    if (v > ext[0]) ext[0] = v;
    if (v < ext[1]) ext[1] = v;
  }
}

/** A phase of length t: per-mode decay factors. */
export function phaseAt(ph: FastPhase, t: number): PhaseAtDuty {
  const n = ph.rate.length;
  const decay = zeros(n);
  const gone = zeros(n);
  for (let i = 0; i < n; i++) {
    decay[i] = Math.exp(-ph.rate[i] * t);
    gone[i] = -Math.expm1(-ph.rate[i] * t);
  }
  return { ph, t, decay, gone };
}
