import './doubleFields.js';
import { solveTwoByTwo } from '../../numeric/lu.js';
import { phi2 } from '../../numeric/phi.js';
import type { ModalLadder } from './modalLadder.js';

/**
 * The periodic steady state of a one- or two-mode ladder at one duty, as plain numbers: output
 * deviation from the rising edge is -(aHigh0 expm1(rh0 tau) + aHigh1 expm1(rh1 tau)) in the high
 * phase and yEnd - (aLow0 expm1(rl0 s) + aLow1 expm1(rl1 s)) in the low phase (a single mode has
 * the second coefficients 0).
 */
export interface SmallState {
  t1: number;
  t2: number;
  yStart: number;
  /** average - yStart, V (kept apart: tiny next to the level when the ripple is). */
  meanOffset: number;
  average: number;
  yEnd: number;
  aHigh0: number;
  aHigh1: number;
  aLow0: number;
  aLow1: number;
  rh0: number;
  rh1: number;
  rl0: number;
  rl1: number;
}

/**
 * periodicState (same method, same numbers) written out with scalars for ladders of one or two
 * stages, which are most tolerance samples and most design candidates: no arrays are allocated,
 * so millions of calls stay cheap.
 *
 * With `into` (an earlier result) the figures are written there and it is returned: a search
 * that reads each state at once allocates nothing (an object's number fields are boxed, so a new
 * state costs fifteen allocations).
 *
 * With `withMean` false the time average is not integrated (meanOffset and average are NaN): for
 * a caller that needs the ripple only, which smallExtrema takes from the other figures.
 *
 * Syntax: smallState(modal, duty[, into[, withMean]])
 * Example: smallState(modalLadder(oneStage)!, 0.5).average  // V
 */
export function smallState(m: ModalLadder, duty: number, into?: SmallState, withMean = true): SmallState {
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
  const x00 = mix[0];
  const x01 = two ? mix[1] : 0;
  const x10 = two ? mix[2] : 0;
  const x11 = two ? mix[3] : 0;
  // u = x_s - x_l and v = Delta - u, each from its own right-hand side (see periodicState)
  let u0: number;
  let u1 = 0;
  let v0: number;
  let v1 = 0;
  if (t2 === 0) {
    // duty 1: the state is the high phase's DC state, u = Delta and v = 0 exactly
    u0 = delta[0];
    u1 = two ? delta[1] : 0;
    v0 = 0;
  } else if (!two) {
    const den = kl0 + el0 * kh0;
    u0 = (el0 * kh0 * delta[0]) / den;
    v0 = (kl0 * delta[0]) / den;
  } else {
    const kl1 = -Math.expm1(rl1 * t2);
    const el1 = Math.exp(rl1 * t2);
    // (K_l + E_l K_h) [u v] = [E_l K_h Delta, K_l Delta] in modal coordinates
    const a = x00 * (kl0 + el0 * kh0);
    const b = x01 * (kl0 + el0 * kh1);
    const c = x10 * (kl1 + el1 * kh0);
    const d = x11 * (kl1 + el1 * kh1);
    const e = el0 * (x00 * kh0 * delta[0] + x01 * kh1 * delta[1]);
    const f = el1 * (x10 * kh0 * delta[0] + x11 * kh1 * delta[1]);
    const g = kl0 * (x00 * delta[0] + x01 * delta[1]);
    const h = kl1 * (x10 * delta[0] + x11 * delta[1]);
    // a zero pivot leaves NaN, as the inline elimination this replaces did (0/0)
    if (!solveTwoByTwo(a, b, c, d, e, f, SOLVED)) SOLVED[0] = SOLVED[1] = NaN;
    u0 = SOLVED[0];
    u1 = SOLVED[1];
    if (!solveTwoByTwo(a, b, c, d, g, h, SOLVED)) SOLVED[0] = SOLVED[1] = NaN;
    v0 = SOLVED[0];
    v1 = SOLVED[1];
  }
  const aHigh0 = hi.out[0] * v0;
  const aHigh1 = two ? hi.out[1] * v1 : 0;
  const w0 = kh0 * v0;
  const w1 = kh1 * v1;
  const yEnd = aHigh0 * kh0 + aHigh1 * kh1;
  const aLow0 = lo.out[0] * -(x00 * (u0 + w0) + x01 * (u1 + w1));
  const aLow1 = two ? lo.out[1] * -(x10 * (u0 + w0) + x11 * (u1 + w1)) : 0;
  let integral = NaN;
  if (withMean) {
    integral = t2 * yEnd - aHigh0 * rh0 * t1 * t1 * phi2(rh0 * t1) - aLow0 * rl0 * t2 * t2 * phi2(rl0 * t2);
    if (two) integral -= aHigh1 * rh1 * t1 * t1 * phi2(rh1 * t1) + aLow1 * rl1 * t2 * t2 * phi2(rl1 * t2);
  }
  // the output at the rising edge from the DC state needing the smaller correction
  const yStart =
    duty > 0.5
      ? m.outHigh - (hi.out[0] * v0 + (two ? hi.out[1] * v1 : 0))
      : m.outLow + hi.out[0] * u0 + (two ? hi.out[1] * u1 : 0);
  const meanOffset = integral / period;
  if (into === undefined) {
    return {
      t1,
      t2,
      yStart,
      meanOffset,
      average: yStart + meanOffset,
      yEnd,
      aHigh0,
      aHigh1,
      aLow0,
      aLow1,
      rh0,
      rh1,
      rl0,
      rl1,
    };
  }
  into.t1 = t1;
  into.t2 = t2;
  into.yStart = yStart;
  into.meanOffset = meanOffset;
  into.average = yStart + meanOffset;
  into.yEnd = yEnd;
  into.aHigh0 = aHigh0;
  into.aHigh1 = aHigh1;
  into.aLow0 = aLow0;
  into.aLow1 = aLow1;
  into.rh0 = rh0;
  into.rh1 = rh1;
  into.rl0 = rl0;
  into.rl1 = rl1;
  return into;
}

