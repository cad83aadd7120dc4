import type { Network } from '../../circuit/network.js';
import { brentRoot } from '../../numeric/brentRoot.js';
import { generalEigenvalues } from '../../numeric/generalEigenvalues.js';
import { networkCache } from './phaseFlows.js';
import { transferMagnitude } from '../transferMagnitude.js';

/**
 * The small-signal input of a network: per volt of the PWM signal, the first output drives its
 * input vector; a complement output moves opposite to it (it is high when the first is low), so
 * its input counts with a minus sign; a fine output is a separate, much smaller input and is left
 * out (the cutoff is that of the main path).
 */
function smallSignalInput(network: Network): number[] {
  const { mean } = networkCache(network).equations;
  if (network.second?.role === 'complement') return mean.first.map((v, i) => v - mean.second[i]);
  return [...mean.first];
}

/**
 * |H(j 2 pi f)|: the magnitude of the small-signal transfer from the PWM signal to the output,
 * H(s) = c (sI - A)^{-1} b with the drivers at the mean of high and low (model.md, cutoff).
 *
 * Method: transferMagnitude.ts (the real 2n x 2n form of the complex solve, by the one LU).
 *
 * Syntax: networkMagnitude(network, f)
 * Example: networkMagnitude(n, 0)  // DC gain of the small-signal path
 */
export function networkMagnitude(network: Network, f: number): number {
  const { equations } = networkCache(network);
  return transferMagnitude(equations.mean.A, smallSignalInput(network), equations.output, equations.n, 2 * Math.PI * f);
}

/**
 * The -3 dB frequency of the small-signal response relative to its DC value (model.md): the lowest
 * frequency where |H| / |H(0)| falls to 1/sqrt(2). A response that peaks (a Sallen-Key stage with
 * Q above 0.707) first rises; the crossing counted is the first one going down.
 *
 * Method: scan of 24 points per decade from 1e-3 of the slowest pole's |lambda| / 2 pi to 1e3 n of
 * the fastest (poles from numeric/generalEigenvalues.ts), then Brent's root finder on log f in the bracketing step.
 *
 * Syntax: networkCutoff(network)
 * Example: networkCutoff(oneRc)  // 1 / (2 pi R C) for one stage without driver or load
 */
export function networkCutoff(network: Network): number {
  const { equations } = networkCache(network);
  const poles = generalEigenvalues(equations.mean.A, equations.n);
  const rates = poles.re.map((r, i) => Math.hypot(r, poles.im[i]));
  const dc = networkMagnitude(network, 0);
  const target = dc / Math.SQRT2;
  const g = (logF: number) => networkMagnitude(network, 10 ** logF) - target;
  const lo = Math.log10(Math.min(...rates) / (2 * Math.PI)) - 3;
  const hi = Math.log10(Math.max(...rates) / (2 * Math.PI)) + 3 + Math.log10(equations.n);
  let prev = lo;
  let gPrev = g(prev);
  for (let x = lo + 1 / 24; x <= hi; x += 1 / 24) {
    const gx = g(x);
    if (gPrev > 0 && gx <= 0) return 10 ** brentRoot(g, prev, x, 1e-13, gPrev, gx);
    prev = x;
    gPrev = gx;
  }
  return NaN;
}
