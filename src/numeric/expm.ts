import { matmul, norm1, zeros, type Matrix } from './dense.js';

/**
 * Padé coefficients b_0..b_m of the diagonal [m/m] approximant of exp, scaled so that b_m = 1
 * (Higham 2005, section 2: b_k proportional to (2m-k)! m! / ((2m)! k! (m-k)!)). Exact integers; test/numeric/expm.test.ts re-derives them from the factorial formula.
 */
export const PADE_COEFFICIENTS: Readonly<Record<3 | 5 | 7 | 9 | 13, readonly number[]>> = {
  3: [120, 60, 12, 1],
  5: [30240, 15120, 3360, 420, 30, 1],
  7: [17297280, 8648640, 1995840, 277200, 25200, 1512, 56, 1],
  9: [17643225600, 8821612800, 2075673600, 302702400, 30270240, 2162160, 110880, 3960, 90, 1],
  13: [
    64764752532480000, 32382376266240000, 7771770303897600, 1187353796428800, 129060195264000,
    10559470521600, 670442572800, 33522128640, 1323241920, 40840800, 960960, 16380, 182, 1,
  ],
};

/** Largest 1-norm for which the [m/m] approximant is accurate to unit roundoff (Higham 2005, Table 2.3). */
const THETA: ReadonlyArray<[3 | 5 | 7 | 9, number]> = [
  [3, 1.495585217958292e-2],
  [5, 2.53939833006323e-1],
  [7, 9.504178996162932e-1],
  [9, 2.097847961257068],
];
const THETA_13 = 5.371920351148152;

/**
 * Matrix exponential e^a of an n x n matrix.
 *
 * Method: scaling and squaring with a diagonal Padé approximant of degree 3, 5, 7, 9 or 13 chosen
 * from the 1-norm, Algorithm 2.3 of N. J. Higham, "The scaling and squaring method for the matrix
 * exponential revisited", SIAM J. Matrix Anal. Appl. 26(4) (2005) 1179-1193. The rational
 * approximant r = (V - U)^{-1} (V + U) is formed with U the odd and V the even part. Scratch
 * matrices are reused between calls (one set per order) because the engine calls this with tiny
 * matrices millions of times and allocation would dominate.
 *
 * Syntax: expm(a, n[, out])
 * Example: expm([-1, 0, 0, -2], 2)  // diag(e^-1, e^-2)
 */
export function expm(a: Matrix, n: number, out: Matrix = zeros(n * n)): Matrix {
  const eta = norm1(a, n);
  if (!Number.isFinite(eta)) throw new RangeError('expm: matrix has non-finite entries');
  const ws = workspace(n);
  for (const [m, theta] of THETA) {
    if (eta <= theta) {
      padeLow(a, n, m, ws, out);
      return out;
    }
  }
  const s = Math.max(0, Math.ceil(Math.log2(eta / THETA_13)));
  const nn = n * n;
  const factor = 2 ** -s;
  for (let i = 0; i < nn; i++) ws.scaled[i] = a[i] * factor;
  let r = out;
  let tmp = ws.square;
  pade13(ws.scaled, n, ws, s % 2 === 0 ? r : tmp);
  // Square s times, alternating buffers so that the last square lands in `out`.
  if (s % 2 === 1) {
    const swap = r;
    r = tmp;
    tmp = swap;
  }
  for (let k = 0; k < s; k++) {
    matmul(r, r, n, tmp);
    const swap = r;
    r = tmp;
    tmp = swap;
  }
  return r;
}

interface Workspace {
  scaled: Matrix;
  square: Matrix;
  a2: Matrix;
  a4: Matrix;
  a6: Matrix;
  a8: Matrix;
  u: Matrix;
  v: Matrix;
  t1: Matrix;
  t2: Matrix;
  piv: Int32Array;
}

const workspaces = new Map<number, Workspace>();

function workspace(n: number): Workspace {
  let ws = workspaces.get(n);
  if (!ws) {
    const nn = n * n;
    const m = () => zeros(nn);
    ws = { scaled: m(), square: m(), a2: m(), a4: m(), a6: m(), a8: m(), u: m(), v: m(), t1: m(), t2: m(), piv: new Int32Array(n) };
    workspaces.set(n, ws);
  }
  return ws;
}

