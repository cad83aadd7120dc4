import { scaled, type PhaseFlows } from './phaseFlows.js';

/**
 * Terms kept of the Taylor series of e^{sA}: with s ||D A D^{-1}||_inf <= 1 the remainder is below
 * 1/SERIES_TERMS! = 2e-20 of the leading term's scale (Taylor's theorem with the exponential's
 * coefficients 1/k!).
 */
export const SERIES_TERMS = 21;

/** What a pin state's series need, formed once per state matrix (shared by its phases of any length). */
interface PhaseSeries {
  readonly n: number;
  /** D A D^{-1}, row-major. */
  readonly As: readonly number[];
  /** Rows c~ A~^k, k = 0..SERIES_TERMS-1 (c~ = c D^{-1}), row k at k * n. */
  readonly rows: readonly number[];
}

const cache = new WeakMap<readonly number[], PhaseSeries>();

function seriesOf(ph: PhaseFlows, output: readonly number[], d: readonly number[]): PhaseSeries {
  // Keyed by the state matrix: the phases of one pin state share it (networkEquations.ts).
  let s = cache.get(ph.A);
  if (s) return s;
  const n = d.length;
  const As = scaled(ph.A, n, d);
  const rows = new Array<number>(SERIES_TERMS * n).fill(0);
  for (let i = 0; i < n; i++) rows[i] = output[i] / d[i];
  for (let k = 1; k < SERIES_TERMS; k++) {
    for (let i = 0; i < n; i++) {
      const ri = rows[(k - 1) * n + i];
      if (ri === 0) continue;
      for (let j = 0; j < n; j++) rows[k * n + j] += ri * As[i * n + j];
    }
  }
  s = { n, As, rows };
  cache.set(ph.A, s);
  return s;
}

/**
 * Coefficients of the output's Taylor series over a step of one phase: y(s) - y(0) =
 * sum_{k>=1} b_k s^k with b_k = -(c A^k g) / k!, where g = x* - x(0) is the deviation from the
 * phase's DC state at the step's start (x(s) = x* - e^{sA} g). b_0 = 0; SERIES_TERMS entries.
 *
 * Method: the series of e^{sA} (exact for a linear phase), its rows c A^k formed once per phase in
 * the balanced basis D A D^{-1} (D = diag(scale)), where s ||D A D^{-1}|| <= 1 bounds the k-th term
 * by 1/k! of the leading scale.
 *
 * Syntax: outputSeries(phase, g, output, scale)
 * Example: outputSeries(ph, g, c, scale)[1]  // -(c A g): the output's rate at the step's start
 */
export function outputSeries(ph: PhaseFlows, g: readonly number[], output: readonly number[], scale: readonly number[]): number[] {
  const { n, rows } = seriesOf(ph, output, scale);
  const b = new Array<number>(SERIES_TERMS).fill(0);
  let factorial = 1;
  for (let k = 1; k < SERIES_TERMS; k++) {
    factorial *= k;
    let s = 0;
    for (let i = 0; i < n; i++) s += rows[k * n + i] * scale[i] * g[i];
    b[k] = -s / factorial;
  }
  return b;
}

/**
 * The output's rate s into the step, from outputSeries' coefficients: sum_k k b_k s^(k-1)
 * (Horner's rule).
 *
 * Syntax: seriesRate(b, s)
 * Example: seriesRate(outputSeries(ph, g, c, scale), 0)  // -(c A g)
 */
export function seriesRate(b: readonly number[], s: number): number {
  let r = (SERIES_TERMS - 1) * b[SERIES_TERMS - 1];
  for (let k = SERIES_TERMS - 2; k >= 1; k--) r = r * s + k * b[k];
  return r;
}

/**
 * K(s) g = (I - e^{sA}) g for a step of one phase with s ||D A D^{-1}|| <= 1: the change of the
 * state s into the step, x(s) - x(0), from g = x* - x(0).
 *
 * Method: -sum_{k>=1} A^k g s^k / k!, formed in the balanced basis and transformed back; the terms
 * fall at least as 1/k!, so no cancellation beyond that of the exact flow (flow.ts forms the same K
 * by a Pade approximant of the augmented matrix).
 *
 * Syntax: seriesStep(phase, g, s, output, scale)
 * Example: seriesStep(ph, g, 1e-7, c, scale)  // the state change 0.1 us into the step
 */
export function seriesStep(ph: PhaseFlows, g: readonly number[], s: number, output: readonly number[], scale: readonly number[]): number[] {
  const { n, As } = seriesOf(ph, output, scale);
  let v = g.map((x, i) => x * scale[i]);
  let next = new Array<number>(n).fill(0);
  const sum = new Array<number>(n).fill(0);
  let coefficient = 1;
  for (let k = 1; k < SERIES_TERMS; k++) {
    coefficient *= s / k;
    for (let i = 0; i < n; i++) {
      let a = 0;
      for (let j = 0; j < n; j++) a += As[i * n + j] * v[j];
      next[i] = a;
    }
    [v, next] = [next, v];
    for (let i = 0; i < n; i++) sum[i] -= coefficient * v[i];
  }
  for (let i = 0; i < n; i++) sum[i] /= scale[i];
  return sum;
}

