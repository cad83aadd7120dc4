import { identity, matmul, matvec, normInf, type Matrix, type Vector } from '../numeric/dense.js';

/**
 * Powers M^(2^j) of the one-period map of deviations, M = E_l E_h = I - S, kept as I + N while
 * close to the identity so that M^(2^j) e keeps its digits when M is within 1e-9 of I.
 *
 * Method: repeated squaring. While ||N|| < 1/2: N <- 2N + N N (from (I + N)^2), never forming
 * I + N; afterwards plain squaring P <- P P. (The squaring phase of scaling and squaring
 * written for M - I, as flow.ts does for K = I - E.)
 *
 * Syntax: const pw = periodPowers(S, n); pw.apply(j, e)
 * Example: periodPowers(S, n).apply(3, e)  // M^8 e
 */
export function periodPowers(S: Matrix, n: number): PeriodPowers {
  const nearIdentity: boolean[] = [];
  const matrices: Matrix[] = [];
  const first = S.map((v) => -v);
  matrices.push(first);
  nearIdentity.push(true);
  const ensure = (j: number) => {
    while (matrices.length <= j) {
      const last = matrices[matrices.length - 1];
      const near = nearIdentity[nearIdentity.length - 1];
      if (near && normInf(last, n) < 0.5) {
        const sq = matmul(last, last, n);
        matrices.push(sq.map((v, i) => v + 2 * last[i]));
        nearIdentity.push(true);
      } else {
        const p = near ? identity(n).map((v, i) => v + last[i]) : last;
        matrices.push(matmul(p, p, n));
        nearIdentity.push(false);
      }
    }
  };
  return {
    apply(j: number, e: Vector): Vector {
      ensure(j);
      const m = matrices[j];
      const me = matvec(m, e, n);
      if (!nearIdentity[j]) return me;
      for (let i = 0; i < n; i++) me[i] += e[i];
      return me;
    },
    applyPower(k: number, e: Vector): Vector {
      let x = e;
      for (let j = 0; k > 0; j++, k = Math.floor(k / 2)) if (k % 2 === 1) x = this.apply(j, x);
      return x;
    },
  };
}

export interface PeriodPowers {
  /** M^(2^j) e. */
  apply(j: number, e: Vector): Vector;
  /** M^k e for an integer k >= 0 (binary powering). */
  applyPower(k: number, e: Vector): Vector;
}
