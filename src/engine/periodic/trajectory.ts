import { brentRoot } from '../../numeric/brentRoot.js';
import { dot, rowDot } from '../../numeric/dense.js';
import { flow } from '../flow.js';
import type { PhaseFlows } from './phaseFlows.js';
import { outputSeries, seriesRate, seriesStep } from './phaseSeries.js';

/**
 * One instant of a period trajectory: where it is (phase, time in the phase, time in the period),
 * the state as a deviation from a reference state, and the output deviation w = c . d.
 */
export interface TrajectoryPoint {
  readonly phase: number;
  readonly tau: number;
  readonly t: number;
  readonly d: readonly number[];
  readonly w: number;
}

/**
 * The output over one period from a start state, as the ordered list of the grid points and the
 * output's turning points between them; between two consecutive points the output is monotone
 * (turning points inside a grid step are located as sign changes of the exact output rate and
 * refined by Brent's root finder on that rate).
 *
 * States are deviations d = x - ref from a reference state `ref` (the periodic start state when
 * the caller computes ripple), so that a ripple 1e-9 of the level keeps its relative accuracy.
 *
 * Method: exact flows per grid step, x(tau + h) = x(tau) + K(h) (x* - x(tau)) (flow.ts); the output
 * rate -(c^T A)(x* - x) is exact at every point. Inside a step with h ||D A D^{-1}|| <= 1 the rate
 * and the state at the turning point come from the Taylor series of e^{sA} (phaseSeries.ts; the
 * remainder is below 2e-20 of the leading scale), so the root finder needs no matrix exponential
 * per iteration; longer steps evaluate e^{sA} (flow.ts) per iteration.
 *
 * Syntax: periodTrajectoryPoints(phases, output, ref, d0, scale)
 * Example: periodTrajectoryPoints(flows, c, xs, zeros(n), scale).map((p) => p.w)
 * See also: walkPeriod
 */
export function periodTrajectoryPoints(
  phases: readonly PhaseFlows[],
  output: readonly number[],
  ref: readonly number[],
  d0: readonly number[],
  scale: readonly number[],
): TrajectoryPoint[] {
  const points: TrajectoryPoint[] = [];
  walkPeriod(phases, output, ref, d0, scale, true, (phase, tau, t, d, w) => points.push({ phase, tau, t, d, w }));
  return points;
}

/** Scratch of walkPeriod, n long (g goes on to the series of phaseSeries.ts, which map over it). */
let WALK_G: number[] = [];
let WALK_TARGET: number[] = [];

/**
 * The points of periodTrajectoryPoints handed to `visit` in order, without a list: `visit(phase,
 * tau, t, d, w)`. With `fresh` every point's state d is an array of its own (the caller may keep
 * it); without, the grid points' states alternate between two arrays that later steps overwrite
 * (for a caller that reads d at once, or only w and t: the periodic orbit's extremes). The same
 * operations either way, so the same numbers.
 *
 * Syntax: walkPeriod(phases, output, ref, d0, scale, fresh, visit)
 * Example: walkPeriod(flows, c, xs, zeros(n), scale, false, (p, tau, t, d, w) => { peak = Math.max(peak, w); })
 * See also: periodTrajectoryPoints
 */
