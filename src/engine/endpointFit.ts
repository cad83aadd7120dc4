import { maximizeOnInterval } from '../numeric/maximizeOnInterval.js';
import type { DcTransfer } from './types.js';

/** What the DC transfer errors are computed from (dcTransfer.ts, periodic/networkFigures.ts). */
export interface TransferSource {
  /** Time-average output at a fraction of the code range, V. */
  average(d: number): number;
  /** Ideal output there, V (low + q (high - low), q the fraction the code stands for). */
  ideal(d: number): number;
  /** The fraction a code stands for (the identity when duties are continuous). */
  quantize(d: number): number;
  /** high - low, V. */
  span: number;
  /** ideal(0), V. */
  low: number;
  /** Discrete points to scan for the largest errors; absent: search the interval. */
  candidates?: readonly number[];
  /**
   * A search of one's own for where g = |error| or |deviation| is largest (a tolerance study
   * starting from a nominal circuit's peaks); it replaces the candidates and the interval search.
   */
  search?: ExtremumSearch;
}

/**
 * Where g (>= 0) is largest over [min, max]: `figure` says which error g is (`droop`: |ideal -
 * average|, `inl`: |fit - average|). Returns the fraction.
 */
export type ExtremumSearch = (g: (d: number) => number, min: number, max: number, figure: 'droop' | 'inl') => number;

/**
 * DC transfer errors over [min, max], every one signed ideal minus actual (README "Sign
 * convention"): droop, the largest |ideal - average|; the endpoint fit through the averages at min
 * and max, with offsetError = ideal(0) - fit(0) and gainError = span - slope; inl, the largest
 * fit - average. With min = max the fit takes the ideal slope. Endpoint-fit terms as DAC data
 * sheets define them (common practice).
 *
 * Method: the largest errors by `search` when given, else over `candidates` when given (discrete
 * codes), else a 16-cell grid plus Brent refinement (numeric/maximizeOnInterval.ts): with unequal
 * driver resistances the average is not affine in the duty, so the extremes must be searched.
 *
 * Syntax: endpointFit(source, min, max)
 * Example: endpointFit({ average, ideal, quantize: (d) => d, span: 3.3, low: 0 }, 0.05, 0.95).inl.error
 */
export function endpointFit(source: TransferSource, min: number, max: number): DcTransfer {
  const { average, ideal, quantize, span, low, candidates, search } = source;
  const error = (d: number) => ideal(d) - average(d);
  const qMin = quantize(min);
  const qMax = quantize(max);
  const yMin = average(min);
  const yMax = average(max);
  const slope = qMax > qMin ? (yMax - yMin) / (qMax - qMin) : span;
  const fit = (d: number) => yMin + slope * (quantize(d) - qMin);
  const deviation = (d: number) => fit(d) - average(d);
  const largest = (f: (d: number) => number, figure: 'droop' | 'inl'): number => {
    if (search) return search((d) => Math.abs(f(d)), min, max, figure);
    if (!candidates) return maximizeOnInterval((d) => Math.abs(f(d)), min, max).x;
    let at = candidates[0];
    let best = -1;
    for (const d of candidates) {
      const v = Math.abs(f(d));
      if (v > best) [best, at] = [v, d];
    }
    return at;
  };
  const droopAt = largest(error, 'droop');
  const inlAt = largest(deviation, 'inl');
  return {
    droop: { duty: droopAt, error: error(droopAt) },
    offsetError: low - (yMin - slope * qMin),
    gainError: span - slope,
    inl: { duty: inlAt, error: deviation(inlAt) },
  };
}
