import type { Ladder } from '../circuit/ladder.js';

/**
 * A lower bound on the endpoint-fit gain error |G| / (high - low) of every ladder with series
 * resistors `r` (pin side first) in `circuit`, whatever its capacitors: the full scale a load takes
 * away through the series resistance. 0 when no bound is known (open output, a single duty).
 *
 * Method: in periodic steady state no capacitor carries average current, so the average currents
 * of the pin, every resistor and the load are all I_L = v / R_L (Kirchhoff's current law on
 * averages). The average voltage drops then give v = ideal(D) - R_sx I_L - (R_dy - R_dx) Q_y, with x
 * the pin state of the smaller driver resistance, y the other one, R_sx = R_dx + sum r, and Q_y the
 * pin's average current during the y phase. Equal drivers: v = k ideal(D), k = R_L / (R_L + R_s),
 * so |G| / span = 1 - k exactly. Unequal drivers, with low <= 0 <= high (every node then stays in
 * [low, high]): |Q_y| <= span / (R_dy + r_1), so the endpoint slope of v lies within
 * k_x span +- k_x |R_dh - R_dl| span / ((R_dy + r_1)(D_max - D_min)), and
 * |G| / span >= (1 - k_x) - k_x |R_dh - R_dl| / ((R_dy + r_1)(D_max - D_min)). Derived here;
 * test/design/gainFloor.test.ts holds it to the engine's dcTransfer.
 *
 * Syntax: gainFloor(circuit, r, dutyMin, dutyMax)
 * Example: gainFloor({ ...circuit, driverHigh: 25, driverLow: 25, loadResistance: 10e3 }, [975], 0.05, 0.95)   // 0.0909...
 */
export function gainFloor(circuit: Omit<Ladder, 'stages'>, r: ArrayLike<number>, dutyMin: number, dutyMax: number): number {
  const loadR = circuit.loadResistance;
  if (loadR === null || !(dutyMax > dutyMin)) return 0;
  const small = Math.min(circuit.driverHigh, circuit.driverLow);
  const large = Math.max(circuit.driverHigh, circuit.driverLow);
  let series = small;
  for (let k = 0; k < r.length; k++) series += r[k];
  const shortfall = series / (loadR + series);
  if (small === large) return shortfall;
  if (!(circuit.low <= 0 && circuit.high >= 0 && circuit.high > circuit.low)) return 0;
  const k = loadR / (loadR + series);
  return Math.max(0, shortfall - (k * (large - small)) / ((large + r[0]) * (dutyMax - dutyMin)));
}
