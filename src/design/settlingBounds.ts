import type { DesignProblem } from './designProblem.js';
import { requiredAttenuation } from './requiredAttenuation.js';
import { settlingFloorPlan, steadyExcursionCap, type SettlingFloorPlan } from './settlingFloor.js';
import { threeStageSpread, threeStageTauMin } from './threeStageSpread.js';

/**
 * The pieces of the search's lower bounds on the settling time of one resistor choice
 * (any capacitors): settling >= tauSlow * factor - slack, and tauSlow >= ripple-implied minimum.
 */
export interface TupleBounds {
  /** Driver resistance the time constants are taken with (the smaller one), ohm. */
  driver: number;
  /** ln(...) multiplier of the slowest time constant (0: no bound). */
  factor: number;
  /** s subtracted from tau * factor (0 when the circuit is time-invariant). */
  slack: number;
  /** Lower bound on the slowest time constant of the fast ladder of any feasible capacitor choice, s. */
  tauMin: number;
  /** tauMin as budgeted walks take it (the older, for unequal drivers unproven bound; see tupleBounds), s. */
  budgetTauMin: number;
  /**
   * The resistor-only part of the proven settling floor (settlingFloor.ts), for the same limits,
   * or the plan the caller passed to tupleBounds (a scratch plan, or NO_FLOOR: floor 0).
   */
  floor: SettlingFloorPlan;
}

/**
 * The largest |H(j w)| at the PWM frequency (relative to DC full scale) that meets a ripple limit
 * near duty 1/2 and settles at all (ripple <= 2 band at every step's target duty): peak-to-peak >=
 * (pi/2) |fundamental| and the PWM fundamental is (2/pi)(high - low) sin(pi D) (Fourier series of a
 * pulse train, any signals textbook), so ripple >= (high - low) sin(pi D) |H(j w)|.
 *
 * Syntax: transferCap(problem, limits)
 * Example: transferCap(problem, problem.searchLimits)   // Infinity without a ripple limit or steps
 */
export function transferCap(problem: DesignProblem, limits: DesignProblem['limits']): number {
  const { dutyMin, dutyMax, steps, band, project } = problem;
  const span = Math.abs(project.pwm.high - project.pwm.low);
  let hStar = Infinity;
  if (limits.ripple !== undefined) {
    const sine = Math.sin(Math.PI * Math.min(dutyMax, Math.max(dutyMin, 0.5)));
    if (sine > 0) hStar = limits.ripple / (span * sine);
  }
  for (let j = 0; j < steps.length; j++) {
    const sine = Math.sin(Math.PI * steps[j][1]);
    if (sine > 0) hStar = Math.min(hStar, (2 * band) / (span * sine));
  }
  return hStar;
}

/**
 * The ln(...) factor of the settling bound: settled needs exp(-t / tau_slow) (S - 2P) <= band + P
 * for the slowest step, with S = g |to - from| (high - low) and P the steady excursion at the ends
 * (at most the band, or the ripple limit where it applies); 0 when no bound follows. Method and
 * proof: tupleBounds below.
 *
 * Syntax: settlingLogFactor(problem, limits, g)
 * Example: settlingLogFactor(problem, problem.searchLimits, 1)   // ln((S - 2P) / (band + P))
 */
export function settlingLogFactor(problem: DesignProblem, limits: DesignProblem['limits'], g: number): number {
  const { steps, band, project } = problem;
  const span = Math.abs(project.pwm.high - project.pwm.low);
  const ripple = limits.ripple ?? Infinity;
  // (plain loop, no closures or destructuring: this runs for every resistor tuple a search lists)
  let factor = 0;
  for (let j = 0; j < steps.length; j++) {
    const from = steps[j][0];
    const to = steps[j][1];
    const step = g * Math.abs(to - from) * span;
    const pTo = steadyExcursionCap(problem, ripple, to, true);
    const pFrom = steadyExcursionCap(problem, ripple, from, false);
    const ratio = (step - pTo - pFrom) / (band + pTo);
    if (ratio > 1) factor = Math.max(factor, Math.log(ratio));
  }
  return factor;
}

