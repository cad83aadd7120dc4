import type { Network } from './network.js';

/** x' = A x + b; A row-major n x n. */
export interface LinearSystem {
  readonly A: readonly number[];
  readonly b: readonly number[];
}

/** The circuit's state equations in every pin state, and its small-signal form. */
export interface NetworkEquations {
  /** Number of states (capacitor voltages). */
  readonly n: number;
  /** What each state is: `v1` (node of RC stage 1), `s2.c1`, `s2.c2` (Sallen-Key stage 2), `inject.c`. */
  readonly names: readonly string[];
  /** Output y = output . x. */
  readonly output: readonly number[];
  /** Balancing scale of each state (sqrt of its capacitance), for the matrix exponential. */
  readonly scale: readonly number[];
  /** The system with the first output high or low and the second output high or low. */
  readonly phases: {
    readonly [key in PinStateKey]: LinearSystem;
  };
  /** Small-signal system: drivers at the mean of high and low; inputs per volt of each source. */
  readonly mean: { readonly A: readonly number[]; readonly first: readonly number[]; readonly second: readonly number[] };
}

/** 'hh', 'hl', 'lh', 'll': first then second output, high or low. */
export type PinStateKey = 'hh' | 'hl' | 'lh' | 'll';

/** Key of a pin state. */
export function pinStateKey(firstHigh: boolean, secondHigh: boolean): PinStateKey {
  return `${firstHigh ? 'h' : 'l'}${secondHigh ? 'h' : 'l'}` as PinStateKey;
}

/**
 * State equations of a network (network.ts) in each of the four pin states.
 *
 * Method: Kirchhoff's current law at every capacitor node (nodal analysis), with these elements:
 * - RC stage k, state v_k: C_k v_k' = (v_in - v_k) / R_in - (current drawn by the next stage)
 *   [- v_k / R_load at an unbuffered last stage] [+ injection current]; R_in includes the pin's
 *   driver resistance for the first stage; v_in is the pin level, the previous node, or an ideal
 *   source (follower or op-amp output) that the stage does not load.
 * - Sallen-Key stage (unity gain, ideal op-amp: output = node b), states u = v_a - v_b (across c1,
 *   which goes from node a to the output) and v_b (across c2): with i1 = (v_in - u - v_b) / r1,
 *   c1 u' = i1 - u / r2 and c2 v_b' = u / r2. It draws i1 from the node before it.
 * - Second output: its level behind its driver plus `r` into RC node `stage`; with `c` in series
 *   the state w across c: i = (v2 - v_node - w) / (R_d2 + r), c w' = i.
 * The load sits at the last node when that is an unbuffered RC stage; an ideal follower or op-amp
 * output drives it otherwise and it changes nothing.
 *
 * Syntax: networkEquations(network)
 * Example: networkEquations(rcOnly).phases.hl.A   // [-1 / (R C)] for one stage without driver
 */
export function networkEquations(network: Network): NetworkEquations {
  const layout = stateLayout(network);
  const second = network.second;
  const pin = network.pin;
  const p2 = second?.pin ?? pin;
  const assemble = (rd1: number, v1: number, rd2: number, v2: number): LinearSystem => build(network, layout, rd1, v1, rd2, v2);
  const phases = {
    hh: assemble(pin.driverHigh, pin.high, p2.driverHigh, p2.high),
    hl: assemble(pin.driverHigh, pin.high, p2.driverLow, p2.low),
    lh: assemble(pin.driverLow, pin.low, p2.driverHigh, p2.high),
    ll: assemble(pin.driverLow, pin.low, p2.driverLow, p2.low),
  };
  const rd1 = (pin.driverHigh + pin.driverLow) / 2;
  const rd2 = (p2.driverHigh + p2.driverLow) / 2;
  const first = assemble(rd1, 1, rd2, 0);
  const secondInput = assemble(rd1, 0, rd2, 1);
  return {
    n: layout.n,
    names: layout.names,
    output: layout.output,
    scale: layout.capacitance.map(Math.sqrt),
    phases,
    mean: { A: first.A, first: first.b, second: secondInput.b },
  };
}

