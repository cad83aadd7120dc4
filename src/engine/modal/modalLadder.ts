import { zeros } from '../../numeric/dense.js';
import type { Ladder } from '../../circuit/ladder.js';
import { cascadeLadder } from './cascadeLadder.js';
import { symmetricEigen } from '../../numeric/symmetricEigen.js';
import { dcStates } from './dcStates.js';
import type { ModalLadder, PhaseModes } from './modalTypes.js';

export type { ModalLadder, PhaseModes } from './modalTypes.js';

/**
 * The modal form of a ladder, or null when it does not apply. A follower after the last stage
 * only disconnects the load (as in the engine's state equations); followers inside the ladder make
 * a cascade of sections, handed to cascadeLadder (null when two sections share a mode: a Jordan
 * block, for the engine's matrix-exponential path). The engine decides with modalRoute.ts whether it
 * uses the form; the tolerance module uses it directly.
 *
 * Method: nodal state equations C x' = -G x + g (Kirchhoff's current law at each capacitor node, as
 * in circuit/stateSpace.ts). With Cs = diag(sqrt C),
 * S = Cs A Cs^-1 = -Cs^-1 G Cs^-1 is symmetric (G is), so A has real negative eigenvalues and
 * Cs^-1-scaled orthonormal eigenvectors; a follower-free RC ladder gives an irreducible tridiagonal
 * S, whose eigenvalues are distinct (an unreduced symmetric tridiagonal has simple eigenvalues:
 * B. N. Parlett, "The Symmetric Eigenvalue Problem", SIAM 1998, ch. 7; cited from memory).
 * Eigen-decomposition by Jacobi rotations (numeric/symmetricEigen.ts). DC states from the
 * resistive chain (dcStates.ts).
 *
 * Syntax: modalLadder(ladder)
 * Example: modalLadder(oneStage).hi.rate  // [-1 / ((R + Rd) C)]
 */
export function modalLadder(ladder: Ladder): ModalLadder | null {
  const { stages } = ladder;
  const n = stages.length;
  for (let k = 0; k < n - 1; k++) if (stages[k].buffered) return cascadeLadder(ladder);
  for (const st of stages) {
    if (!(st.r > 0) || !(st.c > 0)) throw new RangeError('invalid ladder: every stage needs r > 0 and c > 0');
  }
  // Nodal equations as in circuit/stateSpace.ts: conductance into node k from the node before
  // (node 0: from the pin through driver + R1), load at the last node unless a follower drives it.
  const loaded = !stages[n - 1].buffered;
  const gLoad = loaded && ladder.loadResistance !== null ? 1 / ladder.loadResistance : 0;
  const cs = zeros(n);
  for (let k = 0; k < n; k++) cs[k] = Math.sqrt(stages[k].c + (k === n - 1 && loaded ? ladder.loadCapacitance : 0));
  const gIn = zeros(n + 1);
  for (let k = 1; k < n; k++) gIn[k] = 1 / stages[k].r;
  gIn[n] = gLoad;
  const phase = (driver: number): { modes: PhaseModes; basis: number[] } => {
    gIn[0] = 1 / (stages[0].r + driver);
    const S = zeros(n * n);
    for (let k = 0; k < n; k++) {
      S[k * n + k] = -(gIn[k] + gIn[k + 1]) / (cs[k] * cs[k]);
      if (k + 1 < n) {
        const off = gIn[k + 1] / (cs[k] * cs[k + 1]);
        S[k * n + k + 1] = off;
        S[(k + 1) * n + k] = off;
      }
    }
    const { values, vectors } = symmetricEigen(S, n, { vectors: true });
    const out = zeros(n);
    for (let i = 0; i < n; i++) out[i] = vectors[(n - 1) * n + i] / cs[n - 1];
    return { modes: { rate: values, out }, basis: vectors };
  };
  const high = phase(ladder.driverHigh);
  const low = phase(ladder.driverLow);
  const dc = dcStates(ladder);
  const hi = high.modes;
  const lo = low.modes;
  const mix = zeros(n * n);
  const delta = zeros(n);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      let s = 0;
      for (let k = 0; k < n; k++) s += low.basis[k * n + i] * high.basis[k * n + j];
      mix[i * n + j] = s;
      delta[i] += high.basis[j * n + i] * cs[j] * dc.delta[j];
    }
  }
  return {
    n,
    period: ladder.period,
    high: ladder.high,
    low: ladder.low,
    symmetric: true,
    hi,
    lo,
    mix,
    delta,
    outLow: dc.low[n - 1],
    outHigh: dc.high[n - 1],
    condition: 1,
  };
}
