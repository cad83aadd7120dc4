import type { Duties, Network } from '../../circuit/network.js';
import { networkCache, phaseFlows, type PhaseFlows } from './phaseFlows.js';
import { periodStart } from './periodStart.js';
import { pinSchedule } from './pinSchedule.js';
import { walkPeriod } from './trajectory.js';

/** The periodic steady state of a network at one pair of duties. */
export interface PeriodicOrbit {
  readonly duties: Duties;
  readonly phases: readonly PhaseFlows[];
  /** State at the period start, V. */
  readonly start: readonly number[];
  /** S = I - M, M the one-period map of deviations (kept for settling). */
  readonly S: readonly number[];
  /** Output at the period start, time average, extremes (V) and their instants (s from the period start). */
  readonly yStart: number;
  readonly average: number;
  readonly min: number;
  readonly max: number;
  readonly ripple: number;
  readonly tMin: number;
  readonly tMax: number;
}

/** Scratch of the average's loop (periodicOrbit does not re-enter). */
let AVERAGE_D: number[] = [];
let AVERAGE_G: number[] = [];

/**
 * Exact periodic steady state of a network (two PWM outputs, RC and Sallen-Key stages) at the given
 * duties: start state, time-average output and the extremes of the output over one period.
 *
 * Method: the period is a sequence of linear phases x' = A_p x + b_p (pinSchedule.ts), each solved
 * exactly, x(t) = x* + E(t)(x(0) - x*) with E = e^{tA}, K = I - E and J = int K (flow.ts). In
 * deviation form the period map's fixed point solves S (x_s - r) = sum_p P_p K_p (x*_p - r) with
 * S = I - E_N...E_1 accumulated as S_p = K_p + E_p S_{p-1} and P_p = E_N...E_{p+1}, r the
 * duty-weighted mean of the phase DC states; K is formed without cancellation, so the solve keeps
 * its accuracy when the time constants are 1e8 periods. The average adds t_p d_p + J_p (x*_p - x_p)
 * over the phases; the extremes come from the grid and the exactly located turning points of
 * trajectory.ts. This is the general route for every network; `steadyState` (steadyState.ts) is the
 * faster one for one output and RC stages, and the tests hold the two to each other.
 *
 * Without `withExtrema` only the start state and the average are exact (min = max = start); without
 * `withAverage` the average is NaN and the phases' integrals J are not formed (cheaper flows).
 *
 * Syntax: periodicOrbit(network, duties[, withExtrema, withAverage])
 * Example: periodicOrbit(n, { first: 0.5, second: null }).ripple   // V peak-to-peak
 */
export function periodicOrbit(network: Network, duties: Duties, withExtrema = true, withAverage = true): PeriodicOrbit {
  const { equations } = networkCache(network);
  const n = equations.n;
  const T = network.period;
  const phases = pinSchedule(network, duties).map((p) => phaseFlows(network, p.key, p.duration));
  const { start, S } = periodStart(
    phases.map((ph) => {
      const f = withAverage ? ph.full : ph.map;
      return { duration: ph.duration, xStar: ph.xStar, E: f.E, K: f.K };
    }),
    n,
    T,
  );
  const c = equations.output;
  // Extremes over the trajectory's points (trajectory.ts), the first of equal values; without
  // extrema the start alone (w = 0 at t = 0).
  let minW = 0;
  let minT = 0;
  let maxW = 0;
  let maxT = 0;
  if (withExtrema) {
    let first = true;
    walkPeriod(phases, c, start, new Array<number>(n).fill(0), equations.scale, false, (_p, _tau, t, _d, w) => {
      if (first || w < minW) {
        minW = w;
        minT = t;
      }
      if (first || w > maxW) {
        maxW = w;
        maxT = t;
      }
      first = false;
    });
  }
  // Average: integral of d over each phase, t_p d_p + J_p (x*_p - x_s - d_p); d and g in scratch
  // arrays (d_i is read before it is moved on, and g holds what the next row needs).
  let integral = withAverage ? 0 : NaN;
  if (withAverage) {
    if (AVERAGE_D.length !== n) {
      AVERAGE_D = new Array<number>(n).fill(0);
      AVERAGE_G = new Array<number>(n).fill(0);
    }
    const d = AVERAGE_D;
    const g = AVERAGE_G;
    for (let i = 0; i < n; i++) d[i] = 0;
    for (const ph of phases) {
      for (let i = 0; i < n; i++) g[i] = ph.xStar[i] - start[i] - d[i];
      const J = ph.full.J!;
      const K = ph.full.K;
      for (let i = 0; i < n; i++) {
        let jg = 0;
        let kg = 0;
        for (let j = 0; j < n; j++) {
          jg += J[i * n + j] * g[j];
          kg += K[i * n + j] * g[j];
        }
        integral += c[i] * (ph.duration * d[i] + jg);
        d[i] += kg;
      }
    }
  }
  let yStart = 0;
  for (let i = 0; i < n; i++) yStart += c[i] * start[i];
  return {
    duties,
    phases,
    start,
    S,
    yStart,
    average: yStart + integral / T,
    min: yStart + minW,
    max: yStart + maxW,
    ripple: maxW - minW,
    tMin: minT,
    tMax: maxT,
  };
}
