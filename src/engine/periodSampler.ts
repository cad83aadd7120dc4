import { matvec, rowDot, zeros, type Vector } from '../numeric/dense.js';
import type { DutyPlan } from './dutyPlan.js';
import { flow } from './flow.js';
import type { Prepared } from './prepare.js';

/**
 * The output at fixed offsets into a period as an affine function of the state deviation at the
 * period start: y(tau_j) = yStart + steady[j] + rows[j] . e, with e = x(0) - x_s.
 */
export interface PeriodSampler {
  /** Offsets tau_j from the rising edge, s (clamped to [0, T]). */
  offsets: number[];
  /** y_s(tau_j) - yStart: the periodic steady state relative to its rising-edge value, V. */
  steady: number[];
  /** r_j = Phi(tau_j)^T c: the output row of the homogeneous transition from the period start. */
  rows: Vector[];
  /** Output at offset j, V, for the deviation e at the period start. */
  valueAt(j: number, e: Vector): number;
}

/**
 * Exact output samples at fixed offsets inside a period, for any deviation from the periodic
 * steady state at the plan's duty, after a one-time cost of one flow per offset.
 *
 * Method: each phase is affine, x' = A_p x + b_p, so the deviation e(t) = x(t) - x_s(t) obeys the
 * homogeneous e' = A_p e and e(tau) = Phi(tau) e(0) with Phi(tau) = E_h(tau) in the high phase and
 * E_l(tau - t1) E_h(t1) in the low phase (t1 = D T). Hence y(tau) = y_s(tau) + (Phi(tau)^T c) . e(0):
 * the steady part y_s(tau) - yStart = c^T K_h(tau) (x_h - x_s), or c^T [w_a + K_l(s)(x_l - x_s - w_a)]
 * after the edge, from the exact flow (flow.ts: E = e^{sA}, K = I - E by Van Loan's block
 * exponential, no cancellation). Principle of superposition for linear time-varying systems (any
 * linear-systems text, e.g. C.-T. Chen, "Linear System Theory and Design", ch. 4).
 * Each sample is then one dot product; periods are advanced with the one-period map (periodPowers.ts).
 *
 * Syntax: periodSampler(prepared, plan, offsets)
 * Example: periodSampler(p, dutyPlan(p, 0.9), [0, T / 2]).valueAt(1, e)  // V at mid-period
 */
export function periodSampler(p: Prepared, plan: DutyPlan, offsets: number[]): PeriodSampler {
  const { n, period } = p;
  const out = p.system.output;
  const t1 = plan.high.t;
  const highOnly = plan.low.t === 0;
  // State change over the whole high phase, w_a = K_h(t1)(x_h - x_s), and what drives the low phase.
  const wA = matvec(plan.high.full.K, plan.vHigh, n);
  const vLow = plan.u.map((u, i) => -u - wA[i]);
  const Eh = plan.high.full.E;
  const taus: number[] = [];
  const steady: number[] = [];
  const rows: Vector[] = [];
  for (const offset of offsets) {
    const tau = Math.min(Math.max(offset, 0), period);
    taus.push(tau);
    if (tau <= t1 || highOnly) {
      const f = flow(plan.high.A, n, Math.min(tau, t1), false, p.balance);
      steady.push(rowDot(f.K, out, plan.vHigh, n));
      rows.push(f.E.slice(out * n, out * n + n));
    } else {
      const f = flow(plan.low.A, n, Math.min(tau - t1, plan.low.t), false, p.balance);
      steady.push(wA[out] + rowDot(f.K, out, vLow, n));
      // r = E_h(t1)^T (E_l(s)^T c): the output row of E_l(s) times E_h(t1).
      const row = zeros(n);
      for (let k = 0; k < n; k++) {
        const lk = f.E[out * n + k];
        if (lk === 0) continue;
        for (let i = 0; i < n; i++) row[i] += lk * Eh[k * n + i];
      }
      rows.push(row);
    }
  }
  const yStart = plan.yStart;
  return {
    offsets: taus,
    steady,
    rows,
    valueAt(j: number, e: Vector): number {
      const r = rows[j];
      let s = 0;
      for (let i = 0; i < n; i++) s += r[i] * e[i];
      return yStart + steady[j] + s;
    },
  };
}
