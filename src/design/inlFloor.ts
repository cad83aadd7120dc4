import type { DesignProblem } from './designProblem.js';

/** Interior duties of the bound: the grid of dcTransferMiss.ts (the endpoints define the fit). */
const GRID = 8;

/** What an INL floor needs of one resistor choice; the capacitors enter through inlFloor. */
export interface InlFloorPlan {
  /** |v_inf - fit| at the interior grid duties, V (v_inf: the average output with node 1 held still). */
  bent: readonly number[];
  /** Per interior duty: the error weight x(D) + max(x(a), x(b)), V per (V/s^2) of curvature. */
  weight: readonly number[];
  /** Curvature bound pieces: |v1''| <= (first / c1' + second / c2') / c1', V/s^2 times F^2. */
  first: number;
  second: number;
  /** Load capacitance added at the last node, F, and the stage count. */
  loadC: number;
  stages: number;
}

/**
 * The resistor-only part of a lower bound on the INL (endpoint fit, model.md) of every ladder with
 * series resistors `r` in the problem's circuit, for unequal driver resistances (equal ones give a
 * straight transfer); null when the bound does not apply (equal drivers, no INL limit, low > 0 or
 * high < 0). inlFloor finishes it for given capacitors.
 *
 * Method (derived here from Kirchhoff's laws on period averages): in periodic steady state no
 * capacitor carries average current, so the pin, every resistor and the load carry I = v / R_L on
 * average (v the average output), and node 1 averages v1 = v (1 + R_rest / R_L), R_rest = r_2 + ...
 * + r_n. The pin current is (u - v1) / R_p with u and R_p = driver + r_1 of the phase, so with
 * m_h, m_l the means of v1 over the high and low phases and delta = m_h - m_l:
 *   v M(D) = D high / R_h + (1 - D) low / R_l - D (1 - D) delta k,
 *   M(D) = 1 / R_L + (1 + R_rest / R_L)(D / R_h + (1 - D) / R_l),  k = 1 / R_h - 1 / R_l.
 * With delta = 0 (node 1 held still) this is v_inf(D), a function of the resistors alone. The
 * error E = D (1 - D) delta k / M is bounded through delta: v1 is smooth inside each phase, and
 * the mean of a function minus its chord over an interval of length h is at most max|v1''| h^2 /
 * 12 (error of the trapezoid rule, any numerical analysis text), while the chord (a triangle wave)
 * has equal means over both phases; so |delta| <= max|v1''| T^2 (D^2 + (1 - D)^2) / 12. Every node
 * stays within [low, high] when low <= 0 <= high (passive network), so from the node equations
 * |v1'| <= span (1 / R_min + g_2) / c1' and |v1''| <= (span (1 / R_min + g_2)^2 / c1' + g_2 span
 * (g_2 + g_3) / c2') / c1', with g_2 = 1 / r_2 (the load conductance for one stage), g_3 the next
 * conductance, c' the node capacitances (the load capacitance at the last node). The INL at a grid
 * duty D is at least |v_inf - fit_inf|(D) - |E(D)| - max(|E(a)|, |E(b)|) (the fit of E lies between
 * its endpoint values). test/design/inlFloor.test.ts holds it to the engine's INL.
 *
 * Syntax: inlFloorPlan(problem, r)
 * Example: inlFloor(inlFloorPlan(problem, [100, 820])!, [510e-9, 82e-9])   // V, at most the INL
 */
export function inlFloorPlan(problem: DesignProblem, r: ArrayLike<number>): InlFloorPlan | null {
  const k = problem.circuit;
  if (problem.limits.inl === undefined || k.driverHigh === k.driverLow) return null;
  if (!(k.low <= 0 && k.high >= 0 && k.high > k.low)) return null;
  const { dutyMin: a, dutyMax: b, period } = problem;
  if (!(b > a)) return null;
  const n = r.length;
  const span = k.high - k.low;
  const gL = k.loadResistance === null ? 0 : 1 / k.loadResistance;
  const rh = k.driverHigh + r[0];
  const rl = k.driverLow + r[0];
  let rest = 0;
  for (let i = 1; i < n; i++) rest += r[i];
  const kappa = 1 / rh - 1 / rl;
  const m = (d: number) => gL + (1 + rest * gL) * (d / rh + (1 - d) / rl);
  const vInf = (d: number) => ((d * k.high) / rh + ((1 - d) * k.low) / rl) / m(d);
  const x = (d: number) => (d * (1 - d) * (d * d + (1 - d) * (1 - d)) * period * period * Math.abs(kappa)) / (12 * m(d));
  const yA = vInf(a);
  const slope = (vInf(b) - yA) / (b - a);
  const ends = Math.max(x(a), x(b));
  const bent: number[] = [];
  const weight: number[] = [];
  for (let i = 1; i < GRID; i++) {
    const d = a + ((b - a) * i) / GRID;
    bent.push(Math.abs(vInf(d) - (yA + slope * (d - a))));
    weight.push(x(d) + ends);
  }
  const g2 = n >= 2 ? 1 / r[1] : gL;
  const g3 = n >= 3 ? 1 / r[2] : gL;
  const rMin = Math.min(rh, rl);
  return { bent, weight, first: span * (1 / rMin + g2) ** 2, second: n >= 2 ? g2 * span * (g2 + g3) : 0, loadC: k.loadCapacitance, stages: n };
}

/**
 * A lower bound on the INL of the ladder of `plan` (inlFloorPlan) with capacitors `c`, V; it
 * never falls when any capacitor grows (the curvature bound only shrinks), which lets a column of
 * the search stop at the first capacitor it rules out.
 *
 * Syntax: inlFloor(plan, c)
 * Example: inlFloor(inlFloorPlan(problem, [100, 820])!, [510e-9, 82e-9])   // V
 */
export function inlFloor(plan: InlFloorPlan, c: ArrayLike<number>): number {
  const c1 = c[0] + (plan.stages === 1 ? plan.loadC : 0);
  const c2 = plan.stages >= 2 ? c[1] + (plan.stages === 2 ? plan.loadC : 0) : Infinity;
  const curvature = (plan.first / c1 + (plan.second > 0 ? plan.second / c2 : 0)) / c1;
  let best = 0;
  for (let i = 0; i < plan.bent.length; i++) best = Math.max(best, plan.bent[i] - curvature * plan.weight[i]);
  return best;
}
