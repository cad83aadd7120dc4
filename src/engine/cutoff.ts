import type { Ladder } from '../circuit/ladder.js';
import { brentRoot } from '../numeric/brentRoot.js';
import { relativeGain } from './magnitude.js';
import { prepare } from './prepare.js';
import { timeConstants } from './timeConstants.js';

/**
 * The -3 dB frequency (Hz) of the small-signal response from the pin to the output, relative to
 * its DC value, with the driver at the mean of its high and low resistances.
 *
 * Method: the ladder's poles are real and it has no finite zeros, so |H(j w)|/|H(0)| =
 * prod 1/sqrt(1 + (w tau_i)^2) falls monotonically; with tau_1 the slowest time constant the
 * -3 dB point lies between sqrt(ln 2 / sum tau_i^2) and 1/tau_1 (from 1 + x <= e^x and
 * prod(1 + x_i) >= 1 + x_1). Brent's method (brentRoot.ts) on ln|H| + ln(2)/2 in log w inside
 * that bracket, with |H| from the complex solve of magnitude.ts.
 *
 * Syntax: cutoff(ladder)
 * Example: cutoff(oneStage)  // 1 / (2 pi (R + driver) C) with an open output
 */
export function cutoff(ladder: Ladder): number {
  const p = prepare(ladder);
  const taus = timeConstants(ladder);
  const sumSquares = taus.reduce((s, t) => s + t * t, 0);
  let lo = Math.log(Math.sqrt(Math.LN2 / sumSquares));
  let hi = Math.log(1 / taus[0]);
  const f = (logW: number) => Math.log(relativeGain(p, Math.exp(logW))) + 0.5 * Math.LN2;
  // Widen the bracket if rounding put an end on the wrong side.
  let fLo = f(lo);
  for (let i = 0; fLo < 0 && i < 60; i++) fLo = f((lo -= 0.5));
  let fHi = f(hi);
  for (let i = 0; fHi > 0 && i < 60; i++) fHi = f((hi += 0.5));
  const logW = brentRoot(f, lo, hi, 1e-13, fLo, fHi);
  return Math.exp(logW) / (2 * Math.PI);
}