/** [m/m] Padé approximant for m in {3, 5, 7, 9}: U = a sum b_odd a^(k-1), V = sum b_even a^k. */
function padeLow(a: Matrix, n: number, m: 3 | 5 | 7 | 9, ws: Workspace, out: Matrix): void {
  const b = PADE_COEFFICIENTS[m];
  const nn = n * n;
  matmul(a, a, n, ws.a2);
  if (m >= 5) matmul(ws.a2, ws.a2, n, ws.a4);
  if (m >= 7) matmul(ws.a4, ws.a2, n, ws.a6);
  if (m >= 9) matmul(ws.a6, ws.a2, n, ws.a8);
  const inner = ws.t1;
  const v = ws.v;
  const { a2, a4, a6, a8 } = ws;
  for (let i = 0; i < nn; i++) {
    let ui = b[3] * a2[i];
    let vi = b[2] * a2[i];
    if (m >= 5) {
      ui += b[5] * a4[i];
      vi += b[4] * a4[i];
    }
    if (m >= 7) {
      ui += b[7] * a6[i];
      vi += b[6] * a6[i];
    }
    if (m >= 9) {
      ui += b[9] * a8[i];
      vi += b[8] * a8[i];
    }
    inner[i] = ui;
    v[i] = vi;
  }
  for (let i = 0; i < n; i++) {
    inner[i * n + i] += b[1];
    v[i * n + i] += b[0];
  }
  matmul(a, inner, n, ws.u);
  padeSolve(ws, n, out);
}

/** [13/13] Padé approximant, evaluated with the 6-product scheme of Higham 2005, section 2. */
function pade13(a: Matrix, n: number, ws: Workspace, out: Matrix): void {
  const b = PADE_COEFFICIENTS[13];
  const nn = n * n;
  const { a2, a4, a6, t1, t2, u, v } = ws;
  matmul(a, a, n, a2);
  matmul(a2, a2, n, a4);
  matmul(a4, a2, n, a6);
  for (let i = 0; i < nn; i++) {
    t1[i] = b[13] * a6[i] + b[11] * a4[i] + b[9] * a2[i];
    t2[i] = b[12] * a6[i] + b[10] * a4[i] + b[8] * a2[i];
  }
  matmul(a6, t1, n, ws.a8); // a8 reused as scratch: a6 (b13 a6 + b11 a4 + b9 a2)
  matmul(a6, t2, n, v);
  for (let i = 0; i < nn; i++) {
    t1[i] = ws.a8[i] + b[7] * a6[i] + b[5] * a4[i] + b[3] * a2[i];
    v[i] += b[6] * a6[i] + b[4] * a4[i] + b[2] * a2[i];
  }
  for (let i = 0; i < n; i++) {
    t1[i * n + i] += b[1];
    v[i * n + i] += b[0];
  }
  matmul(a, t1, n, u);
  padeSolve(ws, n, out);
}

/** out = (V - U)^{-1} (V + U), LU with partial pivoting done in place on scratch. */
function padeSolve(ws: Workspace, n: number, out: Matrix): void {
  const nn = n * n;
  const { u, v } = ws;
  const q = ws.t2;
  for (let i = 0; i < nn; i++) {
    out[i] = v[i] + u[i];
    q[i] = v[i] - u[i];
  }
  // Factor q and apply the same row operations to out (Gaussian elimination, partial pivoting).
  for (let k = 0; k < n; k++) {
    let p = k;
    let big = Math.abs(q[k * n + k]);
    for (let i = k + 1; i < n; i++) {
      const val = Math.abs(q[i * n + k]);
      if (val > big) {
        big = val;
        p = i;
      }
    }
    if (big === 0) throw new RangeError('expm: singular Padé denominator');
    if (p !== k) {
      for (let j = 0; j < n; j++) {
        let t = q[k * n + j];
        q[k * n + j] = q[p * n + j];
        q[p * n + j] = t;
        t = out[k * n + j];
        out[k * n + j] = out[p * n + j];
        out[p * n + j] = t;
      }
    }
    const pivot = q[k * n + k];
    for (let i = k + 1; i < n; i++) {
      const f = q[i * n + k] / pivot;
      if (f === 0) continue;
      for (let j = k + 1; j < n; j++) q[i * n + j] -= f * q[k * n + j];
      for (let j = 0; j < n; j++) out[i * n + j] -= f * out[k * n + j];
    }
  }
  for (let i = n - 1; i >= 0; i--) {
    for (let k = i + 1; k < n; k++) {
      const f = q[i * n + k];
      if (f === 0) continue;
      for (let j = 0; j < n; j++) out[i * n + j] -= f * out[k * n + j];
    }
    const d = q[i * n + i];
    for (let j = 0; j < n; j++) out[i * n + j] /= d;
  }
}
