import type { Ladder } from '../../circuit/ladder.js';
import { stateSpace, type PhaseSystem, type Section } from '../../circuit/stateSpace.js';
import type { ModalLadder, PhaseModes } from './modalTypes.js';
import { solveLinear } from '../../numeric/lu.js';
import { symmetricEigen } from '../../numeric/symmetricEigen.js';
import { normInf, zeros } from '../../numeric/dense.js';
import { dcStates } from './dcStates.js';

/**
 * Largest condition number ||V|| ||V^-1|| (infinity norm) of the eigenvector matrix accepted: it
 * bounds how much rounding the modal sums can amplify (here to about 1e-11 relative). Sections
 * with nearly equal time constants exceed it and go to the engine.
 */
const MAX_CONDITION = 1e5;

/**
 * The modal form of a cascade: sections of the ladder separated by unity-gain followers, each
 * driven by the last node of the one before. The state matrix is block lower-triangular; each
 * diagonal block is a follower-free ladder (real, distinct modes), so A = V diag(rate) V^-1 when no
 * two sections share a mode. null when they (nearly) do: a Jordan block, left to the engine.
 * The result has symmetric = false: steady states, ripple and averages use it; settling goes to
 * the engine.
 *
 * Method: state equations from circuit/stateSpace.ts. Modes of section s from the symmetric form
 * Cs A_ss Cs^-1 (symmetricEigen); a mode's eigenvector is zero before its section, the section's
 * own eigenvector in it, and continues into each later section t by solving
 * (A_tt - rate I) v_t = -(coupling from the sections before) v (block forward substitution;
 * Golub & Van Loan, "Matrix Computations", 4th ed., section 7.6 on block-triangular eigenproblems).
 * V^-1 by Gaussian elimination (solveLinear, numeric/lu.ts); the DC states from the resistive chain (dcStates.ts).
 *
 * Syntax: cascadeLadder(ladder)
 * Example: cascadeLadder(bufferedTwoStage)?.hi.rate  // [-1/((R1 + Rd) C1), -1/(R2 C2)]
 */
export function cascadeLadder(ladder: Ladder): ModalLadder | null {
  const ss = stateSpace(ladder);
  const n = ss.n;
  const high = phaseModes(ss.high, ss.sections, ss.capacitance, n);
  const low = phaseModes(ss.low, ss.sections, ss.capacitance, n);
  if (!high || !low) return null;
  const dc = dcStates(ladder);
  const mix = zeros(n * n);
  const delta = zeros(n);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      let s = 0;
      for (let k = 0; k < n; k++) s += low.W[i * n + k] * high.V[k * n + j];
      mix[i * n + j] = s;
      delta[i] += high.W[i * n + j] * dc.delta[j];
    }
  }
  return {
    n,
    period: ladder.period,
    high: ladder.high,
    low: ladder.low,
    symmetric: false,
    hi: high.modes,
    lo: low.modes,
    mix,
    delta,
    outLow: dc.low[n - 1],
    outHigh: dc.high[n - 1],
    condition: Math.max(high.condition, low.condition),
  };
}

function phaseModes(
  sys: PhaseSystem,
  sections: Section[],
  capacitance: number[] | Float64Array,
  n: number,
): { modes: PhaseModes; V: number[]; W: number[]; condition: number } | null {
  const { A } = sys;
  const V = zeros(n * n);
  const rate = zeros(n);
  let col = 0;
  for (let s = 0; s < sections.length; s++) {
    const { first, last } = sections[s];
    const m = last - first + 1;
    const cs = Array.from({ length: m }, (_, i) => Math.sqrt(capacitance[first + i]));
    const S = zeros(m * m);
    for (let i = 0; i < m; i++) {
      for (let j = 0; j < m; j++) {
        const aij = A[(first + i) * n + first + j];
        const aji = A[(first + j) * n + first + i];
        S[i * m + j] = 0.5 * ((cs[i] * aij) / cs[j] + (cs[j] * aji) / cs[i]);
      }
    }
    const eig = symmetricEigen(S, m, { vectors: true });
    for (let j = 0; j < m; j++, col++) {
      const lambda = eig.values[j];
      rate[col] = lambda;
      for (let i = 0; i < m; i++) V[(first + i) * n + col] = eig.vectors[i * m + j] / cs[i];
      for (let t = s + 1; t < sections.length; t++) {
        const { first: f, last: l } = sections[t];
        const size = l - f + 1;
        const block = zeros(size * size);
        const rhs = zeros(size);
        for (let i = 0; i < size; i++) {
          for (let k = 0; k < size; k++) block[i * size + k] = A[(f + i) * n + f + k] - (i === k ? lambda : 0);
          let sum = 0;
          for (let k = 0; k < f; k++) sum += A[(f + i) * n + k] * V[k * n + col];
          rhs[i] = -sum;
        }
        const x = solveLinear(block, size, rhs);
        if (!x) return null; // the mode is also a mode of section t: a Jordan block
        for (let i = 0; i < size; i++) V[(f + i) * n + col] = x[i];
      }
    }
  }
  const W = solveLinear(V, n, Array.from({ length: n * n }, (_, i) => (i % (n + 1) === 0 ? 1 : 0)), n);
  if (!W || !(normInf(V, n) * normInf(W, n) <= MAX_CONDITION)) return null;
  const out = zeros(n);
  for (let i = 0; i < n; i++) out[i] = V[(n - 1) * n + i];
  // the same condition number in the balanced coordinates sqrt(C) x, where each section's own
  // eigenvectors are orthonormal: what is left measures how nearly two sections share a mode
  const Vb = zeros(n * n);
  const Wb = zeros(n * n);
  for (let i = 0; i < n; i++) {
    const s = Math.sqrt(capacitance[i]);
    for (let j = 0; j < n; j++) {
      Vb[i * n + j] = V[i * n + j] * s;
      Wb[j * n + i] = W[j * n + i] / s;
    }
  }
  return { modes: { rate, out }, V, W, condition: normInf(Vb, n) * normInf(Wb, n) };
}

