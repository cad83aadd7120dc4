/**
 * The circuit as the engine sees it: a PWM pin behind a driver resistance, a ladder of RC
 * stages (optionally followed by ideal unity-gain followers) and a load. SI base units only.
 *
 * See `../shared/design/model.md` (circuit model) for the meaning of every field.
 *
 * Immutable, deeply: the engine remembers its work per ladder object (engine/recentLadders.ts), so a
 * ladder changed in place would be answered with the old circuit's numbers. A changed circuit is a
 * new object (`{ ...ladder, stages: ladder.stages.map(...) }`); the compiler refuses in-place writes
 * (test/circuit/ladder.test.ts).
 */

/** One RC stage: series resistor `r` (ohm) from the previous node, capacitor `c` (F) to ground. */
export interface Stage {
  readonly r: number;
  readonly c: number;
  /** An ideal unity-gain follower drives whatever comes after this stage. */
  readonly buffered: boolean;
}

/** PWM source and ladder, everything the engine needs. */
export interface Ladder {
  /** PWM period T in s. */
  readonly period: number;
  /** Pin level during the high phase, V. */
  readonly high: number;
  /** Pin level during the low phase, V. */
  readonly low: number;
  /** Driver (output) resistance of the pin in the high phase, ohm (may be 0). */
  readonly driverHigh: number;
  /** Driver resistance in the low phase, ohm (may be 0). */
  readonly driverLow: number;
  /** 1 to 4 stages, pin side first. */
  readonly stages: readonly Stage[];
  /** Load resistance from the output to ground, ohm; `null` = open output. */
  readonly loadResistance: number | null;
  /** Load capacitance in parallel with the last capacitor, F (0 when none). */
  readonly loadCapacitance: number;
}

/**
 * The circuit around the stages: PWM source, drivers and the load as the last stage sees it. The
 * design search describes its candidates by this and plain resistor and capacitor lists.
 */
export type LadderCircuit = Omit<Ladder, 'stages'>;
