import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { eigs } from 'mathjs';
import { symmetricEigen, symmetricEigenJacobi } from '../../src/numeric/symmetricEigen.js';

/** A random symmetric matrix of order n from n (n + 1) / 2 free entries. */
const symmetric = (n: number) =>
  fc.array(fc.double({ min: -10, max: 10, noNaN: true }), { minLength: (n * (n + 1)) / 2, maxLength: (n * (n + 1)) / 2 }).map((free) => {
    const a = new Array<number>(n * n).fill(0);
    let k = 0;
    for (let i = 0; i < n; i++) {
      for (let j = i; j < n; j++) {
        a[i * n + j] = free[k];
        a[j * n + i] = free[k];
        k++;
      }
    }
    return a;
  });

const frobenius = (a: number[]) => Math.sqrt(a.reduce((s, x) => s + x * x, 0));

describe('symmetricEigen (cyclic Jacobi, Golub & Van Loan 8.5)', () => {
  it('gives the textbook 2 x 2 example: [[2, 1], [1, 2]] has eigenvalues 1 and 3', () => {
    // Source: closed form lambda = (a + d)/2 +- sqrt(((a - d)/2)^2 + b^2) (common practice).
    const { values, vectors } = symmetricEigen([2, 1, 1, 2], 2, { vectors: true });
    expect(values[0]).toBeCloseTo(1, 14);
    expect(values[1]).toBeCloseTo(3, 14);
    // Column 0 is +-(1, -1)/sqrt(2).
    expect(Math.abs(vectors[0] * vectors[2] + 0.5)).toBeLessThan(1e-15);
  });

  it('agrees with mathjs eigs on random symmetric matrices of order 1 to 6 (reference library)', () => {
    // Source: mathjs eigs (npm reference library), sorted ascending.
    for (const n of [1, 2, 3, 4, 5, 6]) {
      fc.assert(
        fc.property(symmetric(n), (a) => {
          const rows = Array.from({ length: n }, (_, i) => a.slice(i * n, i * n + n));
          const ref = (eigs(rows).values as number[]).slice().sort((x, y) => x - y);
          const mine = symmetricEigen(a, n).values;
          const scale = Math.max(1, frobenius(a));
          for (let k = 0; k < n; k++) expect(Math.abs(mine[k] - ref[k])).toBeLessThan(1e-10 * scale);
        }),
        { numRuns: 60 },
      );
    }
  });

  it('returns orthonormal eigenvectors with A v = lambda v when asked', () => {
    // Source: definition of the spectral decomposition A = V diag(lambda) V^T (Golub & Van Loan,
    // Theorem 8.1.1).
    for (const n of [1, 2, 3, 4, 5]) {
      fc.assert(
        fc.property(symmetric(n), (a) => {
          const { values, vectors: v } = symmetricEigen(a, n, { vectors: true });
          const scale = Math.max(1, frobenius(a));
          for (let j = 0; j < n; j++) {
            for (let i = 0; i < n; i++) {
              let av = 0;
              for (let k = 0; k < n; k++) av += a[i * n + k] * v[k * n + j];
              expect(Math.abs(av - values[j] * v[i * n + j])).toBeLessThan(1e-12 * scale);
            }
            for (let l = 0; l < n; l++) {
              let dot = 0;
              for (let k = 0; k < n; k++) dot += v[k * n + j] * v[k * n + l];
              expect(Math.abs(dot - (j === l ? 1 : 0))).toBeLessThan(1e-13);
            }
          }
        }),
        { numRuns: 60 },
      );
    }
  });

  it('keeps the small eigenvalue of a graded ladder matrix to high relative accuracy', () => {
    // Source: two-stage RC ladder, S = C^-1/2 G C^-1/2 with time constants decades apart; the
    // product of eigenvalues equals det S = g1 g2 / (c1 c2) exactly (no cancellation), and the
    // large one is near the trace. Demmel & Veselic (1992) bound the relative error of Jacobi here.
    const g1 = 1e-3;
    const g2 = 1e-6;
    const c1 = 1e-9;
    const c2 = 1e-3;
    const s = [(g1 + g2) / c1, -g2 / Math.sqrt(c1 * c2), -g2 / Math.sqrt(c1 * c2), g2 / c2];
    const det = (g1 * g2) / (c1 * c2);
    for (const n of [2, 3]) {
      // Order 3: the same block plus a decoupled third mode of rate 5, which must not disturb it.
      const a = n === 2 ? s : [s[0], s[1], 0, s[2], s[3], 0, 0, 0, 5];
      const values = symmetricEigen(a, n).values;
      const small = values[0];
      const large = values[n - 1];
      expect(Math.abs((small * large) / det - 1)).toBeLessThan(1e-13);
      if (n === 3) expect(values[1]).toBeCloseTo(5, 12);
    }
  });
  it('order 3 on scalars gives the general loops\' digits exactly (fast-check, with and without vectors; ladder-like spreads too)', () => {
    // the scalar path is the general code written out: every number must agree bit for bit
    const ladderLike = fc.tuple(fc.double({ min: 0, max: 8, noNaN: true }), fc.double({ min: 0, max: 8, noNaN: true }), fc.double({ min: 0, max: 8, noNaN: true }), fc.double({ min: 0, max: 0.95, noNaN: true }), fc.double({ min: 0, max: 0.95, noNaN: true })).map(([x, y, z, u, w]) => {
      const a = -(10 ** x);
      const b = -(10 ** y);
      const c = -(10 ** z);
      const o1 = Math.sqrt(a * b) * u;
      const o2 = Math.sqrt(b * c) * w;
      return [a, o1, 0, o1, b, o2, 0, o2, c];
    });
    fc.assert(
      fc.property(fc.oneof(symmetric(3), ladderLike), (a) => {
        const got = symmetricEigen(a, 3, { vectors: true });
        const want = symmetricEigenJacobi(a, 3, true);
        const plain = symmetricEigen(a, 3).values;
        return got.values.every((v, i) => Object.is(v, want.values[i]) && Object.is(plain[i], v)) && got.vectors.every((v, i) => Object.is(v, want.vectors![i]));
      }),
      { numRuns: 2000, seed: 31 },
    );
  });
});
