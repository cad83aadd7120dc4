import type { Ladder } from './ladder.js';
import { checkLadder } from './checkLadder.js';

/** x' = A x + b for one pin state; A row-major n x n. */
export interface PhaseSystem {
  A: number[];
  b: number[];
  /** b per volt of source (b = input * source). */
  input: number[];
}

/** Nodes first..last (inclusive, 0-based) that no follower separates. */
export interface Section {
  first: number;
  last: number;
}

/** The ladder as linear state equations; the state is the capacitor voltages, pin side first. */
export interface StateSpace {
  /** Number of capacitor nodes (= stages). */
  n: number;
  /** Pin at `high` behind `driverHigh`. */
  high: PhaseSystem;
  /** Pin at `low` behind `driverLow`. */
  low: PhaseSystem;
  /** Small-signal system: driver = mean of high and low, b for a 1 V source. */
  mean: PhaseSystem;
  /** Capacitance at each node, F (load capacitance included at an unbuffered last node). */
  capacitance: number[];
  /** Follower-free sections; A restricted to one is C^{-1} G with G symmetric. */
  sections: Section[];
  /** Index of the output node (the last). */
  output: number;
}

/**
 * State equations of a ladder in one pin state: the pin is an ideal source `source` (V) behind
 * `driver` (ohm). Node k (0-based) has C_k to ground and R_k from the node before (node 0: from the
 * pin through driver + R_0). A buffered stage feeds the next R from an ideal follower, so it gives
 * no current to it. The load resistance and capacitance sit at the last node unless the last stage
 * is buffered; then the follower drives the load and the load does not touch the ladder.
 *
 * Method: nodal analysis (Kirchhoff's current law at each capacitor node): C x' = -G x + g_in source,
 * A = -C^{-1} G, b = C^{-1} g_in source.
 *
 * Syntax: phaseSystem(ladder, driver, source)
 * Example: phaseSystem({ ...ladder, stages: [{ r: 1e3, c: 1e-6, buffered: false }] }, 0, 1).A  // [-1000]
 */
export function phaseSystem(ladder: Ladder, driver: number, source: number): PhaseSystem {
  const { stages } = ladder;
  const n = stages.length;
  const A: number[] = new Array<number>(n * n).fill(0);
  const input: number[] = new Array<number>(n).fill(0);
  const cap = nodeCapacitance(ladder);
  for (let k = 0; k < n; k++) {
    const gIn = 1 / (stages[k].r + (k === 0 ? driver : 0));
    let gSelf = gIn;
    if (k > 0) A[k * n + k - 1] = gIn / cap[k];
    if (k < n - 1 && !stages[k].buffered) {
      const gOut = 1 / stages[k + 1].r;
      gSelf += gOut;
      A[k * n + k + 1] = gOut / cap[k];
    }
    if (k === n - 1 && !stages[k].buffered && ladder.loadResistance !== null) {
      gSelf += 1 / ladder.loadResistance;
    }
    A[k * n + k] = -gSelf / cap[k];
    if (k === 0) input[0] = gIn / cap[0];
  }
  return { A, b: input.map((v) => v * source), input };
}

/**
 * The ladder's state equations for both pin states and the small-signal (mean driver) system.
 * Throws RangeError for a ladder that is not physical (no stages, non-positive R or C, negative
 * driver, load resistance <= 0, negative load capacitance).
 *
 * Syntax: stateSpace(ladder)
 * Example: stateSpace(ladder).high.A  // n x n, row-major
 */
export function stateSpace(ladder: Ladder): StateSpace {
  checkLadder(ladder);
  const n = ladder.stages.length;
  const sections: Section[] = [];
  let first = 0;
  for (let k = 0; k < n; k++) {
    if (ladder.stages[k].buffered || k === n - 1) {
      sections.push({ first, last: k });
      first = k + 1;
    }
  }
  return {
    n,
    high: phaseSystem(ladder, ladder.driverHigh, ladder.high),
    low: phaseSystem(ladder, ladder.driverLow, ladder.low),
    mean: phaseSystem(ladder, (ladder.driverHigh + ladder.driverLow) / 2, 1),
    capacitance: nodeCapacitance(ladder),
    sections,
    output: n - 1,
  };
}

function nodeCapacitance(ladder: Ladder): number[] {
  const n = ladder.stages.length;
  const cap = ladder.stages.map((s) => s.c);
  if (!ladder.stages[n - 1].buffered) cap[n - 1] += ladder.loadCapacitance;
  return cap;
}
