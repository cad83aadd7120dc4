/**
 * Solve a X = B for a small square matrix a (row-major n x n) and `columns` right-hand sides
 * (B row-major n x columns); returns X in the same layout, or null when a is singular to working
 * precision (a zero pivot).
 *
 * Method: Gaussian elimination with partial pivoting and back substitution (Golub & Van Loan,
 * "Matrix Computations", 4th ed., 2013, Algorithms 3.4.1 and 3.1.2).
 *
 * Syntax: solveSmall(a, n, b[, columns])
 * Example: solveSmall([2, 0, 0, 4], 2, [2, 2])  // [1, 0.5]
 */
export function solveSmall(a: ArrayLike<number>, n: number, b: ArrayLike<number>, columns = 1): number[] | null {
  const m = Array.from({ length: n * n }, (_, i) => a[i]);
  const x = Array.from({ length: n * columns }, (_, i) => b[i]);
  for (let k = 0; k < n; k++) {
    let p = k;
    for (let i = k + 1; i < n; i++) if (Math.abs(m[i * n + k]) > Math.abs(m[p * n + k])) p = i;
    const pivot = m[p * n + k];
    if (pivot === 0 || !Number.isFinite(pivot)) return null;
    if (p !== k) {
      for (let j = 0; j < n; j++) [m[k * n + j], m[p * n + j]] = [m[p * n + j], m[k * n + j]];
      for (let j = 0; j < columns; j++) [x[k * columns + j], x[p * columns + j]] = [x[p * columns + j], x[k * columns + j]];
    }
    for (let i = k + 1; i < n; i++) {
      const f = m[i * n + k] / pivot;
      if (f === 0) continue;
      for (let j = k + 1; j < n; j++) m[i * n + j] -= f * m[k * n + j];
      for (let j = 0; j < columns; j++) x[i * columns + j] -= f * x[k * columns + j];
    }
  }
  for (let k = n - 1; k >= 0; k--) {
    for (let j = 0; j < columns; j++) {
      let s = x[k * columns + j];
      for (let i = k + 1; i < n; i++) s -= m[k * n + i] * x[i * columns + j];
      x[k * columns + j] = s / m[k * n + k];
    }
  }
  return x;
}
