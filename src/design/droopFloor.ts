import type { DesignProblem } from './designProblem.js';
import { gridFloor, heldFirstNode } from './heldFirstNode.js';

/** Steps of the duty grid (GRID + 1 duties, both ends included): the droop grid of collectCandidates.ts. */
const GRID = 8;

/** What a droop floor needs of one resistor choice; the capacitors enter through droopFloor. */
export interface DroopFloorPlan {
  /** |ideal - v_inf| at the grid duties, V (v_inf: the average output with node 1 held still). */
  gap: readonly number[];
  /** Per grid duty: the error weight x(D), V per (V/s^2) of node-1 curvature. */
  weight: readonly number[];
  /** Curvature bound pieces (heldFirstNode.ts). */
  first: number;
  second: number;
  loadC: number;
  stages: number;
}

/**
 * The resistor-only part of a lower bound on the droop (largest |ideal - average| over the used
 * duty range, model.md) of every ladder with series resistors `r` in the problem's circuit, for
 * unequal driver resistances; null when it does not apply (equal drivers: the droop is then a
 * function of the resistors alone, low > 0 or high < 0). droopFloor finishes it for given capacitors.
 *
 * Method: the average output is v_inf(D) - E(D), v_inf from the resistors alone and |E(D)| <=
 * x(D) max|v1''| (heldFirstNode.ts, derived there from Kirchhoff's laws on period averages), so
 * |ideal(D) - average(D)| >= |ideal(D) - v_inf(D)| - x(D) max|v1''| at every duty, and the droop
 * (a maximum over the range) is at least that at each of the GRID + 1 evenly spaced duties of the
 * range. test/design/droopFloor.test.ts holds it to the engine's droop.
 *
 * Syntax: droopFloorPlan(problem, r)
 * Example: droopFloor(droopFloorPlan(problem, [470, 3300, 12e3])!, [390e-9, 39e-9, 10e-9])   // V, at most the droop
 */
export function droopFloorPlan(problem: DesignProblem, r: ArrayLike<number>): DroopFloorPlan | null {
  const held = heldFirstNode(problem, r);
  if (held === null) return null;
  const { dutyMin: a, dutyMax: b } = problem;
  const { high, low } = problem.circuit;
  const gap: number[] = [];
  const weight: number[] = [];
  for (let i = 0; i <= GRID; i++) {
    const d = a + ((b - a) * i) / GRID;
    gap.push(Math.abs(low + d * (high - low) - held.vInf(d)));
    weight.push(held.weight(d));
  }
  return { gap, weight, first: held.first, second: held.second, loadC: held.loadC, stages: held.stages };
}

/**
 * A lower bound on the droop of the ladder of `plan` (droopFloorPlan) with capacitors `c`, V; it
 * never falls when any capacitor grows (the curvature bound only shrinks), so a search can stop a
 * column, or every larger capacitor, at the first one it rules out.
 *
 * Syntax: droopFloor(plan, c)
 * Example: droopFloor(droopFloorPlan(problem, [470, 3300, 12e3])!, [390e-9, 39e-9, 10e-9])   // V
 */
export function droopFloor(plan: DroopFloorPlan, c: ArrayLike<number>): number {
  return gridFloor(plan, c, plan.gap, plan.weight);
}
