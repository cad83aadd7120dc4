import type { Ladder } from '../circuit/ladder.js';
import { prepare } from './prepare.js';
import { symmetricEigen } from '../numeric/symmetricEigen.js';

/**
 * Time constants of the filter with the driver at the mean of its high and low resistances, s,
 * slowest first: -1/lambda for each eigenvalue lambda of the state matrix A.
 *
 * Method: A is block lower triangular over the follower-free sections, so its eigenvalues are
 * those of the diagonal blocks. On a section A = -C^{-1} G with G symmetric (nodal conductance
 * matrix) and C diagonal, similar to the symmetric S = C^{-1/2} G C^{-1/2}, whose entries are
 * S_ij = -A_ij sqrt(C_i / C_j); its eigenvalues come from cyclic Jacobi (symmetricEigen.ts).
 * All are real and positive: the circuit is passive RC (common practice).
 *
 * Syntax: timeConstants(ladder)
 * Example: timeConstants(oneStage)  // [(R + driver) * C] with an open output
 */
export function timeConstants(ladder: Ladder): number[] {
  const p = prepare(ladder);
  if (!p.timeConstants) {
    const { A } = p.system.mean;
    const { n, capacitance: cap, sections } = p.system;
    const taus: number[] = [];
    for (const { first, last } of sections) {
      const m = last - first + 1;
      const s: number[] = new Array<number>(m * m).fill(0);
      for (let i = 0; i < m; i++) {
        for (let j = 0; j < m; j++) {
          const gi = first + i;
          const gj = first + j;
          s[i * m + j] = -A[gi * n + gj] * Math.sqrt(cap[gi] / cap[gj]);
        }
      }
      // Average the two halves: they agree to rounding, and Jacobi wants exact symmetry.
      for (let i = 0; i < m; i++) {
        for (let j = i + 1; j < m; j++) {
          const v = 0.5 * (s[i * m + j] + s[j * m + i]);
          s[i * m + j] = v;
          s[j * m + i] = v;
        }
      }
      for (const lambda of symmetricEigen(s, m).values) taus.push(1 / lambda);
    }
    p.timeConstants = taus.sort((x, y) => y - x);
  }
  return p.timeConstants.slice();
}
