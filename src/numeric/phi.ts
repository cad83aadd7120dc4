/**
 * The phi functions of exponential integrators, phi_1(z) = (e^z - 1)/z and phi_2(z) =
 * (e^z - 1 - z)/z^2 (M. Hochbruck & A. Ostermann, "Exponential integrators", Acta Numerica 19
 * (2010), section 2), in the forms the engine integrates exponentials with.
 */

/**
 * phi2(z) = (e^z - 1 - z) / z^2 for a real z, to full relative precision (phi2(0) = 1/2).
 *
 * Method: for |z| < 1 the Taylor series sum z^k / (k + 2)! (terms fall at least as 1/(k+2)!, 18
 * terms reach unit roundoff); otherwise (expm1(z) - z) / z^2, where expm1 - z loses at most a
 * couple of bits for |z| >= 1. The phi-functions are those of exponential integrators
 * (M. Hochbruck & A. Ostermann, "Exponential integrators", Acta Numerica 19 (2010), section 2).
 *
 * Syntax: phi2(z)
 * Example: phi2(1e-9)  // 0.5000000001666667
 */
export function phi2(z: number): number {
  if (Math.abs(z) >= 1) return (Math.expm1(z) - z) / (z * z);
  let term = 0.5;
  let sum = 0.5;
  for (let k = 1; k < 25; k++) {
    term *= z / (k + 2);
    sum += term;
    if (Math.abs(term) <= 1e-17 * Math.abs(sum)) break;
  }
  return sum;
}

/**
 * 1 - phi_1(-x) = (x - 1 + e^-x) / x for x >= 0: the mean of 1 - e^(-r s) over a phase of length
 * t, with x = r t.
 *
 * Method: for x < 0.01 the Taylor series x/2 - x^2/6 + x^3/24 - x^4/120 + x^5/720 (alternating,
 * relative truncation error below x^5/2520, 4e-14 at x = 0.01); otherwise (x + expm1(-x)) / x,
 * whose cancellation costs at most a few bits once x >= 0.01.
 *
 * Syntax: oneMinusPhi1(x)
 * Example: oneMinusPhi1(1)  // 0.36787944117144233 (= 1/e)
 */
export function oneMinusPhi1(x: number): number {
  if (x < 1e-2) return x * (1 / 2 - x * (1 / 6 - x * (1 / 24 - x * (1 / 120 - x / 720))));
  return (x + Math.expm1(-x)) / x;
}

/**
 * phi_1(z) = (e^z - 1) / z for a real z, to full relative precision (phi_1(0) = 1).
 *
 * Method: for |z| < 1e-5 the Taylor series 1 + z/2 + z^2/6 (truncation below z^3/24, 4e-17
 * relative); otherwise expm1(z) / z, which has no cancellation (expm1 is accurate near 0).
 *
 * Syntax: phi1(z)
 * Example: phi1(-1)  // 0.6321205588285577 (= 1 - 1/e)
 */
export function phi1(z: number): number {
  if (Math.abs(z) < 1e-5) return 1 + z * (1 / 2 + z / 6);
  return Math.expm1(z) / z;
}
