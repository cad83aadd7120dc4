import { type Vec, vec, zeros } from './smallLinear.js';
/**
 * Eigenvalues and eigenvectors of a small real symmetric matrix (row-major, order n, n <= 4).
 *
 * Method: cyclic Jacobi rotations (G. H. Golub & C. F. Van Loan, "Matrix Computations", 4th ed.,
 * section 8.5, Algorithms 8.5.1-8.5.3), accumulating the rotations into the eigenvector matrix.
 * Jacobi keeps small eigenvalues of well-scaled positive definite matrices to high relative
 * accuracy (Demmel & Veselic, SIAM J. Matrix Anal. Appl. 13(4), 1992), which matters because
 * the time constants of a ladder may span many decades.
 *
 * Syntax: symmetricEigen(a, n)
 * Example: symmetricEigen(vec(2, 1, 1, 2), 2)
 *          // { values: [1, 3], vectors: column j is the unit eigenvector of values[j] }
 */
export function symmetricEigen(a: ArrayLike<number>, n: number): { values: Vec; vectors: Vec } {
  if (n === 1) return { values: vec(a[0]), vectors: vec(1) };
  if (n === 2) return eigen2(a[0], a[1], a[3]);
  const m = zeros(n * n);
  for (let i = 0; i < n * n; i++) m[i] = a[i];
  const v = zeros(n * n);
  for (let i = 0; i < n; i++) v[i * n + i] = 1;
  for (let sweep = 0; sweep < 50; sweep++) {
    let rotated = false;
    for (let p = 0; p < n - 1; p++) {
      for (let q = p + 1; q < n; q++) {
        const apq = m[p * n + q];
        if (apq === 0) continue;
        const app = m[p * n + p];
        const aqq = m[q * n + q];
        // Below the rounding level of both diagonal entries: drop it (relative criterion).
        if (Math.abs(apq) <= 1e-19 * Math.sqrt(Math.abs(app * aqq))) {
          m[p * n + q] = 0;
          m[q * n + p] = 0;
          continue;
        }
        rotated = true;
        const zeta = (aqq - app) / (2 * apq);
        const t = (zeta >= 0 ? 1 : -1) / (Math.abs(zeta) + Math.sqrt(1 + zeta * zeta));
        const c = 1 / Math.sqrt(1 + t * t);
        const s = t * c;
        m[p * n + p] = app - t * apq;
        m[q * n + q] = aqq + t * apq;
        m[p * n + q] = 0;
        m[q * n + p] = 0;
        for (let k = 0; k < n; k++) {
          if (k !== p && k !== q) {
            const akp = m[k * n + p];
            const akq = m[k * n + q];
            const kp = c * akp - s * akq;
            const kq = s * akp + c * akq;
            m[k * n + p] = kp;
            m[p * n + k] = kp;
            m[k * n + q] = kq;
            m[q * n + k] = kq;
          }
          const vkp = v[k * n + p];
          const vkq = v[k * n + q];
          v[k * n + p] = c * vkp - s * vkq;
          v[k * n + q] = s * vkp + c * vkq;
        }
      }
    }
    if (!rotated) break;
  }
  // Ascending order (insertion sort of the indices).
  const order = zeros(n);
  for (let i = 0; i < n; i++) {
    let j = i;
    while (j > 0 && m[order[j - 1] * n + order[j - 1]] > m[i * n + i]) {
      order[j] = order[j - 1];
      j--;
    }
    order[j] = i;
  }
  const values = zeros(n);
  const vectors = zeros(n * n);
  for (let dst = 0; dst < n; dst++) {
    const src = order[dst];
    values[dst] = m[src * n + src];
    for (let k = 0; k < n; k++) vectors[k * n + dst] = v[k * n + src];
  }
  return { values, vectors };
}

/** Order 2: one Jacobi rotation is exact. */
function eigen2(app: number, apq: number, aqq: number): { values: Vec; vectors: Vec } {
  if (apq === 0) {
    return app <= aqq
      ? { values: vec(app, aqq), vectors: vec(1, 0, 0, 1) }
      : { values: vec(aqq, app), vectors: vec(0, 1, 1, 0) };
  }
  const zeta = (aqq - app) / (2 * apq);
  const t = (zeta >= 0 ? 1 : -1) / (Math.abs(zeta) + Math.sqrt(1 + zeta * zeta));
  const c = 1 / Math.sqrt(1 + t * t);
  const s = t * c;
  const l1 = app - t * apq; // eigenvector (c, -s)
  const l2 = aqq + t * apq; // eigenvector (s, c)
  return l1 <= l2
    ? { values: vec(l1, l2), vectors: vec(c, s, -s, c) }
    : { values: vec(l2, l1), vectors: vec(s, c, c, -s) };
}