export function walkPeriod(
  phases: readonly PhaseFlows[],
  output: readonly number[],
  ref: readonly number[],
  d0: readonly number[],
  scale: readonly number[],
  fresh: boolean,
  visit: (phase: number, tau: number, t: number, d: readonly number[], w: number) => void,
): void {
  const n = ref.length;
  let d = [...d0];
  let spare = fresh ? d : new Array<number>(n).fill(0);
  let t0 = 0;
  visit(0, 0, 0, d, dot(output, d));
  // g = x* - x as a deviation (target - d), reused from step to step; both in scratch arrays
  // (walkPeriod does not re-enter: refineTurning reads g at once).
  if (WALK_G.length !== n) {
    WALK_G = new Array<number>(n).fill(0);
    WALK_TARGET = new Array<number>(n).fill(0);
  }
  const g = WALK_G;
  const target = WALK_TARGET;
  for (let p = 0; p < phases.length; p++) {
    const ph = phases[p];
    for (let i = 0; i < n; i++) target[i] = ph.xStar[i] - ref[i];
    const outputRate = ph.outputRate;
    let tau = 0;
    let rate = 0;
    for (let i = 0; i < n; i++) rate -= outputRate[i] * (target[i] - d[i]);
    for (const step of ph.steps) {
      for (let i = 0; i < n; i++) g[i] = target[i] - d[i];
      const K = step.K;
      const next = fresh ? new Array<number>(n) : spare;
      let nextRate = 0;
      let w = 0;
      for (let i = 0; i < n; i++) {
        let kg = 0;
        for (let j = 0; j < n; j++) kg += K[i * n + j] * g[j];
        const s = d[i] + kg;
        next[i] = s;
        nextRate -= outputRate[i] * (target[i] - s);
        w += output[i] * s;
      }
      if (rate * nextRate < 0) {
        const turning = refineTurning(ph, g, d, rate, nextRate, step.t, output, scale, n);
        visit(p, tau + turning.delta, t0 + tau + turning.delta, turning.d, dot(output, turning.d));
      }
      tau += step.t;
      spare = d;
      d = next;
      rate = nextRate;
      visit(p, tau, t0 + tau, d, w);
    }
    t0 += ph.duration;
  }
}

/**
 * The output a time delta after a trajectory point inside its phase (the series of e^{sA} when
 * delta is short against every mode, else the exact flow).
 *
 * Syntax: advanceInPhase(phase, ref, point, delta, output, scale)
 */
export function advanceInPhase(
  ph: PhaseFlows,
  ref: readonly number[],
  d: readonly number[],
  delta: number,
  output: readonly number[],
  scale: readonly number[],
): number {
  const n = ref.length;
  const g = ph.xStar.map((v, i) => v - ref[i] - d[i]);
  let w = 0;
  if (delta * ph.rate <= 1) {
    // short against every mode: the series of e^{sA} (phaseSeries.ts)
    const change = seriesStep(ph, g, delta, output, scale);
    for (let i = 0; i < n; i++) w += output[i] * (d[i] + change[i]);
    return w;
  }
  const f = flow(ph.A, n, delta, false, scale);
  for (let i = 0; i < n; i++) w += output[i] * (d[i] + rowDot(f.K, i, g, n));
  return w;
}

function refineTurning(
  ph: PhaseFlows,
  g: readonly number[],
  d: readonly number[],
  rateA: number,
  rateB: number,
  h: number,
  output: readonly number[],
  scale: readonly number[],
  n: number,
): { delta: number; d: number[] } {
  if (h * ph.rate <= 1) {
    // The step is short against every mode: the rate and the state from the series of e^{sA}.
    const b = outputSeries(ph, g, output, scale);
    const delta = brentRoot((s) => seriesRate(b, s), 0, h, h * 1e-13, rateA, rateB);
    const change = seriesStep(ph, g, delta, output, scale);
    return { delta, d: d.map((v, i) => v + change[i]) };
  }
  // Rate at delta: -(c^T A) E(delta) g, since x* - x(delta) = E(delta) g.
  const rateAt = (delta: number) => {
    const f = flow(ph.A, n, delta, false, scale);
    let s = 0;
    for (let i = 0; i < n; i++) s -= ph.outputRate[i] * rowDot(f.E, i, g, n);
    return s;
  };
  const delta = brentRoot(rateAt, 0, h, h * 1e-13, rateA, rateB);
  const f = flow(ph.A, n, delta, false, scale);
  return { delta, d: d.map((v, i) => v + rowDot(f.K, i, g, n)) };
}

