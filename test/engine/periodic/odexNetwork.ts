import odex from 'odex';
import { lusolve } from 'mathjs';
import type { Duties, Network, PwmPin } from '../../../src/circuit/network.js';

/**
 * Reference time-domain simulation of the general circuit (`Network`, src/circuit/network.ts;
 * model.md "Circuit model" and "Version 1.1 additions"), for the tests of the exact engine.
 * Written here from Kirchhoff's laws, independently of src/ (only the types are imported), and
 * integrated with Hairer & Wanner's ODEX (GBS extrapolation, npm `odex`) at tight tolerances,
 * restarting the solver at every pin edge so that no step straddles a discontinuity.
 *
 * State vector (all capacitor voltages, in stage order, then the injection capacitor):
 * - RC stage k: its node voltage v_k (one state);
 * - Sallen-Key stage: u1 = voltage of c1 (node a minus the output b), u2 = voltage of c2 (= b);
 *   node a = u1 + u2 (two states);
 * - second PWM output with a series capacitor: w = voltage of that capacitor, pin side minus node
 *   side (last state).
 *
 * Equations (Kirchhoff's current law; pin p at level V_p behind driver R_dp of its state):
 * - What feeds stage k is a Thevenin source (E, R_E): stage 0 gets (V_1, R_d1); after an RC stage
 *   it is (v_{k-1}, 0); after a buffered RC stage or a Sallen-Key stage also (node, 0), but that
 *   source is an ideal follower / op-amp output, so no current is drawn from the node before.
 * - RC stage k: i_k = (E - v_k) / (R_E + r_k) enters node k; if the stage before is an unbuffered
 *   RC stage, i_k leaves that node (it loads it).
 *   C_k dv_k/dt = i_k - (current drawn by the next stage) - (load) + (injection).
 * - Sallen-Key (unity gain, ideal op-amp, output = b): i1 = (E - (u1 + u2)) / (R_E + r1),
 *   i2 = u1 / r2 (r2 from a to b carries (v_a - v_b)); KCL at a: c1 du1/dt = i1 - i2 (c1 sits from
 *   a to the output, which is b); KCL at b: c2 du2/dt = i2. i1 loads an unbuffered RC node before.
 * - Load: at the last node, -v / R_load and C_load in parallel with c_last, only when the last
 *   stage is an unbuffered RC stage; a buffered or Sallen-Key output is ideal and the load
 *   changes nothing.
 * - Second PWM output into the node of RC stage s: i_2 = (V_2 - w - v_s) / (R_d2 + r), w = 0 without
 *   a series capacitor, else c dw/dt = i_2; i_2 enters node s.
 */

/** Where each capacitor voltage sits in the state vector. */
export interface NetworkStateLayout {
  /** Number of states. */
  readonly size: number;
  /** Index of each stage's first state (RC: node voltage; Sallen-Key: c1 voltage, then c2 voltage). */
  readonly stageIndex: readonly number[];
  /** Index of the injection capacitor's voltage (pin side minus node), or null. */
  readonly injectionIndex: number | null;
  /** Index of the state that is the output voltage. */
  readonly outputIndex: number;
}

/** One interval of a period with the pin states; t0, t1 in s, t0 < t1. */
export interface PinInterval {
  readonly t0: number;
  readonly t1: number;
  readonly firstHigh: boolean;
  readonly secondHigh: boolean;
}

/** Samples of the output and the final state of a simulation. */
export interface NetworkSimulation {
  /** State at the end. */
  readonly y: number[];
  /** Sample times, s (0 = start), strictly increasing; every pin edge is among them. */
  readonly t: number[];
  /** Output voltage at each sample time, V. */
  readonly v: number[];
  /** Integral of the output over the whole run, V s (an extra integrated state). */
  readonly integral: number;
  /** Largest and smallest output over the run and their times, refined on dense output. */
  readonly max: number;
  readonly tMax: number;
  readonly min: number;
  readonly tMin: number;
}

/** Periodic steady state found by simulation. */
export interface NetworkPeriodic {
  /** State at the period start (a period starts at t = 0 of pinSchedule). */
  readonly start: number[];
  readonly average: number;
  readonly min: number;
  readonly max: number;
  readonly ripple: number;
  /** Times of min and max within the period, s. */
  readonly tMin: number;
  readonly tMax: number;
  /** max |F(start) - start| of the simulated period map F, V. */
  readonly residual: number;
  /** Periods simulated to find it. */
  readonly periods: number;
}

