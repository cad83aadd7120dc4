import { luFactor, luSolve } from '../numeric/lu.js';
import { matmul, matvec, normInf, rowDot, zeros, type Matrix } from '../numeric/dense.js';
import { doubleFlow, flow, type Flow } from './flow.js';
import { PLAN_CACHE_SIZE, type DutyPlan, type PhasePlan, type Prepared } from './planTypes.js';

export type { DutyPlan, PhasePlan } from './planTypes.js';

/**
 * Periodic steady state of the ladder at duty D, in deviations from the DC state of the low phase.
 *
 * Method: exact per-phase flows (flow.ts). With Delta = x_h - x_l, t1 = D T, t2 = (1 - D) T,
 * u = x_s - x_l solves (K_l + E_l K_h) u = E_l K_h Delta (I - E_l E_h written as K_l + E_l K_h so
 * nothing cancels when the time constants dwarf T), and Delta - u = (K_l + E_l K_h)^{-1} K_l Delta
 * with the same factors. The deviation from x_s is K_h(t)(Delta - u) in the high phase; the average is y_s + c^T [J_h (Delta - u) + t2 w_a + J_l (-u - w_a)] / T with
 * w_a = K_h(t1)(Delta - u). Whole-phase flows come from the cell flow by exact doubling, so the
 * grid used for extrema costs nothing extra.
 *
 * Syntax: dutyPlan(prepared, duty)
 * Example: dutyPlan(prepare(ladder), 0.5).average  // V
 */
export function dutyPlan(p: Prepared, duty: number): DutyPlan {
  const hit = p.plans.get(duty);
  if (hit) return hit;
  const { n, period } = p;
  const t1 = duty * period;
  const t2 = (1 - duty) * period;
  const high = phasePlan(p.system.high.A, n, t1, p.cells, p.balance);
  const low = phasePlan(p.system.low.A, n, t2, p.cells, p.balance);
  const Kh = high.full.K;
  const El = low.full.E;
  const ElKh = matmul(El, Kh, n);
  const S = zeros(n * n);
  for (let i = 0; i < n * n; i++) S[i] = low.full.K[i] + ElKh[i];
  const factors = luFactor(S, n);
  const u = luSolve(factors, matvec(ElKh, p.delta, n));
  const out = p.system.output;
  // Delta - u = S^{-1} K_l Delta: no subtraction, so it keeps its digits near duty 1 where u ~ Delta.
  const vHigh = luSolve(factors, matvec(low.full.K, p.delta, n));
  const wA = matvec(Kh, vHigh, n);
  const vLow = u.map((ui, i) => -ui - wA[i]);
  const integral =
    rowDot(high.full.J as Matrix, out, vHigh, n) + t2 * wA[out] + rowDot(low.full.J as Matrix, out, vLow, n);
  const meanOffset = integral / period;
  // x_s = x_l + u = x_h - (Delta - u): take the form whose correction is the smaller one.
  const fromHigh = duty > 0.5;
  const xStart = fromHigh ? vHigh.map((v, i) => p.xHigh[i] - v) : u.map((v, i) => p.xLow[i] + v);
  const yStart = xStart[out];
  const plan: DutyPlan = {
    duty,
    high,
    low,
    S,
    u,
    vHigh,
    xStart,
    yStart,
    meanOffset,
    average: yStart + meanOffset,
  };
  if (p.plans.size >= PLAN_CACHE_SIZE) p.plans.clear();
  p.plans.set(duty, plan);
  return plan;
}

/**
 * Flows over one cell (one exponential) and, by exact doubling, over the phase (cells is a power
 * of two, so this is the squaring phase of the exponential of the whole phase). The geometric
 * sub-grid of the first cell gets its own chain, started from one exponential over h 2^-K and
 * doubled up to h/2, with K such that h 2^-K ||A||_inf <= 1/4 (||A||_inf >= 1/tau_min, so the
 * finest step is below a quarter of the fastest time constant). Keeping the two chains apart
 * matters: squaring amplifies rounding by about 2 per step in the slow components, so the phase
 * flows must not inherit the extra K squarings of the sub-grid.
 */
function phasePlan(A: Matrix, n: number, t: number, cells: number, balance: readonly number[]): PhasePlan {
  const h = t / cells;
  const step = flow(A, n, h, true, balance);
  let full = step;
  for (let c = 1; c < cells; c *= 2) full = doubleFlow(full, n);
  const levels = n === 1 || t === 0 ? 0 : Math.min(MAX_FINE_LEVELS, Math.max(0, Math.ceil(Math.log2(4 * h * normInf(A, n)))));
  const fine: Flow[] = [];
  if (levels > 0) {
    let f = flow(A, n, h / 2 ** levels, false, balance);
    for (let k = 0; k < levels; k++) {
      fine.push(f);
      if (k + 1 < levels) f = doubleFlow(f, n);
    }
  }
  return { A, t, cells, h, step, full, fine };
}

/** Deepest geometric refinement of the first cell (2^-60 of a cell). */
const MAX_FINE_LEVELS = 60;
