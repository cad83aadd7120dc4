import { matvec, rowDot, zeros, type Matrix, type Vector } from '../numeric/dense.js';
import { expm } from '../numeric/expm.js';
import { flow } from './flow.js';
import { brentRoot } from '../numeric/brentRoot.js';
import type { DutyPlan, PeriodExtrema, PhasePlan, Prepared } from './planTypes.js';

export type { PeriodExtrema } from './planTypes.js';

/** One period of the exact trajectory, with what is needed to evaluate it anywhere. */
export interface PeriodTrajectory extends PeriodExtrema {
  /** Phase boundaries and turning points, sorted: the output is monotone between two knots. */
  knots: number[];
  /** State deviation x(T) - x(0) at the end of the period. */
  wEnd: Vector;
  /** c^T (x(tau) - x(0)) for tau in [0, T]. */
  valueAt(tau: number): number;
}

interface PhaseTrack {
  phase: PhasePlan;
  t0: number;
  /** q_j = E(j h) v and w_j = w(t0 + j h), j = 0..cells. */
  q: Vector[];
  w: Vector[];
}

/**
 * The output over one period at the plan's duty, starting from x(0) = x_s + e (e = null: the
 * periodic steady state itself), with its exact extremes.
 *
 * Method: in each phase x(t) = x(0) + w(t), w(t) = w(t0) + K(t - t0) v with v = x_p - x(t0), so
 * the output is a constant plus a sum of n decaying exponentials, whose derivative has at most
 * n - 1 real zeros (generalized Descartes rule of signs for exponential sums; reference from
 * memory: G. Pólya & G. Szegő, "Problems and Theorems in Analysis II", part V). The derivative
 * -c^T A E(t) v is sampled on a uniform grid of 2^k cells per phase, the first cell subdivided
 * geometrically down to a quarter of the fastest time constant (dutyPlan.ts), by exact marching
 * (q <- E(h) q, w <- w + K(h) q); each sign change is bracketed and refined by Brent's method
 * (brentRoot.ts) on the exact derivative, and the extremes are taken over phase boundaries, grid
 * points and turning points. A pair of turning points inside one grid step (a dip smaller than
 * the step's variation) can be missed; with two stages (one turning point per phase at most)
 * nothing is missed.
 *
 * Syntax: periodTrajectory(prepared, plan[, e])
 * Example: periodTrajectory(p, dutyPlan(p, 0.5)).maxW  // V above the rising-edge value
 */
export function periodTrajectory(p: Prepared, plan: DutyPlan, e: Vector | null = null): PeriodTrajectory {
  const { n } = p;
  const out = p.system.output;
  const vHigh = zeros(n);
  for (let i = 0; i < n; i++) vHigh[i] = plan.vHigh[i] - (e ? e[i] : 0);
  const acc: PeriodExtrema & { knots: number[] } = { minW: 0, maxW: 0, tMin: 0, tMax: 0, knots: [0] };
  const zero = zeros(n);
  const high = walkPhase(p, plan.high, 0, vHigh, zero, acc);
  const wA = matvec(plan.high.full.K, vHigh, n);
  const t1 = plan.high.t;
  consider(acc, wA[out], t1);
  if (t1 > 0 && plan.low.t > 0) acc.knots.push(t1);
  const vLow = zeros(n);
  for (let i = 0; i < n; i++) vLow[i] = -plan.u[i] - (e ? e[i] : 0) - wA[i];
  const low = walkPhase(p, plan.low, t1, vLow, wA, acc);
  const kEnd = matvec(plan.low.full.K, vLow, n);
  const wEnd = wA.map((w, i) => w + kEnd[i]);
  const period = p.period;
  consider(acc, wEnd[out], period);
  acc.knots.push(period);

  const valueAt = (tau: number): number => {
    const track = high && (tau <= t1 || !low) ? high : low;
    if (!track) return 0;
    const { phase, t0 } = track;
    const s = Math.min(Math.max(tau - t0, 0), phase.t);
    const j = Math.min(Math.floor(s / phase.h), phase.cells - 1);
    const delta = s - j * phase.h;
    const base = track.w[j][out];
    if (delta === 0) return base;
    const k = flow(phase.A, n, delta, false, p.balance).K;
    return base + rowDot(k, out, track.q[j], n);
  };
  return { minW: acc.minW, maxW: acc.maxW, tMin: acc.tMin, tMax: acc.tMax, knots: acc.knots, wEnd, valueAt };
}

