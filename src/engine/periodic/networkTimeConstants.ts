import type { Network } from '../../circuit/network.js';
import { generalEigenvalues } from '../../numeric/generalEigenvalues.js';
import { networkCache } from './phaseFlows.js';

/**
 * Time constants of a network's small-signal system (drivers at their mean), slowest first:
 * -1 / Re(lambda) for each eigenvalue of A (a complex pair gives its decay time twice).
 *
 * Method: eigenvalues of the state matrix by balancing, Hessenberg reduction and the double-shift
 * QR iteration (numeric/generalEigenvalues.ts).
 *
 * Syntax: networkTimeConstants(network)
 * Example: networkTimeConstants(oneRc)  // [R C]
 */
export function networkTimeConstants(network: Network): number[] {
  const { equations } = networkCache(network);
  const { re } = generalEigenvalues(equations.mean.A, equations.n);
  return re.map((r) => -1 / r).sort((a, b) => b - a);
}
