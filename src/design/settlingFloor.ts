import { phi1 } from '../numeric/phi.js';
import type { DesignProblem } from './designProblem.js';
import { pinDriveStep } from './pinDriveStep.js';

/** One settling step of a floor plan (settlingFloorPlan): what the floor needs of it, V. */
export interface FloorStep {
  /** S': the step's size at the output of the comparison ladder (see settlingFloorPlan), V. */
  scaled: number;
  /** Lower bound on the output error at the step from the two steady states (equal drivers), V; -Infinity when none. */
  head: number;
  /** band + the largest steady excursion the target may keep and still settle, V. */
  threshold: number;
  /** ln(scaled / threshold) and ln(head / threshold) (-Infinity when head <= threshold), for the quick bounds. */
  logScaled: number;
  logHead: number;
  /** The band alone, V: what the error may reach where the target's steady orbit is at its far side (see settlingFloorPlan). */
  band: number;
  /** ln(scaled / band) and ln(head / band) (-Infinity when head <= band). */
  logScaledBand: number;
  logHeadBand: number;
}

/** The resistor-only part of the settling floor of one resistor choice (settlingFloorPlan). */
export interface SettlingFloorPlan {
  /** PWM period, s. */
  period: number;
  steps: readonly FloorStep[];
}

/**
 * The resistor-only part of a lower bound on the settling time of every ladder with series
 * resistors `r` (pin side first) in the problem's circuit, any capacitors, for equal or unequal
 * driver resistances; settlingFloor finishes it from the capacitors' two slowest time constants.
 * `limits` (default problem.searchLimits) bound the steady excursions a design may keep (its
 * ripple limit).
 *
 * Method (derived here; the comparison of cooperative systems is Kamke's theorem, W. A. Coppel,
 * "Stability and Asymptotic Behavior of Differential Equations", 1965, from memory). Let the duty
 * step from `from` to `to` (rising; falling by symmetry) at a period start, from the periodic
 * steady state at `from`. The error e(t) = x_to(t) - x(t) of the node voltages against the
 * steady orbit at `to` obeys e' = A(t) e after the step (both see the same phases), where A(t) is
 * the ladder's matrix -C^-1 G with the pin conductance of the phase, g_H = 1 / (R_dH + r1) or
 * g_L = 1 / (R_dL + r1). Every A(t) is Metzler and at least (entrywise) A_F, the matrix of the
 * fast ladder whose pin conductance is g_F = max(g_H, g_L). Before the step, the difference of
 * the two steady orbits obeys the same equation plus a node-1 forcing during the parts of each
 * period where `to` is high and `from` is low: (g_H (high - v1) + g_L (v1 - low)) / c1, at least
 * F / c1 with F its least value over the range every node keeps (between the levels and ground,
 * a passive network). So, by comparison, e(t) is at least the error of the fast ladder, an
 * ordinary time-invariant RC ladder, driven before the step by a pulse train of height F / g_F
 * and mean |to - from| F / g_F, whose output mean is S' = |to - from| (F / g_F) G_F (G_F the fast
 * ladder's DC gain). For equal drivers this is the plain step S = G |to - from| (high - low).
 *
 * That ladder's transfer function is all-pole with real poles, a cascade of first-order sections.
 * With tau_a >= tau_b its two slowest time constants, let y be the output of all sections but
 * the slowest, z the output. A first-order section of time constant tau fed a non-negative
 * periodic input of mean W never falls below W q(T / tau), q(x) = x / (e^x - 1) (the kernel is at
 * least e^(-(k + 1) T / tau) / tau over the k-th period back): so z(0) >= S' q_a and y(0) >=
 * S' q_b. After the step the input difference is 0, so y(t) >= y(0) e^(-t / tau_b) and
 *   z(t) >= z(0) e^(-t / tau_a) + y(0) tau_b / (tau_a - tau_b) (e^(-t / tau_a) - e^(-t / tau_b))
 * (variation of constants through the slowest section); for equal drivers z(0) is also at least
 * the head S - pTo - pFrom from the steady excursions. Settled at t needs z(t) <= band + pTo
 * (model.md: |v - average_to| <= band, and the steady orbit lies within its excursion pTo of its
 * average; a target whose excursion passes the band never settles), so the settling time is at
 * least the last t at which that lower bound of z(t) still exceeds band + pTo. Besides, once in
 * every period the steady orbit at `to` passes its far side (its minimum after a rising step, at
 * or below its average), where settled needs z <= band: the bound of z falls, so if it still
 * exceeds the band at the end of period k, the output leaves the band in period k, after kT;
 * hence the settling time is also at least the last t at which the bound exceeds the band alone,
 * less two periods (the whole period that t lies in and the one before it).
 *
 * With `into` (scratchFloorPlan) the plan is written into it and it is returned: no allocation.
 *
 * Syntax: settlingFloorPlan(problem, r[, limits[, into]])
 * Example: settlingFloor(settlingFloorPlan(problem, [470, 16e3]), 2.9e-4, 2.0e-4)   // s
 */
