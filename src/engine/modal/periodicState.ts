import './doubleFields.js';
import { doubles } from '../../numeric/dense.js';
import { solveLinear, solveTwoByTwo } from '../../numeric/lu.js';
import { phi2 } from '../../numeric/phi.js';
import type { ModalLadder } from './modalLadder.js';
import type { PhaseCurve } from './phaseCurve.js';

/** Scratch for solveTwoByTwo (read at once). */
const SOLVED = [0.5, 0.5];

/** Periodic steady state at one duty, in modal form. */
export interface PeriodicState {
  duty: number;
  /** Lengths of the high and low phases, s. */
  t1: number;
  t2: number;
  /** State at the rising edge minus the DC state of the low phase, high-phase modal coordinates. */
  start: number[];
  /** Output at the rising edge, V. */
  yStart: number;
  /** Time average minus yStart, V (kept apart: it is tiny next to the level when ripple is). */
  meanOffset: number;
  /** Time-average output, V. */
  average: number;
  /** Output minus yStart during the high phase (tau from the rising edge) and the low phase. */
  high: PhaseCurve;
  low: PhaseCurve;
}

/**
 * Periodic steady state of a ladder in modal form at duty D, exactly, in O(n^2) plus one n x n
 * solve with two right-hand sides.
 *
 * Method: the deviation form of the engine (dutyPlan.ts) written in modal coordinates. With
 * Delta = x_h - x_l, t1 = D T, t2 = (1 - D) T, K_p = I - e^{A_p t_p}, E_p = e^{A_p t_p}, the state at
 * the rising edge x_s = x_l + u solves (K_l + E_l K_h) u = E_l K_h Delta, and the drive of the high
 * phase v = Delta - u solves (K_l + E_l K_h) v = K_l Delta (no subtraction: near duty 1, where
 * u ~ Delta, v keeps its digits). In high-phase modal coordinates (u~ = W_h u) and with
 * X = W_l V_h this is Y u~ = r, Y v~ = r', where Y_ij = X_ij (k_l,i + e_l,i k_h,j),
 * r_i = e_l,i sum_j X_ij k_h,j Delta~_j and r'_i = k_l,i sum_j X_ij Delta~_j; the k's are
 * -expm1(rate t) so nothing cancels when time constants dwarf the period. The output deviation from
 * the rising edge is sum_i a_i (-expm1(rate_i tau)) in each phase (a sum of decaying exponentials),
 * and the mean uses the integral of -expm1, -rate t^2 phi2(rate t) (phi-functions of exponential
 * integrators: Hochbruck & Ostermann, Acta Numerica 19, 2010). The output at the rising edge is
 * taken from the DC state that needs the smaller correction (x_l + u below duty 1/2, x_h - v above),
 * as in dutyPlan.ts.
 *
 * With `into`, a state from an earlier call on a ladder of as many stages, the new state is written
 * into it (arrays and curves included) and it is returned: a search that keeps a few states per
 * candidate allocates nothing per candidate (from three stages on, only the n x n solve's arrays).
 *
 * Syntax: periodicState(modal, duty[, into])
 * Example: periodicState(modalLadder(ladder)!, 0.5).average  // V
 */
export function periodicState(m: ModalLadder, duty: number, into?: PeriodicState): PeriodicState {
  const fits = into !== undefined && into.start.length === m.n ? into : undefined;
  return m.n <= 2 ? smallPeriodicState(m, duty, fits) : periodicStateAnyOrder(m, duty, fits);
}

/**
 * periodicState by the general-order code for any number of stages; periodicState uses it from
 * three stages on. Callable by name so that tests hold the scalar one- and two-stage path to it.
 * Its work arrays are module scratch (grown to the largest order seen); with `into` (a state of
 * as many stages) the result is written into it.
 *
 * Syntax: periodicStateAnyOrder(modal, duty[, into])
 * Example: periodicStateAnyOrder(modalLadder(ladder)!, 0.5).average  // equal to periodicState(...)
 */
