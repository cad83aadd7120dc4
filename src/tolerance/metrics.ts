/** The figures a tolerance study checks for one circuit, ladder or network (SI: V, s). */
export interface CircuitMetrics {
  /** Largest ripple over the used duty range and where. */
  worstRipple: { duty: number; ripple: number };
  /** DC error (ideal - average) of largest magnitude over the range, sign kept, and where. */
  droop: { duty: number; error: number };
  /** Largest deviation from the endpoint line (sign kept), when the plan asks for it. */
  inl: { duty: number; error: number } | null;
  /**
   * Endpoint-fit gain error as a fraction of this circuit's full scale, signed ideal - actual
   * ((high - low) - fit slope) / (high - low), when the plan asks for it.
   */
  gain: number | null;
  /** Slowest settling time over the plan's steps, s; null = never settles. */
  settlingTime: number | null;
  /**
   * Some figure needed the engine's matrix-exponential path (a ladder's cascade settling, ...;
   * every figure of a network, which has no modal form).
   */
  usedEngine: boolean;
}