export function settlingFloorPlan(
  problem: DesignProblem,
  r: ArrayLike<number>,
  limits: DesignProblem['limits'] = problem.searchLimits,
  into?: ScratchFloorPlan,
): SettlingFloorPlan {
  const { circuit: k, steps, band, period } = problem;
  const { gF, gainF, drive: f } = comparisonLadder(problem, r);
  const lti = k.driverHigh === k.driverLow;
  const span = Math.abs(k.high - k.low);
  const ripple = limits.ripple ?? Infinity;
  // (plain loops, no closures, and with `into` no allocation: this runs for every resistor tuple)
  const out: FloorStep[] = into ? into.steps : [];
  let count = 0;
  for (let j = 0; j < steps.length; j++) {
    const from = steps[j][0];
    const to = steps[j][1];
    const dutyStep = Math.abs(to - from);
    const pTo = steadyExcursionCap(problem, ripple, to, true);
    const pFrom = steadyExcursionCap(problem, ripple, from, false);
    const scaled = (dutyStep * f * gainF) / gF;
    const head = lti ? gainF * dutyStep * span - pTo - pFrom : -Infinity;
    const threshold = band + pTo;
    // Steps with the same figures give the same floor (the default step: rising and falling).
    let same = false;
    for (let i = 0; i < count && !same; i++) same = out[i].scaled === scaled && out[i].head === head && out[i].threshold === threshold;
    if (same) continue;
    if (count < out.length) setFloorStep(out[count], scaled, head, threshold, band);
    else out.push(floorStep(scaled, head, threshold, band));
    count++;
  }
  out.length = count;
  if (!into) return { period, steps: out };
  into.period = period;
  return into;
}

/**
 * The largest steady excursion about its average (V) a design may keep at one end of a settling
 * step, as the settling bounds take it: at the target at most the band (a larger one never
 * settles), at the start the band too for the default full-range step (rising and falling: its
 * start is the other step's target), and at either end the ripple limit `ripple` where the duty
 * lies in the design range.
 * Shared by settlingFloorPlan and settlingLogFactor (settlingBounds.ts), whose proofs use the same P.
 *
 * Syntax: steadyExcursionCap(problem, ripple, duty, target)
 * Example: steadyExcursionCap(problem, problem.searchLimits.ripple ?? Infinity, 0.9, true)   // V
 */
export function steadyExcursionCap(problem: DesignProblem, ripple: number, duty: number, target: boolean): number {
  const limited = duty >= problem.dutyMin && duty <= problem.dutyMax ? ripple : Infinity;
  return Math.min(target || problem.defaultStep ? problem.band : Infinity, limited);
}

/** A plan settlingFloorPlan may overwrite (a search's scratch for plans it keeps only briefly). */
export interface ScratchFloorPlan {
  period: number;
  steps: FloorStep[];
}

/**
 * A plan with no steps: settlingFloor gives 0 with it, the trivial floor. Stands for a plan not
 * made (yet): a search makes a tuple's plan only when it walks that tuple.
 */
export const NO_FLOOR: SettlingFloorPlan = Object.freeze({ period: 0, steps: Object.freeze([]) as readonly FloorStep[] });

/** An empty scratch plan for settlingFloorPlan's `into`. */
export function scratchFloorPlan(): ScratchFloorPlan {
  return { period: 0, steps: [] };
}

