/**
 * Eigenvalues of a real symmetric matrix (row-major, order n), ascending.
 *
 * Method: cyclic Jacobi rotations until the off-diagonal part is negligible (G. H. Golub &
 * C. F. Van Loan, "Matrix Computations", 4th ed., section 8.5.3, cyclic Jacobi; rotation angle
 * from Algorithm 8.5.1). Jacobi computes small eigenvalues of well-scaled positive definite
 * matrices to high relative accuracy (J. Demmel & K. Veselić, SIAM J. Matrix Anal. Appl. 13(4),
 * 1992), which matters here because time constants may span many decades.
 *
 * Syntax: symmetricEigenvalues(a, n)
 * Example: symmetricEigenvalues([2, 1, 1, 2], 2)  // [1, 3]
 */
export function symmetricEigenvalues(a: number[], n: number): number[] {
  const m = a.slice();
  for (let sweep = 0; sweep < 60; sweep++) {
    let off = 0;
    for (let p = 0; p < n; p++) for (let q = p + 1; q < n; q++) off += m[p * n + q] ** 2;
    if (off === 0) break;
    let rotated = false;
    for (let p = 0; p < n - 1; p++) {
      for (let q = p + 1; q < n; q++) {
        const apq = m[p * n + q];
        if (apq === 0) continue;
        const app = m[p * n + p];
        const aqq = m[q * n + q];
        // Skip entries below the rounding level of both diagonal entries (relative criterion).
        if (Math.abs(apq) <= 1e-18 * Math.sqrt(Math.abs(app * aqq))) {
          m[p * n + q] = 0;
          m[q * n + p] = 0;
          continue;
        }
        rotated = true;
        const tau = (aqq - app) / (2 * apq);
        const t = (tau >= 0 ? 1 : -1) / (Math.abs(tau) + Math.sqrt(1 + tau * tau));
        const c = 1 / Math.sqrt(1 + t * t);
        const s = t * c;
        for (let k = 0; k < n; k++) {
          const akp = m[k * n + p];
          const akq = m[k * n + q];
          m[k * n + p] = c * akp - s * akq;
          m[k * n + q] = s * akp + c * akq;
        }
        for (let k = 0; k < n; k++) {
          const apk = m[p * n + k];
          const aqk = m[q * n + k];
          m[p * n + k] = c * apk - s * aqk;
          m[q * n + k] = s * apk + c * aqk;
        }
        m[p * n + q] = 0;
        m[q * n + p] = 0;
      }
    }
    if (!rotated) break;
  }
  const values: number[] = [];
  for (let i = 0; i < n; i++) values.push(m[i * n + i]);
  return values.sort((x, y) => x - y);
}
