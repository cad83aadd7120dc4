/**
 * The normalized project: what a project file means, in SI base units (V, s, Hz, ohm, F, A).
 * Produced by `loadProject`, consumed by the engine, design, tolerance and report layers.
 */
import type { Stage } from '../circuit/ladder.js';
import type { NetworkStage, SecondPwm } from '../circuit/network.js';

export type Alignment = 'edge' | 'center';

export interface PwmSettings {
  /** PWM frequency in Hz (given, or derived from clock, prescaler, bits and alignment). */
  frequency: number;
  /** Timer clock in Hz, when given. */
  clock?: number;
  /** Resolution in bits, when known. */
  bits?: number;
  prescaler: number;
  alignment: Alignment;
  high: number;
  low: number;
  driver: { high: number; low: number };
  /**
   * Used duty range, fractions 0..1; with a fine channel (`second_pwm.role: fine`), fractions of
   * the combined code range N / 2^(bits + b) (model.md 1.1).
   */
  duty: { min: number; max: number };
}

export interface LoadSettings {
  /** ohm; undefined = open output. */
  resistance?: number;
  /** F, 0 when not given. */
  capacitance: number;
}

/** Settling requirement, all in SI: band in V, time in s, from/to as duty fractions. */
export interface SettlingSpec {
  band: number;
  time?: number;
  /** Both undefined: the default step (full used range, rising and falling). */
  from?: number;
  to?: number;
}

/** Spec limits, already converted to volts (LSB and % of full scale resolved). */
export interface Spec {
  /** Peak-to-peak ripple limit, V. */
  ripple?: number;
  /** Largest DC error allowed over the used range, V. */
  droop?: number;
  settling?: SettlingSpec;
  /** Largest INL allowed, V (endpoint fit). */
  inl?: number;
  /**
   * Largest endpoint-fit gain error allowed, as a fraction of full scale (0.02 = 2 %). Defaults to
   * 2 % when the file limits no droop (model.md 1.1, "Full scale"; an INL limit does not bound the
   * full scale, so it does not replace the default); undefined when `spec.gain: none` or when a
   * droop limit already bounds the DC transfer.
   */
  gain?: number;
}

export type SeriesName = 'E3' | 'E6' | 'E12' | 'E24' | 'E48' | 'E96' | 'E192';

export interface SearchSettings {
  stages: number[];
  /** IEC 60063 series of the resistors and of the capacitors (model.md 1.1: they may differ). */
  series: { resistor: SeriesName; capacitor: SeriesName };
  /** Headroom every recommended design keeps below each limit, fraction (default 0.1). */
  margin: number;
  /** Whether the search may (true) or may not (false) put an ideal follower after the last stage. */
  buffered: boolean[];
  resistance: { min: number; max: number };
  capacitance: { min: number; max: number };
  /** Largest pin peak current allowed, A. */
  pinCurrent?: number;
  /** With pwm.clock: the resolutions the search may choose. */
  bits?: { min: number; max: number };
  /**
   * Sallen-Key stages: the window of Q the search may use (search.q); the design search applies
   * its default (0.5 to 0.8) when absent.
   */
  q?: { min: number; max: number };
  /** Ranges of the second PWM output's parts (search.second_pwm); absent: the search's defaults. */
  secondPwm?: { r?: { min: number; max: number }; c?: { min: number; max: number } };
}

export interface ToleranceSettings {
  /** Relative tolerance of resistors (0.01 = 1 %). */
  resistor: number;
  /** Relative tolerance of capacitors. */
  capacitor: number;
  /** Per-stage overrides, index = stage number - 1. */
  stages?: Array<{ resistor?: number; capacitor?: number } | undefined>;
  /** Driver resistance ranges, ohm. */
  driver?: { high: { min: number; max: number }; low: { min: number; max: number } };
  /** Relative tolerance of the high level (supply). */
  supply?: number;
  /** Relative tolerance of the load resistance. */
  load?: number;
  distribution: 'normal' | 'uniform';
  samples: number;
  seed: number;
  /** Required overall yield, fraction 0..1. */
  yield?: number;
}

/**
 * The circuit of a file that uses a version 1.1 element (`second_pwm`, an active stage): every
 * stage in file order and the second PWM output (model.md, "Version 1.1 additions").
 */
export interface ProjectNetwork {
  /** Every stage of filter.stages in file order; RC stages as { kind: 'rc', r, c, buffered }. */
  readonly stages: readonly NetworkStage[];
  /** The second PWM output; `stage` is 0-based into `stages` and names an RC stage. */
  readonly second: SecondPwm | null;
}

/** A loaded, validated, normalized project file. */
export interface Project {
  /** Path the project was read from (for messages). */
  file: string;
  pwm: PwmSettings;
  load: LoadSettings;
  /**
   * The RC stages. For a file with `network`, these are its RC stages only (its active stages are
   * in `network.stages`), so ladder code must not run on it: see requireLadder.ts.
   */
  filter: { stages: Stage[] };
  /**
   * Present exactly when the file has `second_pwm` or an active stage (commands that work on a
   * `Ladder` refuse such a project until the engine for it arrives).
   */
  network?: ProjectNetwork;
  spec: Spec;
  search?: SearchSettings;
  tolerance?: ToleranceSettings;
  /**
   * LSB in V when bits is known: (high - low) / 2^bits; with `second_pwm.role: fine` of b bits,
   * (high - low) / 2^(bits + b), full scale over the combined code range (model.md 1.1).
   */
  lsb?: number;
  /**
   * Spec limits that the file gave in LSB, as LSB counts, so that a search over the resolution can
   * rescale them with the LSB of each resolution (a limit in V or % of full scale stays fixed).
   */
  specInLsb?: { ripple?: number; droop?: number; inl?: number; band?: number };
}