/**
 * One step of a floor plan from its three figures (V), with the logarithms the quick bounds use.
 *
 * Syntax: floorStep(scaled, head, threshold, band)
 * Example: floorStep(2.5, -Infinity, 3e-3, 1.6e-3).logScaled   // ln(2.5 / 3e-3)
 */
export function floorStep(scaled: number, head: number, threshold: number, band: number): FloorStep {
  return setFloorStep({ scaled: 0, head: 0, threshold: 0, logScaled: 0, logHead: 0, band: 0, logScaledBand: 0, logHeadBand: 0 }, scaled, head, threshold, band);
}

/** floorStep written into an existing step. */
function setFloorStep(step: FloorStep, scaled: number, head: number, threshold: number, band: number): FloorStep {
  step.scaled = scaled;
  step.head = head;
  step.threshold = threshold;
  step.logScaled = Math.log(scaled / threshold);
  step.logHead = head > threshold ? Math.log(head / threshold) : -Infinity;
  step.band = band;
  step.logScaledBand = Math.log(scaled / band);
  step.logHeadBand = head > band ? Math.log(head / band) : -Infinity;
  return step;
}

/**
 * A lower bound (s) on the settling time of the ladder of `plan` (settlingFloorPlan) whose fast
 * ladder (the smaller driver resistance) has slowest time constant tauA and next tauB (0 for one
 * stage); it never falls when tauA or tauB grows (every term of the bound of z(t) grows), and both
 * grow with every capacitor (Courant-Fischer for C^-1 G), so a search may cut a column at the
 * first capacitor it rules out. With `ceiling`, it may stop refining once it knows which side of
 * `ceiling` the exact floor lies on (the value is a lower bound either way).
 *
 * Method: the bound of z(t) (settlingFloorPlan) is e^(-u) (z0 + y0 w(t)), u = t / tauA,
 * w(t) = u phi1(-t (1/tauB - 1/tauA)) (numeric/phi.ts) = (1 - e^(-t (1/tauB - 1/tauA))) tauB /
 * (tauA - tauB), falling in t; h(t) = ln(that / threshold) is concave (ln of a concave increasing
 * function, less a linear one). The root of h lies between t0 = tauA ln(z0 / threshold) (where the
 * single-exponential part alone meets the threshold: h(t0) >= 0) and a Newton step from any point
 * left of it (concavity: the tangent lies above h); the chord between such points lies below h, so
 * its root t_s has h(t_s) >= 0 and is a certified lower bound. A few rounds of Newton then chord
 * give a lower bound within 1e-9 of the root.
 *
 * Syntax: settlingFloor(plan, tauA, tauB[, ceiling])
 * Example: settlingFloor(settlingFloorPlan(problem, [470, 16e3]), 2.9e-4, 2.0e-4)   // s
 */
export function settlingFloor(plan: SettlingFloorPlan, tauA: number, tauB: number, ceiling = Infinity): number {
  const { period, steps } = plan;
  if (ceiling < Infinity) {
    // Quick bounds without exponentials: ln q(x) >= -x/2 - x^2/24 (x / (2 sinh(x/2)) >= e^(-x^2/24)),
    // so the single-exponential root t0 >= tauA ln(S' / threshold) - T/2 - T^2 / (24 tauA); and the
    // floor is at most tauA ln((S' + S' tauB / (tauA - tauB)) / threshold) <= tauA ln(S' / threshold)
    // + tauA tauB / (tauA - tauB) (ln(1 + u) <= u; z0 <= S', head <= S').
    let low = 0;
    let settled = true;
    for (let j = 0; j < steps.length; j++) {
      const s = steps[j];
      const lb = quickStepFloor(s, tauA, period);
      if (lb > ceiling) return lb;
      if (lb > low) low = lb;
      const tail = tauB > 0 ? (tauA * tauB) / (tauA - tauB) : 0;
      if (settled && !(tauA * s.logScaled + tail <= ceiling && tauA * s.logScaledBand + tail - 2 * period <= ceiling)) settled = false;
    }
    if (settled) return low;
  }
  const qa = q(period / tauA);
  const qb = tauB > 0 ? q(period / tauB) : 0;
  let best = 0;
  for (let j = 0; j < steps.length; j++) {
    const s = steps[j];
    const z0 = Math.max(s.head, s.scaled * qa);
    // (the band alone is at most the threshold: nothing crosses it when nothing crosses the band)
    if (!(z0 > s.band)) continue;
    let t = z0 > s.threshold ? crossing(z0, s.scaled * qb, s.threshold, tauA, tauB, ceiling) : 0;
    if (!(t > ceiling)) t = Math.max(t, crossing(z0, s.scaled * qb, s.band, tauA, tauB, ceiling + 2 * period) - 2 * period);
    if (t > best) {
      best = t;
      if (best > ceiling) return best;
    }
  }
  return best;
}