function consider(acc: PeriodExtrema, value: number, t: number): void {
  if (value > acc.maxW) {
    acc.maxW = value;
    acc.tMax = t;
  }
  if (value < acc.minW) {
    acc.minW = value;
    acc.tMin = t;
  }
}

/** March one phase over its grid, refining every sign change of the output's derivative. */
function walkPhase(
  p: Prepared,
  phase: PhasePlan,
  t0: number,
  v: Vector,
  w0: Vector,
  acc: PeriodExtrema & { knots: number[] },
): PhaseTrack | null {
  if (phase.t === 0) return null;
  const { n } = p;
  const out = p.system.output;
  const { cells, h, A, fine } = phase;
  const q: Vector[] = [v.slice()];
  const w: Vector[] = [w0.slice()];
  const slopes = n > 1;
  // The first cell on its geometric grid: steps h 2^-K, h 2^-K, h 2^-(K-1), ..., h/2.
  const firstCell = fine.length === 0 ? [phase.step] : [fine[0], ...fine];
  let qCur = v.slice();
  let wCur = w0.slice();
  let tCur = t0;
  let dPrev = slopes ? -rowDot(A, out, qCur, n) : 0;
  const kq = zeros(n);
  for (let j = 0; j < cells; j++) {
    const steps = j === 0 ? firstCell : [phase.step];
    for (let s = 0; s < steps.length; s++) {
      const f = steps[s];
      matvec(f.K, qCur, n, kq);
      const qNext = matvec(f.E, qCur, n);
      const wNextOut = wCur[out] + kq[out];
      const last = j === cells - 1 && s === steps.length - 1;
      if (!last) consider(acc, wNextOut, tCur + f.t);
      if (slopes) {
        const dNext = -rowDot(A, out, qNext, n);
        if ((dPrev < 0 && dNext > 0) || (dPrev > 0 && dNext < 0)) {
          turningPoint(p, A, qCur, wCur[out], tCur, f.t, dPrev, dNext, acc);
        }
        dPrev = dNext;
      }
      const wNext = zeros(n);
      for (let i = 0; i < n; i++) wNext[i] = wCur[i] + kq[i];
      wCur = wNext;
      qCur = qNext;
      tCur += f.t;
    }
    q.push(qCur);
    w.push(wCur);
  }
  return { phase, t0, q, w };
}

/** Refine the zero of the output's slope -c^T A E(delta) q inside a step of length len. */
function turningPoint(
  p: Prepared,
  A: Matrix,
  q: Vector,
  wOut: number,
  tStart: number,
  len: number,
  dStart: number,
  dEnd: number,
  acc: PeriodExtrema & { knots: number[] },
): void {
  const { n } = p;
  const out = p.system.output;
  const qCopy = q.slice();
  const d = p.balance;
  const scaled = zeros(n * n);
  const ed = zeros(n * n);
  // slope from the balanced exponential: E = D^{-1} e^{delta D A D^{-1}} D (see flow.ts)
  const slope = (delta: number): number => {
    for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) scaled[i * n + j] = (delta * A[i * n + j] * d[i]) / d[j];
    expm(scaled, n, ed);
    let s = 0;
    for (let i = 0; i < n; i++) {
      let edq = 0;
      for (let j = 0; j < n; j++) edq += (ed[i * n + j] * d[j] * qCopy[j]) / d[i];
      s += A[out * n + i] * edq;
    }
    return -s;
  };
  const delta = brentRoot(slope, 0, len, len * 1e-12, dStart, dEnd);
  const k = flow(A, n, delta, false, d).K;
  consider(acc, wOut + rowDot(k, out, qCopy, n), tStart + delta);
  acc.knots.push(tStart + delta);
}
