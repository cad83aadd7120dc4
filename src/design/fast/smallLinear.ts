/** A small vector or row-major matrix (plain arrays: cheaper than typed arrays at this size). */
export type Vec = number[];

/** n zeros. */
export function zeros(n: number): Vec {
  const out = new Array<number>(n);
  for (let i = 0; i < n; i++) out[i] = 0;
  return out;
}

/** A vector of the given entries. */
export function vec(...xs: number[]): Vec {
  return xs;
}

/**
 * Small dense linear algebra for the fast model (row-major n x n, n <= 4): products, the
 * phase operators U diag(d) U^T, and a solve.
 *
 * Method: Gaussian elimination with partial pivoting (Golub & Van Loan, "Matrix Computations",
 * 4th ed., Algorithm 3.4.1) for `solveSmall`; the rest is plain arithmetic.
 *
 * Syntax: solveSmall(a, b, n)
 * Example: solveSmall(vec(2, 0, 0, 4), vec(2, 2), 2)   // [1, 0.5]
 */
export function solveSmall(a: Vec, b: Vec, n: number): Vec {
  const m = a.slice();
  const x = b.slice();
  for (let k = 0; k < n; k++) {
    let p = k;
    for (let i = k + 1; i < n; i++) if (Math.abs(m[i * n + k]) > Math.abs(m[p * n + k])) p = i;
    if (p !== k) {
      for (let j = 0; j < n; j++) {
        const t = m[k * n + j];
        m[k * n + j] = m[p * n + j];
        m[p * n + j] = t;
      }
      const t = x[k];
      x[k] = x[p];
      x[p] = t;
    }
    const pivot = m[k * n + k];
    for (let i = k + 1; i < n; i++) {
      const f = m[i * n + k] / pivot;
      if (f === 0) continue;
      for (let j = k; j < n; j++) m[i * n + j] -= f * m[k * n + j];
      x[i] -= f * x[k];
    }
  }
  for (let i = n - 1; i >= 0; i--) {
    let s = x[i];
    for (let j = i + 1; j < n; j++) s -= m[i * n + j] * x[j];
    x[i] = s / m[i * n + i];
  }
  return x;
}

/** U diag(d) U^T for orthonormal U (row-major). */
export function spectralMatrix(u: Vec, d: ArrayLike<number>, n: number): Vec {
  const out = zeros(n * n);
  for (let i = 0; i < n; i++) {
    for (let j = i; j < n; j++) {
      let s = 0;
      for (let k = 0; k < n; k++) s += u[i * n + k] * d[k] * u[j * n + k];
      out[i * n + j] = s;
      out[j * n + i] = s;
    }
  }
  return out;
}

/** a b (both n x n). */
export function matMul(a: Vec, b: Vec, n: number): Vec {
  const out = zeros(n * n);
  for (let i = 0; i < n; i++) {
    for (let k = 0; k < n; k++) {
      const aik = a[i * n + k];
      if (aik === 0) continue;
      for (let j = 0; j < n; j++) out[i * n + j] += aik * b[k * n + j];
    }
  }
  return out;
}

/** a x. */
export function matVec(a: Vec, x: ArrayLike<number>, n: number): Vec {
  const out = zeros(n);
  for (let i = 0; i < n; i++) {
    let s = 0;
    for (let k = 0; k < n; k++) s += a[i * n + k] * x[k];
    out[i] = s;
  }
  return out;
}

/** U^T x (coordinates in the orthonormal basis U). */
export function transposeVec(u: Vec, x: ArrayLike<number>, n: number): Vec {
  const out = zeros(n);
  for (let i = 0; i < n; i++) {
    let s = 0;
    for (let k = 0; k < n; k++) s += u[k * n + i] * x[k];
    out[i] = s;
  }
  return out;
}
