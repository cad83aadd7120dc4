import type { DesignProblem } from './designProblem.js';
import { gridFloor, heldFirstNode } from './heldFirstNode.js';

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
 * Method: the average output is v_inf(D) - E(D) with v_inf from the resistors alone and |E(D)| <=
 * x(D) max|v1''| (heldFirstNode.ts, derived there from Kirchhoff's laws on period averages). The
 * INL at a grid duty D is at least |v_inf - fit_inf|(D) - |E(D)| - max(|E(a)|, |E(b)|) (the fit of
 * E lies between its endpoint values). test/design/inlFloor.test.ts holds it to the engine's INL.
 *
 * Syntax: inlFloorPlan(problem, r)
 * Example: inlFloor(inlFloorPlan(problem, [100, 820])!, [510e-9, 82e-9])   // V, at most the INL
 */
export function inlFloorPlan(problem: DesignProblem, r: ArrayLike<number>): InlFloorPlan | null {
  if (problem.limits.inl === undefined) return null;
  const { dutyMin: a, dutyMax: b } = problem;
  if (!(b > a)) return null;
  const held = heldFirstNode(problem, r);
  if (held === null) return null;
  const { vInf, weight: x } = held;
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
  return { bent, weight, first: held.first, second: held.second, loadC: held.loadC, stages: held.stages };
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
  return gridFloor(plan, c, plan.bent, plan.weight);
}
