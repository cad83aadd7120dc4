import './doubleFields.js';
import { doubles, zeros } from '../../numeric/dense.js';
import { solveLinear } from '../../numeric/lu.js';
import { phi2 } from '../../numeric/phi.js';
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
 * Periodic steady state of a ladder in modal form at duty D, exactly, in O(n^2) plus one n x n
 * solve with two right-hand sides.
 *
 * Method: the deviation form of the engine (dutyPlan.ts) written in modal coordinates. With
 * Delta = x_h - x_l, t1 = D T, t2 = (1 - D) T, K_p = I - e^{A_p t_p}, E_p = e^{A_p t_p}, the state at
 * the rising edge x_s = x_l + u solves (K_l + E_l K_h) u = E_l K_h Delta, and the drive of the high
 * phase v = Delta - u solves (K_l + E_l K_h) v = K_l Delta (no subtraction: near duty 1, where
 * u ~ Delta, v keeps its digits). In high-phase modal coordinates (u~ = W_h u) and with
 * X = W_l V_h this is Y u~ = r, Y v~ = r', where Y_ij = X_ij (k_l,i + e_l,i k_h,j),
 * r_i = e_l,i sum_j X_ij k_h,j Delta~_j and r'_i = k_l,i sum_j X_ij Delta~_j; the k's are
 * -expm1(rate t) so nothing cancels when time constants dwarf the period. The output deviation from
 * the rising edge is sum_i a_i (-expm1(rate_i tau)) in each phase (a sum of decaying exponentials),
 * and the mean uses the integral of -expm1, -rate t^2 phi2(rate t) (phi-functions of exponential
 * integrators: Hochbruck & Ostermann, Acta Numerica 19, 2010). The output at the rising edge is
 * taken from the DC state that needs the smaller correction (x_l + u below duty 1/2, x_h - v above),
 * as in dutyPlan.ts.
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
  let drive: number[];
  // Duty 1: no low phase, the state sits at the high phase's DC state: u = Delta and v = 0 exactly.
  if (t2 === 0) {
    start = delta.slice();
    drive = zeros(n);
  } else if (n === 1) {
    const den = kl[0] + el[0] * kh[0];
    start = [(el[0] * kh[0] * delta[0]) / den];
    drive = [(kl[0] * delta[0]) / den];
  } else {
    // Y and the two right-hand sides [r r'] (row-major n x 2)
    const Y = zeros(n * n);
    const rhs = zeros(2 * n);
    for (let i = 0; i < n; i++) {
      let sHigh = 0;
      let sAll = 0;
      for (let j = 0; j < n; j++) {
        const x = mix[i * n + j];
        Y[i * n + j] = x * (kl[i] + el[i] * kh[j]);
        sHigh += x * kh[j] * delta[j];
        sAll += x * delta[j];
      }
      rhs[2 * i] = el[i] * sHigh;
      rhs[2 * i + 1] = kl[i] * sAll;
    }
    const solved = solveLinear(Y, n, rhs, 2);
    if (!solved) throw new RangeError('periodicState: singular period map (not a physical ladder)');
    start = zeros(n);
    drive = zeros(n);
    for (let i = 0; i < n; i++) {
      start[i] = solved[2 * i];
      drive[i] = solved[2 * i + 1];
    }
  }
  const aHigh = zeros(n);
  const wEnd = zeros(n);
  let yEnd = 0;
  let fromLow = 0;
  let fromHigh = 0;
  for (let i = 0; i < n; i++) {
    aHigh[i] = hi.out[i] * drive[i];
    wEnd[i] = kh[i] * drive[i];
    yEnd += aHigh[i] * kh[i];
    fromLow += hi.out[i] * start[i];
    fromHigh += hi.out[i] * drive[i];
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
  const yStart = duty > 0.5 ? m.outHigh - fromHigh : m.outLow + fromLow;
  return {
    duty,
    t1,
    t2,
    start,
    yStart,
    meanOffset,
    average: yStart + meanOffset,
    high: { offset: 0, gain: negated(aHigh), rate: hi.rate, length: t1 },
    low: { offset: yEnd, gain: negated(aLow), rate: lo.rate, length: t2 },
  };
}


/** -a in a new array of doubles (whatever the values: every phase curve's gains are one kind of array). */
function negated(a: number[]): number[] {
  const out = doubles(a.length);
  for (let i = 0; i < a.length; i++) out[i] = -a[i];
  return out;
}
