import type { DesignProblem } from './designProblem.js';

/** The resistor-only pieces of the period-average model with node 1 held still (unequal drivers). */
export interface HeldFirstNode {
  /** Average output with node 1 held still, V, at a duty: v_inf(D). */
  vInf: (duty: number) => number;
  /** |v_inf(D) - average(D)| <= weight(D) * (node-1 curvature bound): V per (V/s^2). */
  weight: (duty: number) => number;
  /** Curvature bound pieces: |v1''| <= (first / c1' + second / c2') / c1', V/s^2 times F^2. */
  first: number;
  second: number;
  /** Load capacitance added at the last node, F, and the stage count. */
  loadC: number;
  stages: number;
}

/**
 * The average output of every ladder with series resistors `r` (pin side first) in the problem's
 * circuit, up to an error that shrinks as the first capacitors grow, for unequal driver
 * resistances; null when the drivers are equal (the average is then exact from the resistors:
 * a divider) or when low > 0, high < 0 or high <= low (the node bound below needs low <= 0 <= high).
 * The INL floor (inlFloor.ts) and the droop floor (droopFloor.ts) are built on it.
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
 * has equal means over both phases; so |delta| <= max|v1''| T^2 (D^2 + (1 - D)^2) / 12, and
 * |E(D)| <= weight(D) max|v1''|. Every node stays within [low, high] when low <= 0 <= high (passive
 * network), so from the node equations |v1'| <= span (1 / R_min + g_2) / c1' and |v1''| <= (span
 * (1 / R_min + g_2)^2 / c1' + g_2 span (g_2 + g_3) / c2') / c1' (firstNodeCurvature), with g_2 =
 * 1 / r_2 (the load conductance for one stage), g_3 the next conductance, c' the node capacitances
 * (the load capacitance at the last node). test/design/inlFloor.test.ts and droopFloor.test.ts hold
 * the floors built on it to the engine.
 *
 * Syntax: heldFirstNode(problem, r)
 * Example: heldFirstNode(problem, [100, 820])!.vInf(0.5)   // V
 */
export function heldFirstNode(problem: DesignProblem, r: ArrayLike<number>): HeldFirstNode | null {
  const k = problem.circuit;
  if (k.driverHigh === k.driverLow) return null;
  if (!(k.low <= 0 && k.high >= 0 && k.high > k.low)) return null;
  const { period } = problem;
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
  const weight = (d: number) => (d * (1 - d) * (d * d + (1 - d) * (1 - d)) * period * period * Math.abs(kappa)) / (12 * m(d));
  const g2 = n >= 2 ? 1 / r[1] : gL;
  const g3 = n >= 3 ? 1 / r[2] : gL;
  const rMin = Math.min(rh, rl);
  return { vInf, weight, first: span * (1 / rMin + g2) ** 2, second: n >= 2 ? g2 * span * (g2 + g3) : 0, loadC: k.loadCapacitance, stages: n };
}

/**
 * The bound on |v1''| of heldFirstNode for capacitors `c`, V/s^2: it never grows when any
 * capacitor grows, so the floors built on it never fall.
 *
 * Syntax: firstNodeCurvature(held, c)
 * Example: firstNodeCurvature(heldFirstNode(problem, [100, 820])!, [510e-9, 82e-9])   // V/s^2
 */
export function firstNodeCurvature(held: Pick<HeldFirstNode, 'first' | 'second' | 'loadC' | 'stages'>, c: ArrayLike<number>): number {
  const c1 = c[0] + (held.stages === 1 ? held.loadC : 0);
  const c2 = held.stages >= 2 ? c[1] + (held.stages === 2 ? held.loadC : 0) : Infinity;
  return (held.first / c1 + (held.second > 0 ? held.second / c2 : 0)) / c1;
}

/**
 * The floor both DC floors take on their duty grids: max over the grid of (the held ladder's
 * deviation there - curvature x its weight), at least 0, with the curvature of capacitors `c`
 * (firstNodeCurvature); it never falls when any capacitor grows, since the curvature only shrinks.
 *
 * Syntax: gridFloor(held, c, deviation, weight)
 * Example: gridFloor(plan, [390e-9, 39e-9], plan.gap, plan.weight)   // V
 */
export function gridFloor(
  held: Pick<HeldFirstNode, 'first' | 'second' | 'loadC' | 'stages'>,
  c: ArrayLike<number>,
  deviation: readonly number[],
  weight: readonly number[],
): number {
  const curvature = firstNodeCurvature(held, c);
  let best = 0;
  for (let i = 0; i < deviation.length; i++) best = Math.max(best, deviation[i] - curvature * weight[i]);
  return best;
}
