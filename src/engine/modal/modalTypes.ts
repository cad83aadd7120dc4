/**
 * The modal form of a ladder, as modalLadder.ts and cascadeLadder.ts build it. Declared apart from
 * both so that they do not import each other (they used to form an import cycle).
 */

/** The modes of one pin state: x' = A x + b with A = V diag(rate) W, W = V^-1. */
export interface PhaseModes {
  /** Eigenvalues of A, 1/s (negative). */
  readonly rate: readonly number[];
  /** Output (last node) per unit of each modal coordinate: the last row of V. */
  readonly out: readonly number[];
}

/**
 * A ladder in modal form, both pin states. Modal coordinates of a state deviation z in the
 * high-phase basis are W_h z; `mix` = W_l V_h turns them into low-phase ones.
 */
export interface ModalLadder {
  readonly n: number;
  readonly period: number;
  readonly high: number;
  readonly low: number;
  /**
   * No follower inside the ladder: V = Cs^-1 Q with Q orthogonal, so `mix` is orthogonal (the
   * settling fast path needs that). False for a cascade of sections (cascadeLadder.ts).
   */
  readonly symmetric: boolean;
  readonly hi: PhaseModes;
  readonly lo: PhaseModes;
  readonly mix: readonly number[];
  /** DC state of the high phase minus that of the low phase, in high-phase modal coordinates. */
  readonly delta: readonly number[];
  /** Output at the DC state of the low phase, V. */
  readonly outLow: number;
  /** Output at the DC state of the high phase, V. */
  readonly outHigh: number;
  /**
   * Condition number ||V||_inf ||V^-1||_inf of the modal basis in the balanced coordinates
   * sqrt(C) x, the larger of the two phases: 1 for a follower-free ladder (orthonormal basis), large
   * for a cascade whose sections have nearly equal modes. Rounding in the modal sums grows with it.
   */
  readonly condition: number;
}
