import { zeros } from './dense.js';

/**
 * All eigenvalues of a small real nonsymmetric matrix (row-major, order n), as real and imaginary
 * parts: sorted by real part descending, then by imaginary part descending, so a complex conjugate
 * pair sits side by side with its positive imaginary part first (on an exact tie of real parts the
 * larger |im| comes first, which keeps pairs together). The input is not modified.
 *
 * Method: the textbook dense eigenvalue pipeline. (1) Balancing by exact powers of two (Parlett &
 * Reinsch, Numer. Math. 13, 1969; EISPACK balanc): a diagonal similarity that makes the norms of
 * each row and column comparable, which removes the grading of circuit state matrices whose time
 * constants span many decades. (2) Reduction to upper Hessenberg form by Householder reflections
 * (Golub & Van Loan, "Matrix Computations", 4th ed., Alg. 7.4.2; EISPACK orthes). (3) The Francis
 * double-shift QR iteration (Wilkinson & Reinsch, "Handbook for Automatic Computation" vol. II,
 * 1971, contribution II/14, hqr; Golub & Van Loan Alg. 7.5.2), deflating where a subdiagonal entry
 * is below the rounding level of its two neighbouring diagonal entries, starting each double step
 * below the lowest pair of small consecutive subdiagonals, with exceptional shifts every tenth
 * iteration. Eigenvalues of a converged 2 x 2 block come from its characteristic polynomial,
 * written to avoid cancellation. Accuracy: normwise backward stable (error ~ eps ||A|| per
 * eigenvalue); on RC-ladder state matrices whose time constants grow or shrink monotonically along
 * the ladder the small eigenvalues also keep ~1e-11 relative accuracy across 12 decades, but with a
 * fast stage placed after slow ones the smallest can lose that (measured 6e-4 relative). Throws a RangeError if an eigenvalue takes more than 30 n
 * iterations, or on non-finite entries.
 *
 * Syntax: generalEigenvalues(a, n)
 * Example: generalEigenvalues([0, 1, -2, -3], 2)  // { re: [-1, -2], im: [0, 0] }
 *          generalEigenvalues([0, -1, 1, 0], 2)   // { re: [0, 0], im: [1, -1] }
 */
export function generalEigenvalues(a: ArrayLike<number>, n: number): { re: number[]; im: number[] } {
  if (!Number.isInteger(n) || n < 0 || a.length < n * n) {
    throw new RangeError(`generalEigenvalues: need an integer order n >= 0 and n * n entries (n = ${n})`);
  }
  const h = zeros(n * n);
  for (let i = 0; i < n * n; i++) {
    if (!Number.isFinite(a[i])) throw new RangeError('generalEigenvalues: matrix has non-finite entries');
    h[i] = a[i];
  }
  balance(h, n);
  toHessenberg(h, n);
  const re = zeros(n);
  const im = zeros(n);
  hessenbergQr(h, n, re, im);
  return sortEigenvalues(re, im);
}

/** Parlett-Reinsch balancing in place: D^-1 H D with D a diagonal of powers of two (exact). */
function balance(h: number[], n: number): void {
  const radix = 2;
  let converged = false;
  while (!converged) {
    converged = true;
    for (let i = 0; i < n; i++) {
      let c = 0;
      let r = 0;
      for (let j = 0; j < n; j++) {
        if (j === i) continue;
        c += Math.abs(h[j * n + i]);
        r += Math.abs(h[i * n + j]);
      }
      // A row or column with nothing off the diagonal holds an isolated eigenvalue: leave it.
      if (c === 0 || r === 0) continue;
      const s = c + r;
      let f = 1;
      while (c < r / radix) {
        f *= radix;
        c *= radix * radix;
      }
      while (c >= r * radix) {
        f /= radix;
        c /= radix * radix;
      }
      // Scale only for a worthwhile reduction of the row plus column norm (EISPACK's 0.95).
      if ((c + r) / f < 0.95 * s) {
        converged = false;
        const g = 1 / f;
        for (let j = 0; j < n; j++) h[i * n + j] *= g;
        for (let j = 0; j < n; j++) h[j * n + i] *= f;
      }
    }
  }
}

