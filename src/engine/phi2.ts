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
