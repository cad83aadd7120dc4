import { describe, expect, it } from 'vitest';
import { designProblem, type DesignProblem } from '../../src/design/designProblem.js';
import { droopFloor, droopFloorPlan, type DroopFloorPlan } from '../../src/design/droopFloor.js';
import { gainFloor } from '../../src/design/gainFloor.js';
import { resistiveDroop, resistiveDroopFloor } from '../../src/design/resistiveDroop.js';
import { listTuples, tupleFloor, tupleOf, tupleQueue } from '../../src/design/listTuples.js';
import { exceeds } from '../../src/design/searchAllowance.js';
import { tupleBounds } from '../../src/design/settlingBounds.js';
import { loadProject } from '../../src/project/index.js';

/**
 * The listing as its documentation states it, one tuple at a time: every tuple of the series in
 * the order of its index (first resistor most significant), kept when the pin current, the droop
 * floor of the series resistance, the gain floor and (unequal drivers) the droop floor at the
 * smallest capacitors pass, and its key is at most theta. listTuples skips whole subtrees
 * instead, and tupleQueue finishes keys lazily; the tuples they give must agree with this list
 * sorted by key, tuple for tuple, in order.
 */
function listedOneByOne(problem: DesignProblem, stages: number, theta: number): { tuples: number[][]; keys: number[] } {
  const { rValues: R, searchLimits: limits, project, circuit } = problem;
  const { pwm } = project;
  const span = Math.abs(pwm.high - pwm.low);
  const loadR = circuit.loadResistance;
  const seriesDroop = limits.droop !== undefined ? resistiveDroop(circuit, problem.dutyMin, problem.dutyMax) : null;
  const minC = new Array<number>(stages).fill(problem.cValues[0]);
  const tuples: number[][] = [];
  const keys: number[] = [];
  for (let count = 0; count < R.length ** stages; count++) {
    const rs: number[] = [];
    for (let k = 0, rest = count; k < stages; k++, rest = Math.floor(rest / R.length)) rs.unshift(R[rest % R.length]);
    if (limits.pinCurrent !== undefined && exceeds(span / (Math.min(pwm.driver.high, pwm.driver.low) + rs[0]), limits.pinCurrent)) continue;
    if (seriesDroop !== null) {
      const series = rs.reduce((s, r) => s + r, seriesDroop.driver);
      if (exceeds(resistiveDroopFloor(seriesDroop, series), limits.droop)) continue;
    }
    if (loadR !== null && limits.gain !== undefined && exceeds(gainFloor(circuit, rs, problem.dutyMin, problem.dutyMax), limits.gain)) continue;
    if (pwm.driver.high !== pwm.driver.low && limits.droop !== undefined) {
      const plan: DroopFloorPlan | null = droopFloorPlan(problem, rs);
      if (plan !== null && exceeds(droopFloor(plan, minC), limits.droop)) continue;
    }
    const key = tupleFloor(problem, rs, minC, tupleBounds(problem, rs, limits), false);
    if (key > theta) continue;
    tuples.push(rs);
    keys.push(key);
  }
  return { tuples, keys };
}