/**
 * The factor from a duty step to its size at the comparison ladder's output, S' = |to - from| *
 * this (V): F / g_F * G_F of settlingFloorPlan's Method, from the resistors alone.
 *
 * Syntax: floorStepScale(problem, r)
 * Example: floorStepScale(problem, [470, 16e3]) * 0.8   // V, S' of a 10 % -> 90 % step
 */
export function floorStepScale(problem: DesignProblem, r: ArrayLike<number>): number {
  const { gF, gainF, drive } = comparisonLadder(problem, r);
  return (drive * gainF) / gF;
}

/** The comparison ladder's figures settlingFloorPlan's Method uses (scratch, read at once). */
const COMPARISON = { gF: 0.5, gainF: 0.5, drive: 0.5 };

/**
 * The comparison ladder of settlingFloorPlan's Method for resistors r: its pin conductance g_F
 * (the larger one), its DC gain G_F to the output, and the pin's least drive step F
 * (pinDriveStep.ts), written into a scratch object.
 */
function comparisonLadder(problem: DesignProblem, r: ArrayLike<number>): typeof COMPARISON {
  const k = problem.circuit;
  const gF = Math.max(1 / (k.driverHigh + r[0]), 1 / (k.driverLow + r[0]));
  let rest = 0;
  for (let i = 1; i < r.length; i++) rest += r[i];
  const rL = k.loadResistance;
  COMPARISON.gF = gF;
  COMPARISON.gainF = rL === null ? 1 : rL / (rL + 1 / gF + rest);
  COMPARISON.drive = pinDriveStep(k, r[0]);
  return COMPARISON;
}

const POINT_PLAN: ScratchFloorPlan = { period: 0, steps: [floorStep(1, -Infinity, 1, 1)] };

/**
 * A lower bound (s) on the settling time of one design after one duty step, from its fast
 * ladder's two slowest time constants (tauA >= tauB) and its target's steady orbit: settlingFloor's
 * bound with that orbit's own excursions in place of their caps. After a rising step the output
 * is the target orbit less z(t); settled needs z <= band + `near` (the orbit's excursion on the
 * side the output comes from, `above` after a rising step) at every instant, and z <= band - `far`
 * where the orbit is at its far side, once a period (settlingFloorPlan's Method, with the actual
 * extreme in place of the average). `head`: a lower bound on z(0), for equal drivers the actual
 * output step at the period start |yStart(to) - yStart(from)| (the ladder is its own comparison
 * ladder), else -Infinity. Infinity when the far side leaves the band (never settles).
 *
 * Syntax: pointSettlingFloor(period, scaled, head, band, near, far, tauA, tauB[, ceiling])
 * Example: pointSettlingFloor(T, floorStepScale(problem, r) * 0.8, -Infinity, band, swing.above, swing.below, 3e-4, 1e-4)   // s
 */
export function pointSettlingFloor(period: number, scaled: number, head: number, band: number, near: number, far: number, tauA: number, tauB: number, ceiling = Infinity): number {
  if (!(band - far > 0)) return Infinity;
  POINT_PLAN.period = period;
  setFloorStep(POINT_PLAN.steps[0], scaled, head, band + near, band - far);
  return settlingFloor(POINT_PLAN, tauA, tauB, ceiling);
}

/**
 * The quick bound of settlingFloor for one step, without exponentials (see its Method): at most
 * the floor of that step for any tauB and any slowest time constant at least tauA, since each
 * term grows with tauA where it is positive.
 */
