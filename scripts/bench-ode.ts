/**
 * The reference route of the bench: the periodic steady-state ripple found the way a circuit
 * simulator finds it, by integrating the filter's differential equations period after period
 * with a general-purpose adaptive ODE solver until the start of a period repeats.
 */
import { createRequire } from 'node:module';
import type { Solver as OdexSolver } from 'odex';
import type { Ladder } from '../src/circuit/ladder.js';

// By file: tsx applies tsconfig `paths`, which map the bare name 'odex' to its type declaration.
const { Solver } = createRequire(import.meta.url)('odex/src/odex.js') as { Solver: typeof OdexSolver };

export interface OdeRippleOptions {
  /** ODEX relative and absolute tolerance (absolute in V) (default 1e-12 and 1e-12 V). */
  relativeTolerance?: number;
  absoluteTolerance?: number;
  /** Stop when the estimated distance to the periodic state is below this share of the ripple (default 1e-8). */
  settle?: number;
  /** Give up after this many periods (default 1e6). */
  maxPeriods?: number;
}

export interface OdeRipple {
  /** Output max - min over the last period, V. */
  ripple: number;
  min: number;
  max: number;
  /** Periods integrated from power-up until the periodic state was reached (plus the measured one). */
  periods: number;
  /** ODEX steps (accepted + rejected) and right-hand-side evaluations over the whole run. */
  steps: number;
  evaluations: number;
}

/**
 * Peak-to-peak output ripple in periodic steady state at duty `duty`, by time-stepping.
 *
 * Method: the node equations (Kirchhoff's current law at each capacitor; a buffered stage drives
 * the next one from an ideal follower; load resistance and capacitance on the last node) are
 * written here independently of src/circuit; time runs in periods. From power-up (all capacitors
 * at 0 V) each period is integrated as its high phase [0, D] and low phase [D, 1], restarting the
 * solver at each switching instant, with ODEX (Gragg-Bulirsch-Stoer extrapolation; E. Hairer,
 * S. P. Norsett, G. Wanner, "Solving Ordinary Differential Equations I", 2nd ed., Springer 1993,
 * section II.9; npm `odex`, a port of the Fortran original). The start of period k+1 is x_{k+1};
 * with d_k = max|x_{k+1} - x_k| and rho = d_k / d_{k-1} the contraction per period, the distance
 * to the periodic state is about d_k rho / (1 - rho) (geometric series), and the run stops once
 * that is below `settle` times the ripple of the latest period, in two periods running. A last period is then integrated
 * with dense output; in every solver step the output is sampled at 16 points and each interior
 * extremum refined by golden-section search on the dense output (Press et al., "Numerical
 * Recipes", 3rd ed., section 10.2); the phase ends count as candidates too.
 *
 * Syntax: odeRipple(ladder, duty[, { relativeTolerance, absoluteTolerance, settle, maxPeriods }])
 * Example: odeRipple(oneStage, 0.3).ripple   // 0.0227 (V), the same as steadyState(oneStage, 0.3).ripple
 */
export function odeRipple(ladder: Ladder, duty: number, options: OdeRippleOptions = {}): OdeRipple {
  if (!(duty > 0 && duty < 1)) throw new RangeError(`duty ${duty} must be inside (0, 1) for the ODE route`);
  const n = ladder.stages.length;
  const out = n - 1;
  const settle = options.settle ?? 1e-8;
  const maxPeriods = options.maxPeriods ?? 1e6;
  const solver = new Solver(n);
  solver.relativeTolerance = options.relativeTolerance ?? 1e-12;
  solver.absoluteTolerance = options.absoluteTolerance ?? 1e-12;
  solver.maxSteps = 1e6;
  const high = nodeRates(ladder, ladder.high, ladder.driverHigh);
  const low = nodeRates(ladder, ladder.low, ladder.driverLow);
  let steps = 0;
  let evaluations = 0;

  const period = (x0: number[], extremes?: Extremes): number[] => {
    solver.denseOutput = extremes !== undefined;
    let x = x0;
    for (const [rates, start, end] of [
      [high, 0, duty],
      [low, duty, 1],
    ] as const) {
      extremes?.consider(x[out]);
      const result = solver.solve(rates, start, x, end, extremes ? extremes.watch(out) : undefined);
      steps += result.nStep;
      evaluations += result.nEval;
      x = result.y;
      extremes?.consider(x[out]);
    }
    return x;
  };

  let x = new Array<number>(n).fill(0);
  let previousChange = Infinity;
  let periods = 0;
  let settledPeriods = 0;
  for (;;) {
    const startOfPeriod = x;
    const watch = new Extremes();
    x = period(startOfPeriod, watch);
    periods++;
    const change = Math.max(...x.map((v, i) => Math.abs(v - startOfPeriod[i])));
    const rho = change / previousChange;
    previousChange = change;
    const distance = rho < 1 ? (change * rho) / (1 - rho) : Infinity;
    const ripple = watch.max - watch.min;
    // Twice in a row, so that one lucky ratio of changes does not end the run.
    settledPeriods = distance <= settle * ripple || change === 0 ? settledPeriods + 1 : 0;
    if (settledPeriods >= 2) break;
    if (periods >= maxPeriods) throw new Error(`no periodic state after ${periods} periods`);
  }
  const last = new Extremes();
  period(x, last);
  periods++;
  return { ripple: last.max - last.min, min: last.min, max: last.max, periods, steps, evaluations };
}

