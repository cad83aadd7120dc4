/**
 * The general circuit: one or two PWM outputs of one timer, a chain of passive RC stages and active
 * second-order stages, and a load. SI base units only. A `Ladder` (ladder.ts) is the special case
 * with one PWM output and RC stages only; `networkOfLadder` (networkOfLadder.ts) converts it.
 *
 * See `../shared/design/model.md` ("Circuit model" and "Version 1.1 additions").
 *
 * Deeply immutable, like `Ladder`: a changed circuit is a new object.
 */

/** A PWM output: its two levels and the driver resistance in each. */
export interface PwmPin {
  /** Level while high, V. */
  readonly high: number;
  /** Level while low, V. */
  readonly low: number;
  /** Driver resistance while high, ohm (may be 0). */
  readonly driverHigh: number;
  /** Driver resistance while low, ohm (may be 0). */
  readonly driverLow: number;
}

/** Passive RC stage: series `r` from the previous node, `c` from its node to ground. */
export interface RcStage {
  readonly kind: 'rc';
  readonly r: number;
  readonly c: number;
  /** An ideal unity-gain follower drives whatever comes after this stage. */
  readonly buffered: boolean;
}

/**
 * Unity-gain Sallen-Key low-pass with an ideal op-amp: `r1` from the previous node to node a, `r2`
 * from a to b, `c1` from a to the op-amp output, `c2` from b to ground; the output (= b) is an
 * ideal source, so what follows does not load the stage.
 * f0 = 1 / (2 pi sqrt(r1 r2 c1 c2)), Q = sqrt(r1 r2 c1 c2) / (c2 (r1 + r2)).
 */
export interface SallenKeyStage {
  readonly kind: 'sallen-key';
  readonly r1: number;
  readonly r2: number;
  readonly c1: number;
  readonly c2: number;
}

export type NetworkStage = RcStage | SallenKeyStage;

/**
 * The second PWM output of the same timer (same period and alignment).
 * - `fine`: its own duty, set by the low `bits` of the code; weighted in through `r`.
 * - `complement`: high exactly when the first output is low.
 * It enters the node of RC stage `stage` (0-based) through `r`, and through `c` in series when
 * `c` is not null.
 */
export interface SecondPwm {
  readonly role: 'fine' | 'complement';
  /** Fine channel resolution b (code = coarse * 2^b + fine); null for `complement`. */
  readonly bits: number | null;
  /** Resolution of the first (coarse) output, `pwm.bits`; needed for `fine`, null otherwise. */
  readonly coarseBits: number | null;
  readonly pin: PwmPin;
  /** 0-based index of the RC stage whose node the injection enters. */
  readonly stage: number;
  /** Injection resistance, ohm (> 0). */
  readonly r: number;
  /** Injection series capacitance, F, or null for a resistor alone. */
  readonly c: number | null;
}

export interface Network {
  /** PWM period T, s. */
  readonly period: number;
  /** Edge: each period starts with the high phase; center: the high phase sits mid-period. */
  readonly alignment: 'edge' | 'center';
  /** The first (main, coarse) PWM output. */
  readonly pin: PwmPin;
  /** 1 to 4 stages, pin side first. */
  readonly stages: readonly NetworkStage[];
  readonly second: SecondPwm | null;
  /** Load resistance from the output to ground, ohm; null = open output. */
  readonly loadResistance: number | null;
  /** Load capacitance at the output, F (0 when none); an op-amp output ignores it (ideal). */
  readonly loadCapacitance: number;
}

/**
 * The duties of the two outputs for one operating point (`second` is null without a fine channel;
 * a complement output follows the first and needs no duty of its own).
 */
export interface Duties {
  readonly first: number;
  readonly second: number | null;
}
