import { formatEng } from '../units/index.js';
import { resistiveDroop, resistiveDroopFloor } from './resistiveDroop.js';
import type { DesignProblem } from './designProblem.js';
import { settlingLogFactor, transferCap } from './settlingBounds.js';
import { threeStageTauMin } from './threeStageSpread.js';
import { threeStageSpreadFloor } from './threeStageSpreadFloor.js';
import type { ProvenMiss } from './types.js';

export type { ProvenMiss } from './types.js';

/** Relative allowance: a bound proves a miss only beyond the limit by this much (rounding). */
const REL = 1e-6;

/** Global bounds of one stage count, shared by the checks below. */
export interface SpaceBounds {
  stages: number;
  /** Largest total series resistance (driver + all R) any admissible design can have, ohm. */
  seriesMax: number;
  /** Smallest total series resistance of any admissible design, ohm. */
  seriesMin: number;
  /** Lower bound on the worst ripple of any design (equal drivers only, else 0), V. */
  rippleFloor: number;
  /** Lower bound on the settling time of any design that meets the ripple limit (equal drivers only, else 0), s. */
  settlingFloor: number;
}

/**
 * Limits that no `stages`-stage design of the problem's discrete space can meet, proven from the
 * circuit alone before any candidate is evaluated; an empty list proves nothing.
 *
 * Method, each a true bound on the engine's figure:
 * - Pin current (Ohm's law): the pin peak current is (high - low) / (driver + R1) with the smaller
 *   driver resistance, so R1 >= (high - low) / I_max - driver.
 * - Droop (DC current balance, resistiveDroop.ts; a load R_L, and the high level >= 0 with the
 *   high-side driver resistance >= the low-side one, or the mirror image): droop >= ideal S /
 *   (R_L + S), S = that side's driver + sum R, so S <= R_L droop / (ideal - droop).
 * - Gain (equal drivers, a load): the ladder is linear and time-invariant, the average output is
 *   g (low + D (high - low)) with g = R_L / (R_L + S), so the endpoint-fit gain error is 1 - g
 *   exactly, and S <= R_L gain / (1 - gain).
 * - Ripple (equal drivers). The transfer function of an unbuffered RC ladder is all-pole with real
 *   poles, H = g / prod(1 + s tau_i) (settlingBounds.ts), and the worst ripple is at least
 *   (high - low) sin(pi D) |H(j w)| at the duty D nearest 50 % (fundamental of the PWM wave,
 *   settlingBounds.ts). |1 + j w tau| <= 1 + w tau and, by the inequality of arithmetic and
 *   geometric means, prod(1 + w tau_i) <= (1 + w s / n)^n with s = sum tau_i = trace(G^-1 C) =
 *   sum_k C_k (G^-1)_kk. (G^-1)_kk is the resistance from node k to ground with the capacitors
 *   open: (driver + R_1..R_k) parallel (R_k+1..R_n + R_L) = x (S + R_L - x) / (S + R_L) with
 *   x <= S, at most rho(S) = S R_L / (S + R_L) when S <= R_L, else (S + R_L) / 4 (open output:
 *   S). So |H| >= g(S) / (1 + w (n C_max + C_load) rho(S) / n)^n, which falls as S grows: its
 *   value at seriesMax bounds every design.
 * - Settling (equal drivers): as tupleBounds (settlingBounds.ts), settling >= tau_slow
 *   ln((g step - P_to - P_from) / (band + P_to)) and prod(1 + w^2 tau_i^2) >= (g / h*)^2, h* the
 *   |H(j w)| the ripple limit (and settling at all: ripple <= 2 band at the target) allows;
 *   with every tau_i <= tau_slow, tau_slow >= sqrt((g / h*)^(2/n) - 1) / w. Three stages: the
 *   poles of a ladder stay apart, (sum tau)^3 >= 27 kappa_3 prod tau (threeStageSpread.ts), and
 *   tau_slow >= threeStageTauMin(gamma, kappa), which grows with kappa, taken at the smallest
 *   kappa_3 of any admissible resistor choice (threeStageSpreadFloor.ts). Both grow with g, so
 *   g(seriesMax) gives a bound for every design.
 * With unequal driver resistances the circuit is not time-invariant and only the pin-current and
 * droop bounds are claimed.
 *
 * Syntax: infeasibilityBounds(problem, stages)
 * Example: infeasibilityBounds(designProblem(p, 12), 2).misses[0].reason
 *          // 'ripple: any 2-stage design has at least 2.1 mV ...'
 */