export function periodicStateAnyOrder(m: ModalLadder, duty: number, into?: PeriodicState): PeriodicState {
  const { n, period, hi, lo, mix, delta } = m;
  const t1 = duty * period;
  const t2 = (1 - duty) * period;
  if (WORK.kh.length < n) growWork(n);
  const { kh, kl, el, Y, rhs, start, drive, aHigh, wEnd, aLow } = WORK;
  for (let i = 0; i < n; i++) {
    kh[i] = -Math.expm1(hi.rate[i] * t1);
    kl[i] = -Math.expm1(lo.rate[i] * t2);
    el[i] = Math.exp(lo.rate[i] * t2);
  }
  // Duty 1: no low phase, the state sits at the high phase's DC state: u = Delta and v = 0 exactly.
  if (t2 === 0) {
    for (let i = 0; i < n; i++) {
      start[i] = delta[i];
      drive[i] = 0;
    }
  } else if (n === 1) {
    const den = kl[0] + el[0] * kh[0];
    start[0] = (el[0] * kh[0] * delta[0]) / den;
    drive[0] = (kl[0] * delta[0]) / den;
  } else {
    // Y and the two right-hand sides [r r'] (row-major n x 2)
    for (let i = 0; i < n; i++) {
      let sHigh = 0;
      let sAll = 0;
      for (let j = 0; j < n; j++) {
        const x = mix[i * n + j];
        Y[i * n + j] = x * (kl[i] + el[i] * kh[j]);
        sHigh += x * kh[j] * delta[j];
        sAll += x * delta[j];
      }
      rhs[2 * i] = el[i] * sHigh;
      rhs[2 * i + 1] = kl[i] * sAll;
    }
    // (the scratch may be longer than n x n: the solve reads the first n^2 entries, row-major)
    const solved = solveLinear(Y, n, rhs, 2);
    if (!solved) throw new RangeError('periodicState: singular period map (not a physical ladder)');
    for (let i = 0; i < n; i++) {
      start[i] = solved[2 * i];
      drive[i] = solved[2 * i + 1];
    }
  }
  let yEnd = 0;
  let fromLow = 0;
  let fromHigh = 0;
  for (let i = 0; i < n; i++) {
    aHigh[i] = hi.out[i] * drive[i];
    wEnd[i] = kh[i] * drive[i];
    yEnd += aHigh[i] * kh[i];
    fromLow += hi.out[i] * start[i];
    fromHigh += hi.out[i] * drive[i];
  }
  for (let i = 0; i < n; i++) {
    let s = 0;
    for (let j = 0; j < n; j++) s -= mix[i * n + j] * (start[j] + wEnd[j]);
    aLow[i] = lo.out[i] * s;
  }
  let integral = t2 * yEnd;
  for (let i = 0; i < n; i++) {
    const zh = hi.rate[i] * t1;
    const zl = lo.rate[i] * t2;
    integral += aHigh[i] * -hi.rate[i] * t1 * t1 * phi2(zh);
    integral += aLow[i] * -lo.rate[i] * t2 * t2 * phi2(zl);
  }
  const meanOffset = integral / period;
  const yStart = duty > 0.5 ? m.outHigh - fromHigh : m.outLow + fromLow;
  const out = into ?? blankState(n, m);
  for (let i = 0; i < n; i++) {
    out.start[i] = start[i];
    out.high.gain[i] = -aHigh[i];
    out.low.gain[i] = -aLow[i];
  }
  return finishState(out, m, duty, t1, t2, yStart, meanOffset, yEnd);
}

/** Work arrays of periodicStateAnyOrder (module scratch: read before the next call). */
const WORK = { kh: doubles(0), kl: doubles(0), el: doubles(0), Y: doubles(0), rhs: doubles(0), start: doubles(0), drive: doubles(0), aHigh: doubles(0), wEnd: doubles(0), aLow: doubles(0) };

function growWork(n: number): void {
  for (const key of ['kh', 'kl', 'el', 'start', 'drive', 'aHigh', 'wEnd', 'aLow'] as const) WORK[key] = doubles(n);
  WORK.Y = doubles(n * n);
  WORK.rhs = doubles(2 * n);
}

/**
 * periodicStateAnyOrder for one or two stages on scalars: every operation of the general code in
 * its order (sums started from 0 as there; the 2 x 2 solve is solveLinear's elimination with
 * partial pivoting, operation for operation), without its work arrays: only the result is
 * allocated. The design search asks for two states per candidate it bounds the settling of.
 */
