import './doubleFields.js';
import { doubles } from '../../numeric/dense.js';
import type { LadderCircuit } from '../../circuit/ladder.js';
import { dividerGain } from '../../circuit/dcGain.js';
import { symmetricEigen, symmetricEigen2 } from '../../numeric/symmetricEigen.js';
import type { ModalLadder, PhaseModes } from './modalTypes.js';

/**
 * The modal form of a follower-free ladder given as its circuit and plain resistor and capacitor
 * lists (pin side first), without building a Ladder: modalLadder uses it for every follower-free
 * ladder, and the design search for each of its candidates. The load in `circuit` is the load the
 * last stage sees (none behind a follower).
 *
 * Method: nodal state equations C x' = -G x + g (Kirchhoff's current law at each capacitor node, as
 * in circuit/stateSpace.ts). With Cs = diag(sqrt C), S = Cs A Cs^-1 = -Cs^-1 G Cs^-1 is symmetric
 * (G is), so A has real negative eigenvalues and Cs^-1-scaled orthonormal eigenvectors; the RC
 * ladder gives an irreducible tridiagonal S, whose eigenvalues are distinct (an unreduced symmetric
 * tridiagonal has simple eigenvalues: B. N. Parlett, "The Symmetric Eigenvalue Problem", SIAM
 * 1998, ch. 7; cited from memory). Eigen-decomposition by Jacobi rotations
 * (numeric/symmetricEigen.ts), once when both drivers are equal (the two phases then share S).
 * DC states from the resistive divider (circuit/dcGain.ts), Delta = (V_h - V_l) g with equal
 * drivers, else V_h g_h - V_l g_l (engine/modal/dcStates.ts). The search builds millions of these:
 * one and two stages (most candidates) are written out on scalars (smallLadder, the same operations
 * in the same order, so the same digits: test/engine/modal/modalLadderOf.test.ts), and the
 * intermediate arrays of the general order are module scratch.
 *
 * With `into`, a modal form of as many stages from an earlier call for the same circuit, one to
 * three stages are written into it and it is returned instead of a new object (the design search
 * keeps one per walk and allocates nothing per candidate); whatever holds it sees the new ladder.
 *
 * Syntax: modalLadderOf(circuit, r, c[, into])
 * Example: modalLadderOf(circuit, [4700, 47e3], [1e-6, 10e-9]).hi.rate  // two rates, 1/s, fastest first
 */
export function modalLadderOf(circuit: LadderCircuit, r: ArrayLike<number>, c: ArrayLike<number>, into?: ModalLadder): ModalLadder {
  const n = load(circuit, r, c);
  return n === 1 || n === 2 ? smallLadder(n, into) : anyOrder(n, into);
}

/**
 * modalLadderOf by the general-order construction for any number of stages; modalLadderOf uses it
 * from three stages on. Callable by name so that tests hold the scalar one- and two-stage path to it.
 *
 * Syntax: modalLadderOfAnyOrder(circuit, r, c)
 * Example: modalLadderOfAnyOrder(circuit, [4700, 47e3], [1e-6, 10e-9])  // equal to modalLadderOf(circuit, ...)
 */
export function modalLadderOfAnyOrder(circuit: LadderCircuit, r: ArrayLike<number>, c: ArrayLike<number>): ModalLadder {
  return anyOrder(load(circuit, r, c));
}

/**
 * The general construction from the circuit and stages load() put in scratch; for three stages
 * written into `into` when it is one of the same shape (its arrays, same operations).
 */
