import type { Ladder } from '../circuit/ladder.js';
import type { Network } from '../circuit/network.js';
import type { Check } from './checks.js';
import type { Warning } from './plausibilityWarnings.js';
import type { DcTransfer, OperatingPoint, Settling, WorstRipple } from './types.js';

/** Everything `analyze` reports about one project, SI base units throughout. */
export interface Analysis {
  /** The circuit that was analysed, when it is a passive ladder with one PWM output (else null). */
  ladder: Ladder | null;
  /** The circuit, when it has a second PWM output or an active stage (circuitEngine.ts); else null. */
  network: Network | null;
  /** Periodic steady state at each requested duty (or on the default grid). */
  points: OperatingPoint[];
  worstRipple: WorstRipple;
  dc: DcTransfer;
  settling: Settling;
  /** -3 dB frequency, Hz. */
  cutoff: number;
  /** Attenuation at the PWM frequency relative to DC, dB (positive: -20 log10 |H(f_pwm)/H(0)|). */
  attenuation: number;
  /** A. */
  pinPeakCurrent: number;
  /**
   * Voltage stress of the filter capacitors: the working voltage (an upper bound, V), the derating
   * factor asked for, and the next standard rating at or above factor x working (V; null above 1 kV).
   */
  capacitorVoltage: { working: number; factor: number; rating: number | null };
  /** s, as the engine reports them. */
  timeConstants: number[];
  /** V, or null when the resolution is unknown. */
  lsb: number | null;
  checks: Check[];
  /** Every check passes (true when there are no checks). */
  pass: boolean;
  /** Values that are legal but probably not meant (plausibilityWarnings.ts); never change `pass`. */
  warnings: Warning[];
  /** Natural frequency (Hz) and Q of each Sallen-Key stage (0-based stage index); empty for a ladder. */
  activeStages: Array<{ stage: number; f0: number; q: number }>;
}

export interface AnalyzeOptions {
  /** Duties to evaluate (fractions 0..1); default: a grid over the used range. */
  duties?: number[];
  /** Number of grid duties when `duties` is not given (default 11). */
  grid?: number;
}