describe('listTuples', () => {
  // Invented bench scenarios (scripts/bench-projects): a droop limit with a 1 Mohm load and a pin
  // current limit prune most tuples, unequal drivers add the droop floor per tuple.
  const cases: Array<[string, number]> = [
    ['scripts/bench-projects/wide-e24.yaml', 1],
    ['scripts/bench-projects/wide-e24.yaml', 2],
    ['scripts/bench-projects/wide-e12-three.yaml', 3],
    ['sample-configs/design-tight-ripple.yaml', 2],
    ['sample-configs/greenhouse-heater.yaml', 2],
  ];
  for (const [file, stages] of cases) {
    it(`${file}, ${stages} stage(s): the same tuples and keys, in the walk's order, as checking every tuple and sorting by key`, () => {
      const problem = designProblem(loadProject(file));
      const droopFloorCheck = problem.project.pwm.driver.high !== problem.project.pwm.driver.low && problem.searchLimits.droop !== undefined;
      const all = listedOneByOne(problem, stages, Infinity);
      expect(all.tuples.length).toBeGreaterThan(1);
      // every tuple, then about half of them by key
      const median = [...all.keys].sort((a, b) => a - b)[all.keys.length >> 1];
      for (const theta of [Infinity, median]) {
        const reference = theta === Infinity ? all : listedOneByOne(problem, stages, theta);
        // the walk's order: ascending key, ties in listing order (a stable sort)
        const order = reference.keys.map((_, i) => i).sort((a, b) => reference.keys[a] - reference.keys[b]);
        const list = listTuples(problem, stages, { theta }, false, droopFloorCheck);
        const queue = tupleQueue(problem, list, droopFloorCheck);
        const walked: Array<{ rs: number[]; key: number }> = [];
        for (let next = queue.take(theta); next !== null; next = queue.take(theta)) walked.push(next);
        expect(walked).toEqual(order.map((i) => ({ rs: reference.tuples[i], key: reference.keys[i] })));
        // every tuple the queue may finish is listed, under a floor at most its key
        for (let i = 0; i < list.count; i++) {
          const rs = tupleOf(problem, list, i);
          const key = tupleFloor(problem, rs, minCOf(problem, stages), tupleBounds(problem, rs, problem.searchLimits), false);
          expect(list.floors[i]).toBeLessThanOrEqual(key);
        }
      }
    });
    it(`${file}, ${stages} stage(s): a budgeted listing's keys are exact, and its queue keeps listing order on ties`, () => {
      const problem = designProblem(loadProject(file));
      const droopFloorCheck = problem.project.pwm.driver.high !== problem.project.pwm.driver.low && problem.searchLimits.droop !== undefined;
      const list = listTuples(problem, stages, { theta: Infinity }, true, droopFloorCheck);
      const minC = minCOf(problem, stages);
      const keys = Array.from({ length: list.count }, (_, i) => tupleFloor(problem, tupleOf(problem, list, i), minC, tupleBounds(problem, tupleOf(problem, list, i), problem.searchLimits), true));
      expect(Array.from(list.floors.subarray(0, list.count))).toEqual(keys);
      const order = keys.map((_, i) => i).sort((a, b) => keys[a] - keys[b]);
      const queue = tupleQueue(problem, list, droopFloorCheck);
      const walked: number[][] = [];
      for (let next = queue.take(Infinity); next !== null; next = queue.take(Infinity)) walked.push(next.rs);
      expect(walked).toEqual(order.map((i) => tupleOf(problem, list, i)));
    });
    it(`${file}, ${stages} stage(s): a falling threshold stops the queue where a sorted list would stop`, () => {
      const problem = designProblem(loadProject(file));
      const droopFloorCheck = problem.project.pwm.driver.high !== problem.project.pwm.driver.low && problem.searchLimits.droop !== undefined;
      const all = listedOneByOne(problem, stages, Infinity);
      const sorted = [...all.keys].sort((a, b) => a - b);
      const queue = tupleQueue(problem, listTuples(problem, stages, { theta: Infinity }, false, droopFloorCheck), droopFloorCheck);
      // take a quarter of the tuples, then lower theta to the median key: the rest up to it follow
      const quarter = sorted.length >> 2;
      const median = sorted[sorted.length >> 1];
      const keys: number[] = [];
      for (let k = 0; k < quarter; k++) keys.push(queue.take(Infinity)!.key);
      for (let next = queue.take(median); next !== null; next = queue.take(median)) keys.push(next.key);
      expect(keys).toEqual(sorted.filter((key, k) => k < quarter || key <= median));
    });
  }
});

/** The smallest capacitor of the series at every stage. */
function minCOf(problem: DesignProblem, stages: number): number[] {
  return new Array<number>(stages).fill(problem.cValues[0]);
}
