import type { Network } from '../../circuit/network.js';
import { solveLinear } from '../../numeric/lu.js';
import { brentRoot } from '../../numeric/brentRoot.js';
import { generalEigenvalues } from '../../numeric/generalEigenvalues.js';
import { networkCache } from './phaseFlows.js';

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
 * Method: the complex solve (j w I - A)(u + j v) = b written as the real 2n x 2n system
 * [[-A, -w I], [w I, -A]] [u; v] = [b; 0] and solved by the one LU (numeric/lu.ts).
 *
 * Syntax: networkMagnitude(network, f)
 * Example: networkMagnitude(n, 0)  // DC gain of the small-signal path
 */
export function networkMagnitude(network: Network, f: number): number {
  const { equations } = networkCache(network);
  const n = equations.n;
  const A = equations.mean.A;
  const b = smallSignalInput(network);
  const c = equations.output;
  const w = 2 * Math.PI * f;
  const m = 2 * n;
  const M = new Array<number>(m * m).fill(0);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      M[i * m + j] = -A[i * n + j];
      M[(n + i) * m + n + j] = -A[i * n + j];
    }
    M[i * m + n + i] = -w;
    M[(n + i) * m + i] = w;
  }
  const rhs = [...b, ...new Array<number>(n).fill(0)];
  const x = solveLinear(M, m, rhs);
  if (!x) return Infinity;
  let re = 0;
  let im = 0;
  for (let i = 0; i < n; i++) {
    re += c[i] * x[i];
    im += c[i] * x[n + i];
  }
  return Math.hypot(re, im);
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
