import type { FastCircuit } from './fastLadder.js';
import { solveTwoByTwo } from '../../numeric/lu.js';
import { oneMinusPhi1 } from '../../numeric/phi.js';

/** The steady-state figures the search's cheap checks need (see fastSteadyState for all of them). */
export interface TwoStageSteady {
  /** V peak-to-peak. */
  ripple: number;
  /** Time-average output, V. */
  average: number;
  /** Output at the rising edge, V. */
  yStart: number;
  /** Largest excursion of the output above and below its average, V. */
  above: number;
  below: number;
}

/**
 * Periodic steady state of an unbuffered two-stage ladder at duty D: the same equations and
 * method as fastSteadyState.ts (modes of S_p = C^(-1/2) G_p C^(-1/2), fixed point (Psi_l + Phi_l
 * Psi_h) u = Phi_l Psi_h Delta, turning points in closed form), unrolled for n = 2 on scalars so
 * that the search's many cheap checks allocate nothing.
 *
 * Syntax: twoStageSteady(circuit, r1, c1, r2, c2, duty)
 * Example: twoStageSteady(circuit, 1e3, 1e-6, 10e3, 100e-9, 0.5).ripple   // V
 */
export function twoStageSteady(k: FastCircuit, r1: number, c1: number, r2: number, c2: number, duty: number): TwoStageSteady {
  const T = k.period;
  const t1 = duty * T;
  const t2 = T - t1;
  const cc2 = c2 + k.loadCapacitance;
  const s1 = Math.sqrt(c1);
  const s2 = Math.sqrt(cc2);
  const g2 = 1 / r2;
  const gL = k.loadResistance === null ? 0 : 1 / k.loadResistance;
  const b = -g2 / (s1 * s2);
  const dd = (g2 + gL) / cc2;
  const lti = k.driverHigh === k.driverLow;

  // Modes of each phase (one Jacobi rotation), DC states per phase.
  const gh = 1 / (r1 + k.driverHigh);
  const gl = lti ? gh : 1 / (r1 + k.driverLow);
  mode((gh + g2) / c1, b, dd, H);
  if (lti) {
    L.l1 = H.l1;
    L.l2 = H.l2;
    L.u11 = H.u11;
    L.u12 = H.u12;
    L.u21 = H.u21;
    L.u22 = H.u22;
  } else mode((gl + g2) / c1, b, dd, L);
  const detH = gh * g2 + gh * gL + g2 * gL;
  const detL = gl * g2 + gl * gL + g2 * gL;
  // x = G^-1 e1 g1 V: x1 = g1 V (g2 + gL) / det, x2 = g1 V g2 / det; y = C^(1/2) x.
  const eqH1 = ((gh * (g2 + gL)) / detH) * s1;
  const eqH2 = ((gh * g2) / detH) * s2;
  const eqL1 = ((gl * (g2 + gL)) / detL) * s1;
  const eqL2 = ((gl * g2) / detL) * s2;
  let d1: number;
  let d2: number;
  if (lti) {
    const span = k.high - k.low;
    d1 = eqH1 * span;
    d2 = eqH2 * span;
  } else {
    d1 = eqH1 * k.high - eqL1 * k.low;
    d2 = eqH2 * k.high - eqL2 * k.low;
  }
  const yl1 = eqL1 * k.low;
  const yl2 = eqL2 * k.low;

  // Phase operators: Phi = U diag(e) U^T, Psi = U diag(1 - e) U^T.
  const eh1 = Math.exp(-H.l1 * t1);
  const eh2 = Math.exp(-H.l2 * t1);
  const gh1 = -Math.expm1(-H.l1 * t1);
  const gh2 = -Math.expm1(-H.l2 * t1);
  const el1 = Math.exp(-L.l1 * t2);
  const el2 = Math.exp(-L.l2 * t2);
  const gl1 = -Math.expm1(-L.l1 * t2);
  const gl2 = -Math.expm1(-L.l2 * t2);
  spectral(H, gh1, gh2, PSI_H);
  spectral(L, el1, el2, PHI_L);
  spectral(L, gl1, gl2, PSI_L);
  // A = Phi_l Psi_h; system S = Psi_l + A; rhs = A Delta.
  const a11 = PHI_L[0] * PSI_H[0] + PHI_L[1] * PSI_H[2];
  const a12 = PHI_L[0] * PSI_H[1] + PHI_L[1] * PSI_H[3];
  const a21 = PHI_L[2] * PSI_H[0] + PHI_L[3] * PSI_H[2];
  const a22 = PHI_L[2] * PSI_H[1] + PHI_L[3] * PSI_H[3];
  const m11 = PSI_L[0] + a11;
  const m12 = PSI_L[1] + a12;
  const m21 = PSI_L[2] + a21;
  const m22 = PSI_L[3] + a22;
  const r1v = a11 * d1 + a12 * d2;
  const r2v = a21 * d1 + a22 * d2;
  if (!solveTwoByTwo(m11, m12, m21, m22, r1v, r2v, SOLVED)) SOLVED[0] = SOLVED[1] = NaN;
  const u1 = SOLVED[0];
  const u2 = SOLVED[1];

  // High phase: deviation sum_i wh_i (1 - e^(-l_i s)), modal coordinates of Delta - u.
  const vh1 = d1 - u1;
  const vh2 = d2 - u2;
  const ch1 = H.u11 * vh1 + H.u21 * vh2;
  const ch2 = H.u12 * vh1 + H.u22 * vh2;
  const oh1 = H.u21 / s2;
  const oh2 = H.u22 / s2;
  const wh1 = ch1 * oh1;
  const wh2 = ch2 * oh2;
  const a1 = H.u11 * gh1 * ch1 + H.u12 * gh2 * ch2;
  const a2 = H.u21 * gh1 * ch1 + H.u22 * gh2 * ch2;
  const aOut = a2 / s2;
  // Low phase: aOut + sum_i wl_i (1 - e^(-l_i s)), modal coordinates of -u - a.
  const vl1 = -u1 - a1;
  const vl2 = -u2 - a2;
  const cl1 = L.u11 * vl1 + L.u21 * vl2;
  const cl2 = L.u12 * vl1 + L.u22 * vl2;
  const wl1 = cl1 * (L.u21 / s2);
  const wl2 = cl2 * (L.u22 / s2);

  EXT[0] = Math.max(0, aOut);
  EXT[1] = Math.min(0, aOut);
  turn(wh1, wh2, H.l1, H.l2, t1, 0);
  turn(wl1, wl2, L.l1, L.l2, t2, aOut);
  const maxDev = EXT[0];
  const minDev = EXT[1];

  const integral =
    aOut * t2 +
    wh1 * t1 * oneMinusPhi1(H.l1 * t1) +
    wh2 * t1 * oneMinusPhi1(H.l2 * t1) +
    wl1 * t2 * oneMinusPhi1(L.l1 * t2) +
    wl2 * t2 * oneMinusPhi1(L.l2 * t2);
  const meanOffset = integral / T;
  const yStart = (yl2 + u2) / s2;
  return {
    ripple: maxDev - minDev,
    average: yStart + meanOffset,
    yStart,
    above: maxDev - meanOffset,
    below: meanOffset - minDev,
  };
}