function anyOrder(n: number, into?: ModalLadder): ModalLadder {
  const r = R_S;
  const c = C_S;
  const loadResistance = K_OPEN ? null : K[LOAD_R];
  const loadCapacitance = K[LOAD_C];
  const driverHigh = K[DRIVER_HIGH];
  const driverLow = K[DRIVER_LOW];
  for (let k = 0; k < n; k++) CS[k] = Math.sqrt(c[k] + (k === n - 1 ? loadCapacitance : 0));
  // Conductance into node k from the node before (node 0: from the pin through driver + R1).
  for (let k = 1; k < n; k++) G_IN[k] = 1 / r[k];
  G_IN[n] = loadResistance !== null ? 1 / loadResistance : 0;
  const equal = driverHigh === driverLow;
  // (a three-stage form from anyOrder: symmetric, one phase object shared exactly when the drivers are equal)
  const reuse = n === 3 && into !== undefined && into.n === 3 && into.symmetric && (into.hi === into.lo) === equal && into.mix.length === 9;
  const high = phase(n, r[0] + driverHigh, reuse ? into.hi : undefined, BASIS_HIGH);
  const low = equal ? high : phase(n, r[0] + driverLow, reuse ? into.lo : undefined, BASIS_LOW);
  // DC gains per volt of the pin (an open output: every node at the pin's level).
  for (let k = 0; k < n; k++) G_HIGH[k] = 1;
  if (loadResistance !== null) dividerGain(r, 0, n - 1, loadResistance, driverHigh, 1, G_HIGH);
  const gLow = equal ? G_HIGH : G_LOW;
  if (!equal) {
    for (let k = 0; k < n; k++) G_LOW[k] = 1;
    if (loadResistance !== null) dividerGain(r, 0, n - 1, loadResistance, driverLow, 1, G_LOW);
  }
  const span = K[HIGH] - K[LOW];
  for (let j = 0; j < n; j++) DC_DELTA[j] = equal ? G_HIGH[j] * span : G_HIGH[j] * K[HIGH] - gLow[j] * K[LOW];
  const hb = high.basis;
  const lb = low.basis;
  const mix = reuse ? (into.mix as number[]) : doubles(n * n);
  const delta = reuse ? (into.delta as number[]) : doubles(n);
  if (reuse) delta.fill(0, 0, n);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      let s = 0;
      for (let k = 0; k < n; k++) s += lb[k * n + i] * hb[k * n + j];
      mix[i * n + j] = s;
      delta[i] += hb[j * n + i] * CS[j] * DC_DELTA[j];
    }
  }
  // One write path: a new form (its keys in smallLadder's order, so one hidden class; numbers
  // first written as doubles), or `into` overwritten field by field.
  const m = (reuse ? into : { n, period: 0.5, high: 0.5, low: 0.5, symmetric: true, hi: high.modes, lo: low.modes, mix, delta, outLow: 0.5, outHigh: 0.5, condition: 1 }) as {
    -readonly [K in keyof ModalLadder]: ModalLadder[K];
  };
  m.period = K[PERIOD];
  m.high = K[HIGH];
  m.low = K[LOW];
  m.outLow = gLow[n - 1] * K[LOW];
  m.outHigh = G_HIGH[n - 1] * K[HIGH];
  return m;
}

/**
 * Check the stages and copy them into R_S, C_S, and the circuit into K: circuits and
 * arrays come in several shapes (a search's side problems), and only this small function sees
 * them. Returns the number of stages.
 */
function load(circuit: LadderCircuit, r: ArrayLike<number>, c: ArrayLike<number>): number {
  K[PERIOD] = circuit.period;
  K[HIGH] = circuit.high;
  K[LOW] = circuit.low;
  K[DRIVER_HIGH] = circuit.driverHigh;
  K[DRIVER_LOW] = circuit.driverLow;
  K_OPEN = circuit.loadResistance === null;
  K[LOAD_R] = circuit.loadResistance ?? 0;
  K[LOAD_C] = circuit.loadCapacitance;
  const n = r.length;
  if (CS.length < n) grow(n);
  for (let k = 0; k < n; k++) {
    if (!(r[k] > 0) || !(c[k] > 0)) throw new RangeError('invalid ladder: every stage needs r > 0 and c > 0');
    R_S[k] = r[k];
    C_S[k] = c[k];
  }
  return n;
}

/**
 * modalLadderOfAnyOrder for one or two stages on scalars: every operation of the general
 * construction, in its order (sums started from 0 as there), without its loops and scratch arrays;
 * written into `into` when it fits (same stage count, phases shared exactly when the drivers are equal).
 */
