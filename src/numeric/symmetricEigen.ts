import { zeros } from './dense.js';

/** Eigenvalues, ascending, and (on request) the orthonormal eigenvectors as matrix columns. */
export interface SymmetricEigen {
  values: number[];
  /** Row-major n x n; column j is the unit eigenvector of values[j]. */
  vectors: number[];
}

/**
 * Eigenvalues and, on request, eigenvectors of a small real symmetric matrix (row-major, order n).
 *
 * Method: cyclic Jacobi rotations (G. H. Golub & C. F. Van Loan, "Matrix Computations", 4th ed.,
 * section 8.5, Algorithms 8.5.1-8.5.3), updating the two rotated diagonal entries in closed form
 * and accumulating the rotations into the eigenvector matrix when asked. Order 2 takes a single
 * rotation, which is exact. Jacobi keeps small eigenvalues of well-scaled positive definite
 * matrices to high relative accuracy (J. Demmel & K. Veselic, SIAM J. Matrix Anal. Appl. 13(4),
 * 1992), which matters because the time constants of a ladder may span many decades.
 *
 * Syntax: symmetricEigen(a, n[, { vectors: true }])
 * Example: symmetricEigen([2, 1, 1, 2], 2).values                    // [1, 3]
 *          symmetricEigen([2, 1, 1, 2], 2, { vectors: true }).vectors // columns: unit eigenvectors
 */
export function symmetricEigen(a: ArrayLike<number>, n: number): { values: number[] };
export function symmetricEigen(a: ArrayLike<number>, n: number, options: { vectors: true }): SymmetricEigen;
export function symmetricEigen(a: ArrayLike<number>, n: number, options?: { vectors?: boolean }): { values: number[]; vectors?: number[] } {
  if (n === 1) return { values: [a[0]], vectors: [1] };
  if (n === 2) return symmetricEigen2(a[0], a[1], a[3]);
  const withVectors = options?.vectors === true;
  const m = zeros(n * n);
  for (let i = 0; i < n * n; i++) m[i] = a[i];
  const v = withVectors ? zeros(n * n) : [];
  if (withVectors) for (let i = 0; i < n; i++) v[i * n + i] = 1;
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
          if (k === p || k === q) continue;
          const akp = m[k * n + p];
          const akq = m[k * n + q];
          const kp = c * akp - s * akq;
          const kq = s * akp + c * akq;
          m[k * n + p] = kp;
          m[p * n + k] = kp;
          m[k * n + q] = kq;
          m[q * n + k] = kq;
        }
        if (withVectors) {
          for (let k = 0; k < n; k++) {
            const vkp = v[k * n + p];
            const vkq = v[k * n + q];
            v[k * n + p] = c * vkp - s * vkq;
            v[k * n + q] = s * vkp + c * vkq;
          }
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
  for (let dst = 0; dst < n; dst++) values[dst] = m[order[dst] * n + order[dst]];
  if (!withVectors) return { values };
  const vectors = zeros(n * n);
  for (let dst = 0; dst < n; dst++) {
    const src = order[dst];
    for (let k = 0; k < n; k++) vectors[k * n + dst] = v[k * n + src];
  }
  return { values, vectors };
}

/**
 * symmetricEigen of the order-2 matrix [[app, apq], [apq, aqq]] with vectors, from its three
 * entries (for callers that keep them in scalars): one Jacobi rotation, which is exact. With `out`
 * the result is written into its arrays (lengths 2 and 4) and `out` returned: no allocation.
 *
 * Syntax: symmetricEigen2(app, apq, aqq[, out])
 * Example: symmetricEigen2(2, 1, 2).values  // [1, 3]
 */
export function symmetricEigen2(app: number, apq: number, aqq: number, out?: SymmetricEigen): SymmetricEigen {
  if (apq === 0) {
    return app <= aqq ? put(app, aqq, 1, 0, 0, 1, out) : put(aqq, app, 0, 1, 1, 0, out);
  }
  const zeta = (aqq - app) / (2 * apq);
  const t = (zeta >= 0 ? 1 : -1) / (Math.abs(zeta) + Math.sqrt(1 + zeta * zeta));
  const c = 1 / Math.sqrt(1 + t * t);
  const s = t * c;
  const l1 = app - t * apq; // eigenvector (c, -s)
  const l2 = aqq + t * apq; // eigenvector (s, c)
  return l1 <= l2 ? put(l1, l2, c, s, -s, c, out) : put(l2, l1, s, c, c, -s, out);
}

function put(v0: number, v1: number, a: number, b: number, c: number, d: number, out?: SymmetricEigen): SymmetricEigen {
  if (!out) return { values: [v0, v1], vectors: [a, b, c, d] };
  out.values[0] = v0;
  out.values[1] = v1;
  out.vectors[0] = a;
  out.vectors[1] = b;
  out.vectors[2] = c;
  out.vectors[3] = d;
  return out;
}