interface Mode {
  l1: number;
  l2: number;
  /** U row-major: u_rc = node r of mode c. */
  u11: number;
  u12: number;
  u21: number;
  u22: number;
}
const H: Mode = { l1: 0, l2: 0, u11: 1, u12: 0, u21: 0, u22: 1 };
const L: Mode = { l1: 0, l2: 0, u11: 1, u12: 0, u21: 0, u22: 1 };
const PSI_H = [0, 0, 0, 0];
const PHI_L = [0, 0, 0, 0];
const PSI_L = [0, 0, 0, 0];
const SOLVED = [0, 0];

/** Eigen decomposition of [[p, q], [q, r]] (one Jacobi rotation), ascending. */
function mode(p: number, q: number, r: number, out: Mode): void {
  const zeta = (r - p) / (2 * q);
  const t = (zeta >= 0 ? 1 : -1) / (Math.abs(zeta) + Math.sqrt(1 + zeta * zeta));
  const c = 1 / Math.sqrt(1 + t * t);
  const s = t * c;
  const la = p - t * q; // vector (c, -s)
  const lb = r + t * q; // vector (s, c)
  if (la <= lb) {
    out.l1 = la;
    out.l2 = lb;
    out.u11 = c;
    out.u21 = -s;
    out.u12 = s;
    out.u22 = c;
  } else {
    out.l1 = lb;
    out.l2 = la;
    out.u11 = s;
    out.u21 = c;
    out.u12 = c;
    out.u22 = -s;
  }
}

/** U diag(x1, x2) U^T into out (row-major 2 x 2). */
function spectral(m: Mode, x1: number, x2: number, out: number[]): void {
  out[0] = m.u11 * x1 * m.u11 + m.u12 * x2 * m.u12;
  out[1] = m.u11 * x1 * m.u21 + m.u12 * x2 * m.u22;
  out[2] = out[1];
  out[3] = m.u21 * x1 * m.u21 + m.u22 * x2 * m.u22;
}

/** Largest and smallest deviation seen so far. */
const EXT = [0, 0];

/** Turning point of offset + sum w_i (1 - e^(-l_i s)): w1 l1 e^(-l1 s) + w2 l2 e^(-l2 s) = 0, into EXT. */
function turn(w1: number, w2: number, l1: number, l2: number, t: number, offset: number): void {
  const ratio = -(w2 * l2) / (w1 * l1);
  if (!(ratio > 0) || !(t > 0)) return;
  const s = Math.log(ratio) / (l2 - l1);
  if (!(s > 0 && s < t)) return;
  const v = offset - w1 * Math.expm1(-l1 * s) - w2 * Math.expm1(-l2 * s);
  if (v > EXT[0]) EXT[0] = v;
  if (v < EXT[1]) EXT[1] = v;
}
