import type { FastLadder } from './fastLadder.js';
import { expSumRoots } from '../../numeric/expSumRoots.js';
import { fastSteadyState, type FastSteady, type PhaseAtDuty } from './fastSteadyState.js';
import { symmetricEigen } from '../../numeric/symmetricEigen.js';
import { matmul, matvec, spectralMatrix, transposeMatvec, zeros } from '../../numeric/dense.js';

/** Largest period index the search looks at (2^52: beyond it a period count is no longer exact). */
const MAX_PERIODS = 2 ** 52;

/**
 * A lower bound on the settling time (model.md definition) after the duty steps from `from` to
 * `to` at the start of a period, the circuit having been in periodic steady state at `from`:
 * the latest instant found at which |v(t) - average(to)| > band. It equals the settling time
 * whenever the last violation lies in the period the search lands on (the usual case: the error
 * decays monotonically once the slowest mode dominates); it is never larger, because every
 * instant it returns is a verified violation. Infinity when the steady state at `to` itself
 * leaves the band (never settles); 0 when no violation is found.
 *
 * Method: the deviation from the steady state at the start of period k is e_k = M^k e_0,
 * M = Phi_l Phi_h. With B = Phi_l^(1/2) Phi_h Phi_l^(1/2) (symmetric, same eigenvalues as M),
 * M^k = Phi_l^(1/2) B^(k-1) Phi_l^(1/2) Phi_h, and B = I - N with N = Psi_l + Phi_l^(1/2) Psi_h
 * Phi_l^(1/2) formed without cancellation, so beta^k = exp(k log1p(-nu)) stays accurate when the
 * time constants dwarf the period. Inside a period the error is a constant plus n exponentials
 * per phase; its band crossings come from numeric/expSumRoots.ts. The last violating period is found by
 * galloping from the slowest mode's estimate, then bisection.
 *
 * With a finite `ceiling` (s) the bound may stop early: when the first period starting after the
 * ceiling still holds a violation, that violation's instant is returned (above the ceiling, still
 * a verified violation, so still a lower bound), for callers that only compare the bound with it.
 *
 * Syntax: fastSettlingBound(model, from, to, band[, steadyFrom, steadyTo, ceiling])
 * Example: fastSettlingBound(fastLadder(ladder), 0.1, 0.9, 1.6e-3)   // s (a lower bound)
 */
