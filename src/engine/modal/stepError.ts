import './doubleFields.js';
import { doubles } from '../../numeric/dense.js';
import { brentRoot } from '../../numeric/brentRoot.js';
import { symmetricEigen, symmetricEigen2, type SymmetricEigen } from '../../numeric/symmetricEigen.js';
import type { ModalLadder } from './modalLadder.js';
import type { PeriodicState } from './periodicState.js';
import { curveExtremaInto, curveTurningPoints, curveValue, smallTurningPoint, type CurveExtrema, type PhaseCurve } from './phaseCurve.js';

/** The periodic steady state at the target duty as an error about its own mean, over one period. */
export interface SteadyError {
  /** Orbit minus its mean during the high phase and the low phase, V. */
  high: PhaseCurve;
  low: PhaseCurve;
  /** Largest error (>= 0) and smallest (<= 0) over the period, V. */
  above: number;
  below: number;
}

/**
 * The steady-state part of the error after a duty step: the orbit at the target duty minus its
 * time average, with its exact extremes (curveExtrema). With `into` (an earlier result) the figures
 * are written there and it is returned: nothing is allocated (settlingLowerBound, candidate after
 * candidate); its curves then share the gains of `target`.
 *
 * Syntax: steadyError(periodicState(modal, to)[, into])
 * Example: steadyError(target).above - steadyError(target).below  // the ripple at `to`, V
 */
export function steadyError(target: PeriodicState, into?: SteadyError): SteadyError {
  const { meanOffset } = target;
  const out = into ?? { high: newCurve(), low: newCurve(), above: 0.5, below: 0.5 };
  const high = out.high as Curve;
  const low = out.low as Curve;
  high.offset = target.high.offset - meanOffset;
  high.gain = target.high.gain;
  high.rate = target.high.rate;
  high.length = target.high.length;
  low.offset = target.low.offset - meanOffset;
  low.gain = target.low.gain;
  low.rate = target.low.rate;
  low.length = target.low.length;
  const eh = curveExtremaInto(high, EXT_HIGH);
  const el = curveExtremaInto(low, EXT_LOW);
  out.above = Math.max(eh.max, el.max);
  out.below = Math.min(eh.min, el.min);
  return out;
}

/** A phase curve whose every field may be set (the shape of PhaseCurve, doubles from the start). */
type Curve = { offset: number; gain: number[]; rate: readonly number[]; length: number };

function newCurve(): Curve {
  return { offset: 0.5, gain: [0.5], rate: [0.5], length: 0.5 };
}

/** Scratch extremes (read at once). */
const EXT_HIGH: CurveExtrema = { max: 0.5, tMax: 0.5, min: 0.5, tMin: 0.5 };
const EXT_LOW: CurveExtrema = { max: 0.5, tMax: 0.5, min: 0.5, tMin: 0.5 };

/**
 * The output error v(t) - average(to) in the periods after a duty step, mode by mode of the
 * period map (see stepError): error curves for one period at a time, set by setFirstPeriod or
 * setModes and then examined by leaves or lastExit.
 */
export interface StepError {
  readonly n: number;
  /** Coefficient of each mode of the period map in the starting deviation. */
  readonly zeta: readonly number[];
  /** log mu_j: period k >= 1 carries zeta_j mu_j^(k-1) of mode j. */
  readonly logMu: readonly number[];
  /** H_j >= the largest |output| the state r_j of mode j gives during a period, V. */
  readonly bound: readonly number[];
  /** Output at the start of a period whose state is r_j, V (the high-phase curve at tau = 0). */
  readonly lead: readonly number[];
  /** mu_j^(k-1) for period k >= 1. */
  power(j: number, k: number): number;
  /** Set the error curves to those of period 0, the one the step starts. */
  setFirstPeriod(): void;
  /** Set them to a period that starts in state sum_j c_j r_j (period k: c_j = zeta_j mu_j^(k-1)). */
  setModes(c: readonly number[]): void;
  /** Set them to period k: setFirstPeriod for k = 0, else setModes with c_j = zeta_j mu_j^(k-1). */
  setPeriod(k: number): void;
  /** The curves set leave the band widened by `slack`: max + slack > band or min - slack < -band. */
  leaves(band: number, slack: number): boolean;
  /** With the curves of period k set: the time from the step after which they stay within band. */
  lastExit(k: number, band: number): number;
}