interface Layout {
  n: number;
  names: string[];
  /** First state index of each stage. */
  index: number[];
  /** Index of the injection capacitor's state, or -1. */
  inject: number;
  capacitance: number[];
  output: number[];
}

function stateLayout(network: Network): Layout {
  const names: string[] = [];
  const index: number[] = [];
  const capacitance: number[] = [];
  const last = network.stages.length - 1;
  network.stages.forEach((s, k) => {
    index.push(names.length);
    if (s.kind === 'rc') {
      names.push(`v${k + 1}`);
      const loaded = k === last && !s.buffered;
      capacitance.push(s.c + (loaded ? network.loadCapacitance : 0));
    } else {
      names.push(`s${k + 1}.c1`, `s${k + 1}.c2`);
      capacitance.push(s.c1, s.c2);
    }
  });
  let inject = -1;
  if (network.second?.c != null) {
    inject = names.length;
    names.push('inject.c');
    capacitance.push(network.second.c);
  }
  const n = names.length;
  const output = new Array<number>(n).fill(0);
  const lastStage = network.stages[last];
  output[index[last] + (lastStage.kind === 'rc' ? 0 : 1)] = 1;
  return { n, names, index, inject, capacitance, output };
}

function build(network: Network, layout: Layout, rd1: number, v1: number, rd2: number, v2: number): LinearSystem {
  const { n, index, capacitance } = layout;
  // Currents into each state's capacitor as G x + s (then divided by the capacitance).
  const G = new Array<number>(n * n).fill(0);
  const s = new Array<number>(n).fill(0);
  const stages = network.stages;
  const last = stages.length - 1;
  // A current (a . x + a0) / R flows from "input" (state i or the source) into the node of state j.
  stages.forEach((stage, k) => {
    // The stage's input: the first pin (through its driver), or the output of the stage before.
    const fromPin = k === 0;
    const before = k === 0 ? null : stages[k - 1];
    const inputState = before === null ? -1 : index[k - 1] + (before.kind === 'rc' ? 0 : 1);
    // The previous RC node is loaded only when it is unbuffered; a Sallen-Key output never is.
    const loadsBefore = before !== null && before.kind === 'rc' && !before.buffered;
    const r = (stage.kind === 'rc' ? stage.r : stage.r1) + (fromPin ? rd1 : 0);
    const g = 1 / r;
    // i_in = g (v_in - v_target), v_target = v_k (RC) or v_a = u + v_b (Sallen-Key).
    const targets = stage.kind === 'rc' ? [index[k]] : [index[k], index[k] + 1];
    const into = index[k]; // RC node, or u's equation (c1 carries i1 - i2)
    for (const t of targets) G[into * n + t] -= g;
    if (fromPin) s[into] += g * v1;
    else {
      G[into * n + inputState] += g;
      if (loadsBefore) {
        G[inputState * n + inputState] -= g;
        for (const t of targets) G[inputState * n + t] += g;
      }
    }
    if (stage.kind === 'sallen-key') {
      const g2 = 1 / stage.r2;
      G[into * n + into] -= g2; // c1 u' = i1 - u / r2
      G[(into + 1) * n + into] += g2; // c2 v_b' = u / r2
    } else if (k === last && !stage.buffered && network.loadResistance !== null) {
      G[into * n + into] -= 1 / network.loadResistance;
    }
  });
  const second = network.second;
  if (second) {
    const node = index[second.stage];
    const g = 1 / (second.r + rd2);
    // i = g (v2 - v_node [- w]) into the node (and through the series capacitor).
    G[node * n + node] -= g;
    s[node] += g * v2;
    if (layout.inject >= 0) {
      const w = layout.inject;
      G[node * n + w] -= g;
      G[w * n + node] -= g;
      G[w * n + w] -= g;
      s[w] += g * v2;
    }
  }
  const A = G.map((v, i) => v / capacitance[Math.floor(i / n)]);
  const b = s.map((v, i) => v / capacitance[i]);
  return { A, b };
}