function smallLadder(n: number, into?: ModalLadder): ModalLadder {
  const r = R_S;
  const c = C_S;
  const loadResistance = K_OPEN ? null : K[LOAD_R];
  const loadCapacitance = K[LOAD_C];
  const driverHigh = K[DRIVER_HIGH];
  const driverLow = K[DRIVER_LOW];
  const vHigh = K[HIGH];
  const vLow = K[LOW];
  const equal = driverHigh === driverLow;
  const gLoad = loadResistance !== null ? 1 / loadResistance : 0;
  // DC gains per volt of the pin (circuit/dcGain.ts), into G_HIGH and G_LOW
  G_HIGH[0] = G_HIGH[1] = G_LOW[0] = G_LOW[1] = 1;
  if (loadResistance !== null) {
    dividerGain(r, 0, n - 1, loadResistance, driverHigh, 1, G_HIGH);
    if (!equal) dividerGain(r, 0, n - 1, loadResistance, driverLow, 1, G_LOW);
  }
  const gLow = equal ? G_HIGH : G_LOW;
  const span = vHigh - vLow;
  const last = n - 1;
  // Modes (EIG_H, EIG_L), output per mode, mix and Delta of both phases, as the general construction.
  let cs0: number;
  let cs1 = 0;
  let d1 = 0;
  let outH0: number;
  let outH1 = 0;
  let outL0: number;
  let outL1 = 0;
  if (n === 1) {
    cs0 = Math.sqrt(c[0] + loadCapacitance);
    const cc = cs0 * cs0;
    // order 1: the eigenvalue is the entry itself, the vector [1]
    EIG_H.values[0] = -(1 / (r[0] + driverHigh) + gLoad) / cc;
    EIG_H.vectors[0] = 1;
    EIG_L.values[0] = -(1 / (r[0] + driverLow) + gLoad) / cc;
    EIG_L.vectors[0] = 1;
    outH0 = outL0 = 1 / cs0;
  } else {
    cs0 = Math.sqrt(c[0] + 0);
    cs1 = Math.sqrt(c[1] + loadCapacitance);
    const g1 = 1 / r[1];
    const off = g1 / (cs0 * cs1);
    const s11 = -(g1 + gLoad) / (cs1 * cs1);
    symmetricEigen2(-(1 / (r[0] + driverHigh) + g1) / (cs0 * cs0), off, s11, EIG_H);
    if (!equal) symmetricEigen2(-(1 / (r[0] + driverLow) + g1) / (cs0 * cs0), off, s11, EIG_L);
    outH0 = EIG_H.vectors[2] / cs1;
    outH1 = EIG_H.vectors[3] / cs1;
    outL0 = EIG_L.vectors[2] / cs1;
    outL1 = EIG_L.vectors[3] / cs1;
    d1 = equal ? G_HIGH[1] * span : G_HIGH[1] * vHigh - gLow[1] * vLow;
  }
  const H = EIG_H.vectors;
  const L = equal ? H : EIG_L.vectors;
  const d0 = equal ? G_HIGH[0] * span : G_HIGH[0] * vHigh - gLow[0] * vLow;
  const outLow = gLow[last] * vLow;
  const outHigh = G_HIGH[last] * vHigh;
  let mix0: number;
  let mix1 = 0;
  let mix2 = 0;
  let mix3 = 0;
  let delta0: number;
  let delta1 = 0;
  if (n === 1) {
    mix0 = 0 + L[0] * H[0];
    delta0 = 0 + H[0] * cs0 * d0;
  } else {
    mix0 = 0 + L[0] * H[0] + L[2] * H[2];
    mix1 = 0 + L[0] * H[1] + L[2] * H[3];
    mix2 = 0 + L[1] * H[0] + L[3] * H[2];
    mix3 = 0 + L[1] * H[1] + L[3] * H[3];
    delta0 = 0 + H[0] * cs0 * d0 + H[2] * cs1 * d1;
    delta1 = 0 + H[1] * cs0 * d0 + H[3] * cs1 * d1;
  }
  const reuse = into !== undefined && into.n === n && into.symmetric && (into.hi === into.lo) === equal;
  if (!reuse) {
    // a new object, every field at its final value (no field changes its kind afterwards)
    const two = n === 2;
    const hi: PhaseModes = { rate: two ? pair(EIG_H.values[0], EIG_H.values[1]) : one(EIG_H.values[0]), out: two ? pair(outH0, outH1) : one(outH0) };
    const lo: PhaseModes = equal ? hi : { rate: two ? pair(EIG_L.values[0], EIG_L.values[1]) : one(EIG_L.values[0]), out: two ? pair(outL0, outL1) : one(outL0) };
    const mix = two ? four(mix0, mix1, mix2, mix3) : one(mix0);
    const delta = two ? pair(delta0, delta1) : one(delta0);
    return { n, period: K[PERIOD], high: vHigh, low: vLow, symmetric: true, hi, lo, mix, delta, outLow, outHigh, condition: 1 };
  }
  const m = into as MutableModal;
  const hi = m.hi as MutablePhase;
  const lo = m.lo as MutablePhase;
  hi.rate[0] = EIG_H.values[0];
  hi.out[0] = outH0;
  m.mix[0] = mix0;
  m.delta[0] = delta0;
  if (!equal) {
    lo.rate[0] = EIG_L.values[0];
    lo.out[0] = outL0;
  }
  if (n === 2) {
    hi.rate[1] = EIG_H.values[1];
    hi.out[1] = outH1;
    if (!equal) {
      lo.rate[1] = EIG_L.values[1];
      lo.out[1] = outL1;
    }
    m.mix[1] = mix1;
    m.mix[2] = mix2;
    m.mix[3] = mix3;
    m.delta[1] = delta1;
  }
  m.period = K[PERIOD];
  m.high = vHigh;
  m.low = vLow;
  m.outLow = outLow;
  m.outHigh = outHigh;
  return m;
}

