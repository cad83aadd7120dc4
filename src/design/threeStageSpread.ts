/**
 * The pole-spread factor kappa_3 = rho_1 rho_2 rho_3 / det(G^-1) of an unbuffered three-stage RC
 * ladder (resistors `r`, pin side first, driven through `driver` ohm, an optional load resistance),
 * where rho_k = (G^-1)_kk is the resistance from node k to ground with the capacitors open. For any
 * capacitors it gives (tau_1 + tau_2 + tau_3)^3 >= 27 kappa_3 tau_1 tau_2 tau_3 (time constants of
 * the ladder), which is what keeps the three poles apart (threeStageTauMin).
 *
 * Method: the time constants are the eigenvalues of G^-1 C, so their sum is trace(G^-1 C) =
 * sum_k C_k rho_k and their product det(C) det(G^-1); the inequality of arithmetic and geometric
 * means on the three terms C_k rho_k gives the inequality. For the ladder (nodal analysis, common
 * practice) with cumulative series resistances s_k = driver + r_1 + ... + r_k, S = s_3 and t_k =
 * R_L + S - s_k: (G^-1)_kk = s_k t_k / (R_L + S) and det(G^-1) = s_1 r_2 r_3 R_L / (R_L + S), so
 * kappa_3 = (s_2 S / (r_2 r_3)) (t_1 t_2 / (R_L + S)^2); an open output drops the second factor.
 * test/design/threeStageSpread.test.ts holds it to G^-1 and to the ladder's eigenvalues.
 *
 * Syntax: threeStageSpread(r, driver, loadResistance)
 * Example: threeStageSpread([100, 200, 400], 0, null)   // (300 * 700) / (200 * 400) = 2.625
 */
export function threeStageSpread(r: ArrayLike<number>, driver: number, loadResistance: number | null): number {
  const s2 = driver + r[0] + r[1];
  const S = s2 + r[2];
  const open = (s2 * S) / (r[1] * r[2]);
  if (loadResistance === null) return open;
  const total = loadResistance + S;
  return open * ((loadResistance + r[1] + r[2]) / total) * ((loadResistance + r[2]) / total);
}

/**
 * The largest ratio p = tau_2 tau_3 / tau_1^2 (tau_1 the slowest) that three time constants with
 * (tau_1 + tau_2 + tau_3)^3 >= 27 kappa tau_1 tau_2 tau_3 can have: the root in (0, 1] of
 * (2 + p)^3 = 27 kappa p (1 when kappa <= 1), rounded up.
 *
 * Method: with r_2 = tau_2 / tau_1, r_3 = tau_3 / tau_1 in (0, 1] and r_2 r_3 = p fixed, r_2 + r_3
 * is largest at r_2 = 1, so p is reachable exactly when (2 + p)^3 >= 27 kappa p; that cubic is
 * convex on p > 0, 8 at p = 0 and 27 (1 - kappa) <= 0 at p = 1, so the reachable p form (0, root].
 * Newton's method from p = 0 climbs to the root from below (convex and falling there); the result
 * is moved up until the cubic is no longer positive, so it is never below the root.
 *
 * Syntax: spreadRatioCap(kappa)
 * Example: spreadRatioCap(2.25)   // about 0.168
 */
export function spreadRatioCap(kappa: number): number {
  if (!(kappa > 1)) return 1;
  const f = (p: number) => (2 + p) * (2 + p) * (2 + p) - 27 * kappa * p;
  let p = 0;
  for (let i = 0; i < 60; i++) {
    const step = f(p) / (27 * kappa - 3 * (2 + p) * (2 + p));
    p += step;
    if (!(step > 1e-15 * p)) break;
  }
  let hi = Math.min(1, p * (1 + 1e-12) + 1e-300);
  while (hi < 1 && f(hi) > 0) hi = Math.min(1, hi * (1 + 1e-9) + 1e-300);
  return hi;
}

/**
 * A lower bound on the slowest time constant of a three-stage ladder with spread factor `kappa`
 * (threeStageSpread) whose transfer must satisfy prod(1 + w^2 tau_i^2) >= gamma (the ripple cap
 * of settlingBounds.ts: gamma = (g / h*)^2), w the PWM angular frequency, s.
 *
 * Method: write tau_i = r_i tau_1 with r_i in (0, 1]. For a fixed product p = r_2 r_3 both the
 * spread constraint (threeStageSpread) and prod(1 + u r_i^2) = (1 + u)(1 + u (r_2^2 + r_3^2) +
 * u^2 p^2), u = w^2 tau_1^2, are largest at r_2 = 1, r_3 = p, and the product grows with p; so
 * prod(1 + w^2 tau_i^2) <= (1 + u)^2 (1 + u p*^2) with p* = spreadRatioCap(kappa), and tau_1 >=
 * sqrt(u*) / w for the u* at which the right side reaches gamma. The right side is convex and
 * rising in u, so Newton's method from u = cbrt(gamma / p*^2) (where it is at least gamma) falls
 * to u* from above; the result is moved down until the right side is below gamma. With kappa <= 1
 * this is the bound of three equal time constants, (1 + u)^3 >= gamma.
 *
 * Syntax: threeStageTauMin(gamma, kappa, omega)
 * Example: threeStageTauMin(1e6, 2.25, 2 * Math.PI * 31250)   // about 9.1e-5 (s)
 */
export function threeStageTauMin(gamma: number, kappa: number, omega: number): number {
  if (!(gamma > 1)) return 0;
  const q = spreadRatioCap(kappa) ** 2;
  const excess = (u: number) => (1 + u) * (1 + u) * (1 + u * q) - gamma;
  let u = Math.max(Math.cbrt(gamma / q), 1);
  for (let i = 0; i < 100; i++) {
    const slope = (1 + u) * (2 * (1 + u * q) + (1 + u) * q);
    const step = excess(u) / slope;
    u -= step;
    if (!(step > 1e-15 * u)) break;
  }
  let lo = Math.max(0, u * (1 - 1e-12));
  while (lo > 0 && excess(lo) >= 0) lo *= 1 - 1e-9;
  return Math.sqrt(lo) / omega;
}