/**
 * The error after a duty step of a follower-free ladder (modal form with an orthogonal `mix`) in
 * the modes of its period map, from the periodic states at the target and the source duty; null
 * when the step moves nothing (equal starting states).
 *
 * Method: in period k after the step the state deviation from the periodic orbit at `to` is
 * e_k = M^k e_0, M = E_l E_h. In high-phase modal coordinates M = X^T diag(e_l) X diag(e_h) is
 * similar to the symmetric D X^T diag(e_l) X D, D = diag(e_h)^(1/2); its difference from I,
 * N = -(diag(k_h) + D X^T diag(k_l) X D) (all k = -expm1(rate t) >= 0), is formed without
 * cancellation and diagonalized by Jacobi (symmetricEigen): N z_j = nu_j z_j, mu_j = 1 + nu_j.
 * Then e_0 = sum_j zeta_j q_j with zeta_j = z_j^T D e_0 and q_j = D^-1 z_j; to avoid D^-1 (huge for
 * a mode that dies within the phase) period k >= 1 uses e_k = sum_j zeta_j mu_j^(k-1) r_j with
 * r_j = M q_j = X^T diag(e_l) X D z_j, and period 0 uses e_0 itself; mu_j^k = exp(k log1p(nu_j)).
 * The error in a period is then the steady error plus an exponential sum in tau (phaseCurve.ts),
 * whose extremes are exact; inside a period the error is monotone between turning points, and
 * Brent's method (brentRoot) finds its last band crossing.
 *
 * Syntax: stepError(modal, target, source, steadyError(target))
 * Example: stepError(modal, periodicState(modal, 0.9), periodicState(modal, 0.1), ss)?.zeta
 */
export function stepError(m: ModalLadder, target: PeriodicState, source: PeriodicState, ss: SteadyError): StepError | null {
  if (!m.symmetric) throw new RangeError('stepError: the period map needs a follower-free ladder (orthogonal mix)');
  const err = new PeriodError(m.n);
  return err.setUp(m, target, source, ss) ? err : null;
}

/**
 * stepError in an object this module keeps for each order up to two and overwrites on the next
 * call (larger orders get a new one): for callers that are done with one step's error before they
 * ask for the next, as settlingLowerBound is, so that the design search's settling bound
 * allocates nothing per candidate.
 *
 * Syntax: reusedStepError(modal, target, source, steadyError(target))
 * Example: reusedStepError(modal, periodicState(modal, 0.9), periodicState(modal, 0.1), ss)?.zeta
 */
export function reusedStepError(m: ModalLadder, target: PeriodicState, source: PeriodicState, ss: SteadyError): StepError | null {
  if (m.n > 2) return stepError(m, target, source, ss);
  if (!m.symmetric) throw new RangeError('stepError: the period map needs a follower-free ladder (orthogonal mix)');
  const err = (REUSED[m.n] ??= new PeriodError(m.n));
  return err.setUp(m, target, source, ss) ? err : null;
}

/** reusedStepError's objects, by order. */
const REUSED: Array<PeriodError | undefined> = [];

/**
 * The StepError of stepError: the period map's modes and output weights, and the two error curves
 * of the period last set, refilled for each period examined. Its arrays are allocated once, for
 * its order, and setUp fills them for one step.
 */
class PeriodError implements StepError {
  readonly n: number;
  readonly zeta: number[];
  readonly logMu: number[];
  readonly bound: number[];
  readonly lead: number[];
  /** etaHigh[j * n + i], etaLow[j * n + i]: output weight i (per rate) of r_j in each phase. */
  readonly etaHigh: number[];
  readonly etaLow: number[];
  private m: ModalLadder | null = null;
  private t1 = 0.5;
  private ss: SteadyError | null = null;
  private readonly e0: number[];
  private readonly kh: number[];
  private readonly half: number[];
  private readonly kl: number[];
  private readonly elow: number[];
  private readonly nMatrix: number[];
  /** Eigen-decomposition of N for orders 1 and 2 (symmetricEigen's own paths, written here). */
  private readonly eig: SymmetricEigen;
  private readonly r: number[];
  private readonly xr: number[];
  private readonly wh: number[];
  private readonly wl: number[];
  private readonly coef: number[];
  private readonly errHigh: Curve;
  private readonly errLow: Curve;
  private readonly extremes: CurveExtrema = { max: 0.5, tMax: 0.5, min: 0.5, tMin: 0.5 };
  /** Output weights of the starting state of the period set, per rate, in each phase. */
  private readonly bh: number[];
  private readonly bl: number[];

  constructor(n: number) {
    this.n = n;
    this.zeta = doubles(n);
    this.logMu = doubles(n);
    this.bound = doubles(n);
    this.lead = doubles(n);
    this.etaHigh = doubles(n * n);
    this.etaLow = doubles(n * n);
    this.e0 = doubles(n);
    this.kh = doubles(n);
    this.half = doubles(n);
    this.kl = doubles(n);
    this.elow = doubles(n);
    this.nMatrix = doubles(n * n);
    this.eig = { values: doubles(n), vectors: doubles(n * n) };
    this.r = doubles(n);
    this.xr = doubles(n);
    this.wh = doubles(n);
    this.wl = doubles(n);
    this.coef = doubles(n);
    this.errHigh = { offset: 0.5, gain: doubles(n), rate: [0.5], length: 0.5 };
    this.errLow = { offset: 0.5, gain: doubles(n), rate: [0.5], length: 0.5 };
    this.bh = doubles(n);
    this.bl = doubles(n);
  }

