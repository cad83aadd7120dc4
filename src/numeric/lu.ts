import { zeros, type Matrix, type Vector } from './dense.js';

/**
 * The one LU factorization of the program, and its solves. Square matrices of order n are
 * row-major number[] (entry (i, j) at i * n + j), as in dense.ts.
 *
 * Method: Gaussian elimination with partial pivoting, P a = L U with L unit lower triangular
 * (G. H. Golub & C. F. Van Loan, "Matrix Computations", 4th ed., 2013, Algorithm 3.4.1), then
 * forward and back substitution (Algorithms 3.1.1 and 3.1.2).
 */

/** An LU factorization P a = L U, L unit lower triangular, both packed in `lu`. */
export interface LuFactors {
  n: number;
  lu: Matrix;
  /** Row i of the factored matrix is row piv[i] of a. */
  piv: number[];
}

/**
 * LU factorization with partial pivoting (Golub & Van Loan, Algorithm 3.4.1). Throws on an exactly
 * singular matrix; the engine's matrices are nonsingular by construction.
 *
 * Syntax: luFactor(a, n)
 * Example: luSolve(luFactor([2, 0, 0, 4], 2), [2, 2])  // [1, 0.5]
 */
export function luFactor(a: ArrayLike<number>, n: number): LuFactors {
  const f = factor(a, n, false);
  if (!f) throw new RangeError('singular matrix in luFactor');
  return f;
}

/**
 * Solve a X = B from the LU factors of a, for `columns` right-hand sides (B row-major n x columns,
 * one column by default); X in the same layout.
 *
 * Syntax: luSolve(factors, b[, columns])
 * Example: luSolve(luFactor([2, 0, 0, 4], 2), [2, 2])  // [1, 0.5]
 */
export function luSolve(f: LuFactors, b: ArrayLike<number>, columns = 1): Vector {
  const { n, lu, piv } = f;
  const x = zeros(n * columns);
  for (let c = 0; c < columns; c++) {
    for (let i = 0; i < n; i++) {
      let s = b[piv[i] * columns + c];
      for (let k = 0; k < i; k++) s -= lu[i * n + k] * x[k * columns + c];
      x[i * columns + c] = s;
    }
    for (let i = n - 1; i >= 0; i--) {
      let s = x[i * columns + c];
      for (let k = i + 1; k < n; k++) s -= lu[i * n + k] * x[k * columns + c];
      x[i * columns + c] = s / lu[i * n + i];
    }
  }
  return x;
}

/**
 * Solve a X = B (B row-major n x columns) with luFactor and luSolve, or null when a is singular to
 * working precision (a zero or non-finite pivot) instead of throwing.
 *
 * Syntax: solveLinear(a, n, b[, columns])
 * Example: solveLinear([2, 0, 0, 4], 2, [2, 2])  // [1, 0.5]
 *          solveLinear([1, 2, 2, 4], 2, [1, 1])  // null
 */
export function solveLinear(a: ArrayLike<number>, n: number, b: ArrayLike<number>, columns = 1): Vector | null {
  const f = factor(a, n, true);
  return f ? luSolve(f, b, columns) : null;
}

/**
 * Algorithm 3.4.1 on a copy of a; null on a zero pivot, and with `strict` on a NaN or infinite one
 * too. Without `strict` such a pivot goes through (luFactor's callers get NaN out, as they always
 * have); solveLinear's callers want to know.
 */
function factor(a: ArrayLike<number>, n: number, strict: boolean): LuFactors | null {
  const lu = zeros(n * n);
  for (let i = 0; i < n * n; i++) lu[i] = a[i];
  const piv = zeros(n);
  for (let i = 0; i < n; i++) piv[i] = i;
  for (let k = 0; k < n; k++) {
    let p = k;
    let big = Math.abs(lu[k * n + k]);
    for (let i = k + 1; i < n; i++) {
      const v = Math.abs(lu[i * n + k]);
      if (v > big) {
        big = v;
        p = i;
      }
    }
    if (big === 0 || (strict && !Number.isFinite(big))) return null;
    if (p !== k) {
      for (let j = 0; j < n; j++) {
        const t = lu[k * n + j];
        lu[k * n + j] = lu[p * n + j];
        lu[p * n + j] = t;
      }
      const t = piv[k];
      piv[k] = piv[p];
      piv[p] = t;
    }
    const pivot = lu[k * n + k];
    for (let i = k + 1; i < n; i++) {
      const m = lu[i * n + k] / pivot;
      lu[i * n + k] = m;
      if (m === 0) continue;
      for (let j = k + 1; j < n; j++) lu[i * n + j] -= m * lu[k * n + j];
    }
  }
  return { n, lu, piv };
}

/**
 * Order 2 without arrays: [a b; c d] x = [e; f] by the same elimination with partial pivoting
 * (rows swapped when |c| > |a|), x written into out[0], out[1]. For the hot two-stage path
 * (engine/modal/smallState.ts, behind the tolerance studies and the design search), which calls it
 * hundreds of thousands of times per search and keeps its numbers in locals; the arithmetic is
 * luFactor's and luSolve's, operation for operation. Returns false (out untouched) on a zero pivot.
 *
 * Syntax: solveTwoByTwo(a, b, c, d, e, f, out)
 * Example: solveTwoByTwo(2, 0, 0, 4, 2, 2, out)  // out = [1, 0.5]
 */
export function solveTwoByTwo(a: number, b: number, c: number, d: number, e: number, f: number, out: number[]): boolean {
  if (Math.abs(c) > Math.abs(a)) {
    let t = a;
    a = c;
    c = t;
    t = b;
    b = d;
    d = t;
    t = e;
    e = f;
    f = t;
  }
  if (a === 0) return false;
  const l = c / a;
  const pivot = d - l * b;
  if (pivot === 0) return false;
  const x1 = (f - l * e) / pivot;
  out[0] = (e - b * x1) / a;
  out[1] = x1;
  return true;
}