/** Running min and max of the output, fed by phase ends and by ODEX dense output. */
class Extremes {
  min = Infinity;
  max = -Infinity;

  consider(v: number): void {
    if (v < this.min) this.min = v;
    if (v > this.max) this.max = v;
  }

  /** An ODEX output function that samples component `c` inside every step and refines extrema. */
  watch(c: number) {
    return (_n: number, xOld: number, x: number, _y: number[], dense?: (c: number, x: number) => number): void => {
      if (!dense || !(x > xOld)) return;
      const samples = 16;
      const t = Array.from({ length: samples + 1 }, (_, i) => xOld + ((x - xOld) * i) / samples);
      const v = t.map((ti) => dense(c, ti));
      for (let i = 1; i < samples; i++) {
        if (v[i] >= v[i - 1] && v[i] >= v[i + 1]) this.consider(goldenExtreme((s) => dense(c, s), t[i - 1], t[i + 1], 1));
        if (v[i] <= v[i - 1] && v[i] <= v[i + 1]) this.consider(goldenExtreme((s) => dense(c, s), t[i - 1], t[i + 1], -1));
      }
      for (const vi of v) this.consider(vi);
    };
  }
}

/** Largest (sign 1) or smallest (sign -1) value of f on [a, b] by golden-section search. */
function goldenExtreme(f: (t: number) => number, a: number, b: number, sign: 1 | -1): number {
  const g = (Math.sqrt(5) - 1) / 2;
  let lo = a;
  let hi = b;
  let t1 = hi - g * (hi - lo);
  let t2 = lo + g * (hi - lo);
  let f1 = sign * f(t1);
  let f2 = sign * f(t2);
  for (let i = 0; i < 60 && hi - lo > 1e-13; i++) {
    if (f1 > f2) {
      hi = t2;
      t2 = t1;
      f2 = f1;
      t1 = hi - g * (hi - lo);
      f1 = sign * f(t1);
    } else {
      lo = t1;
      t1 = t2;
      f1 = f2;
      t2 = lo + g * (hi - lo);
      f2 = sign * f(t2);
    }
  }
  return sign * Math.max(f1, f2);
}

/**
 * dx/dt of the node voltages, in V per period, with the pin at `pin` behind `driver` (Kirchhoff's
 * current law at each capacitor node).
 */
function nodeRates(l: Ladder, pin: number, driver: number): (t: number, x: number[]) => number[] {
  const n = l.stages.length;
  const last = l.stages[n - 1];
  return (_t, x) => {
    const dx = new Array<number>(n);
    for (let k = 0; k < n; k++) {
      const source = k === 0 ? pin : x[k - 1];
      let current = (source - x[k]) / (l.stages[k].r + (k === 0 ? driver : 0));
      if (k < n - 1 && !l.stages[k].buffered) current -= (x[k] - x[k + 1]) / l.stages[k + 1].r;
      let capacitance = l.stages[k].c;
      if (k === n - 1 && !last.buffered) {
        if (l.loadResistance !== null) current -= x[k] / l.loadResistance;
        capacitance += l.loadCapacitance;
      }
      dx[k] = (current / capacitance) * l.period;
    }
    return dx;
  };
}
