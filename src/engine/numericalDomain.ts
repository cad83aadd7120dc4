import type { Ladder } from '../circuit/ladder.js';
import { formatEng, InputError } from '../units/index.js';
import { timeConstants } from './timeConstants.js';

/**
 * The range in which the engine's figures are exact, in PWM periods T: every stage product
 * R_k C_k and every time constant of the ladder within [MIN_TAU_PERIODS T, MAX_TAU_PERIODS T].
 * The upper end keeps every settling horizon (about tau ln(full scale / band), at most ~50 tau for
 * 32 bits) far below the 2^62 periods the settling search can count and keeps exp(-T/tau) far from
 * 1 in double precision; the engine was checked against 40- and 80-digit references from
 * tau/T = 1e-2 to 2e8. The lower end keeps the nodal matrices of a cascade well inside double
 * precision (a 1 mohm / 1 fF stage beside a 1 Tohm / 10 F one makes them singular).
 */
export const NUMERICAL_DOMAIN = { minTauPeriods: 1e-9, maxTauPeriods: 1e12 } as const;

/** Engineering form where a prefix reads well (ps to ks), else powers of ten (no 'Ts'). */
const seconds = (t: number): string => (t >= 1e-12 && t < 1e4 ? formatEng(t, 's', 3) : `${t.toPrecision(3)} s`);

/** A circuit outside the range the engine computes exactly (exit 2, with the key and numbers). */
export class OutsideDomainError extends InputError {
  override name = 'OutsideDomainError';
}

/**
 * Refuse a ladder whose time constants lie outside NUMERICAL_DOMAIN, naming the stage, its time
 * constant and how many PWM periods that is, rather than return a figure that is not exact.
 *
 * Method: first each stage product R_k C_k (the last with the load capacitance), which needs no
 * linear algebra and catches the wildly spread cascades that make the nodal matrix singular; then
 * the ladder's eigen time constants (timeConstants.ts).
 *
 * Syntax: checkNumericalDomain(ladder[, file])
 * Example: checkNumericalDomain({ ...ladder, stages: [{ r: 1e12, c: 10, buffered: false }] }, 'p.yaml')
 *          // throws OutsideDomainError: p.yaml: filter.stages[0]: R1 C1 = 10 Ts is 2e17 PWM periods ...
 */
export function checkNumericalDomain(ladder: Ladder, file?: string): void {
  const { period } = ladder;
  const { minTauPeriods, maxTauPeriods } = NUMERICAL_DOMAIN;
  const refuse = (key: string, what: string, tau: number): never => {
    const periods = tau / period;
    const side = periods > maxTauPeriods ? `more than ${maxTauPeriods.toExponential(0)}` : `less than ${minTauPeriods.toExponential(0)}`;
    throw new OutsideDomainError(
      `${what} = ${seconds(tau)} is ${periods.toPrecision(3)} PWM periods, ${side}; ` +
        `dacsmith computes exactly for time constants from ${minTauPeriods.toExponential(0)} to ${maxTauPeriods.toExponential(0)} periods ` +
        '(check the units of the parts: is a prefix off by a factor of 1000 or more?)',
      key,
      file,
    );
  };
  const inside = (tau: number) => tau >= minTauPeriods * period && tau <= maxTauPeriods * period;
  ladder.stages.forEach((s, k) => {
    const c = s.c + (k === ladder.stages.length - 1 ? ladder.loadCapacitance : 0);
    const tau = s.r * c;
    if (!inside(tau)) refuse(`filter.stages[${k}]`, `R${k + 1} C${k + 1}`, tau);
  });
  const taus = timeConstants(ladder);
  const slowest = taus[0];
  const fastest = taus[taus.length - 1];
  if (!inside(slowest)) refuse('filter', 'the slowest time constant', slowest);
  if (!inside(fastest)) refuse('filter', 'the fastest time constant', fastest);
}
