/** Relative allowance between the fast model and the engine (both exact; rounding differs). */
export const REL = 1e-6;

/**
 * Whether a fast figure is over a limit by more than the allowance REL (undefined: no limit). A
 * search rules a candidate out only on this, so rounding between its fast model and the engine
 * never rules out a design the engine would accept.
 *
 * Syntax: exceeds(value, limit)
 * Example: exceeds(1.0000005e-3, 1e-3)   // false: within the allowance
 */
export function exceeds(value: number, limit: number | undefined): boolean {
  return limit !== undefined && value > limit * (1 + REL) + 1e-300;
}
