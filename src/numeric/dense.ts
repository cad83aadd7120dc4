/**
 * Small dense linear algebra for the engine: square matrices of order n <= 12 stored row-major in a
 * plain number[] (entry (i, j) at i * n + j), vectors as number[]. Hand-written because the
 * matrices are tiny and called millions of times: a general library's overhead would dominate.
 * Plain arrays rather than Float64Array: V8 allocates small typed arrays off the managed heap,
 * which made allocation and garbage collection the largest cost of the engine.
 *
 * Method: textbook kernels (Golub & Van Loan, "Matrix Computations", 4th ed., ch. 1 and 2.3):
 * ijk products and the 1- and infinity-norms. The LU factorization is in lu.ts.
 */

/** Row-major square matrix of order n. */
export type Matrix = number[];
/** Column vector. */
export type Vector = number[];

/**
 * A vector of n zeros (packed, so V8 keeps it as an unboxed double array once written).
 *
 * Syntax: zeros(n)
 * Example: zeros(3)  // [0, 0, 0]
 */
export function zeros(n: number): number[] {
  const v: number[] = [];
  for (let i = 0; i < n; i++) v.push(0);
  return v;
}

/**
 * A vector of n zeros stored as doubles from the start: zeros() keeps small integers until a
 * fraction is written, and code that reads both kinds of array runs slower.
 *
 * Syntax: doubles(n)
 * Example: doubles(2)  // [0, 0]
 */
export function doubles(n: number): number[] {
  const v: number[] = [];
  for (let i = 0; i < n; i++) v.push(0.5); // a fraction: the array holds doubles for good
  for (let i = 0; i < n; i++) v[i] = 0;
  return v;
}

/**
 * An empty array that holds doubles (see doubles): appending numbers never changes its kind.
 *
 * Syntax: emptyDoubles()
 * Example: emptyDoubles().length   // 0
 */
export function emptyDoubles(): number[] {
  const v = doubles(1);
  v.length = 0;
  return v;
}

/**
 * A copy of `values` stored as doubles (see doubles): search tuples built from series values such
 * as 470 would otherwise hold small integers, and the search's code would then read two kinds of
 * array (measured: polymorphic loads and deoptimizations in a default design run).
 *
 * Syntax: doublesOf(values)
 * Example: doublesOf([470, 16000])  // [470, 16000], stored as doubles
 */
export function doublesOf(values: ArrayLike<number>): number[] {
  const v = doubles(values.length);
  for (let i = 0; i < values.length; i++) v[i] = values[i];
  return v;
}

/**
 * The identity of order n.
 *
 * Syntax: identity(n)
 * Example: identity(2)  // [1, 0, 0, 1]
 */
export function identity(n: number): Matrix {
  const m = zeros(n * n);
  for (let i = 0; i < n; i++) m[i * n + i] = 1;
  return m;
}

/**
 * Matrix product a b of two n x n matrices, written into `out` (must not alias a or b).
 *
 * Syntax: matmul(a, b, n[, out])
 * Example: matmul(identity(2), m, 2)  // a copy of m
 */
export function matmul(a: readonly number[], b: readonly number[], n: number, out: Matrix = zeros(n * n)): Matrix {
  for (let i = 0; i < n; i++) {
    const row = i * n;
    for (let j = 0; j < n; j++) out[row + j] = 0;
    for (let k = 0; k < n; k++) {
      const aik = a[row + k];
      if (aik === 0) continue;
      const bk = k * n;
      for (let j = 0; j < n; j++) out[row + j] += aik * b[bk + j];
    }
  }
  return out;
}

/**
 * Matrix-vector product a x.
 *
 * Syntax: matvec(a, x, n[, out])
 * Example: matvec(identity(2), [1, 2], 2)  // [1, 2]
 */
export function matvec(a: readonly number[], x: readonly number[], n: number, out: Vector = zeros(n)): Vector {
  for (let i = 0; i < n; i++) {
    let s = 0;
    const row = i * n;
    for (let k = 0; k < n; k++) s += a[row + k] * x[k];
    out[i] = s;
  }
  return out;
}

/**
 * Transposed matrix-vector product a^T x; with orthonormal columns in a, the coordinates of x in
 * that basis.
 *
 * Syntax: transposeMatvec(a, x, n[, out])
 * Example: transposeMatvec([0, 1, 1, 0], [1, 2], 2)  // [2, 1]
 */
export function transposeMatvec(a: Matrix, x: ArrayLike<number>, n: number, out: Vector = zeros(n)): Vector {
  for (let i = 0; i < n; i++) {
    let s = 0;
    for (let k = 0; k < n; k++) s += a[k * n + i] * x[k];
    out[i] = s;
  }
  return out;
}

/**
 * U diag(d) U^T for an orthonormal eigenvector matrix U (columns): f(S) = U f(Lambda) U^T for a
 * symmetric S = U Lambda U^T with d = f(Lambda) (spectral theorem, Golub & Van Loan, Theorem
 * 8.1.1). Symmetric by construction: only the upper triangle is summed.
 *
 * Syntax: spectralMatrix(u, d, n)
 * Example: spectralMatrix(identity(2), [2, 3], 2)  // [2, 0, 0, 3]
 */
export function spectralMatrix(u: Matrix, d: ArrayLike<number>, n: number): Matrix {
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

/**
 * Row i of a times x: (a x)_i, without forming the whole product.
 *
 * Syntax: rowDot(a, i, x, n)
 * Example: rowDot(identity(2), 1, [3, 4], 2)  // 4
 */
export function rowDot(a: readonly number[], i: number, x: readonly number[], n: number): number {
  let s = 0;
  const row = i * n;
  for (let k = 0; k < n; k++) s += a[row + k] * x[k];
  return s;
}

/**
 * Maximum absolute column sum, the matrix 1-norm.
 *
 * Syntax: norm1(a, n)
 * Example: norm1([1, -2, 3, 4], 2)  // 6
 */
export function norm1(a: Matrix, n: number): number {
  let best = 0;
  for (let j = 0; j < n; j++) {
    let s = 0;
    for (let i = 0; i < n; i++) s += Math.abs(a[i * n + j]);
    if (s > best) best = s;
  }
  return best;
}

/**
 * Maximum absolute row sum, the matrix infinity-norm (Golub & Van Loan, eq. 2.3.10). NaN when an
 * entry is NaN, so that a caller's check `norm <= limit` fails on a broken matrix (the modal
 * route's condition test relies on that to fall back to the matrix exponential).
 *
 * Syntax: normInf(a, n)
 * Example: normInf([1, -2, 3, 4], 2)  // 7
 */
export function normInf(a: ArrayLike<number>, n: number): number {
  let best = 0;
  for (let i = 0; i < n; i++) {
    let s = 0;
    for (let j = 0; j < n; j++) s += Math.abs(a[i * n + j]);
    best = Math.max(best, s);
  }
  return best;
}

/**
 * Largest absolute entry of a vector.
 *
 * Syntax: vectorNormInf(x)
 * Example: vectorNormInf([1, -3])  // 3
 */
export function vectorNormInf(x: Vector): number {
  let best = 0;
  for (let i = 0; i < x.length; i++) {
    const v = Math.abs(x[i]);
    if (v > best) best = v;
  }
  return best;
}

/**
 * Inner product a . b of two vectors of equal length.
 *
 * Syntax: dot(a, b)
 * Example: dot([1, 2], [3, 4])  // 11
 */
export function dot(a: readonly number[], b: readonly number[]): number {
  let s = 0;
  for (let i = 0; i < a.length; i++) s += a[i] * b[i];
  return s;
}
