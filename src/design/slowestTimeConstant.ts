import { symmetricEigen } from '../numeric/symmetricEigen.js';

/**
 * Slowest time constant (s) of an unbuffered RC ladder driven through `driver` ohm, with an
 * optional load resistance and a load capacitance at the last node (averaged model, one driver).
 *
 * Method: tau_max = 1 / lambda_min of S = C^(-1/2) G C^(-1/2) (nodal conductance matrix G,
 * capacitances C); closed form for one and two stages (lambda_min = det / lambda_max, the
 * determinant written without cancellation), cyclic Jacobi beyond (numeric/symmetricEigen.ts).
 * By the Rayleigh quotient tau_max = max_v (v^T C v) / (v^T G v), it never falls when any C or
 * any R grows (common practice; Courant-Fischer, Golub & Van Loan, Theorem 8.1.2), which the search
 * relies on for its windows.
 *
 * Syntax: slowestTimeConstant(r, c, driver, loadResistance, loadCapacitance)
 * Example: slowestTimeConstant([1e3], [1e-6], 0, null, 0)   // 1e-3
 */
export function slowestTimeConstant(
  r: ArrayLike<number>,
  c: ArrayLike<number>,
  driver: number,
  loadResistance: number | null,
  loadCapacitance: number,
): number {
  const n = r.length;
  const gL = loadResistance === null ? 0 : 1 / loadResistance;
  const g1 = 1 / (r[0] + driver);
  if (n === 1) return (c[0] + loadCapacitance) / (g1 + gL);
  if (n === 2) {
    const g2 = 1 / r[1];
    const c1 = c[0];
    const c2 = c[1] + loadCapacitance;
    const a = (g1 + g2) / c1;
    const d = (g2 + gL) / c2;
    const b2 = (g2 * g2) / (c1 * c2);
    const det = (g1 * g2 + g1 * gL + g2 * gL) / (c1 * c2);
    const half = 0.5 * (a - d);
    const lambdaMax = 0.5 * (a + d) + Math.sqrt(half * half + b2);
    return lambdaMax / det;
  }
  const g = new Float64Array(n);
  const cap = new Float64Array(n);
  for (let k = 0; k < n; k++) {
    g[k] = k === 0 ? g1 : 1 / r[k];
    cap[k] = c[k] + (k === n - 1 ? loadCapacitance : 0);
  }
  const s = new Float64Array(n * n);
  for (let k = 0; k < n; k++) {
    s[k * n + k] = (g[k] + (k < n - 1 ? g[k + 1] : gL)) / cap[k];
    if (k < n - 1) {
      const v = -g[k + 1] / Math.sqrt(cap[k] * cap[k + 1]);
      s[k * n + k + 1] = v;
      s[(k + 1) * n + k] = v;
    }
  }
  return 1 / symmetricEigen(s, n).values[0];
}