export function infeasibilityBounds(problem: DesignProblem, stages: number): { misses: ProvenMiss[]; bounds: SpaceBounds } {
  const { project, limits, rValues, cValues, period, dutyMin, dutyMax } = problem;
  const { pwm } = project;
  // The load as the ladder sees it: none behind a follower (designProblem.ts `buffered`).
  const load = { resistance: problem.circuit.loadResistance ?? undefined, capacitance: problem.circuit.loadCapacitance };
  const span = Math.abs(pwm.high - pwm.low);
  const lti = pwm.driver.high === pwm.driver.low;
  const dLow = pwm.driver.low;
  const dMin = Math.min(pwm.driver.high, pwm.driver.low);
  const rMin = rValues[0];
  const rMax = rValues[rValues.length - 1];
  const cMax = cValues[cValues.length - 1];
  const loadR = load.resistance ?? null;
  const misses: ProvenMiss[] = [];
  const over = (value: number, limit: number) => value > limit * (1 + REL) + 1e-300;

  // Pin current: smallest admissible R1.
  let r1Min = rMin;
  if (limits.pinCurrent !== undefined) {
    const need = span / limits.pinCurrent - dMin;
    const first = rValues.find((r) => r >= need * (1 - REL));
    if (first === undefined) {
      misses.push({
        stages,
        limit: 'pin_current',
        reach: span / (dMin + rMax),
        limitValue: limits.pinCurrent,
        reason: `pin current: R1 must be at least ${formatEng(need, 'Ω')}; the largest resistor allowed (${formatEng(rMax, 'Ω')}) still draws ${formatEng(span / (dMin + rMax), 'A')}`,
      });
      r1Min = Infinity;
    } else r1Min = Math.max(rMin, first);
  }
  // Series resistance (driver + sum R), smallest and the caps from droop and gain.
  const seriesMin = dLow + (Number.isFinite(r1Min) ? r1Min : rMax) + (stages - 1) * rMin;
  let seriesMax = Math.max(pwm.driver.high, pwm.driver.low) + stages * rMax;
  const droopLimit = limits.droop;
  const droop = droopLimit !== undefined ? resistiveDroop(problem.circuit, dutyMin, dutyMax) : null;
  if (droopLimit !== undefined && droop !== null) {
    // The plan's driver may be the high-side one (resistiveDroop.ts); seriesMin counts the low side's.
    const shift = droop.driver - dLow;
    const series = shift === 0 ? seriesMin : seriesMin + shift;
    const floor = resistiveDroopFloor(droop, series);
    if (over(floor, droopLimit)) {
      misses.push({
        stages,
        limit: 'droop',
        reach: floor,
        limitValue: droopLimit,
        reason: `droop: with the load the smallest ${stages}-stage ladder (${formatEng(series, 'Ω')} in series, driver included) already loses ${formatEng(floor, 'V')}`,
      });
    }
    if (droop.ideal > droopLimit) {
      const cap = (droop.load * droopLimit) / (droop.ideal - droopLimit);
      seriesMax = Math.min(seriesMax, shift === 0 ? cap : cap - shift);
    }
  }
  const gainLimit = project.spec.gain;
  if (gainLimit !== undefined && lti && loadR !== null) {
    const error = 1 - loadR / (loadR + seriesMin);
    if (over(error, gainLimit)) {
      misses.push({
        stages,
        limit: 'gain',
        reach: error,
        limitValue: gainLimit,
        reason:
          `gain: the load and the smallest ${stages}-stage ladder (${formatEng(seriesMin, 'Ω')}) lose ${(100 * error).toPrecision(3)} % of full scale; ` +
          `a gain error of ${(100 * gainLimit).toPrecision(3)} % with the ${formatEng(loadR, 'Ω')} load allows at most ${formatEng((loadR * gainLimit) / (1 - gainLimit), 'Ω')} in series (driver included)`,
      });
    }
    if (gainLimit < 1) seriesMax = Math.min(seriesMax, (loadR * gainLimit) / (1 - gainLimit));
  }
  const feasibleSeries = seriesMax >= seriesMin * (1 - REL);

  let rippleFloor = 0;
  let settlingFloor = 0;
  if (lti && feasibleSeries) {
    const S = seriesMax;
    const g = loadR === null ? 1 : loadR / (loadR + S);
    const rho = loadR === null ? S : S <= loadR ? (S * loadR) / (S + loadR) : (S + loadR) / 4;
    const omega = (2 * Math.PI) / period;
    const s = (stages * cMax + load.capacitance) * rho;
    const hMin = g / (1 + (omega * s) / stages) ** stages;
    const dNear = Math.min(dutyMax, Math.max(dutyMin, 0.5));
    rippleFloor = span * Math.sin(Math.PI * dNear) * hMin;
    if (limits.ripple !== undefined && over(rippleFloor, limits.ripple)) {
      misses.push({
        stages,
        limit: 'ripple',
        reach: rippleFloor,
        limitValue: limits.ripple,
        reason: `ripple: at ${formatEng(1 / period, 'Hz')} no ${stages}-stage design with C up to ${formatEng(cMax, 'F')} and at most ${formatEng(S, 'Ω')} in series filters below ${formatEng(rippleFloor, 'V')}`,
      });
    }
    // Settling floor of the smallest slowest time constant the ripple limit allows.
    const gamma = (g / transferCap(problem, limits)) ** 2;
    let tauSlow = gamma > 1 ? Math.sqrt(gamma ** (1 / stages) - 1) / omega : 0;
    if (stages === 3 && gamma > 1) {
      // The three poles cannot coincide (threeStageSpread.ts): the least spread any admissible
      // resistor choice allows, and tauMin grows with the spread.
      const kappa = threeStageSpreadFloor(rValues, Number.isFinite(r1Min) ? r1Min : rMax, dLow, loadR, S);
      if (Number.isFinite(kappa)) tauSlow = Math.max(tauSlow, threeStageTauMin(gamma, kappa, omega));
    }
    settlingFloor = tauSlow * settlingLogFactor(problem, limits, g);
    if (limits.settlingTime !== undefined && over(settlingFloor, limits.settlingTime)) {
      misses.push({
        stages,
        limit: 'settling',
        reach: settlingFloor,
        limitValue: limits.settlingTime,
        reason: `settling: to meet the ripple limit a ${stages}-stage design needs a slowest time constant of at least ${formatEng(tauSlow, 's')}, so it settles in no less than ${formatEng(settlingFloor, 's')}`,
      });
    }
  }
  return { misses, bounds: { stages, seriesMax, seriesMin, rippleFloor, settlingFloor } };
}