/** Options of periodicByRelaxation. */
export interface PeriodicOptions {
  /** shooting: fixed point of the affine period map from n + 1 simulations (default); relaxation: run until the start state repeats. */
  readonly method?: 'shooting' | 'relaxation';
  /** Convergence tolerance on the period-start state, V (default 1e-12 times the level scale). */
  readonly tolerance?: number;
  /** Relaxation: the most periods to run (default 20000). */
  readonly maxPeriods?: number;
  readonly samplesPerPeriod?: number;
}

/** Result of settlingBySimulation. */
export interface NetworkSettling {
  /** Last time |v(t) - average_to| > band, s (0 if never); null when the steady state at `to` leaves the band. */
  readonly time: number | null;
  /** Average of the output in steady state at `to`, V. */
  readonly average: number;
  /** Ripple in steady state at `to`, V. */
  readonly ripple: number;
  /** Periods simulated after the step. */
  readonly periods: number;
}

/**
 * The state layout of a network (see the file comment); throws if a second output targets a
 * stage that is not an RC stage.
 * Syntax: networkStateLayout(network)
 * Example: networkStateLayout(rcSallenKeyQ055).outputIndex // 2
 */
export function networkStateLayout(network: Network): NetworkStateLayout {
  const stageIndex: number[] = [];
  let size = 0;
  for (const s of network.stages) {
    stageIndex.push(size);
    size += s.kind === 'rc' ? 1 : 2;
  }
  const last = network.stages.length - 1;
  const outputIndex = stageIndex[last] + (network.stages[last].kind === 'rc' ? 0 : 1);
  let injectionIndex: number | null = null;
  if (network.second !== null) {
    const target = network.stages[network.second.stage];
    if (target === undefined || target.kind !== 'rc') throw new Error(`second.stage ${network.second.stage} is not an RC stage`);
    if (network.second.c !== null) injectionIndex = size++;
  }
  return { size, stageIndex, injectionIndex, outputIndex };
}

const level = (p: PwmPin, high: boolean): number => (high ? p.high : p.low);
const driver = (p: PwmPin, high: boolean): number => (high ? p.driverHigh : p.driverLow);

/**
 * The rates dy/dt (V/s) of the network's capacitor voltages with the pins in the given states
 * (time t in s, unused: each phase is time-invariant). The nodal equations are in the file comment.
 * For a `complement` second output the caller passes secondHigh = !firstHigh (pinSchedule does).
 * Syntax: networkDerivative(network, firstHigh, secondHigh)(t, y)
 * Example: networkDerivative(oneRc, true, false)(0, [0]) // [3.3 / ((25 + 10e3) * 10e-9)]
 */
export function networkDerivative(network: Network, firstHigh: boolean, secondHigh: boolean): (t: number, y: number[]) => number[] {
  const layout = networkStateLayout(network);
  const { stages } = network;
  const n = stages.length;
  const last = stages[n - 1];
  const lastIsOpenNode = last.kind === 'rc' && !last.buffered;
  const e1 = level(network.pin, firstHigh);
  const rd1 = driver(network.pin, firstHigh);
  const second = network.second;
  return (_t, y) => {
    const dy = new Array<number>(layout.size).fill(0);
    const nodeCurrent = new Array<number>(n).fill(0);
    let source = e1;
    let sourceR = rd1;
    // the unbuffered RC node that feeds the next stage (it supplies that stage's input current)
    let feeding: number | null = null;
    for (let k = 0; k < n; k++) {
      const s = stages[k];
      const at = layout.stageIndex[k];
      if (s.kind === 'rc') {
        const v = y[at];
        const i = (source - v) / (sourceR + s.r);
        nodeCurrent[k] += i;
        if (feeding !== null) nodeCurrent[feeding] -= i;
        source = v;
        sourceR = 0;
        feeding = s.buffered ? null : k;
      } else {
        const u1 = y[at];
        const u2 = y[at + 1];
        const i1 = (source - (u1 + u2)) / (sourceR + s.r1);
        const i2 = u1 / s.r2;
        if (feeding !== null) nodeCurrent[feeding] -= i1;
        dy[at] = (i1 - i2) / s.c1;
        dy[at + 1] = i2 / s.c2;
        source = u2;
        sourceR = 0;
        feeding = null;
      }
    }
    if (lastIsOpenNode && network.loadResistance !== null) nodeCurrent[n - 1] -= y[layout.stageIndex[n - 1]] / network.loadResistance;
    if (second !== null) {
      const node = y[layout.stageIndex[second.stage]];
      const w = layout.injectionIndex === null ? 0 : y[layout.injectionIndex];
      const i = (level(second.pin, secondHigh) - w - node) / (driver(second.pin, secondHigh) + second.r);
      nodeCurrent[second.stage] += i;
      if (layout.injectionIndex !== null) dy[layout.injectionIndex] = i / (second.c as number);
    }
    for (let k = 0; k < n; k++) {
      const s = stages[k];
      if (s.kind !== 'rc') continue;
      const c = s.c + (k === n - 1 && lastIsOpenNode ? network.loadCapacitance : 0);
      dy[layout.stageIndex[k]] = nodeCurrent[k] / c;
    }
    return dy;
  };
}

