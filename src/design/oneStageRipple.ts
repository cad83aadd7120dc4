/**
 * Peak-to-peak ripple of one RC stage (time constant tau, ideal source, open output) driven by a
 * PWM square wave of amplitude `span`, duty d and period T, in periodic steady state.
 *
 * Method: the first-order response charges for a = d T / tau and discharges for b = (1 - d) T /
 * tau; the periodic solution swings by span (1 - e^-a)(1 - e^-b) / (1 - e^-(a+b)) (textbook
 * first-order step response, e.g. Horowitz & Hill, The Art of Electronics, 3rd ed., section 1.4,
 * from memory; common practice). Written with expm1 so that tau >> T keeps its digits; for
 * tau >> T it tends to span d (1 - d) T / tau.
 *
 * Syntax: oneStageRipple(span, d, period, tau)
 * Example: oneStageRipple(3.3, 0.5, 1e-4, 1e-2)   // 3.3 * 0.25 * 1e-4 / 1e-2 = 8.25e-3 (approximately)
 */
export function oneStageRipple(span: number, d: number, period: number, tau: number): number {
  const a = (d * period) / tau;
  const b = ((1 - d) * period) / tau;
  return (span * Math.expm1(-a) * Math.expm1(-b)) / -Math.expm1(-(a + b));
}
