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
 * With `into` (order 3, with vectors) the result is written into its arrays (three and nine
 * doubles) and `into` is returned: a search that decomposes millions of matrices allocates none.
 *
 * Syntax: symmetricEigen(a, n[, { vectors: true[, into] }])
 * Example: symmetricEigen([2, 1, 1, 2], 2).values                    // [1, 3]
 *          symmetricEigen([2, 1, 1, 2], 2, { vectors: true }).vectors // columns: unit eigenvectors
 */
export function symmetricEigen(a: ArrayLike<number>, n: number): { values: number[] };
export function symmetricEigen(a: ArrayLike<number>, n: number, options: { vectors: true; into?: SymmetricEigen }): SymmetricEigen;
export function symmetricEigen(a: ArrayLike<number>, n: number, options?: { vectors?: boolean; into?: SymmetricEigen }): { values: number[]; vectors?: number[] } {
  if (n === 1) return { values: [a[0]], vectors: [1] };
  if (n === 2) return symmetricEigen2(a[0], a[1], a[3]);
  if (n === 3) return symmetricEigen3(a, options?.vectors === true, options?.into);
  return symmetricEigenJacobi(a, n, options?.vectors === true);
}

/**
 * symmetricEigen's cyclic Jacobi for any order n >= 2 (the general loops): symmetricEigen uses it
 * from order 4 on; callable by name so that tests hold the order-3 scalar path to it.
 *
 * Syntax: symmetricEigenJacobi(a, n, withVectors)
 * Example: symmetricEigenJacobi([2, 1, 0, 1, 2, 1, 0, 1, 2], 3, false).values   // [2 - sqrt 2, 2, 2 + sqrt 2]
 */
