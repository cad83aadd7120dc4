/**
 * Closed forms of a first-order RC low-pass driven by a two-level PWM source, written independently
 * of the engine, for the chart-series tests.
 *
 * Circuit: source (level H or L behind driver resistance R_dH or R_dL), series R, capacitor C to
 * ground, optional load R_L across C. Thevenin's theorem (any circuits textbook) turns each phase
 * into a source k V behind R_th = (R + R_d) || R_L with k = R_L / (R + R_d + R_L) (k = 1 open), so
 * the capacitor charges as v(t) = v_inf + (v(0) - v_inf) e^{-t / tau}, tau = R_th C, in each phase
 * (first-order RC response, e.g. Alexander & Sadiku, Fundamentals of Electric Circuits, ch. 7
 * "First-order circuits": step response of an RC circuit). The periodic steady state is the fixed
 * point v0 of one period: with a = e^{-D T / tau_H}, b = e^{-(1 - D) T / tau_L},
 * v1 = vH + (v0 - vH) a and v0 = vL + (v1 - vL) b, so v0 = (vL (1 - b) + vH b (1 - a)) / (1 - a b).
 * At D = 1/2 with equal drivers this gives the textbook ripple (vH - vL) tanh(T / (4 tau)).
 */

export interface FirstOrderPwm {
  high: number;
  low: number;
  r: number;
  c: number;
  driverHigh: number;
  driverLow: number;
  /** Load resistance across C, ohm; undefined = open. */
  load?: number;
  period: number;
}

interface Phase {
  /** Level the capacitor tends to in this phase, V. */
  vInf: number;
  tau: number;
}

function phase(level: number, driver: number, o: FirstOrderPwm): Phase {
  const rs = o.r + driver;
  if (o.load === undefined) return { vInf: level, tau: rs * o.c };
  return { vInf: (level * o.load) / (rs + o.load), tau: ((rs * o.load) / (rs + o.load)) * o.c };
}

/** The closed-form periodic steady state at duty d: output at t (any t >= 0, t = 0 at a rising edge) and its average. */
export function firstOrderSteady(o: FirstOrderPwm, d: number) {
  const T = o.period;
  const h = phase(o.high, o.driverHigh, o);
  const l = phase(o.low, o.driverLow, o);
  const a = Math.exp((-d * T) / h.tau);
  const b = Math.exp((-(1 - d) * T) / l.tau);
  const v0 = (l.vInf * (1 - b) + h.vInf * b * (1 - a)) / (1 - a * b);
  const v1 = h.vInf + (v0 - h.vInf) * a;
  const at = (t: number): number => {
    const tau = t - Math.floor(t / T) * T;
    return tau <= d * T ? h.vInf + (v0 - h.vInf) * Math.exp(-tau / h.tau) : l.vInf + (v1 - l.vInf) * Math.exp(-(tau - d * T) / l.tau);
  };
  // Average: the integral of each exponential phase, (1/T) [vInf t_p + (v_start - vInf) tau (1 - e^{-t_p / tau})].
  const average = (h.vInf * d * T + (v0 - h.vInf) * h.tau * (1 - a) + l.vInf * (1 - d) * T + (v1 - l.vInf) * l.tau * (1 - b)) / T;
  return { v0, at, average };
}

/**
 * The closed-form response to a duty step from `from` to `to` at t = 0 (a rising edge), having been
 * in periodic steady state at `from`, for equal drivers: the deviation from the steady state at `to`
 * obeys the homogeneous first-order equation in both phases (same tau), so it decays as e^{-t/tau}.
 */
export function firstOrderStep(o: FirstOrderPwm, from: number, to: number) {
  if (o.driverHigh !== o.driverLow) throw new Error('firstOrderStep needs equal drivers (one tau)');
  const before = firstOrderSteady(o, from);
  const after = firstOrderSteady(o, to);
  const { tau } = phase(o.high, o.driverHigh, o);
  return (t: number) => after.at(t) + (before.v0 - after.v0) * Math.exp(-t / tau);
}

/** tau of the small-signal response with the driver at the mean of its two resistances, s. */
export function firstOrderTau(o: FirstOrderPwm): number {
  return phase(0, (o.driverHigh + o.driverLow) / 2, o).tau;
}
