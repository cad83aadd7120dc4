import { luFactor, luSolve } from '../numeric/lu.js';
import { zeros } from '../numeric/dense.js';

/**
 * |H(j w)| of a state-space model x' = A x + b u, y = c . x: H(s) = c (sI - A)^{-1} b.
 *
 * Method: the complex system (j w I - A) z = b solved as the real 2n x 2n system
 * [[-A, -w I], [w I, -A]] [Re z; Im z] = [b; 0] by LU with partial pivoting (numeric/lu.ts);
 * transfer function of a state-space model (common practice). At w = 0 this is |c A^{-1} b|.
 *
 * Syntax: transferMagnitude(A, b, c, n, w)
 * Example: transferMagnitude([-1], [1], [1], 1, 1)  // 1 / sqrt(2)
 */
export function transferMagnitude(A: readonly number[], b: readonly number[], c: readonly number[], n: number, w: number): number {
  const m = 2 * n;
  const big = zeros(m * m);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      big[i * m + j] = -A[i * n + j];
      big[(n + i) * m + n + j] = -A[i * n + j];
    }
    big[i * m + n + i] = -w;
    big[(n + i) * m + i] = w;
  }
  const rhs = zeros(m);
  for (let i = 0; i < n; i++) rhs[i] = b[i];
  const z = luSolve(luFactor(big, m), rhs);
  let re = 0;
  let im = 0;
  for (let i = 0; i < n; i++) {
    re += c[i] * z[i];
    im += c[i] * z[n + i];
  }
  return Math.hypot(re, im);
}
