import './doubleFields.js';
import { zeros } from '../../numeric/dense.js';
import { expSumRoots } from '../../numeric/expSumRoots.js';

/**
 * The output during one phase of one period as an exact function of the time tau since the phase
 * began: value(tau) = offset + sum_i gain[i] * expm1(rate[i] * tau), 0 <= tau <= length.
 * Writing it with expm1 keeps tiny deviations (ripple 1e-9 of the level) to full precision.
 */
export interface PhaseCurve {
  offset: number;
  gain: number[];
  readonly rate: readonly number[];
  length: number;
}

/** Extremes of a curve over its phase and where they happen. */
export interface CurveExtrema {
  max: number;
  tMax: number;
  min: number;
  tMin: number;
}

/**
 * Value of a phase curve at tau.
 *
 * Syntax: curveValue(curve, tau)
 * Example: curveValue({ offset: 1, gain: [-1], rate: [-1], length: 1 }, 0)  // 1
 */
export function curveValue(c: PhaseCurve, tau: number): number {
  let v = c.offset;
  for (let i = 0; i < c.gain.length; i++) v += c.gain[i] * Math.expm1(c.rate[i] * tau);
  return v;
}

/**
 * The turning points of a phase curve inside (0, length): the roots of its derivative
 * sum_i gain[i] rate[i] exp(rate[i] tau), found exactly by expSumRoots.
 *
 * Syntax: curveTurningPoints(curve)
 * Example: curveTurningPoints(oneStageCurve)  // [] (a single exponential is monotone)
 */
export function curveTurningPoints(c: PhaseCurve): number[] {
  if (c.gain.length < 2 || !(c.length > 0)) return [];
  if (c.gain.length === 2) {
    const t = twoTermTurningPoint(c);
    return t > 0 ? [t] : [];
  }
  const slope = zeros(c.gain.length);
  for (let i = 0; i < slope.length; i++) slope[i] = c.gain[i] * c.rate[i];
  return expSumRoots(slope, c.rate, c.length);
}

/**
 * Largest and smallest value of a phase curve over [0, length].
 *
 * Method: the extremes of a differentiable function on a closed interval lie at its ends or at
 * turning points (Fermat); the turning points are exact roots of the derivative (curveTurningPoints).
 *
 * Syntax: curveExtrema(curve)
 * Example: curveExtrema(curve).max - curveExtrema(curve).min  // the swing within the phase
 */
export function curveExtrema(c: PhaseCurve): CurveExtrema {
  if (c.gain.length <= 2) return smallCurveExtrema(c, { max: 0.5, tMax: 0.5, min: 0.5, tMin: 0.5 });
  let max = c.offset;
  let min = c.offset;
  let tMax = 0;
  let tMin = 0;
  if (c.length > 0) {
    const turns = curveTurningPoints(c);
    // the phase end, then each turning point
    for (let k = -1; k < turns.length; k++) {
      const t = k < 0 ? c.length : turns[k];
      const v = curveValue(c, t);
      if (v > max) {
        max = v;
        tMax = t;
      }
      if (v < min) {
        min = v;
        tMin = t;
      }
    }
  }
  return { max, tMax, min, tMin };
}

/**
 * curveExtrema written into `out` (returned), for callers that examine many curves in a row: no
 * allocation for one or two terms (the settling bound's period-by-period search).
 *
 * Syntax: curveExtremaInto(curve, out)
 * Example: curveExtremaInto(curve, scratch).max  // as curveExtrema(curve).max
 */
export function curveExtremaInto(c: PhaseCurve, out: CurveExtrema): CurveExtrema {
  if (c.gain.length <= 2) return smallCurveExtrema(c, out);
  const x = curveExtrema(c);
  out.max = x.max;
  out.tMax = x.tMax;
  out.min = x.min;
  out.tMin = x.tMin;
  return out;
}

/**
 * The one turning point a curve of at most two terms can have inside (0, length), or -1 (none, or
 * one term): curveTurningPoints without an array, for callers that examine many curves.
 *
 * Syntax: smallTurningPoint(curve)
 * Example: smallTurningPoint({ offset: 0, gain: [1, -3], rate: [-1, -2], length: 5 })  // ln(6) s
 */
export function smallTurningPoint(c: PhaseCurve): number {
  if (c.gain.length !== 2 || !(c.length > 0)) return -1;
  return twoTermTurningPoint(c);
}

/**
 * The turning point of a two-term curve inside (0, length), or -1: the root of
 * g0 r0 e^(r0 t) + g1 r1 e^(r1 t), t = ln(-g1 r1 / (g0 r0)) / (r0 - r1) (closed form; rates distinct).
 */
function twoTermTurningPoint(c: PhaseCurve): number {
  const d0 = c.gain[0] * c.rate[0];
  const d1 = c.gain[1] * c.rate[1];
  if (d0 === 0 || d1 === 0) return -1;
  const ratio = -d1 / d0;
  if (!(ratio > 0)) return -1;
  const t = Math.log(ratio) / (c.rate[0] - c.rate[1]);
  return t > 0 && t < c.length ? t : -1;
}

/** curveExtrema for one or two terms into `out`: ends and the closed-form turning point. */
function smallCurveExtrema(c: PhaseCurve, out: CurveExtrema): CurveExtrema {
  let max = c.offset;
  let min = c.offset;
  let tMax = 0;
  let tMin = 0;
  if (c.length > 0) {
    const end = curveValue(c, c.length);
    if (end > max) {
      max = end;
      tMax = c.length;
    }
    if (end < min) {
      min = end;
      tMin = c.length;
    }
    if (c.gain.length === 2) {
      const t = twoTermTurningPoint(c);
      if (t > 0) {
        const v = curveValue(c, t);
        if (v > max) {
          max = v;
          tMax = t;
        }
        if (v < min) {
          min = v;
          tMin = t;
        }
      }
    }
  }
  out.max = max;
  out.tMax = tMax;
  out.min = min;
  out.tMin = tMin;
  return out;
}