/**
 * A rigorous bound on the output part of a homogeneous transient over one period: for a start
 * deviation delta (from the periodic orbit, in the orbit's phases), a number U >= max over the
 * period of |c Phi(t) delta|, Phi the period's state transition; or null when some grid step is
 * longer than 1 / ||D A D^{-1}|| (the series bound does not apply).
 *
 * Method: on each grid step (length h, start time t_j) c Phi(t_j + s) delta =
 * sum_k (c A^k Phi(t_j) delta) s^k / k! (the series of e^{sA}), so its magnitude is at most
 * sum_{k < K} |c A^k Phi(t_j) delta| h^k / k! plus the remainder, at most
 * ||c~||_1 ||D Phi(t_j) delta||_inf (h r)^K e^{h r} / K! with r = ||D A D^{-1}||_inf (Taylor's
 * theorem; |c~ A~^k v| <= ||c~||_1 r^k ||v||_inf), K the first term count that makes the factor
 * below 1e-12 (at most SERIES_TERMS, h r <= 1): the remainder is part of the bound, so fewer terms
 * only loosen it by that much. The rows c A^k Phi(t_j) are formed once; each
 * bound then costs a few dot products.
 *
 * With `limit`: first the coarser bound sum_j w_j |delta~_j|, w_j the largest over the steps of
 * sum_k |row_k,j| + remainder max_i |Phi~_ij| (the triangle inequality on each term), a dot product
 * of length n; where it lies within limit with a room of 1e-12 (more than the rounding of either
 * bound: sums of at most 2 SERIES_TERMS products) it is returned instead, so `bound <= limit` comes
 * out as the full bound would give it. Settling scans call it about a thousand times per step of a
 * duty, nearly all within the limit (245 519 calls over 200 Monte Carlo samples of the complement
 * sample, 97.6 % decided by the coarse bound; it lies 3.7 % above the full one there, median).
 *
 * Syntax: transientBound(phases, output, scale)
 * Example: transientBound(orbit.phases, c, scale)?.(delta)  // V
 *          transientBound(orbit.phases, c, scale)?.(delta, slack) <= slack  // as without slack
 */
export function transientBound(
  phases: readonly PhaseFlows[],
  output: readonly number[],
  scale: readonly number[],
): ((delta: readonly number[], limit?: number) => number) | null {
  const n = scale.length;
  const steps: Array<{ rows: number[]; terms: number; remainder: number; Phi: number[] }> = [];
  // Phi accumulated along the grid in the balanced basis: Phi~ = D Phi D^{-1}.
  let Phi = new Array<number>(n * n).fill(0);
  for (let i = 0; i < n; i++) Phi[i * n + i] = 1;
  let cNorm = 0;
  for (let i = 0; i < n; i++) cNorm += Math.abs(output[i] / scale[i]);
  for (const ph of phases) {
    const { rows: series } = seriesOf(ph, output, scale);
    for (const st of ph.steps) {
      if (st.t * ph.rate > 1) return null;
      // rows_k Phi~ (balanced) scaled by h^k / k!, for the terms that matter: the remainder after
      // `terms` terms is at most ||c~||_1 ||Phi~ delta~||_inf (h r)^terms / terms! e^{h r}, r = ||A~||.
      const hr = st.t * ph.rate;
      let terms = 1;
      let tail = hr;
      while (terms < SERIES_TERMS && tail * Math.exp(hr) > 1e-12) {
        terms++;
        tail *= hr / terms;
      }
      const rows = new Array<number>(terms * n).fill(0);
      let weight = 1;
      for (let k = 0; k < terms; k++) {
        if (k > 0) weight *= st.t / k;
        for (let i = 0; i < n; i++) {
          const r = series[k * n + i] * weight;
          if (r === 0) continue;
          for (let j = 0; j < n; j++) rows[k * n + j] += r * Phi[i * n + j];
        }
      }
      steps.push({ rows, terms, remainder: cNorm * tail * Math.exp(hr), Phi: Phi.slice() });
      // Phi~ <- (D E D^{-1}) Phi~
      const next = new Array<number>(n * n).fill(0);
      for (let i = 0; i < n; i++) {
        for (let k = 0; k < n; k++) {
          const e = (st.E[i * n + k] * scale[i]) / scale[k];
          if (e === 0) continue;
          for (let j = 0; j < n; j++) next[i * n + j] += e * Phi[k * n + j];
        }
      }
      Phi = next;
    }
  }
  const weight = new Array<number>(n).fill(0);
  for (const { rows, terms, remainder, Phi: P } of steps) {
    for (let j = 0; j < n; j++) {
      let w = 0;
      for (let k = 0; k < terms; k++) w += Math.abs(rows[k * n + j]);
      let p = 0;
      for (let i = 0; i < n; i++) p = Math.max(p, Math.abs(P[i * n + j]));
      weight[j] = Math.max(weight[j], w + remainder * p);
    }
  }
  const ds = new Array<number>(n).fill(0);
  return (delta, limit = -Infinity) => {
    let coarse = 0;
    for (let i = 0; i < n; i++) {
      ds[i] = delta[i] * scale[i];
      coarse += weight[i] * Math.abs(ds[i]);
    }
    if (coarse * (1 + 1e-12) <= limit) return coarse;
    let worst = 0;
    for (const { rows, terms, remainder, Phi: P } of steps) {
      let bound = 0;
      for (let k = 0; k < terms; k++) {
        let a = 0;
        for (let j = 0; j < n; j++) a += rows[k * n + j] * ds[j];
        bound += Math.abs(a);
      }
      let big = 0;
      for (let i = 0; i < n; i++) {
        let a = 0;
        for (let j = 0; j < n; j++) a += P[i * n + j] * ds[j];
        big = Math.max(big, Math.abs(a));
      }
      worst = Math.max(worst, bound + remainder * big);
    }
    return worst;
  };
}
