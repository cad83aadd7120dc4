import { zeros } from './zeros.js';

/** Eigenvalues and orthonormal eigenvectors of a small symmetric matrix. */
export interface SymmetricEigen {
  /** Eigenvalues, in no particular order. */
  values: number[];
  /** Row-major n x n; column j is the unit eigenvector of values[j]. */
  vectors: number[];
}

/**
 * Eigen-decomposition of a real symmetric n x n matrix (row-major), a = V diag(values) V^T.
 *
 * Method: cyclic Jacobi rotations (Golub & Van Loan, "Matrix Computations", 4th ed., 2013,
 * Algorithm 8.5.3). An off-diagonal entry is dropped once it is below eps sqrt(|a_pp a_qq|), the
 * criterion of Demmel & Veselic ("Jacobi's method is more accurate than QR", SIAM J. Matrix Anal.
 * Appl. 13(4), 1992) that keeps even tiny eigenvalues to high relative accuracy: the slow modes of
 * a stiff ladder are the ones settling depends on.
 *
 * Syntax: symmetricEigen(a, n)
 * Example: symmetricEigen([2, 1, 1, 2], 2).values  // [1, 3]
 */
export function symmetricEigen(a: ArrayLike<number>, n: number): SymmetricEigen {
  if (n === 2) return twoByTwo(a[0], a[1], a[3]);
  const m = Array.from({ length: n * n }, (_, i) => a[i]);
  const v = zeros(n * n);
  for (let i = 0; i < n; i++) v[i * n + i] = 1;
  for (let sweep = 0; sweep < 60; sweep++) {
    let rotated = false;
    for (let p = 0; p < n - 1; p++) {
      for (let q = p + 1; q < n; q++) {
        const apq = m[p * n + q];
        if (apq === 0) continue;
        const app = m[p * n + p];
        const aqq = m[q * n + q];
        if (Math.abs(apq) <= Number.EPSILON * 0.5 * Math.sqrt(Math.abs(app * aqq))) {
          m[p * n + q] = 0;
          m[q * n + p] = 0;
          continue;
        }
        rotated = true;
        const theta = (aqq - app) / (2 * apq);
        const t =
          Math.abs(theta) > 1e150
            ? 1 / (2 * theta)
            : (theta >= 0 ? 1 : -1) / (Math.abs(theta) + Math.sqrt(theta * theta + 1));
        const c = 1 / Math.sqrt(t * t + 1);
        const s = t * c;
        for (let k = 0; k < n; k++) {
          const mkp = m[k * n + p];
          const mkq = m[k * n + q];
          m[k * n + p] = c * mkp - s * mkq;
          m[k * n + q] = s * mkp + c * mkq;
        }
        for (let k = 0; k < n; k++) {
          const mpk = m[p * n + k];
          const mqk = m[q * n + k];
          m[p * n + k] = c * mpk - s * mqk;
          m[q * n + k] = s * mpk + c * mqk;
        }
        // The rotation zeroes (p, q) exactly in exact arithmetic; set it so rounding cannot linger.
        m[p * n + q] = 0;
        m[q * n + p] = 0;
        for (let k = 0; k < n; k++) {
          const vkp = v[k * n + p];
          const vkq = v[k * n + q];
          v[k * n + p] = c * vkp - s * vkq;
          v[k * n + q] = s * vkp + c * vkq;
        }
      }
    }
    if (!rotated) break;
  }
  const values = zeros(n);
  for (let i = 0; i < n; i++) values[i] = m[i * n + i];
  return { values, vectors: v };
}

/** One Jacobi rotation diagonalizes a 2 x 2 matrix exactly (the same formulas as the sweep above). */
function twoByTwo(app: number, apq: number, aqq: number): SymmetricEigen {
  if (apq === 0 || Math.abs(apq) <= Number.EPSILON * 0.5 * Math.sqrt(Math.abs(app * aqq))) {
    return { values: [app, aqq], vectors: [1, 0, 0, 1] };
  }
  const theta = (aqq - app) / (2 * apq);
  const t =
    Math.abs(theta) > 1e150 ? 1 / (2 * theta) : (theta >= 0 ? 1 : -1) / (Math.abs(theta) + Math.sqrt(theta * theta + 1));
  const c = 1 / Math.sqrt(t * t + 1);
  const s = t * c;
  return { values: [app - t * apq, aqq + t * apq], vectors: [c, s, -s, c] };
}