/**
 * The output voltage of a state: the last RC node, or the Sallen-Key output (node b).
 * Syntax: outputOf(network, y)
 * Example: outputOf(rcSallenKeyQ055, [1, 0.2, 0.5]) // 0.5
 */
export function outputOf(network: Network, y: readonly number[]): number {
  return y[networkStateLayout(network).outputIndex];
}

/** High phase of one output in fractions of the period, [a, b). */
function highPhase(network: Network, d: number): [number, number] {
  return network.alignment === 'edge' ? [0, d] : [(1 - d) / 2, (1 + d) / 2];
}

/** The intervals of one period as fractions of T (see pinSchedule). */
function scheduleFractions(network: Network, duties: Duties): Array<{ a: number; b: number; firstHigh: boolean; secondHigh: boolean }> {
  const first = highPhase(network, duties.first);
  let second: [number, number] | null = null;
  if (network.second?.role === 'fine') {
    if (duties.second === null) throw new Error('a fine second output needs duties.second');
    second = highPhase(network, duties.second);
  }
  const cuts = [0, 1, ...first, ...(second ?? [])].filter((x) => x >= 0 && x <= 1).sort((p, q) => p - q);
  const out: Array<{ a: number; b: number; firstHigh: boolean; secondHigh: boolean }> = [];
  for (let i = 0; i + 1 < cuts.length; i++) {
    const a = cuts[i];
    const b = cuts[i + 1];
    if (!(b > a)) continue;
    const mid = (a + b) / 2;
    const firstHigh = mid >= first[0] && mid < first[1];
    let secondHigh = false;
    if (network.second?.role === 'complement') secondHigh = !firstHigh;
    else if (second !== null) secondHigh = mid >= second[0] && mid < second[1];
    const prev = out[out.length - 1];
    if (prev !== undefined && prev.firstHigh === firstHigh && prev.secondHigh === secondHigh) prev.b = b;
    else out.push({ a, b, firstHigh, secondHigh });
  }
  return out;
}

/**
 * The intervals [t0, t1) of one period with the pin states. Edge alignment: each output is high
 * from 0 to D T; center alignment: from (1 - D) T / 2 to (1 + D) T / 2; a complement output is the
 * inverse of the first. Equal-state neighbours are merged, zero-length intervals skipped. Without
 * a second output, secondHigh is false.
 * Syntax: pinSchedule(network, duties)
 * Example: pinSchedule(oneRcCenter, { first: 0.5, second: null }) // [0, T/4) low, [T/4, 3T/4) high, [3T/4, T) low
 */
export function pinSchedule(network: Network, duties: Duties): PinInterval[] {
  const T = network.period;
  return scheduleFractions(network, duties).map((p) => ({ t0: p.a * T, t1: p.b * T, firstHigh: p.firstHigh, secondHigh: p.secondHigh }));
}

/** Largest magnitude among the levels (at least 1 V): the scale of the tolerances. */
function levelScale(network: Network): number {
  const levels = [network.pin.high, network.pin.low];
  if (network.second !== null) levels.push(network.second.pin.high, network.second.pin.low);
  return Math.max(1, ...levels.map(Math.abs));
}

/** Observer of one accepted solver step [x0, x1] (time in periods) with the dense output of v. */
type StepObserver = (x0: number, x1: number, v: (x: number) => number) => void;

/**
 * Integrate whole periods from y0 (time in periods inside; the extra last state is the integral of
 * v in V periods), restarting the solver at every pin edge. `step` sees every accepted step with
 * its dense output, `edge` the output at every phase end. Returns the final state and integral (V s).
 */
