import type { Network } from '../../circuit/network.js';
import { formatEng } from '../../units/index.js';
import { NUMERICAL_DOMAIN, OutsideDomainError } from '../numericalDomain.js';
import { networkTimeConstants } from './networkTimeConstants.js';

/**
 * Refuse a network whose time constants lie outside the range in which the engine is exact
 * (numericalDomain.ts): each stage's own time constant (R C; sqrt(r1 r2 c1 c2) for a Sallen-Key
 * stage; r c of the injection path), then the network's slowest and fastest time constants.
 *
 * Syntax: checkNetworkDomain(network[, file])
 * Example: checkNetworkDomain(n, 'board.yaml')   // throws OutsideDomainError naming the stage
 */
export function checkNetworkDomain(network: Network, file?: string): void {
  const { minTauPeriods, maxTauPeriods } = NUMERICAL_DOMAIN;
  const T = network.period;
  const check = (key: string, what: string, tau: number) => {
    if (tau >= minTauPeriods * T && tau <= maxTauPeriods * T) return;
    throw new OutsideDomainError(
      `${what} = ${formatEng(tau, 's', 3)} is ${(tau / T).toPrecision(3)} PWM periods, outside ${minTauPeriods.toExponential(0)} to ` +
        `${maxTauPeriods.toExponential(0)} periods, where dacsmith computes exactly (check the units of the parts)`,
      key,
      file,
    );
  };
  network.stages.forEach((s, k) => {
    if (s.kind === 'rc') check(`filter.stages[${k}]`, `R${k + 1} C${k + 1}`, s.r * s.c);
    else check(`filter.stages[${k}]`, `stage ${k + 1}: sqrt(r1 r2 c1 c2)`, Math.sqrt(s.r1 * s.r2 * s.c1 * s.c2));
  });
  const second = network.second;
  if (second?.c != null) check('second_pwm.into', 'r c of the second output', second.r * second.c);
  const taus = networkTimeConstants(network);
  check('filter', 'the slowest time constant', taus[0]);
  check('filter', 'the fastest time constant', taus[taus.length - 1]);
}
