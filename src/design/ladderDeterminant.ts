import { modulus } from '../numeric/modulus.js';

/**
 * |det(G + j w C)| of an RC ladder's nodal matrix: G tridiagonal with conductances `g` = [pin side,
 * 1 / r2, ..., 1 / rn, load] (diagonal g_k + g_(k+1), off-diagonal -g_k), C diagonal with the
 * capacitors `c` and the load capacitance `loadC` at the last node; w = 0 gives det(G) (`c` unread).
 *
 * Method: the continuant recurrence of a tridiagonal matrix, D_k = (a_k + j w c_k) D_(k-1) - g_k^2
 * D_(k-2), D_(-1) = 0, D_0 = 1 (any linear algebra text), in complex arithmetic; the modulus
 * without overflow (numeric/modulus.ts). test/design/rippleFloor.test.ts holds it to mathjs det.
 *
 * Syntax: ladderDeterminant(g, c, loadC, w)
 * Example: ladderDeterminant([1e-3, 0], [1e-6], 0, 0)   // 1e-3 S (one stage, no load)
 *
 * See also: rippleFloor, rippleCeiling, requiredAttenuation
 */
export function ladderDeterminant(g: readonly number[], c: ArrayLike<number>, loadC: number, w: number): number {
  const n = g.length - 1;
  let re2 = 0;
  let im2 = 0;
  let re1 = 1;
  let im1 = 0;
  for (let i = 0; i < n; i++) {
    const a = g[i] + g[i + 1];
    const b = w === 0 ? 0 : w * (i === n - 1 ? c[i] + loadC : c[i]);
    const couple = i === 0 ? 0 : g[i] * g[i];
    const re = a * re1 - b * im1 - couple * re2;
    const im = a * im1 + b * re1 - couple * im2;
    re2 = re1;
    im2 = im1;
    re1 = re;
    im1 = im;
  }
  return modulus(re1, im1);
}
