import type { Ladder } from '../circuit/ladder.js';
import { luFactor, luSolve } from '../numeric/lu.js';
import { zeros } from '../numeric/dense.js';
import { prepare, type Prepared } from './prepare.js';

/**
 * Small-signal gain from the pin to the output at a frequency, relative to DC (linear):
 * |H(j 2 pi f)| / |H(0)| with H(s) = c^T (sI - A)^{-1} b, driver = mean of high and low.
 *
 * Method: the complex system (j w I - A) z = b solved as the real 2n x 2n system
 * [[-A, -w I], [w I, -A]] [Re z; Im z] = [b; 0] by LU with partial pivoting (numeric/lu.ts); H(0)
 * from -A z0 = b. Transfer function of a state-space model (common practice).
 *
 * Syntax: magnitude(ladder, frequency)
 * Example: magnitude(oneStage, 1 / (2 * Math.PI * R * C))  // 0.7071 (open output, no driver)
 */
export function magnitude(ladder: Ladder, frequency: number): number {
  if (!(frequency >= 0) || !Number.isFinite(frequency)) {
    throw new RangeError(`frequency ${frequency} must be a finite number >= 0`);
  }
  return relativeGain(prepare(ladder), 2 * Math.PI * frequency);
}

/** |H(j w)| / |H(0)| for angular frequency w (rad/s). */
export function relativeGain(p: Prepared, w: number): number {
  const { n, output } = p.system;
  const { A, input } = p.system.mean;
  const m = 2 * n;
  const big = zeros(m * m);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      big[i * m + j] = -A[i * n + j];
      big[(n + i) * m + n + j] = -A[i * n + j];
    }
    big[i * m + n + i] = -w;
    big[(n + i) * m + i] = w;
  }
  const rhs = zeros(m);
  for (let i = 0; i < n; i++) rhs[i] = input[i];
  const z = luSolve(luFactor(big, m), rhs);
  const dc = luSolve(luFactor(A.map((v) => -v), n), input)[output];
  return Math.hypot(z[output], z[n + output]) / Math.abs(dc);
}
