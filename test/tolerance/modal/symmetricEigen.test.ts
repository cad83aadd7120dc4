import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { eigs } from 'mathjs';
import { symmetricEigen } from '../../../src/tolerance/modal/symmetricEigen.js';

describe('symmetricEigen', () => {
  it('agrees with mathjs eigs on random symmetric matrices (reference library)', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 4 }).chain((n) =>
          fc.tuple(fc.constant(n), fc.array(fc.double({ min: -10, max: 10, noNaN: true }), { minLength: n * n, maxLength: n * n })),
        ),
        ([n, raw]) => {
          const a = Array.from({ length: n * n }, (_, k) => {
            const i = Math.floor(k / n);
            const j = k % n;
            return 0.5 * (raw[i * n + j] + raw[j * n + i]);
          });
          const { values, vectors } = symmetricEigen(a, n);
          const mine = [...values].sort((x, y) => x - y);
          const rows = Array.from({ length: n }, (_, i) => a.slice(i * n, i * n + n));
          const ref = (eigs(rows).values as number[]).slice().sort((x, y) => x - y);
          const scale = Math.max(1, ...a.map(Math.abs));
          mine.forEach((v, i) => expect(Math.abs(v - ref[i])).toBeLessThan(1e-12 * scale));
          // residual A v - lambda v of each unit eigenvector
          for (let j = 0; j < n; j++) {
            for (let i = 0; i < n; i++) {
              let av = 0;
              for (let k = 0; k < n; k++) av += a[i * n + k] * vectors[k * n + j];
              expect(Math.abs(av - values[j] * vectors[i * n + j])).toBeLessThan(1e-12 * scale);
            }
          }
        },
      ),
      { numRuns: 200, seed: 424242 },
    );
  });

  it('returns orthonormal eigenvectors: A v = lambda v and V^T V = I', () => {
    const n = 4;
    const a = [4, 1, 0, 0, 1, 3, 0.5, 0, 0, 0.5, 2, 1e-3, 0, 0, 1e-3, 1e-6];
    const { values, vectors } = symmetricEigen(a, n);
    for (let j = 0; j < n; j++) {
      for (let i = 0; i < n; i++) {
        let av = 0;
        for (let k = 0; k < n; k++) av += a[i * n + k] * vectors[k * n + j];
        expect(Math.abs(av - values[j] * vectors[i * n + j])).toBeLessThan(1e-14 * 4);
      }
      for (let k = 0; k < n; k++) {
        let dot = 0;
        for (let i = 0; i < n; i++) dot += vectors[i * n + j] * vectors[i * n + k];
        expect(Math.abs(dot - (j === k ? 1 : 0))).toBeLessThan(1e-14);
      }
    }
  });

  it('keeps a tiny eigenvalue of a graded matrix to high relative accuracy (Demmel & Veselic 1992)', () => {
    // diag(1, 1e-12) rotated by a tiny coupling: the small eigenvalue is 1e-12 - 1e-26/(1 - 1e-12)
    // to first order (second-order perturbation theory; common practice)
    const a = [1, 1e-13, 1e-13, 1e-12];
    const small = Math.min(...symmetricEigen(a, 2).values);
    const expected = 1e-12 - 1e-26 / (1 - 1e-12);
    expect(Math.abs(small - expected) / expected).toBeLessThan(1e-12);
  });
});
