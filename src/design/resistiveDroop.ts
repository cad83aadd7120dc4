import type { Ladder } from '../circuit/ladder.js';

/** The resistor-only droop floor of a circuit (resistiveDroop): droop >= ideal S / (R_L + S), S = driver + sum R. */
export interface ResistiveDroop {
  /** Largest |ideal output| over the duty range on the side the bound covers, V (> 0). */
  ideal: number;
  /** Driver resistance counted in S on that side, ohm. */
  driver: number;
  /** Load resistance, ohm. */
  load: number;
}

/**
 * A lower bound on the droop (the largest |ideal - average output| over the duty range) of every
 * ladder in `circuit` from its series resistance alone, whatever its capacitors: droop >=
 * ideal S / (R_L + S) with S = plan.driver + sum R (resistiveDroopFloor); null when no such bound is
 * known (open output, or no side below applies).
 *
 * Method (Kirchhoff's current law on averages, derived here): in periodic steady state no
 * capacitor carries average current, so the pin, every series resistor and the load carry the same
 * average current I_L = v / R_L (load to ground). Averaging the voltage drops with the pin's
 * driver resistance R_dh while high and R_dl while low:
 * ideal - v = I_L (R_dl + sum R) + (R_dh - R_dl) Q_h = I_L (R_dh + sum R) + (R_dl - R_dh) Q_l,
 * with Q_h, Q_l the pin's average current over the high and the low phase. No node leaves
 * [min(low, 0), max(high, 0)] (each node is pulled only toward its neighbours, the pin level and
 * ground). So when high >= 0 the first node never exceeds the high level and Q_h >= 0; with
 * R_dh >= R_dl, v = (ideal - X) R_L / (R_L + S) with X >= 0 and S = R_dl + sum R, hence wherever
 * ideal >= 0, ideal - v >= ideal S / (R_L + S). Likewise when low <= 0, Q_l <= 0 and, with
 * R_dl >= R_dh and S = R_dh + sum R, wherever ideal <= 0, v - ideal >= |ideal| S / (R_L + S). Equal
 * drivers meet both (and the bound is then exact at each duty). ideal = low + D (high - low) is
 * largest in magnitude at an end of the duty range. test/design/resistiveDroop.test.ts holds it
 * to the engine's dcTransfer, with the low level below ground too.
 *
 * Syntax: resistiveDroop(circuit, dutyMin, dutyMax)
 * Example: resistiveDroop({ ...circuit, high: 3.3, low: -0.1, driverHigh: 40, driverLow: 25, loadResistance: 1e6 }, 0.025, 0.975)
 *          // { ideal: 3.215, driver: 25, load: 1e6 }
 * See also: resistiveDroopFloor, gainFloor.ts (the same balance for the endpoint-fit gain)
 */
export function resistiveDroop(circuit: Omit<Ladder, 'stages'>, dutyMin: number, dutyMax: number): ResistiveDroop | null {
  const load = circuit.loadResistance;
  if (load === null) return null;
  const { high, low, driverHigh, driverLow } = circuit;
  const span = high - low;
  let ideal = 0;
  let driver = driverLow;
  // High side: R_dh >= R_dl, high >= 0, at the duty with the largest ideal.
  if (driverHigh >= driverLow && high >= 0) ideal = Math.max(0, low + dutyMax * span, low + dutyMin * span);
  // Low side: R_dl >= R_dh, low <= 0, at the duty with the most negative ideal.
  if (driverLow >= driverHigh && low <= 0) {
    const below = Math.max(0, -(low + dutyMin * span), -(low + dutyMax * span));
    if (below > ideal) {
      ideal = below;
      driver = driverHigh;
    }
  }
  return ideal > 0 ? { ideal, driver, load } : null;
}

/**
 * The droop floor of resistiveDroop for a ladder whose series resistance is `series` = plan.driver
 * + sum R, ohm: ideal S / (R_L + S), V.
 *
 * Syntax: resistiveDroopFloor(plan, series)
 * Example: resistiveDroopFloor({ ideal: 3.215, driver: 25, load: 1e6 }, 3025)   // 9.70e-3
 */
export function resistiveDroopFloor(plan: ResistiveDroop, series: number): number {
  return (plan.ideal * series) / (plan.load + series);
}