function quickStepFloor(s: FloorStep, tauA: number, period: number): number {
  const q = 0.5 * period + (period * period) / (24 * tauA);
  return Math.max(tauA * s.logHead, tauA * s.logScaled - q, tauA * s.logHeadBand - 2 * period, tauA * s.logScaledBand - q - 2 * period);
}

/**
 * A lower bound (s) on settlingFloor(plan, tauA', tauB) for every tauA' >= tauA and every tauB,
 * without exponentials or roots: settlingFloor's quick bound, less a room of 1e-9 of its terms'
 * size against rounding (its terms are differences of products, and the floor's own rounding
 * differs). 0 when tauA is not positive.
 *
 * Syntax: settlingFloorQuick(plan, tauA)
 * Example: settlingFloorQuick(settlingFloorPlan(problem, [470, 16e3]), 2.9e-4) <= settlingFloor(plan, 2.9e-4, 1e-4)   // true
 */
export function settlingFloorQuick(plan: SettlingFloorPlan, tauA: number): number {
  if (!(tauA > 0)) return 0;
  const { period, steps } = plan;
  let best = 0;
  for (let j = 0; j < steps.length; j++) best = Math.max(best, quickStepFloor(steps[j], tauA, period));
  const low = best - 1e-9 * (best + 5 * period + (period * period) / (12 * tauA));
  return low > 0 ? low : 0;
}

/** q(x) = x / (e^x - 1), the least a first-order section's periodic output keeps of its input mean (T / tau = x). */
function q(x: number): number {
  return 1 / phi1(x);
}

/**
 * A certified lower bound on the last t with e^(-t / tauA) (z0 + y0 w(t)) > threshold (see
 * settlingFloor), z0 > threshold, 0 <= y0 <= z0.
 */
function crossing(z0: number, y0: number, threshold: number, tauA: number, tauB: number, ceiling: number): number {
  const t0 = tauA * Math.log(z0 / threshold);
  if (!(y0 > 0) || !(tauB > 0) || t0 > ceiling) return t0;
  const rate = Math.max(0, 1 / tauB - 1 / tauA);
  const level = Math.log(threshold);
  // h(t) = -t / tauA + ln(z0 + y0 w(t)) - ln(threshold), w(t) = (t / tauA) phi1(-rate t),
  // w'(t) = e^(-rate t) / tauA (written out below: no closures in this hot path).
  // Above the root: the e^(-t / tauA) part with w at its supremum tauB / (tauA - tauB).
  if (rate > 0) {
    const top = tauA * Math.log((z0 + y0 / (tauA * rate)) / threshold);
    if (top <= ceiling && ceiling < Infinity) return t0;
  }
  let lo = t0;
  let mix = z0 + (y0 * lo * phi1(-rate * lo)) / tauA;
  let hLo = -lo / tauA + Math.log(mix) - level;
  if (!(hLo >= 0)) return t0;
  for (let round = 0; round < 6; round++) {
    const d = -1 / tauA + (y0 * Math.exp(-rate * lo)) / tauA / mix;
    if (!(d < 0)) break;
    const hi = lo - hLo / d;
    const mixHi = z0 + (y0 * hi * phi1(-rate * hi)) / tauA;
    const hHi = -hi / tauA + Math.log(mixHi) - level;
    if (hHi >= 0) {
      // rounding left the Newton point at or before the root: it is a lower bound itself
      lo = hi;
      hLo = hHi;
      mix = mixHi;
      continue;
    }
    const ts = lo + (hLo * (hi - lo)) / (hLo - hHi);
    const mixTs = z0 + (y0 * ts * phi1(-rate * ts)) / tauA;
    const hTs = -ts / tauA + Math.log(mixTs) - level;
    if (hTs >= 0 && ts > lo) {
      lo = ts;
      hLo = hTs;
      mix = mixTs;
    } else if (hTs > -1e-12 && ts > lo) {
      // At the root to rounding (h is a difference of logs near 0): a hair below it, and done.
      // (h falls at least as steeply as at lo, concave: the backoff covers the rounding)
      return Math.max(lo, ts + (2 * hTs) / -d - 1e-12 * ts);
    }
    if (lo > ceiling || (hi <= ceiling && ceiling < Infinity) || hi - lo <= 1e-9 * hi) break;
  }
  return lo;
}