/** Householder reduction to upper Hessenberg form in place (orthogonal similarity). */
function toHessenberg(h: number[], n: number): void {
  const v = zeros(n);
  for (let k = 0; k < n - 2; k++) {
    let scale = 0;
    for (let i = k + 1; i < n; i++) scale += Math.abs(h[i * n + k]);
    if (scale === 0) continue;
    let norm2 = 0;
    for (let i = k + 1; i < n; i++) {
      v[i] = h[i * n + k] / scale;
      norm2 += v[i] * v[i];
    }
    // Reflect x onto alpha e1 with alpha of opposite sign to x1, so v = x - alpha e1 has no
    // cancellation; then P = I - v v^T / half with half = |v|^2 / 2.
    const alpha = v[k + 1] > 0 ? -Math.sqrt(norm2) : Math.sqrt(norm2);
    const half = norm2 - v[k + 1] * alpha;
    v[k + 1] -= alpha;
    // P H: rows k+1..n-1, columns k+1..n-1 (column k is set below).
    for (let j = k + 1; j < n; j++) {
      let f = 0;
      for (let i = k + 1; i < n; i++) f += v[i] * h[i * n + j];
      f /= half;
      for (let i = k + 1; i < n; i++) h[i * n + j] -= f * v[i];
    }
    // (P H) P: every row, columns k+1..n-1.
    for (let i = 0; i < n; i++) {
      let f = 0;
      for (let j = k + 1; j < n; j++) f += h[i * n + j] * v[j];
      f /= half;
      for (let j = k + 1; j < n; j++) h[i * n + j] -= f * v[j];
    }
    h[(k + 1) * n + k] = scale * alpha;
    for (let i = k + 2; i < n; i++) h[i * n + k] = 0;
  }
}

/**
 * Francis double-shift QR on an upper Hessenberg matrix (destroyed), writing the eigenvalues into
 * re and im in the order they deflate.
 */
