/**
 * The circuit as the engine sees it: a PWM pin behind a driver resistance, a ladder of RC
 * stages (optionally followed by ideal unity-gain followers) and a load. SI base units only.
 *
 * See `../shared/design/model.md` (circuit model) for the meaning of every field.
 */

/** One RC stage: series resistor `r` (ohm) from the previous node, capacitor `c` (F) to ground. */
export interface Stage {
  r: number;
  c: number;
  /** An ideal unity-gain follower drives whatever comes after this stage. */
  buffered: boolean;
}

/** PWM source and ladder, everything the engine needs. */
export interface Ladder {
  /** PWM period T in s. */
  period: number;
  /** Pin level during the high phase, V. */
  high: number;
  /** Pin level during the low phase, V. */
  low: number;
  /** Driver (output) resistance of the pin in the high phase, ohm (may be 0). */
  driverHigh: number;
  /** Driver resistance in the low phase, ohm (may be 0). */
  driverLow: number;
  /** 1 to 4 stages, pin side first. */
  stages: Stage[];
  /** Load resistance from the output to ground, ohm; `null` = open output. */
  loadResistance: number | null;
  /** Load capacitance in parallel with the last capacitor, F (0 when none). */
  loadCapacitance: number;
}