function integrate(
  network: Network,
  duties: Duties,
  y0: readonly number[],
  periods: number,
  step?: StepObserver,
  edge?: (x: number, v: number) => void,
): { y: number[]; integral: number } {
  const layout = networkStateLayout(network);
  const n = layout.size;
  if (y0.length !== n) throw new Error(`state has ${y0.length} entries, the network ${n}`);
  const T = network.period;
  const out = layout.outputIndex;
  const schedule = scheduleFractions(network, duties).map((p) => {
    const f = networkDerivative(network, p.firstHigh, p.secondHigh);
    // time in periods: dy/dx = T dy/dt; the integral state gathers v dx
    return { ...p, f: (x: number, y: number[]) => [...f(x * T, y).map((r) => r * T), y[out]] };
  });
  const solver = new odex.Solver(n + 1);
  solver.absoluteTolerance = 1e-14 * levelScale(network);
  solver.relativeTolerance = 1e-12;
  solver.maxSteps = 1e6;
  solver.initialStepSize = 1e-4;
  solver.denseOutput = step !== undefined;
  const solOut = step
    ? (k: number, x0: number, x1: number, _y: number[], dense?: (c: number, x: number) => number) => {
        if (k > 1 && dense !== undefined && x1 > x0) step(x0, x1, (x) => dense(out, x));
      }
    : undefined;
  let y = [...y0, 0];
  for (let p = 0; p < periods; p++) {
    for (const phase of schedule) {
      const r = solver.solve(phase.f, p + phase.a, y, p + phase.b, solOut);
      if (r.outcome !== 0) throw new Error(`odex failed (outcome ${r.outcome}) in period ${p}`);
      y = r.y;
      edge?.(p + phase.b, y[out]);
    }
  }
  return { y: y.slice(0, n), integral: y[n] * T };
}

/** Golden-section search for the extremum of v on [lo, hi] (sign +1: max, -1: min), endpoints included. */
function goldenExtremum(v: (x: number) => number, lo: number, hi: number, sign: number): [number, number] {
  const g = (Math.sqrt(5) - 1) / 2;
  let a = lo;
  let b = hi;
  let c = b - g * (b - a);
  let d = a + g * (b - a);
  let fc = sign * v(c);
  let fd = sign * v(d);
  while (b - a > 1e-13 * Math.max(1, Math.abs(b))) {
    if (fc >= fd) {
      b = d;
      d = c;
      fd = fc;
      c = b - g * (b - a);
      fc = sign * v(c);
    } else {
      a = c;
      c = d;
      fc = fd;
      d = a + g * (b - a);
      fd = sign * v(d);
    }
  }
  const candidates: Array<[number, number]> = [
    [lo, sign * v(lo)],
    [hi, sign * v(hi)],
    [(a + b) / 2, sign * v((a + b) / 2)],
  ];
  candidates.sort((p, q) => q[1] - p[1]);
  return [candidates[0][0], sign * candidates[0][1]];
}

/** The grid points j / samples in (x0, x1], with x0 first and x1 last. */
function stepPoints(x0: number, x1: number, samples: number): number[] {
  const points = [x0];
  for (let j = Math.floor(x0 * samples) + 1; j / samples < x1; j++) if (j / samples > x0) points.push(j / samples);
  points.push(x1);
  return points;
}

/**
 * Simulate `periods` PWM periods at `duties` from state y0 (duties and pin states repeat each
 * period, as pinSchedule gives them), sampling the output on a grid of period / samplesPerPeriod
 * plus every pin edge, from ODEX's dense output. Also returns the integral of the output (an extra
 * integrated state) and its max and min, located by golden-section search on the dense output
 * around the best point of each solver step.
 * Syntax: simulateNetwork(network, duties, y0, periods, samplesPerPeriod?)
 * Example: simulateNetwork(oneRc, { first: 0.5, second: null }, [0], 10).v
 */