/**
 * The largest and smallest output deviation from the rising edge over the period (V) of a
 * SmallState, written into `out`: the extremes lie among the phase ends and the one turning point
 * each two-term phase curve can have, t = ln(-a1 r1 / (a0 r0)) / (r0 - r1). The ripple is
 * out.max - out.min.
 *
 * Syntax: smallExtrema(state, out)
 * Example: smallExtrema(smallState(modal, 0.5), out); out.max - out.min  // V peak-to-peak
 */
export function smallExtrema(s: SmallState, out: { max: number; min: number }): void {
  let max = Math.max(0, s.yEnd);
  let min = Math.min(0, s.yEnd);
  if (s.aHigh1 !== 0) {
    const t = turningPoint(s.aHigh0 * s.rh0, s.aHigh1 * s.rh1, s.rh0, s.rh1, s.t1);
    if (t > 0) {
      const v = -(s.aHigh0 * Math.expm1(s.rh0 * t) + s.aHigh1 * Math.expm1(s.rh1 * t));
      if (v > max) max = v;
      if (v < min) min = v;
    }
  }
  if (s.aLow1 !== 0) {
    const t = turningPoint(s.aLow0 * s.rl0, s.aLow1 * s.rl1, s.rl0, s.rl1, s.t2);
    if (t > 0) {
      const v = s.yEnd - (s.aLow0 * Math.expm1(s.rl0 * t) + s.aLow1 * Math.expm1(s.rl1 * t));
      if (v > max) max = v;
      if (v < min) min = v;
    }
  }
  out.max = max;
  out.min = min;
}

function turningPoint(d0: number, d1: number, r0: number, r1: number, length: number): number {
  if (d0 === 0) return -1;
  const ratio = -d1 / d0;
  if (!(ratio > 0)) return -1;
  const t = Math.log(ratio) / (r0 - r1);
  return t > 0 && t < length ? t : -1;
}

/** Scratch for solveTwoByTwo's answer (read at once, so one per module is enough). */
const SOLVED = [0, 0];