export function fastSettlingBound(
  model: FastLadder,
  from: number,
  to: number,
  band: number,
  steadyFrom: FastSteady = fastSteadyState(model, from),
  steadyTo: FastSteady = fastSteadyState(model, to),
  ceiling = Infinity,
): number {
  const { n, period } = model;
  const plan = steadyTo;
  const above = plan.maxDev - plan.meanOffset;
  const below = plan.meanOffset - plan.minDev;
  if (above > band || below > band) return Infinity;
  const margin = band - Math.max(above, below, 0);
  const e0 = zeros(n);
  for (let i = 0; i < n; i++) e0[i] = steadyFrom.u[i] - plan.u[i];

  const { high, low } = plan;
  const last = n - 1;
  const phiH = spectralMatrix(high.ph.mode, high.decay, n);
  let kHigh = -plan.meanOffset;
  let kLow = plan.aOut - plan.meanOffset;
  for (let i = 0; i < n; i++) {
    kHigh += plan.wHigh[i];
    kLow += plan.wLow[i];
  }

  /** The latest violating instant inside a period that starts with deviation e, or -1. */
  const lastViolation = (e: number[]): number => {
    const eFall = matvec(phiH, e, n);
    const inLow = lateCrossing(low, kLow, plan.wLow, eFall, band, n);
    if (inLow === Infinity) return period;
    if (inLow >= 0) return high.t + inLow;
    const inHigh = lateCrossing(high, kHigh, plan.wHigh, e, band, n);
    if (inHigh === Infinity) return high.t;
    return inHigh;
  };

  // Period powers through the symmetric B = I - N.
  const sqrtDecayL = zeros(n);
  for (let i = 0; i < n; i++) sqrtDecayL[i] = Math.sqrt(low.decay[i]);
  const halfL = spectralMatrix(low.ph.mode, sqrtDecayL, n);
  const psiH = spectralMatrix(high.ph.mode, high.gone, n);
  const nMat = spectralMatrix(low.ph.mode, low.gone, n);
  const inner = matmul(matmul(halfL, psiH, n), halfL, n);
  for (let i = 0; i < n * n; i++) nMat[i] += inner[i];
  for (let i = 0; i < n; i++) {
    for (let j = i + 1; j < n; j++) {
      const v = 0.5 * (nMat[i * n + j] + nMat[j * n + i]);
      nMat[i * n + j] = v;
      nMat[j * n + i] = v;
    }
  }
  const { values: nu, vectors: v } = symmetricEigen(nMat, n, { vectors: true });
  const logBeta = zeros(n);
  for (let i = 0; i < n; i++) logBeta[i] = Math.log1p(-Math.min(nu[i], 1 - 1e-16));
  const z = transposeMatvec(v, matvec(halfL, matvec(phiH, e0, n), n), n);
  const g = matmul(halfL, v, n); // column j: the state shape of mode j
  const stateAt = (k: number): number[] => {
    if (k === 0) return e0;
    const e = zeros(n);
    for (let j = 0; j < n; j++) {
      const amp = z[j] * Math.exp((k - 1) * logBeta[j]);
      if (amp === 0) continue;
      for (let r = 0; r < n; r++) e[r] += g[r * n + j] * amp;
    }
    return e;
  };
  const leaves = (k: number) => lastViolation(stateAt(k)) >= 0;

  // A caller that only asks whether the bound passes `ceiling`: a violation in the first period
  // that starts after it answers yes (and is itself a valid, verified lower bound).
  const kCeiling = Math.floor(ceiling / period) + 1;
  if (kCeiling < MAX_PERIODS) {
    const e = stateAt(kCeiling);
    const t = lastViolation(e);
    if (t >= 0) return kCeiling * period + t;
  }

  // Estimate from the slowest mode (largest beta = smallest nu = index 0).
  const slowOut = (g[last * n] * z[0]) / model.sqrtC[last];
  let kEst = 0;
  if (Math.abs(slowOut) > margin && logBeta[0] < 0) {
    kEst = Math.min(MAX_PERIODS, Math.max(0, Math.floor(1 + Math.log(margin / Math.abs(slowOut)) / logBeta[0])));
  }

  let kv = -1; // a violating period
  let kn = MAX_PERIODS; // a clean period after kv
  if (leaves(kEst)) {
    kv = kEst;
    for (let step = 1; ; step *= 2) {
      const k = kv + step;
      if (k >= MAX_PERIODS) break;
      if (leaves(k)) kv = k;
      else {
        kn = k;
        break;
      }
    }
  } else {
    kn = kEst;
    for (let step = 1; kn > 0; step *= 2) {
      const k = Math.max(0, kn - step);
      if (leaves(k)) {
        kv = k;
        break;
      }
      kn = k;
    }
  }
  if (kv < 0) return 0;
  while (kn - kv > 1) {
    const mid = Math.floor((kv + kn) / 2);
    if (leaves(mid)) kv = mid;
    else kn = mid;
  }
  return kv * period + lastViolation(stateAt(kv));
}

/**
 * In one phase the error is c + sum_i b_i exp(-rate_i s) with b_i = out_i (U^T e)_i - w_i.
 * Returns Infinity if it is outside the band at the phase end, else the last band crossing
 * inside the phase, or -1 when the whole phase stays inside.
 */
function lateCrossing(p: PhaseAtDuty, c: number, w: number[], e: number[], band: number, n: number): number {
  if (p.t <= 0) return -1;
  const modal = transposeMatvec(p.ph.mode, e, n);
  const b = zeros(n + 1);
  const rate = zeros(n + 1); // exponents -rate_i (expSumRoots' convention); rate[0] = 0, the constant
  let end = c;
  for (let i = 0; i < n; i++) {
    b[i + 1] = p.ph.out[i] * modal[i] - w[i];
    rate[i + 1] = -p.ph.rate[i];
    end += b[i + 1] * p.decay[i];
  }
  if (end > band || end < -band) return Infinity;
  let latest = -1;
  b[0] = c - band;
  const up = expSumRoots(b, rate, p.t);
  if (up.length > 0) latest = up[up.length - 1];
  b[0] = c + band;
  const down = expSumRoots(b, rate, p.t);
  if (down.length > 0) latest = Math.max(latest, down[down.length - 1]);
  return latest;
}