export function simulateNetwork(network: Network, duties: Duties, y0: readonly number[], periods: number, samplesPerPeriod = 2000): NetworkSimulation {
  const T = network.period;
  const t: number[] = [0];
  const v: number[] = [outputOf(network, y0)];
  const push = (x: number, value: number): void => {
    if (x * T > t[t.length - 1] * (1 + 1e-12)) {
      t.push(x * T);
      v.push(value);
    }
  };
  let max = v[0];
  let tMax = 0;
  let min = v[0];
  let tMin = 0;
  const margin = 1e-6 * levelScale(network);
  const step: StepObserver = (x0, x1, vAt) => {
    const points = stepPoints(x0, x1, samplesPerPeriod);
    const values = points.map(vAt);
    for (let i = 1; i < points.length - 1; i++) push(points[i], values[i]);
    const last = x1 * samplesPerPeriod;
    if (Math.abs(last - Math.round(last)) < 1e-9) push(x1, values[values.length - 1]);
    for (const sign of [1, -1]) {
      let best = 0;
      for (let i = 1; i < points.length; i++) if (sign * values[i] > sign * values[best]) best = i;
      if (sign * values[best] + margin < sign * (sign > 0 ? max : min)) continue;
      const [x, value] = goldenExtremum(vAt, points[Math.max(0, best - 1)], points[Math.min(points.length - 1, best + 1)], sign);
      if (sign > 0 && value > max) [max, tMax] = [value, x * T];
      if (sign < 0 && value < min) [min, tMin] = [value, x * T];
    }
  };
  const run = integrate(network, duties, y0, periods, step, push);
  return { y: run.y, t, v, integral: run.integral, max, tMax, min, tMin };
}

/** One period of the simulated period map F (state at the next period start). */
function periodMap(network: Network, duties: Duties, x: readonly number[]): number[] {
  return integrate(network, duties, x, 1).y;
}

/** Starting guess: the first pin's ideal average at every node, c1 at 0, the series capacitor at the rest of the second pin's average. */
function averageInputState(network: Network, duties: Duties): number[] {
  const layout = networkStateLayout(network);
  const ideal = (p: PwmPin, d: number): number => p.low + d * (p.high - p.low);
  const v = ideal(network.pin, duties.first);
  const x = new Array<number>(layout.size).fill(0);
  network.stages.forEach((s, k) => {
    if (s.kind === 'rc') x[layout.stageIndex[k]] = v;
    else x[layout.stageIndex[k] + 1] = v;
  });
  const second = network.second;
  if (second !== null && layout.injectionIndex !== null) {
    const d2 = second.role === 'complement' ? 1 - duties.first : (duties.second as number);
    x[layout.injectionIndex] = ideal(second.pin, d2) - v;
  }
  return x;
}

/**
 * The periodic steady state at `duties`, found by simulation alone. Shooting (default): the
 * circuit is affine in each phase, so the simulated period map is F(x) = F(0) + J x; J comes from
 * n + 1 simulated periods (columns F(e_i) - F(0)), the fixed point from (I - J) x = F(0) (mathjs
 * lusolve), then Newton corrections x += (I - J)^-1 (F(x) - x) until |F(x) - x| <= tolerance.
 * Relaxation: from the average-input state, run periods until the start state changes by at most
 * the tolerance. Then one more simulated period gives the average (integrated state), min, max
 * (golden-section on dense output) and ripple.
 * Syntax: periodicByRelaxation(network, duties, options?)
 * Example: periodicByRelaxation(oneRc, { first: 0.25, second: null }).ripple
 */
export function periodicByRelaxation(network: Network, duties: Duties, options: PeriodicOptions = {}): NetworkPeriodic {
  const n = networkStateLayout(network).size;
  const tolerance = options.tolerance ?? 1e-12 * levelScale(network);
  const distance = (a: readonly number[], b: readonly number[]): number => Math.max(...a.map((ai, i) => Math.abs(ai - b[i])));
  let x: number[];
  let fx: number[];
  let periods = 0;
  if ((options.method ?? 'shooting') === 'shooting') {
    const zero = new Array<number>(n).fill(0);
    const g = periodMap(network, duties, zero);
    const iMinusJ = Array.from({ length: n }, () => new Array<number>(n).fill(0));
    for (let j = 0; j < n; j++) {
      const e = zero.map((_, i) => (i === j ? 1 : 0));
      const column = periodMap(network, duties, e);
      for (let i = 0; i < n; i++) iMinusJ[i][j] = (i === j ? 1 : 0) - (column[i] - g[i]);
    }
    periods = n + 1;
    const solve = (rhs: number[]): number[] => (lusolve(iMinusJ, rhs) as number[][]).map((row) => row[0]);
    x = solve(g);
    fx = periodMap(network, duties, x);
    periods++;
    for (let k = 0; k < 5 && distance(fx, x) > tolerance; k++) {
      const dx = solve(fx.map((f, i) => f - x[i]));
      x = x.map((xi, i) => xi + dx[i]);
      fx = periodMap(network, duties, x);
      periods++;
    }
  } else {
    const maxPeriods = options.maxPeriods ?? 20000;
    x = averageInputState(network, duties);
    fx = periodMap(network, duties, x);
    periods = 1;
    while (distance(fx, x) > tolerance) {
      if (periods >= maxPeriods) throw new Error(`no periodic state within ${maxPeriods} periods (change ${distance(fx, x)} V)`);
      x = fx;
      fx = periodMap(network, duties, x);
      periods++;
    }
  }
  const residual = distance(fx, x);
  const one = simulateNetwork(network, duties, x, 1, options.samplesPerPeriod ?? 2000);
  const average = one.integral / network.period;
  return { start: x, average, min: one.min, max: one.max, ripple: one.max - one.min, tMin: one.tMin, tMax: one.tMax, residual, periods: periods + 1 };
}

