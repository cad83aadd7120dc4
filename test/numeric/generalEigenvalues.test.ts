import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { eigs } from 'mathjs';
import { generalEigenvalues } from '../../src/numeric/generalEigenvalues.js';
import { symmetricEigen } from '../../src/numeric/symmetricEigen.js';

interface Eig {
  re: number;
  im: number;
}

const asList = (e: { re: number[]; im: number[] }): Eig[] => e.re.map((re, k) => ({ re, im: e.im[k] }));
const dist = (a: Eig, b: Eig) => Math.hypot(a.re - b.re, a.im - b.im);
const frobenius = (a: ArrayLike<number>) => Math.sqrt(Array.from(a).reduce((s, x) => s + x * x, 0));

/** Largest distance when each computed eigenvalue is paired with the nearest unused reference. */
function worstMatch(mine: Eig[], ref: Eig[]): number {
  expect(mine.length).toBe(ref.length);
  const free = ref.slice();
  let worst = 0;
  for (const m of mine) {
    let best = 0;
    for (let k = 1; k < free.length; k++) if (dist(m, free[k]) < dist(m, free[best])) best = k;
    worst = Math.max(worst, dist(m, free[best]));
    free.splice(best, 1);
  }
  return worst;
}

/** The ordering contract: real part descending, conjugate pairs adjacent with +im first. */
function expectOrdered(e: { re: number[]; im: number[] }): void {
  for (let k = 1; k < e.re.length; k++) expect(e.re[k]).toBeLessThanOrEqual(e.re[k - 1]);
  for (let k = 0; k < e.re.length; k++) {
    if (e.im[k] > 0) {
      expect(e.re[k + 1]).toBe(e.re[k]);
      expect(e.im[k + 1]).toBe(-e.im[k]);
      k++;
    } else {
      expect(e.im[k]).toBe(0);
    }
  }
}

const rowsOf = (a: number[], n: number) => Array.from({ length: n }, (_, i) => a.slice(i * n, i * n + n));

/** mathjs eigs, or null where it reports that its own iteration did not converge. */
function mathjsEigenvalues(a: number[], n: number): Eig[] | null {
  let values: (number | { re: number; im: number })[];
  try {
    values = eigs(rowsOf(a, n), { eigenvectors: false }).values as unknown as (number | { re: number; im: number })[];
  } catch (e) {
    if (e instanceof Error && e.message.includes('failed to converge')) return null;
    throw e;
  }
  return values.map((v) => (typeof v === 'number' ? { re: v, im: 0 } : { re: v.re, im: v.im }));
}

/** Minimum distance between two eigenvalues, relative to the norm: a proxy for well-conditioned. */
function separation(e: Eig[], scale: number): number {
  let sep = Infinity;
  for (let i = 0; i < e.length; i++) for (let j = i + 1; j < e.length; j++) sep = Math.min(sep, dist(e[i], e[j]));
  return sep / scale;
}

/** State matrix x' = A x of an RC ladder from a grounded input (x = node voltages), A = -C^-1 G. */
function rcLadder(r: number[], c: number[]): { a: number[]; g: number[]; n: number } {
  const n = r.length;
  const g = new Array<number>(n * n).fill(0);
  for (let k = 0; k < n; k++) {
    const gk = 1 / r[k];
    g[k * n + k] += gk;
    if (k > 0) {
      g[(k - 1) * n + k - 1] += gk;
      g[(k - 1) * n + k] -= gk;
      g[k * n + k - 1] -= gk;
    }
  }
  return { a: g.map((x, idx) => -x / c[Math.floor(idx / n)]), g, n };
}

/** Entries of order one on a grid of 1e-3 (no subnormal or tiny values, where mathjs is unreliable). */
const entry = fc.integer({ min: -10000, max: 10000 }).map((k) => k / 1000);