  /** Fill every figure for the step from `source` to `target` (see stepError); false when it moves nothing. */
  setUp(m: ModalLadder, target: PeriodicState, source: PeriodicState, ss: SteadyError): boolean {
    const { n, e0, kh, half, kl, elow, r, xr, wh, wl, zeta, logMu, etaHigh, etaLow, bound, lead } = this;
    const N = this.nMatrix;
    const { hi, lo, mix } = m;
    const { t1, t2 } = target;
    let moved = false;
    for (let i = 0; i < n; i++) {
      e0[i] = source.start[i] - target.start[i];
      if (e0[i] !== 0) moved = true;
    }
    if (!moved) return false;
    this.m = m;
    this.t1 = t1;
    this.ss = ss;
    this.errHigh.rate = hi.rate;
    this.errHigh.length = t1;
    this.errLow.rate = lo.rate;
    this.errLow.length = t2;

    // The period map's modes, in the symmetric form.
    for (let i = 0; i < n; i++) {
      kh[i] = -Math.expm1(hi.rate[i] * t1);
      half[i] = Math.exp(0.5 * hi.rate[i] * t1);
      kl[i] = -Math.expm1(lo.rate[i] * t2);
      elow[i] = Math.exp(lo.rate[i] * t2);
    }
    for (let i = 0; i < n; i++) {
      for (let j = 0; j < n; j++) {
        let s = 0;
        for (let k = 0; k < n; k++) s += mix[k * n + i] * kl[k] * mix[k * n + j];
        N[i * n + j] = -(half[i] * s * half[j] + (i === j ? kh[i] : 0));
      }
    }
    let nu: readonly number[];
    let Z: readonly number[];
    if (n === 1) {
      // symmetricEigen of order 1: the entry, the vector [1]
      this.eig.values[0] = N[0];
      this.eig.vectors[0] = 1;
      ({ values: nu, vectors: Z } = this.eig);
    } else if (n === 2) {
      ({ values: nu, vectors: Z } = symmetricEigen2(N[0], N[1], N[3], this.eig));
    } else {
      ({ values: nu, vectors: Z } = symmetricEigen(N, n, { vectors: true }));
    }
    for (let j = 0; j < n; j++) logMu[j] = nu[j] > -1 ? Math.log1p(nu[j]) : -Infinity;
    for (let j = 0; j < n; j++) {
      let z = 0;
      for (let i = 0; i < n; i++) z += half[i] * Z[i * n + j] * e0[i];
      zeta[j] = z;
      // r_j = X^T diag(e_l) X D z_j
      for (let i = 0; i < n; i++) {
        let s = 0;
        for (let k = 0; k < n; k++) s += mix[i * n + k] * half[k] * Z[k * n + j];
        xr[i] = elow[i] * s;
      }
      for (let i = 0; i < n; i++) {
        let s = 0;
        for (let k = 0; k < n; k++) s += mix[k * n + i] * xr[k];
        r[i] = s;
      }
      this.highWeights(r, wh);
      this.lowWeights(r, wl);
      let sumHigh = 0;
      let sumLow = 0;
      let sum = 0;
      for (let i = 0; i < n; i++) {
        etaHigh[j * n + i] = wh[i];
        etaLow[j * n + i] = wl[i];
        sumHigh += Math.abs(wh[i]);
        sumLow += Math.abs(wl[i]);
        sum += wh[i];
      }
      bound[j] = Math.max(sumHigh, sumLow);
      lead[j] = sum;
    }
    return true;
  }

  power(j: number, k: number): number {
    return k === 1 ? 1 : Math.exp((k - 1) * this.logMu[j]);
  }

  /** Output weights (per rate i) of a state w given in high-phase modal coordinates: high phase. */
  private highWeights(w: number[], out: number[]): void {
    const { n, hi } = this.m!;
    for (let i = 0; i < n; i++) out[i] = hi.out[i] * w[i];
  }

  /** The same in the low phase (from the state at the end of the high phase). */
  private lowWeights(w: number[], out: number[]): void {
    const { n, lo, mix } = this.m!;
    const half = this.half;
    for (let i = 0; i < n; i++) {
      let s = 0; // low-phase coordinates of the state at the end of the high phase
      for (let k = 0; k < n; k++) s += mix[i * n + k] * half[k] * half[k] * w[k];
      out[i] = lo.out[i] * s;
    }
  }

