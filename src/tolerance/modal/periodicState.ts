import { zeros } from '../../engine/dense.js';
import { solveSmall } from './solveSmall.js';
import { phi2 } from '../../engine/phi2.js';
import type { ModalLadder } from './modalLadder.js';
import type { PhaseCurve } from './phaseCurve.js';

/** Periodic steady state at one duty, in modal form. */
export interface PeriodicState {
  duty: number;
  /** Lengths of the high and low phases, s. */
  t1: number;
  t2: number;
  /** State at the rising edge minus the DC state of the low phase, high-phase modal coordinates. */
  start: number[];
  /** Output at the rising edge, V. */
  yStart: number;
  /** Time average minus yStart, V (kept apart: it is tiny next to the level when ripple is). */
  meanOffset: number;
  /** Time-average output, V. */
  average: number;
  /** Output minus yStart during the high phase (tau from the rising edge) and the low phase. */
  high: PhaseCurve;
  low: PhaseCurve;
}

/**
 * Periodic steady state of a follower-free ladder at duty D, exactly, in O(n^2) plus one n x n solve.
 *
 * Method: the deviation form of the engine (dutyPlan.ts) written in modal coordinates. With
 * Delta = x_h - x_l, t1 = D T, t2 = (1 - D) T, K_p = I - e^{A_p t_p}, E_p = e^{A_p t_p}, the state at
 * the rising edge x_s = x_l + u solves (K_l + E_l K_h) u = E_l K_h Delta. In high-phase modal
 * coordinates (u~ = Qh^T Cs u) and with X = Ql^T Qh this is Y u~ = r, where
 * Y_ij = X_ij (k_l,i + e_l,i k_h,j) and r_i = e_l,i sum_j X_ij k_h,j Delta~_j; the k's are
 * -expm1(rate t) so nothing cancels when time constants dwarf the period. The output deviation from
 * the rising edge is sum_i a_i (-expm1(rate_i tau)) in each phase (a sum of decaying exponentials),
 * and the mean uses the integral of -expm1, -rate t^2 phi2(rate t) (phi-functions of exponential
 * integrators: Hochbruck & Ostermann, Acta Numerica 19, 2010).
 *
 * Syntax: periodicState(modal, duty)
 * Example: periodicState(modalLadder(ladder)!, 0.5).average  // V
 */
export function periodicState(m: ModalLadder, duty: number): PeriodicState {
  const { n, period, hi, lo, mix, delta } = m;
  const t1 = duty * period;
  const t2 = (1 - duty) * period;
  const kh = zeros(n);
  const kl = zeros(n);
  const el = zeros(n);
  for (let i = 0; i < n; i++) {
    kh[i] = -Math.expm1(hi.rate[i] * t1);
    kl[i] = -Math.expm1(lo.rate[i] * t2);
    el[i] = Math.exp(lo.rate[i] * t2);
  }
  let start: number[];
  if (n === 1) {
    const den = kl[0] + el[0] * kh[0];
    start = [(el[0] * kh[0] * delta[0]) / den];
  } else if (n === 2) {
    start = solveTwoByTwo(
      mix[0] * (kl[0] + el[0] * kh[0]),
      mix[1] * (kl[0] + el[0] * kh[1]),
      mix[2] * (kl[1] + el[1] * kh[0]),
      mix[3] * (kl[1] + el[1] * kh[1]),
      el[0] * (mix[0] * kh[0] * delta[0] + mix[1] * kh[1] * delta[1]),
      el[1] * (mix[2] * kh[0] * delta[0] + mix[3] * kh[1] * delta[1]),
    );
  } else {
    const Y = zeros(n * n);
    const r = zeros(n);
    for (let i = 0; i < n; i++) {
      let s = 0;
      for (let j = 0; j < n; j++) {
        const x = mix[i * n + j];
        Y[i * n + j] = x * (kl[i] + el[i] * kh[j]);
        s += x * kh[j] * delta[j];
      }
      r[i] = el[i] * s;
    }
    const solved = solveSmall(Y, n, r);
    if (!solved) throw new RangeError('periodicState: singular period map (not a physical ladder)');
    start = solved;
  }
  const aHigh = zeros(n);
  const wEnd = zeros(n);
  let yEnd = 0;
  let yStartDev = 0;
  for (let i = 0; i < n; i++) {
    const d = delta[i] - start[i];
    aHigh[i] = hi.out[i] * d;
    wEnd[i] = kh[i] * d;
    yEnd += aHigh[i] * kh[i];
    yStartDev += hi.out[i] * start[i];
  }
  const aLow = zeros(n);
  for (let i = 0; i < n; i++) {
    let s = 0;
    for (let j = 0; j < n; j++) s -= mix[i * n + j] * (start[j] + wEnd[j]);
    aLow[i] = lo.out[i] * s;
  }
  let integral = t2 * yEnd;
  for (let i = 0; i < n; i++) {
    const zh = hi.rate[i] * t1;
    const zl = lo.rate[i] * t2;
    integral += aHigh[i] * -hi.rate[i] * t1 * t1 * phi2(zh);
    integral += aLow[i] * -lo.rate[i] * t2 * t2 * phi2(zl);
  }
  const meanOffset = integral / period;
  const yStart = m.outLow + yStartDev;
  return {
    duty,
    t1,
    t2,
    start,
    yStart,
    meanOffset,
    average: yStart + meanOffset,
    high: { offset: 0, gain: aHigh.map((a) => -a), rate: hi.rate, length: t1 },
    low: { offset: yEnd, gain: aLow.map((a) => -a), rate: lo.rate, length: t2 },
  };
}

/** [a b; c d] x = [e; f] by Gaussian elimination with partial pivoting (Golub & Van Loan, Alg. 3.4.1). */
function solveTwoByTwo(a: number, b: number, c: number, d: number, e: number, f: number): number[] {
  if (Math.abs(c) > Math.abs(a)) [a, b, c, d, e, f] = [c, d, a, b, f, e];
  const l = c / a;
  const x1 = (f - l * e) / (d - l * b);
  return [(e - b * x1) / a, x1];
}