function smallPeriodicState(m: ModalLadder, duty: number, into?: PeriodicState): PeriodicState {
  const { period, hi, lo, mix, delta } = m;
  const two = m.n === 2;
  const t1 = duty * period;
  const t2 = (1 - duty) * period;
  const rh0 = hi.rate[0];
  const rl0 = lo.rate[0];
  const rh1 = two ? hi.rate[1] : 0;
  const rl1 = two ? lo.rate[1] : 0;
  const kh0 = -Math.expm1(rh0 * t1);
  const kl0 = -Math.expm1(rl0 * t2);
  const el0 = Math.exp(rl0 * t2);
  const kh1 = two ? -Math.expm1(rh1 * t1) : 0;
  const kl1 = two ? -Math.expm1(rl1 * t2) : 0;
  const el1 = two ? Math.exp(rl1 * t2) : 0;
  const x00 = mix[0];
  const x01 = two ? mix[1] : 0;
  const x10 = two ? mix[2] : 0;
  const x11 = two ? mix[3] : 0;
  const d0 = delta[0];
  const d1 = two ? delta[1] : 0;
  // start (u) and drive (v), as in the general code
  let u0: number;
  let u1 = 0;
  let v0: number;
  let v1 = 0;
  if (t2 === 0) {
    u0 = d0;
    u1 = d1;
    v0 = 0;
  } else if (!two) {
    const den = kl0 + el0 * kh0;
    u0 = (el0 * kh0 * d0) / den;
    v0 = (kl0 * d0) / den;
  } else {
    // Y = [a b; c d] and the right-hand sides [e g; f h], as the general loop forms them
    const a = x00 * (kl0 + el0 * kh0);
    const b = x01 * (kl0 + el0 * kh1);
    const c = x10 * (kl1 + el1 * kh0);
    const d = x11 * (kl1 + el1 * kh1);
    const e = el0 * (0 + x00 * kh0 * d0 + x01 * kh1 * d1);
    const g = kl0 * (0 + x00 * d0 + x01 * d1);
    const f = el1 * (0 + x10 * kh0 * d0 + x11 * kh1 * d1);
    const h = kl1 * (0 + x10 * d0 + x11 * d1);
    // solveTwoByTwo is solveLinear's elimination with partial pivoting for order 2, operation for
    // operation; the strict factor refuses a zero or non-finite pivot
    if (!(Number.isFinite(a) && Number.isFinite(b) && Number.isFinite(c) && Number.isFinite(d)) || !solveTwoByTwo(a, b, c, d, e, f, SOLVED)) {
      throw new RangeError('periodicState: singular period map (not a physical ladder)');
    }
    u0 = SOLVED[0];
    u1 = SOLVED[1];
    solveTwoByTwo(a, b, c, d, g, h, SOLVED);
    v0 = SOLVED[0];
    v1 = SOLVED[1];
  }
  const aHigh0 = hi.out[0] * v0;
  const aHigh1 = two ? hi.out[1] * v1 : 0;
  const w0 = kh0 * v0;
  const w1 = kh1 * v1;
  let yEnd = 0 + aHigh0 * kh0;
  let fromLow = 0 + hi.out[0] * u0;
  let fromHigh = 0 + hi.out[0] * v0;
  if (two) {
    yEnd += aHigh1 * kh1;
    fromLow += hi.out[1] * u1;
    fromHigh += hi.out[1] * v1;
  }
  const aLow0 = lo.out[0] * (0 - x00 * (u0 + w0) - x01 * (u1 + w1));
  const aLow1 = two ? lo.out[1] * (0 - x10 * (u0 + w0) - x11 * (u1 + w1)) : 0;
  let integral = t2 * yEnd;
  integral += aHigh0 * -rh0 * t1 * t1 * phi2(rh0 * t1);
  integral += aLow0 * -rl0 * t2 * t2 * phi2(rl0 * t2);
  if (two) {
    integral += aHigh1 * -rh1 * t1 * t1 * phi2(rh1 * t1);
    integral += aLow1 * -rl1 * t2 * t2 * phi2(rl1 * t2);
  }
  const meanOffset = integral / period;
  const yStart = duty > 0.5 ? m.outHigh - fromHigh : m.outLow + fromLow;
  const out = into ?? blankState(two ? 2 : 1, m);
  out.start[0] = u0;
  out.high.gain[0] = -aHigh0;
  out.low.gain[0] = -aLow0;
  if (two) {
    out.start[1] = u1;
    out.high.gain[1] = -aHigh1;
    out.low.gain[1] = -aLow1;
  }
  return finishState(out, m, duty, t1, t2, yStart, meanOffset, yEnd);
}

/** A fresh state of n stages in the shape of a written-into one (doubles throughout), to be filled alike. */
function blankState(n: number, m: ModalLadder): PeriodicState {
  return {
    duty: 0.5,
    t1: 0.5,
    t2: 0.5,
    start: doubles(n),
    yStart: 0.5,
    meanOffset: 0.5,
    average: 0.5,
    high: { offset: 0.5, gain: doubles(n), rate: m.hi.rate, length: 0.5 },
    low: { offset: 0.5, gain: doubles(n), rate: m.lo.rate, length: 0.5 },
  };
}

/** The scalar fields and the phase curves' rates, offsets and lengths of a state (the arrays are the caller's). */
function finishState(out: PeriodicState, m: ModalLadder, duty: number, t1: number, t2: number, yStart: number, meanOffset: number, yEnd: number): PeriodicState {
  const high = out.high as Curve;
  const low = out.low as Curve;
  out.duty = duty;
  out.t1 = t1;
  out.t2 = t2;
  out.yStart = yStart;
  out.meanOffset = meanOffset;
  out.average = yStart + meanOffset;
  high.offset = 0;
  high.rate = m.hi.rate;
  high.length = t1;
  low.offset = yEnd;
  low.rate = m.lo.rate;
  low.length = t2;
  return out;
}

/** A phase curve whose every field may be set. */
type Curve = { offset: number; gain: number[]; rate: readonly number[]; length: number };