export function symmetricEigenJacobi(a: ArrayLike<number>, n: number, withVectors: boolean): { values: number[]; vectors?: number[] } {
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

/** Scratch of symmetricEigen3's sort (read at once). */
const D3 = new Float64Array(3);
const V3 = new Float64Array(9);

/**
 * symmetricEigenJacobi for order 3 on scalars: the same rotations in the same order (pairs (0, 1),
 * (0, 2), (1, 2) per sweep), the same skip and drop tests and the same arithmetic, so the same
 * digits (test/numeric/symmetricEigen.test.ts holds it to the general loops), without their index
 * arithmetic and work arrays. Three-stage ladders build their modal form with it, twice per
 * candidate of a three-stage search. The three rotation blocks below share their shape on purpose:
 * each is one pair written out, its indices fixed (that is what the scalar form buys).
 */
function symmetricEigen3(a: ArrayLike<number>, withVectors: boolean, into?: SymmetricEigen): { values: number[]; vectors?: number[] } {
  // the matrix (d: diagonal, o: the upper off-diagonal entries) and the rotations (v, row-major)
  let d0 = a[0];
  let d1 = a[4];
  let d2 = a[8];
  let o01 = a[1];
  let o02 = a[2];
  let o12 = a[5];
  let v00 = 1;
  let v01 = 0;
  let v02 = 0;
  let v10 = 0;
  let v11 = 1;
  let v12 = 0;
  let v20 = 0;
  let v21 = 0;
  let v22 = 1;
  for (let sweep = 0; sweep < 50; sweep++) {
    let rotated = false;
    // pair (0, 1); the third index 2
    if (o01 !== 0) {
      if (Math.abs(o01) <= 1e-19 * Math.sqrt(Math.abs(d0 * d1))) o01 = 0;
      else {
        rotated = true;
        const zeta = (d1 - d0) / (2 * o01);
        const t = (zeta >= 0 ? 1 : -1) / (Math.abs(zeta) + Math.sqrt(1 + zeta * zeta));
        const c = 1 / Math.sqrt(1 + t * t);
        const s = t * c;
        d0 = d0 - t * o01;
        d1 = d1 + t * o01;
        o01 = 0;
        const kp = c * o02 - s * o12;
        const kq = s * o02 + c * o12;
        o02 = kp;
        o12 = kq;
        if (withVectors) {
          let x = v00;
          let y = v01;
          v00 = c * x - s * y;
          v01 = s * x + c * y;
          x = v10;
          y = v11;
          v10 = c * x - s * y;
          v11 = s * x + c * y;
          x = v20;
          y = v21;
          v20 = c * x - s * y;
          v21 = s * x + c * y;
        }
      }
    }
    // pair (0, 2); the third index 1
    if (o02 !== 0) {
      if (Math.abs(o02) <= 1e-19 * Math.sqrt(Math.abs(d0 * d2))) o02 = 0;
      else {
        rotated = true;
        const zeta = (d2 - d0) / (2 * o02);
        const t = (zeta >= 0 ? 1 : -1) / (Math.abs(zeta) + Math.sqrt(1 + zeta * zeta));
        const c = 1 / Math.sqrt(1 + t * t);
        const s = t * c;
        d0 = d0 - t * o02;
        d2 = d2 + t * o02;
        o02 = 0;
        const kp = c * o01 - s * o12;
        const kq = s * o01 + c * o12;
        o01 = kp;
        o12 = kq;
        if (withVectors) {
          let x = v00;
          let y = v02;
          v00 = c * x - s * y;
          v02 = s * x + c * y;
          x = v10;
          y = v12;
          v10 = c * x - s * y;
          v12 = s * x + c * y;
          x = v20;
          y = v22;
          v20 = c * x - s * y;
          v22 = s * x + c * y;
        }
      }
    }
    // pair (1, 2); the third index 0
    if (o12 !== 0) {
      if (Math.abs(o12) <= 1e-19 * Math.sqrt(Math.abs(d1 * d2))) o12 = 0;
      else {
        rotated = true;
        const zeta = (d2 - d1) / (2 * o12);
        const t = (zeta >= 0 ? 1 : -1) / (Math.abs(zeta) + Math.sqrt(1 + zeta * zeta));
        const c = 1 / Math.sqrt(1 + t * t);
        const s = t * c;
        d1 = d1 - t * o12;
        d2 = d2 + t * o12;
        o12 = 0;
        const kp = c * o01 - s * o02;
        const kq = s * o01 + c * o02;
        o01 = kp;
        o02 = kq;
        if (withVectors) {
          let x = v01;
          let y = v02;
          v01 = c * x - s * y;
          v02 = s * x + c * y;
          x = v11;
          y = v12;
          v11 = c * x - s * y;
          v12 = s * x + c * y;
          x = v21;
          y = v22;
          v21 = c * x - s * y;
          v22 = s * x + c * y;
        }
      }
    }
    if (!rotated) break;
  }
  // ascending, ties in index order (the general insertion sort does the same)
  const d = D3;
  d[0] = d0;
  d[1] = d1;
  d[2] = d2;
  let i0 = 0;
  let i1 = 1;
  let i2 = 2;
  if (d[i0] > d[i1]) {
    i0 = 1;
    i1 = 0;
  }
  if (d[i1] > d[i2]) {
    const t = i1;
    i1 = i2;
    i2 = t;
    if (d[i0] > d[i1]) {
      const u = i0;
      i0 = i1;
      i1 = u;
    }
  }
  // arrays of doubles whatever the values (as the general code's)
  const values = withVectors && into ? into.values : [0.5, 0.5, 0.5];
  values[0] = d[i0];
  values[1] = d[i1];
  values[2] = d[i2];
  if (!withVectors) return { values };
  const w = V3;
  w[0] = v00;
  w[1] = v01;
  w[2] = v02;
  w[3] = v10;
  w[4] = v11;
  w[5] = v12;
  w[6] = v20;
  w[7] = v21;
  w[8] = v22;
  const vectors = into ? into.vectors : [0.5, 0.5, 0.5, 0.5, 0.5, 0.5, 0.5, 0.5, 0.5];
  for (let k = 0; k < 3; k++) {
    vectors[3 * k] = w[3 * k + i0];
    vectors[3 * k + 1] = w[3 * k + i1];
    vectors[3 * k + 2] = w[3 * k + i2];
  }
  return into ?? { values, vectors };
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