/**
 * Lower bounds for one resistor choice r (pin side first) that hold for every capacitor choice
 * that can meet the ripple limit and settle at all.
 *
 * Method (settling). For equal driver resistances the circuit is linear and time-invariant; its
 * transfer function is all-pole with real poles, H = g / prod(1 + s tau_i), so it is a cascade
 * of first-order sections with positive impulse responses. After a rising step the output is
 * v = v_ss(to) - z(t), z the response to the input difference of the periods before the step
 * (a positive pulse train), and z(t) >= z(0) exp(-t / tau_slow) (convolution of a positive
 * signal with the slowest section). Settled at t needs z(t) <= band + (largest excursion of the
 * steady state above its average) <= band + P, and z(0) >= S - 2P with S = g |to - from| (high -
 * low) and P = min(band, ripple limit): hence t_s >= tau_slow ln((S - 2P) / (band + P)).
 * (Falling steps by symmetry.) With unequal drivers the circuit switches between two linear
 * systems: the settling bound `factor` is applied with the smaller driver resistance (shorter time
 * constants) and a slack of two periods, without proof (in 1281 random feasible designs it still
 * had >= 10 % of room); only budgeted walks use it, the others the proven settlingFloor.ts.
 *
 * Method (ripple). A ripple limit (and settling at all: ripple <= 2 band at the target duty)
 * needs prod(1 + w^2 tau_i^2) >= Gamma over the time constants of the fast ladder (the smaller
 * driver resistance; for equal drivers the ladder itself), Gamma from the ripple floor
 * (requiredAttenuation.ts, proven for equal and unequal drivers; for equal drivers the
 * fundamental bound ripple >= (high - low) sin(pi D) |H(j w)|, so Gamma = (g / h*)^2 with h* of
 * transferCap). One stage: tau >= sqrt(Gamma - 1) / w. Two stages: with tau_a >= tau_b, tau_a +
 * tau_b = trace(G^-1 C) >= 2 sqrt(kappa tau_a tau_b), kappa = (G^-1)_11 (G^-1)_22 / det(G^-1), so
 * tau_b <= tau_a / phi^2 with phi = sqrt(kappa) + sqrt(kappa - 1), and (1 + u)(1 + u / phi^4) >=
 * Gamma with u = w^2 tau_a^2. Three stages:
 * (1 + u)^3 >= Gamma, and the sharper (1 + u)^2 (1 + u p*^2) >= Gamma, p* from the fast ladder's
 * pole spread (threeStageSpread.ts). budgetTauMin, for budgeted walks only, is the older form of
 * the same: Gamma from the slower driver's DC gain, the spread for equal drivers only, and for
 * unequal drivers 0.8 times that, without proof (in 1281 random feasible designs it kept >= 20 %
 * of room); replacing it would move the explanations' budget cut.
 *
 * `limits` (default problem.searchLimits) are the limits the capacitor choices must meet: the
 * trade-off walk (paretoSearch.ts) asks with each of its ripple limits in turn. Without `legacy`
 * (default true) the parts only budgeted walks read (factor, slack, budgetTauMin) are 0, not
 * computed: the other walks list and walk tuples by the proven floor alone.
 *
 * Syntax: tupleBounds(problem, r[, limits[, floor[, legacy]]])   (floor: the plan to carry; default made here)
 * Example: tupleBounds(problem, [4700, 47e3]).tauMin   // s
 */
export function tupleBounds(
  problem: DesignProblem,
  r: ArrayLike<number>,
  limits: DesignProblem['limits'] = problem.searchLimits,
  floor?: SettlingFloorPlan,
  legacy = true,
): TupleBounds {
  const { project, period, circuit } = problem;
  const { pwm } = project;
  // The load as the ladder sees it (none behind a follower after the last stage).
  const load = { resistance: circuit.loadResistance ?? undefined };
  const lti = pwm.driver.high === pwm.driver.low;
  const driver = Math.min(pwm.driver.high, pwm.driver.low);
  const n = r.length;
  let series = Math.max(pwm.driver.high, pwm.driver.low);
  for (let k = 0; k < n; k++) series += r[k];
  const gain = load.resistance === undefined ? 1 : load.resistance / (load.resistance + series);

  const factor = legacy ? settlingLogFactor(problem, limits, gain) : 0;
  const omega = (2 * Math.PI) / period;
  const loadR = load.resistance ?? null;
  // The fast ladder's least attenuation at the PWM frequency from the ripple limit and from
  // settling at all (requiredAttenuation.ts, proven for unequal drivers too).
  const tauMin = slowestFromAttenuation(requiredAttenuation(problem, r, limits), r, driver, loadR, omega, true);
  // Budgeted walks (the explanations' side searches) keep the bound they were tuned with, so their
  // cut stays where it was: the fundamental bound with the slower driver's gain, the pole spread
  // for equal drivers only, and for unequal drivers scaled by 0.8 without proof.
  const older = legacy ? slowestFromAttenuation((gain / transferCap(problem, limits)) ** 2, r, driver, loadR, omega, lti) : 0;
  const budgetTauMin = lti ? older : 0.8 * older;
  return { driver, factor, slack: lti || !legacy ? 0 : 2 * period, tauMin, budgetTauMin, floor: floor ?? settlingFloorPlan(problem, r, limits) };
}

/**
 * The least slowest time constant of a ladder with resistors `r` (pin side first, driven through
 * `driver`, load `loadR`) whose time constants satisfy prod(1 + w^2 tau_i^2) >= gamma: the
 * ripple part of tupleBounds (see its Method), with the three-stage pole spread when `spread`.
 */
function slowestFromAttenuation(gamma: number, r: ArrayLike<number>, driver: number, loadR: number | null, omega: number, spread: boolean): number {
  if (!(gamma > 1)) return 0;
  const n = r.length;
  let u: number;
  if (n === 1) u = gamma - 1;
  else if (n === 2) {
    const g1 = 1 / (r[0] + driver);
    const g2 = 1 / r[1];
    const gL = loadR === null ? 0 : 1 / loadR;
    const kappa = ((g1 + g2) * (g2 + gL)) / (g1 * g2 + g1 * gL + g2 * gL);
    const phi = Math.sqrt(kappa) + Math.sqrt(Math.max(0, kappa - 1));
    const q = phi ** -4;
    u = (2 * (gamma - 1)) / (1 + q + Math.sqrt((1 + q) ** 2 + 4 * q * (gamma - 1)));
  } else u = Math.cbrt(gamma) - 1;
  const tau = Math.sqrt(u) / omega;
  // Three stages: the ladder keeps its poles apart (threeStageSpread.ts).
  return n === 3 && spread ? Math.max(tau, threeStageTauMin(gamma, threeStageSpread(r, driver, loadR), omega)) : tau;
}