// Arrays of the modal form hold unboxed doubles whatever their values (a mix of exactly [1] stays
// a double array): every consumer then sees one kind of array.
function one(a: number): number[] {
  const v = [0.5];
  v[0] = a;
  return v;
}
function pair(a: number, b: number): number[] {
  const v = [0.5, 0.5];
  v[0] = a;
  v[1] = b;
  return v;
}
function four(a: number, b: number, c: number, d: number): number[] {
  const v = [0.5, 0.5, 0.5, 0.5];
  v[0] = a;
  v[1] = b;
  v[2] = c;
  v[3] = d;
  return v;
}

type MutablePhase = { rate: number[]; out: number[] };
type MutableModal = { -readonly [K in keyof ModalLadder]: ModalLadder[K] } & { mix: number[]; delta: number[] };

/** Scratch of the order-2 eigenproblems (order 1 uses the first entries). */
const EIG_H = { values: [0.5, 0.5], vectors: [0.5, 0.5, 0.5, 0.5] };
const EIG_L = { values: [0.5, 0.5], vectors: [0.5, 0.5, 0.5, 0.5] };

/** The modes of one pin state whose first node is fed through `first` ohm (driver + R1), from the scratch. */
function phase(n: number, first: number, into: PhaseModes | undefined, basis: number[]): { modes: PhaseModes; basis: number[] } {
  G_IN[0] = 1 / first;
  S.fill(0, 0, n * n);
  for (let k = 0; k < n; k++) {
    S[k * n + k] = -(G_IN[k] + G_IN[k + 1]) / (CS[k] * CS[k]);
    if (k + 1 < n) {
      const off = G_IN[k + 1] / (CS[k] * CS[k + 1]);
      S[k * n + k + 1] = off;
      S[(k + 1) * n + k] = off;
    }
  }
  // With `into` (three stages): the rates into its array, the basis into `basis` (scratch, read at once).
  const { values, vectors } = symmetricEigen(S, n, { vectors: true, ...(into && { into: { values: into.rate as number[], vectors: basis } }) });
  const out = into ? (into.out as number[]) : doubles(n);
  for (let i = 0; i < n; i++) out[i] = vectors[(n - 1) * n + i] / CS[n - 1];
  return into ? { modes: into, basis: vectors } : { modes: { rate: values, out }, basis: vectors };
}

/** Eigenvector scratch of the two phases (anyOrder with `into`: three stages). */
const BASIS_HIGH = doubles(9);
const BASIS_LOW = doubles(9);

// Scratch of one call (single-threaded; each worker has its own module): the stages, sqrt C, conductances into
// each node, the symmetric matrix S, DC gains per volt and Delta in node coordinates. Plain arrays
// of doubles, as everywhere else symmetricEigen and dividerGain are called, so that their element
// accesses stay monomorphic.
// The circuit's numbers in a typed array (a module-level number variable would box each double
// stored into it: an allocation per field per call), and whether the output is open.
const PERIOD = 0;
const HIGH = 1;
const LOW = 2;
const DRIVER_HIGH = 3;
const DRIVER_LOW = 4;
const LOAD_R = 5;
const LOAD_C = 6;
const K = new Float64Array(7);
let K_OPEN = true;
let R_S = doubles(4);
let C_S = doubles(4);
let CS = doubles(4);
let G_IN = doubles(5);
let S = doubles(16);
let G_HIGH = doubles(4);
let G_LOW = doubles(4);
let DC_DELTA = doubles(4);


function grow(n: number): void {
  R_S = doubles(n);
  C_S = doubles(n);
  CS = doubles(n);
  G_IN = doubles(n + 1);
  S = doubles(n * n);
  G_HIGH = doubles(n);
  G_LOW = doubles(n);
  DC_DELTA = doubles(n);
}
