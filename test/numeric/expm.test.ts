import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { expm as mathjsExpm, matrix } from 'mathjs';
import { expm, PADE_COEFFICIENTS } from '../../src/numeric/expm.js';

const toRows = (a: number[], n: number): number[][] =>
  Array.from({ length: n }, (_, i) => a.slice(i * n, i * n + n));

describe('expm (Higham 2005 scaling and squaring)', () => {
  it('uses the diagonal Padé coefficients b_k ~ (2m-k)! m! / ((2m)! k! (m-k)!)', () => {
    // Source: Padé approximant of e^x, numerator coefficients (e.g. Higham 2005, section 2;
    // Golub & Van Loan, Matrix Computations, section 9.3.1). Recomputed exactly with BigInt.
    const fact = (k: number): bigint => (k <= 1 ? 1n : BigInt(k) * fact(k - 1));
    for (const m of [3, 5, 7, 9, 13] as const) {
      const num = (k: number) => fact(2 * m - k) * fact(m);
      const den = (k: number) => fact(2 * m) * fact(k) * fact(m - k);
      // b_k / b_m = num(k) den(m) / (den(k) num(m)), an integer
      const expected = Array.from({ length: m + 1 }, (_, k) => Number((num(k) * den(m)) / (den(k) * num(m))));
      expect(PADE_COEFFICIENTS[m]).toEqual(expected);
    }
  });

  it('matches Math.exp on scalars across all Padé degrees and scalings', () => {
    // Source: Math.exp (IEEE 754 double, correctly rounded to within 1 ulp in V8).
    for (const x of [-1e-12, -0.01, -0.2, -0.9, -2, -5, -20, -100, 0.5, 3]) {
      const got = expm([x], 1)[0];
      expect(Math.abs(got - Math.exp(x)) / Math.exp(x)).toBeLessThan(1e-13);
    }
  });

  it('agrees with mathjs expm on random small matrices (fast-check)', () => {
    // Source: mathjs `expm` (npm mathjs 15, Padé approximation with scaling and squaring).
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 6 }),
        fc.array(fc.double({ min: -1, max: 1, noNaN: true }), { minLength: 36, maxLength: 36 }),
        fc.double({ min: 1e-3, max: 20, noNaN: true }),
        (n, entries, scale) => {
          const a = entries.slice(0, n * n).map((v) => v * scale);
          const got = expm(a, n);
          const ref = (mathjsExpm(matrix(toRows(a, n))).toArray() as number[][]).flat();
          const refNorm = Math.max(...ref.map(Math.abs));
          const err = Math.max(...ref.map((v, i) => Math.abs(v - got[i])));
          return err <= 1e-9 * refNorm;
        },
      ),
      { numRuns: 100 },
    );
  });
});