describe('generalEigenvalues (balance, Hessenberg, Francis double-shift QR)', () => {
  it('agrees with mathjs eigs on fixed nonsymmetric matrices (reference library)', () => {
    // Source: mathjs eigs (npm reference library; complex output for nonsymmetric input).
    const cases: [number[], number][] = [
      [[1, 2, 3, 4], 2],
      [[4, -2, 1, 3, 6, -4, 2, 1, 8], 3],
      [[5, -1, 0, 3, 1, 4, -2, 0, 0, 2, 1, -1, 7, 2, -3, -6], 4],
      [[-1e3, 1, 0, 2e2, -1, 3e-2, 0, 5, -1e-3], 3],
    ];
    for (const [a, n] of cases) {
      const copy = a.slice();
      const mine = generalEigenvalues(a, n);
      expect(a).toEqual(copy); // the input is left alone
      expectOrdered(mine);
      const ref = mathjsEigenvalues(a, n);
      expect(ref).not.toBeNull();
      expect(worstMatch(asList(mine), ref ?? [])).toBeLessThan(1e-10 * frobenius(a));
    }
  });

  it('agrees with mathjs eigs on random matrices of order 1 to 10 (reference library, seeded)', () => {
    // Source: mathjs eigs. Normwise relative agreement 1e-10 where the eigenvalues are separated by
    // at least 1e-3 of the norm (nearly repeated eigenvalues are ill-conditioned for any method).
    let worst = 0;
    let checked = 0;
    let referenceFailed = 0; // mathjs 15.2 stops without converging on ~15 % of these
    for (let n = 1; n <= 10; n++) {
      fc.assert(
        fc.property(fc.array(entry, { minLength: n * n, maxLength: n * n }), (a) => {
          const mine = generalEigenvalues(a, n);
          expectOrdered(mine);
          const scale = Math.max(frobenius(a), 1e-300);
          const ref = mathjsEigenvalues(a, n);
          if (ref === null) {
            referenceFailed++;
            return;
          }
          if (separation(ref, scale) < 1e-3) return;
          checked++;
          const err = worstMatch(asList(mine), ref) / scale;
          worst = Math.max(worst, err);
          expect(err).toBeLessThan(1e-10);
        }),
        { numRuns: 40, seed: 20240 + n },
      );
    }
    expect(checked).toBeGreaterThan(250);
    expect(referenceFailed).toBeLessThan(100);
    console.log(`generalEigenvalues vs mathjs: ${checked} matrices, worst ${worst.toExponential(1)}, mathjs failed on ${referenceFailed}`);
    expect(worst).toBeGreaterThan(0); // the comparison really ran on nonzero data
  });

  it('gives the roots of the characteristic polynomial of any 2 x 2 matrix', () => {
    // Source: lambda^2 - (a + d) lambda + (a d - b c) = 0 (closed form, common practice).
    fc.assert(
      fc.property(fc.tuple(entry, entry, entry, entry), ([a, b, c, d]) => {
        const scale = Math.max(Math.abs(a), Math.abs(b), Math.abs(c), Math.abs(d));
        fc.pre(scale > 0);
        const half = (a - d) / 2;
        const disc = half * half + b * c;
        fc.pre(Math.abs(disc) > 1e-6 * scale * scale); // away from a double root
        const mid = (a + d) / 2;
        const root = Math.sqrt(Math.abs(disc));
        const ref: Eig[] = disc >= 0 ? [{ re: mid + root, im: 0 }, { re: mid - root, im: 0 }] : [{ re: mid, im: root }, { re: mid, im: -root }];
        const mine = generalEigenvalues([a, b, c, d], 2);
        expectOrdered(mine);
        for (let k = 0; k < 2; k++) expect(dist(asList(mine)[k], ref[k])).toBeLessThan(1e-12 * scale);
      }),
      { numRuns: 500, seed: 7 },
    );
  });

  it('finds the roots of a known polynomial from its companion matrix', () => {
    // Source: the companion matrix of a monic polynomial has the polynomial's roots as eigenvalues
    // (Golub & Van Loan, 4th ed., section 7.4.6). Roots 2, -1, -3, -2 +- i, multiplied out here.
    let coef = [1]; // ascending powers of x
    const times = (factor: number[]) => {
      const out = new Array<number>(coef.length + factor.length - 1).fill(0);
      for (let i = 0; i < coef.length; i++) for (let j = 0; j < factor.length; j++) out[i + j] += coef[i] * factor[j];
      coef = out;
    };
    times([-2, 1]);
    times([1, 1]);
    times([3, 1]);
    times([5, 4, 1]); // x^2 + 4 x + 5 = (x + 2)^2 + 1
    const n = coef.length - 1;
    const a = new Array<number>(n * n).fill(0);
    for (let j = 0; j < n; j++) a[j] = -coef[n - 1 - j];
    for (let i = 1; i < n; i++) a[i * n + i - 1] = 1;
    const mine = generalEigenvalues(a, n);
    expectOrdered(mine);
    const ref = [
      { re: 2, im: 0 },
      { re: -1, im: 0 },
      { re: -2, im: 1 },
      { re: -2, im: -1 },
      { re: -3, im: 0 },
    ];
    for (let k = 0; k < n; k++) expect(dist(asList(mine)[k], ref[k])).toBeLessThan(1e-12);
  });

  it('converges on the cyclic permutation, where plain Francis shifts stall', () => {
    // Source: the eigenvalues of the 3-cycle permutation are the cube roots of unity 1,
    // -1/2 +- i sqrt(3)/2 (closed form). Its Francis shifts give no progress, so this needs the
    // exceptional shift (Wilkinson & Reinsch hqr); mathjs eigs does not converge here.
    const mine = generalEigenvalues([0, 0, 1, 1, 0, 0, 0, 1, 0], 3);
    expectOrdered(mine);
    const ref = [
      { re: 1, im: 0 },
      { re: -0.5, im: Math.sqrt(3) / 2 },
      { re: -0.5, im: -Math.sqrt(3) / 2 },
    ];
    for (let k = 0; k < 3; k++) expect(dist(asList(mine)[k], ref[k])).toBeLessThan(1e-14);
  });

  it('gives purely imaginary pairs for rotation generators hidden by an orthogonal similarity', () => {
    // Source: [[0, -w], [w, 0]] has eigenvalues +-i w (closed form); Q^T B Q with Q orthogonal
    // has the same eigenvalues (similarity). Q is the Householder reflection I - 2 u u^T / u^T u.
    expect(generalEigenvalues([0, -3, 3, 0], 2)).toEqual({ re: [0, 0], im: [3, -3] });
    const w1 = 2.5;
    const w2 = 0.4;
    const b = [0, -w1, 0, 0, w1, 0, 0, 0, 0, 0, 0, -w2, 0, 0, w2, 0];
    const u = [1, -2, 0.5, 3];
    const uu = u.reduce((s, x) => s + x * x, 0);
    const q = Array.from({ length: 16 }, (_, idx) => (idx % 5 === 0 ? 1 : 0) - (2 * u[Math.floor(idx / 4)] * u[idx % 4]) / uu);
    const qbq = new Array<number>(16).fill(0);
    for (let i = 0; i < 4; i++)
      for (let j = 0; j < 4; j++) for (let k = 0; k < 4; k++) for (let l = 0; l < 4; l++) qbq[i * 4 + j] += q[k * 4 + i] * b[k * 4 + l] * q[l * 4 + j];
    const mine = generalEigenvalues(qbq, 4);
    for (const im of mine.im) expect(im).not.toBe(0);
    const ref = [
      { re: 0, im: w1 },
      { re: 0, im: -w1 },
      { re: 0, im: w2 },
      { re: 0, im: -w2 },
    ];
    expect(worstMatch(asList(mine), ref)).toBeLessThan(1e-14 * w1);
  });

  it('reads the eigenvalues of diagonal and triangular matrices off the diagonal, sorted', () => {
    // Source: the eigenvalues of a triangular matrix are its diagonal entries (common practice).
    const diag = [3, -7, 0.5, 1e-6, -2e4, 12];
    const n = diag.length;
    const d = new Array<number>(n * n).fill(0);
    diag.forEach((x, k) => (d[k * n + k] = x));
    const sorted = diag.slice().sort((x, y) => y - x);
    expect(generalEigenvalues(d, n)).toEqual({ re: sorted, im: new Array<number>(n).fill(0) });
    const upper = d.slice();
    const lower = d.slice();
    for (let i = 0; i < n; i++) {
      for (let j = i + 1; j < n; j++) {
        upper[i * n + j] = Math.sin(3 * i + j) * 5;
        lower[j * n + i] = Math.cos(i - 2 * j) * 5;
      }
    }
    // Upper triangular is already Hessenberg with zero subdiagonal: every eigenvalue deflates at once.
    expect(generalEigenvalues(upper, n)).toEqual({ re: sorted, im: new Array<number>(n).fill(0) });
    // Lower triangular goes through the reduction: normwise backward error (Golub & Van Loan 7.5.6).
    const mine = generalEigenvalues(lower, n);
    expect(mine.im).toEqual(new Array<number>(n).fill(0));
    for (let k = 0; k < n; k++) expect(Math.abs(mine.re[k] - sorted[k])).toBeLessThan(1e-14 * frobenius(lower));
  });

  it('keeps every eigenvalue of an RC ladder with time constants 1e-9 s to 1e3 s to 1e-9 relative', () => {
    // Source: A = -C^-1 G is similar to the symmetric C^1/2 A C^-1/2 = -C^-1/2 G C^-1/2, whose
    // eigenvalues symmetricEigen.ts finds by Jacobi rotations (an independent method); and
    // det A = prod(-1 / (R_k C_k)), since det G = prod(1 / R_k) for a ladder from ground (expand
    // the tridiagonal determinant from the last row; derived here, checked at n = 1, 2 by hand).
    const ladders: [number[], number[]][] = [
      // fast stage first: R_k C_k = 1e-9, 1e-6, 1e-3, 1, 1e3, 1e3 s
      [[1e3, 1e3, 1e4, 1e5, 1e6, 1e6], [1e-12, 1e-9, 1e-7, 1e-5, 1e-3, 1e-3]],
      // slow stage first: 1e3, 1, 1e-3, 1e-6, 1e-9, 1e-9 s
      [[1e6, 1e5, 1e4, 1e3, 1e2, 1e1], [1e-3, 1e-5, 1e-7, 1e-9, 1e-11, 1e-10]],
      // mixed: 1e-9, 1e-5, 1e-2, 1e3, 1e-2, 1e3 s
      [[1, 1e2, 1e4, 1e6, 1e3, 1e5], [1e-9, 1e-7, 1e-6, 1e-3, 1e-5, 1e-2]],
    ];
    let worst = 0;
    for (const [r, c] of ladders) {
      const { a, g, n } = rcLadder(r, c);
      const mine = generalEigenvalues(a, n);
      expect(mine.im).toEqual(new Array<number>(n).fill(0));
      const s = g.map((x, idx) => -x / Math.sqrt(c[Math.floor(idx / n)] * c[idx % n]));
      const ref = symmetricEigen(s, n).values.slice().reverse(); // descending
      expect(Math.max(...ref.map(Math.abs)) / Math.min(...ref.map(Math.abs))).toBeGreaterThan(1e11);
      for (let k = 0; k < n; k++) {
        const err = Math.abs(mine.re[k] - ref[k]) / Math.abs(ref[k]);
        worst = Math.max(worst, err);
        expect(err).toBeLessThan(1e-9);
      }
      let product = 1;
      let exact = 1;
      for (let k = 0; k < n; k++) {
        product *= mine.re[k];
        exact *= -1 / (r[k] * c[k]);
      }
      expect(Math.abs(product / exact - 1)).toBeLessThan(1e-9);
    }
    expect(worst).toBeLessThan(1e-9);
  });

  it('matches the published f0 and Q of unity-gain Sallen-Key low-pass stages', () => {
    // Circuit: vin -R1- node 1 -R2- node 2, C1 from node 1 to the output, C2 from node 2 to ground,
    // unity-gain follower output = v(node 2). States x1 = v_C1 = v1 - vout, x2 = v_C2 = vout;
    // KCL (derived here): C2 x2' = x1 / R2, C1 x1' = (vin - x1 - x2) / R1 - x1 / R2, so
    //   A = [[-(1/R1 + 1/R2) / C1, -1 / (R1 C1)], [1 / (R2 C2), 0]].
    // Source (from memory): unity-gain Sallen-Key low-pass f0 = 1 / (2 pi sqrt(R1 R2 C1 C2)),
    // Q = sqrt(R1 R2 C1 C2) / (C2 (R1 + R2)); poles solve s^2 + (w0 / Q) s + w0^2 = 0.
    const stages = [
      { r1: 10e3, r2: 22e3, c1: 10e-9, c2: 1e-9 }, // complex pair (Q ~ 1.6)
      { r1: 4.7e3, r2: 4.7e3, c1: 22e-9, c2: 10e-9 }, // Q ~ 0.74
      { r1: 1e3, r2: 100e3, c1: 1e-9, c2: 100e-9 }, // two real poles (Q < 1/2)
    ];
    for (const { r1, r2, c1, c2 } of stages) {
      const a = [-(1 / r1 + 1 / r2) / c1, -1 / (r1 * c1), 1 / (r2 * c2), 0];
      const f0 = 1 / (2 * Math.PI * Math.sqrt(r1 * r2 * c1 * c2));
      const q = Math.sqrt(r1 * r2 * c1 * c2) / (c2 * (r1 + r2));
      const w0 = 2 * Math.PI * f0;
      const { re, im } = generalEigenvalues(a, 2);
      expect(im[0] !== 0).toBe(q > 0.5);
      // product of the eigenvalues (complex) = w0^2, minus their sum = w0 / Q
      const product = re[0] * re[1] - im[0] * im[1];
      expect(Math.abs(product / (w0 * w0) - 1)).toBeLessThan(1e-12);
      expect(Math.abs(-(re[0] + re[1]) / (w0 / q) - 1)).toBeLessThan(1e-12);
      if (q > 0.5) {
        // s = -w0 / (2Q) +- i w0 sqrt(1 - 1 / (4 Q^2))
        expect(Math.abs(re[0] / (-w0 / (2 * q)) - 1)).toBeLessThan(1e-12);
        expect(Math.abs(im[0] / (w0 * Math.sqrt(1 - 1 / (4 * q * q))) - 1)).toBeLessThan(1e-12);
      }
    }
  });

  it('handles order 0 and 1 and rejects non-finite entries', () => {
    expect(generalEigenvalues([], 0)).toEqual({ re: [], im: [] });
    expect(generalEigenvalues([-4.5], 1)).toEqual({ re: [-4.5], im: [0] });
    expect(() => generalEigenvalues([1, NaN, 0, 1], 2)).toThrow(RangeError);
    expect(() => generalEigenvalues([1, 2, 3], 2)).toThrow(RangeError);
  });
});