function hessenbergQr(h: number[], n: number, re: number[], im: number[]): void {
  const eps = Number.EPSILON;
  let norm = 0;
  for (let i = 0; i < n; i++) for (let j = Math.max(i - 1, 0); j < n; j++) norm += Math.abs(h[i * n + j]);
  const maxIterations = 30 * n;
  // Accumulated exceptional shifts: the active block holds H - shift I.
  let shift = 0;
  let its = 0;
  let last = n - 1;
  while (last >= 0) {
    // The lowest l with a negligible subdiagonal h(l, l-1): the active block is rows l..last.
    let l = last;
    for (; l > 0; l--) {
      let s = Math.abs(h[(l - 1) * n + l - 1]) + Math.abs(h[l * n + l]);
      if (s === 0) s = norm;
      if (Math.abs(h[l * n + l - 1]) <= eps * s) {
        h[l * n + l - 1] = 0;
        break;
      }
    }
    let x = h[last * n + last];
    if (l === last) {
      re[last] = x + shift;
      im[last] = 0;
      last--;
      its = 0;
      continue;
    }
    let y = h[(last - 1) * n + last - 1];
    let w = h[last * n + last - 1] * h[(last - 1) * n + last];
    if (l === last - 1) {
      // 2 x 2 block [[y, .], [., x]]: lambda = x + p +- sqrt(p^2 + w), p = (y - x) / 2.
      const p = 0.5 * (y - x);
      const q = p * p + w;
      const z = Math.sqrt(Math.abs(q));
      x += shift;
      if (q >= 0) {
        // Real pair: the larger root by addition, the other from the product (no cancellation).
        const big = p + (p >= 0 ? z : -z);
        re[last - 1] = x + big;
        re[last] = big !== 0 ? x - w / big : x + big;
        im[last - 1] = 0;
        im[last] = 0;
      } else {
        re[last - 1] = x + p;
        re[last] = x + p;
        im[last - 1] = z;
        im[last] = -z;
      }
      last -= 2;
      its = 0;
      continue;
    }
    if (its >= maxIterations) {
      throw new RangeError(`generalEigenvalues: QR iteration did not converge in ${maxIterations} iterations`);
    }
    if (its > 0 && its % 10 === 0) {
      // Exceptional shift (Wilkinson & Reinsch hqr) to break a cycle of the standard shifts.
      shift += x;
      for (let i = 0; i <= last; i++) h[i * n + i] -= x;
      const s = Math.abs(h[last * n + last - 1]) + Math.abs(h[(last - 1) * n + last - 2]);
      x = 0.75 * s;
      y = x;
      w = -0.4375 * s * s;
    }
    its++;
    // Look for two consecutive small subdiagonals to start the double step at row m >= l.
    let m = last - 2;
    let p = 0;
    let q = 0;
    let r = 0;
    for (; m >= l; m--) {
      const z = h[m * n + m];
      const rr = x - z;
      const ss = y - z;
      // First column of (H - s1 I)(H - s2 I) at row m, divided by h(m+1, m).
      p = (rr * ss - w) / h[(m + 1) * n + m] + h[m * n + m + 1];
      q = h[(m + 1) * n + m + 1] - z - rr - ss;
      r = h[(m + 2) * n + m + 1];
      const s = Math.abs(p) + Math.abs(q) + Math.abs(r);
      p /= s;
      q /= s;
      r /= s;
      if (m === l) break;
      const u = Math.abs(h[m * n + m - 1]) * (Math.abs(q) + Math.abs(r));
      const v = Math.abs(p) * (Math.abs(h[(m - 1) * n + m - 1]) + Math.abs(z) + Math.abs(h[(m + 1) * n + m + 1]));
      if (u <= eps * v) break;
    }
    for (let i = m + 2; i <= last; i++) {
      h[i * n + i - 2] = 0;
      if (i !== m + 2) h[i * n + i - 3] = 0;
    }
    // Chase the bulge with 3 x 3 Householder reflections (2 x 2 at the last row).
    for (let k = m; k < last; k++) {
      const notLast = k !== last - 1;
      let scale = 0;
      if (k !== m) {
        p = h[k * n + k - 1];
        q = h[(k + 1) * n + k - 1];
        r = notLast ? h[(k + 2) * n + k - 1] : 0;
        scale = Math.abs(p) + Math.abs(q) + Math.abs(r);
        if (scale === 0) continue;
        p /= scale;
        q /= scale;
        r /= scale;
      }
      const s = (p >= 0 ? 1 : -1) * Math.sqrt(p * p + q * q + r * r);
      if (k === m) {
        if (l !== m) h[k * n + k - 1] = -h[k * n + k - 1];
      } else {
        h[k * n + k - 1] = -s * scale;
      }
      p += s;
      const px = p / s;
      const py = q / s;
      const pz = r / s;
      q /= p;
      r /= p;
      // Rows k..k+2 from the left.
      for (let j = k; j <= last; j++) {
        let t = h[k * n + j] + q * h[(k + 1) * n + j];
        if (notLast) {
          t += r * h[(k + 2) * n + j];
          h[(k + 2) * n + j] -= t * pz;
        }
        h[(k + 1) * n + j] -= t * py;
        h[k * n + j] -= t * px;
      }
      // Columns k..k+2 from the right.
      const iEnd = Math.min(last, k + 3);
      for (let i = l; i <= iEnd; i++) {
        let t = px * h[i * n + k] + py * h[i * n + k + 1];
        if (notLast) {
          t += pz * h[i * n + k + 2];
          h[i * n + k + 2] -= t * r;
        }
        h[i * n + k + 1] -= t * q;
        h[i * n + k] -= t;
      }
    }
  }
}

/**
 * Real part descending, then imaginary part descending. A pair's two members share one computed
 * real part; on an exact tie with other eigenvalues |im| decides first, so pairs stay adjacent.
 */
function sortEigenvalues(re: number[], im: number[]): { re: number[]; im: number[] } {
  const order = re.map((_, i) => i);
  order.sort((i, j) => re[j] - re[i] || Math.abs(im[j]) - Math.abs(im[i]) || im[j] - im[i]);
  return { re: order.map((i) => re[i]), im: order.map((i) => im[i]) };
}