/** Options of settlingBySimulation. */
export interface SettlingOptions {
  readonly samplesPerPeriod?: number;
  /** The most periods to simulate after the step (default 5000). */
  readonly maxPeriods?: number;
}

/**
 * Settling time as model.md defines it: in periodic steady state at `from` (periodicByRelaxation),
 * the duties switch to `to` at a period start (t = 0); the result is the last time with
 * |v(t) - average_to| > band, or null if the steady state at `to` itself leaves the band. Periods
 * are simulated until the period-start state is within 1e-6 of the band's margin (band minus the
 * steady ripple's largest excursion from the average) of the periodic state at `to`, and the
 * output is back in the band. Every out-to-in crossing between two samples of a solver step is
 * refined by bisection on ODEX's dense output (to 1e-14 of a period); the last one is the answer.
 * An excursion shorter than the sample spacing (period / samplesPerPeriod) would be missed.
 * Syntax: settlingBySimulation(network, from, to, band, options?)
 * Example: settlingBySimulation(oneRc, { first: 0.25, second: null }, { first: 0.75, second: null }, 0.01).time
 */
export function settlingBySimulation(network: Network, from: Duties, to: Duties, band: number, options: SettlingOptions = {}): NetworkSettling {
  const samples = options.samplesPerPeriod ?? 2000;
  const maxPeriods = options.maxPeriods ?? 5000;
  const before = periodicByRelaxation(network, from, { samplesPerPeriod: samples });
  const after = periodicByRelaxation(network, to, { samplesPerPeriod: samples });
  const average = after.average;
  const excursion = Math.max(after.max - average, average - after.min);
  if (excursion > band) return { time: null, average, ripple: after.ripple, periods: 0 };
  const T = network.period;
  const out = (value: number): boolean => Math.abs(value - average) > band;
  let outNow = out(outputOf(network, before.start));
  let lastOut = outNow ? 0 : -1;
  const step: StepObserver = (x0, x1, vAt) => {
    const points = stepPoints(x0, x1, samples);
    let prevOut = out(vAt(points[0]));
    for (let i = 1; i < points.length; i++) {
      const nowOut = out(vAt(points[i]));
      if (nowOut) lastOut = points[i];
      else if (prevOut) {
        // out at points[i - 1], in at points[i]: bisect for the crossing
        let lo = points[i - 1];
        let hi = points[i];
        while (hi - lo > 1e-14 * Math.max(1, hi)) {
          const mid = (lo + hi) / 2;
          if (out(vAt(mid))) lo = mid;
          else hi = mid;
        }
        lastOut = lo;
      }
      prevOut = nowOut;
    }
    outNow = prevOut;
  };
  const target = 1e-6 * (band - excursion);
  let x = [...before.start];
  let periods = 0;
  for (;;) {
    if (periods >= maxPeriods) throw new Error(`not settled within ${maxPeriods} periods`);
    x = integrate(network, to, x, 1, (x0, x1, vAt) => step(x0 + periods, x1 + periods, (s) => vAt(s - periods))).y;
    periods++;
    const distance = Math.max(...x.map((xi, i) => Math.abs(xi - after.start[i])));
    if (distance <= target && !outNow) break;
  }
  return { time: lastOut < 0 ? 0 : lastOut * T, average, ripple: after.ripple, periods };
}