  setFirstPeriod(): void {
    this.highWeights(this.e0, this.bh);
    this.lowWeights(this.e0, this.bl);
  }

  setModes(c: readonly number[]): void {
    const { n, etaHigh, etaLow, bh, bl } = this;
    for (let i = 0; i < n; i++) {
      let h = 0;
      let l = 0;
      for (let j = 0; j < n; j++) {
        h += c[j] * etaHigh[j * n + i];
        l += c[j] * etaLow[j * n + i];
      }
      bh[i] = h;
      bl[i] = l;
    }
  }

  setPeriod(k: number): void {
    if (k === 0) {
      this.setFirstPeriod();
      return;
    }
    const { n, zeta, coef } = this;
    for (let j = 0; j < n; j++) coef[j] = zeta[j] * this.power(j, k);
    this.setModes(coef);
  }

  // the low phase first: in a violating period it is usually the one that leaves
  leaves(band: number, slack: number): boolean {
    const ss = this.ss!;
    const xl = curveExtremaInto(this.fill(this.errLow, ss.low, this.bl), this.extremes);
    if (xl.max + slack > band || xl.min - slack < -band) return true;
    const xh = curveExtremaInto(this.fill(this.errHigh, ss.high, this.bh), this.extremes);
    return xh.max + slack > band || xh.min - slack < -band;
  }

  lastExit(k: number, band: number): number {
    const ss = this.ss!;
    const period = this.m!.period;
    const inLow = curveLastExit(this.fill(this.errLow, ss.low, this.bl), band, period);
    if (inLow >= 0) return k * period + this.t1 + inLow;
    const inHigh = curveLastExit(this.fill(this.errHigh, ss.high, this.bh), band, period);
    return k * period + Math.max(inHigh, 0);
  }

  /** The error curve of one phase: the steady one plus the output weights b. */
  private fill(err: PhaseCurve, steady: PhaseCurve, b: number[]): PhaseCurve {
    let o = steady.offset;
    for (let i = 0; i < this.n; i++) {
      err.gain[i] = steady.gain[i] + b[i];
      o += b[i];
    }
    err.offset = o;
    return err;
  }
}

/**
 * The time in [0, length] after which |curve| stays within band, or -1 if it never leaves it.
 *
 * Method: between the phase ends and the turning points the curve is monotone, so the last piece
 * that leaves the band holds the answer: its end if that lies outside, else the crossing inside it,
 * found by Brent's method (brentRoot) to 1e-12 of the period. One and two terms take the same
 * points without arrays (smallLastExit).
 *
 * Syntax: curveLastExit(curve, band, period)
 * Example: curveLastExit({ offset: 1, gain: [1], rate: [-1], length: 5 }, 0.5, 5)  // ln 2, s
 */
export function curveLastExit(c: PhaseCurve, band: number, period: number): number {
  if (!(c.length > 0)) return -1;
  if (c.gain.length <= 2) return smallLastExit(c, band, period);
  const ends = [0, ...curveTurningPoints(c), c.length];
  const values = ends.map((t) => curveValue(c, t));
  for (let k = ends.length - 1; k > 0; k--) {
    const va = values[k - 1];
    const vb = values[k];
    if (Math.abs(vb) > band) return ends[k];
    if (Math.abs(va) > band) {
      const level = va > 0 ? band : -band;
      return brentRoot((t) => curveValue(c, t) - level, ends[k - 1], ends[k], 1e-12 * period);
    }
  }
  return -1;
}

/**
 * curveLastExit for one or two terms without arrays: the same points (0, the turning point if
 * any, the end), examined in the same order.
 */
function smallLastExit(c: PhaseCurve, band: number, period: number): number {
  const turn = smallTurningPoint(c);
  const t1 = turn > 0 ? turn : c.length;
  const v0 = curveValue(c, 0);
  const v1 = curveValue(c, t1);
  if (turn > 0) {
    // the last piece, from the turning point to the end
    const v2 = curveValue(c, c.length);
    if (Math.abs(v2) > band) return c.length;
    if (Math.abs(v1) > band) return crossing(c, v1 > 0 ? band : -band, t1, c.length, period);
  }
  if (Math.abs(v1) > band) return t1;
  if (Math.abs(v0) > band) return crossing(c, v0 > 0 ? band : -band, 0, t1, period);
  return -1;
}

/** Where the curve crosses `level` between a and b (brentRoot, as curveLastExit). */
function crossing(c: PhaseCurve, level: number, a: number, b: number, period: number): number {
  return brentRoot((t) => curveValue(c, t) - level, a, b, 1e-12 * period);
}
