import { NUMERICAL_DOMAIN } from '../../engine/index.js';
import { formatEng } from '../../units/index.js';
import { DesignInputError } from '../designInputError.js';
import type { NetworkProblem } from './networkProblem.js';

/**
 * Refuse a version 1.1 design space that reaches circuits outside the engine's numerical domain
 * (numericalDomain.ts: time constants from 1e-9 to 1e12 PWM periods), as an input error naming
 * search, before any search.
 *
 * Method: a stage's own time constant (R C, or sqrt(r1 r2 c1 c2) for a Sallen-Key stage, as
 * periodic/networkDomain.ts checks it) grows with every part, so the smallest and the largest
 * parts of the ranges carry the extremes; the same for the second output's r c. The network's
 * eigen time constants are checked per design by the engine, which the search counts as ruled out.
 *
 * Syntax: checkNetworkSpaceDomain(problem)
 * Example: checkNetworkSpaceDomain(networkProblem(p))   // throws DesignInputError outside the domain
 */
export function checkNetworkSpaceDomain(problem: NetworkProblem): void {
  const { minTauPeriods, maxTauPeriods } = NUMERICAL_DOMAIN;
  const T = problem.base.period;
  const r = problem.rValues;
  const c = problem.cValues;
  for (const [what, tau] of [
    ['the smallest stage (smallest R and C)', r[0] * c[0]],
    ['the largest stage (largest R and C)', r[r.length - 1] * c[c.length - 1]],
  ] as const) {
    if (tau >= minTauPeriods * T && tau <= maxTauPeriods * T) continue;
    throw new DesignInputError(
      `${what} has a time constant of ${formatEng(tau, 's', 3)}, ${(tau / T).toPrecision(3)} PWM periods, outside the ${minTauPeriods.toExponential(0)} to ${maxTauPeriods.toExponential(0)} periods where dacsmith computes exactly; check the units of search.resistance and search.capacitance`,
      'search',
      problem.base.project.file,
    );
  }
}
