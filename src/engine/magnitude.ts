import type { Ladder } from '../circuit/ladder.js';
import { luFactor, luSolve } from '../numeric/lu.js';
import { zeros } from '../numeric/dense.js';
import { prepare, type Prepared } from './prepare.js';
import { transferMagnitude } from './transferMagnitude.js';

/**
 * Small-signal gain from the pin to the output at a frequency, relative to DC (linear):
 * |H(j 2 pi f)| / |H(0)| with H(s) = c^T (sI - A)^{-1} b, driver = mean of high and low.
 *
 * Method: transferMagnitude.ts at w; H(0) from -A z0 = b.
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
  const c = zeros(n);
  c[output] = 1;
  const dc = luSolve(luFactor(A.map((v) => -v), n), input)[output];
  return transferMagnitude(A, input, c, n, w) / Math.abs(dc);
}
