import { identity, matmul, zeros, type Matrix } from '../numeric/dense.js';
import { expm } from '../numeric/expm.js';

/**
 * The exact flow of x' = A x + b over a time t, in the three matrices the engine needs:
 * E = e^{tA}, K = I - e^{tA} and J = integral_0^t K(s) ds. With x_p = -A^{-1} b the DC state,
 * x(t) = x(0) + K (x_p - x(0)), and the integral of x over [0, t] is t x(0) + J (x_p - x(0)).
 */
export interface Flow {
  t: number;
  E: Matrix;
  K: Matrix;
  /** null when not asked for. */
  J: Matrix | null;
}

/**
 * E, K and J of the flow of A over time t, from one matrix exponential.
 *
 * Method: block-triangular augmentation (C. F. Van Loan, "Computing integrals involving the matrix
 * exponential", IEEE Trans. Autom. Control 23(3), 1978; the phi-function form of Y. Saad, SIAM J.
 * Numer. Anal. 29(1), 1992, and A. H. Al-Mohy & N. J. Higham, SIAM J. Sci. Comput. 33(2), 2011).
 * With X = tA, exp([[X, X, 0], [0, 0, I], [0, 0, 0]]) has first block row
 * [e^X, e^X - I, phi1(X) - I], phi1(z) = (e^z - 1)/z. Putting X instead of I in block (1,2) makes
 * the exponential deliver e^X - I and phi1(X) - I directly, so K = -(e^X - I) and
 * J = -t (phi1(X) - I) are never formed by subtracting nearly equal numbers nor by a product with
 * A: K keeps full relative accuracy when t is 1e-9 of the time constant. The exponential is
 * Higham's 2005 scaling and squaring (see expm.ts). With `scale` = d the exponential is taken of
 * the balanced D A D^{-1} (D = diag(d)) and transformed back, M_ij = M~_ij d_j / d_i: for an RC
 * ladder d_i = sqrt(C_i) makes D A D^{-1} symmetric (A = -C^{-1} G), which keeps the Padé solve and
 * the squarings accurate when the capacitors differ by decades (balancing before the exponential:
 * R. C. Ward, SIAM J. Numer. Anal. 14(4), 1977).
 *
 * Syntax: flow(A, n, t[, withIntegral, scale])
 * Example: flow([-1], 1, 1e-12).K  // [1e-12 * (1 - 5e-13)], to full precision
 */
export function flow(A: readonly number[], n: number, t: number, withIntegral = true, scale?: readonly number[]): Flow {
  const blocks = withIntegral ? 3 : 2;
  const m = blocks * n;
  if (t === 0) {
    return { t, E: identity(n), K: zeros(n * n), J: withIntegral ? zeros(n * n) : null };
  }
  // Scratch for the augmented matrix and its exponential, reused between calls (allocation was a
  // large share of the engine's time; flow never calls itself).
  const { z, ez: buffer } = scratch(m);
  z.fill(0);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      const x = scale ? (t * A[i * n + j] * scale[i]) / scale[j] : t * A[i * n + j];
      z[i * m + j] = x;
      z[i * m + n + j] = x;
    }
  }
  if (withIntegral) for (let i = 0; i < n; i++) z[(n + i) * m + 2 * n + i] = 1;
  const ez = expm(z, m, buffer);
  const E = zeros(n * n);
  const K = zeros(n * n);
  const J = withIntegral ? zeros(n * n) : null;
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      const back = scale ? scale[j] / scale[i] : 1;
      E[i * n + j] = ez[i * m + j] * back;
      K[i * n + j] = -ez[i * m + n + j] * back;
      if (J) J[i * n + j] = -t * ez[i * m + 2 * n + j] * back;
    }
  }
  return { t, E, K, J };
}

const scratches = new Map<number, { z: Matrix; ez: Matrix }>();

function scratch(m: number): { z: Matrix; ez: Matrix } {
  let s = scratches.get(m);
  if (!s) {
    s = { z: zeros(m * m), ez: zeros(m * m) };
    scratches.set(m, s);
  }
  return s;
}

/**
 * The flow over 2t from the flow over t, without cancellation: addFlows(f, f, n),
 * E(2t) = E^2, K(2t) = K + E K, J(2t) = J + t K + E J (from K(t + s) = K(t) + E(t) K(s)).
 * This is the squaring step of scaling and squaring applied to the augmented exponential.
 *
 * Syntax: doubleFlow(f, n)
 * Example: doubleFlow(flow(A, n, T / 8), n)  // the flow over T / 4
 * See also: addFlows
 */
export function doubleFlow(f: Flow, n: number): Flow {
  return addFlows(f, f, n);
}

/**
 * The flow over a.t + b.t from the flows over a.t and b.t (J when both have it), by the composition
 * rules E(a + b) = E(a) E(b), K(a + b) = K(a) + E(a) K(b), J(a + b) = J(a) + b K(a) + E(a) J(b):
 * no term is formed by cancellation. The products E(a) K(b) and E(a) J(b) go through one scratch
 * matrix (read at once), so a call allocates only the three matrices it returns.
 *
 * Syntax: addFlows(a, b, n)
 * Example: addFlows(flow(A, n, t1), flow(A, n, t2), n)  // the flow over t1 + t2
 * See also: doubleFlow
 */
export function addFlows(a: Flow, b: Flow, n: number): Flow {
  const nn = n * n;
  const E = matmul(a.E, b.E, n);
  const product = productScratch(nn);
  matmul(a.E, b.K, n, product);
  const K = zeros(nn);
  for (let i = 0; i < nn; i++) K[i] = a.K[i] + product[i];
  if (!a.J || !b.J) return { t: a.t + b.t, E, K, J: null };
  matmul(a.E, b.J, n, product);
  const J = zeros(nn);
  for (let i = 0; i < nn; i++) J[i] = a.J[i] + b.t * a.K[i] + product[i];
  return { t: a.t + b.t, E, K, J };
}

/** addFlows' scratch product, grown to the largest n * n asked for. */
let PRODUCT: Matrix = [];
function productScratch(nn: number): Matrix {
  if (PRODUCT.length < nn) PRODUCT = zeros(nn);
  return PRODUCT;
}
