import { solveLinear } from '../../numeric/lu.js';

/** One linear phase of a period as the fixed point needs it: x(t) = x* + E (x(0) - x*), K = I - E. */
export interface PeriodPhase {
  readonly duration: number;
  readonly xStar: readonly number[];
  readonly E: readonly number[];
  readonly K: readonly number[];
}

/**
 * The state at the start of the periodic steady state of a piecewise-linear circuit whose period
 * is the given phases in order (each exact: E = e^{t A_p}, K = I - E formed without cancellation).
 *
 * Method: deviation form about r = sum (t_p / T) x*_p, the time-weighted DC state; composing the
 * phases gives x_end - r = M (x_s - r) + sum_p P_p K_p (x*_p - r) with P_p the flows after phase p,
 * so the fixed point solves S (x_s - r) = acc, S = I - M built as sum_p P_p K_p (no 1 - e^{-x}
 * cancellation when the time constants dwarf the period). One LU solve (numeric/lu.ts). S is
 * returned too: its powers give the settling of a step (periodPowers.ts).
 *
 * Syntax: periodStart(phases, n, period)
 * Example: periodStart([{ duration: T / 2, xStar: [3.3], E: [e], K: [1 - e] }, { duration: T / 2, xStar: [0], E: [e], K: [1 - e] }], 1, T).start  // [3.3 e / (1 + e)]
 */
export function periodStart(phases: readonly PeriodPhase[], n: number, period: number): { start: number[]; S: number[] } {
  const r = new Array<number>(n).fill(0);
  for (const ph of phases) for (let i = 0; i < n; i++) r[i] += (ph.duration / period) * ph.xStar[i];
  // Two buffers each for S and acc, swapped after every phase (the last S written is returned).
  let S = new Array<number>(n * n).fill(0);
  let acc = new Array<number>(n).fill(0);
  let nextS = new Array<number>(n * n).fill(0);
  let nextAcc = new Array<number>(n).fill(0);
  for (const ph of phases) {
    const { E, K } = ph;
    for (let i = 0; i < n * n; i++) nextS[i] = K[i];
    for (let i = 0; i < n; i++) {
      let a = 0;
      for (let j = 0; j < n; j++) {
        a += E[i * n + j] * acc[j] + K[i * n + j] * (ph.xStar[j] - r[j]);
        let s = 0;
        for (let k = 0; k < n; k++) s += E[i * n + k] * S[k * n + j];
        nextS[i * n + j] += s;
      }
      nextAcc[i] = a;
    }
    const doneS = nextS;
    nextS = S;
    S = doneS;
    const doneAcc = nextAcc;
    nextAcc = acc;
    acc = doneAcc;
  }
  const u = solveLinear(S, n, acc);
  if (!u) throw new RangeError('periodStart: the period map has no unique fixed point');
  for (let i = 0; i < n; i++) r[i] += u[i];
  return { start: r, S };
}
