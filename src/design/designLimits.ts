import type { DesignLimits } from './types.js';

/**
 * A limits object with every key present (undefined where there is no limit), written in one
 * order: every limits object of a search then has one shape, so V8's optimized search code
 * meets one hidden class and is not thrown away when a search moves on to another problem (the
 * trade-off curves' limits after the search's; traced as deoptimizations, 'wrong map').
 *
 * Syntax: designLimits(limits)
 * Example: designLimits({ ripple: 1.6e-3 }).droop   // undefined
 */
export function designLimits(l: DesignLimits): DesignLimits {
  return { ripple: l.ripple, droop: l.droop, inl: l.inl, gain: l.gain, settlingTime: l.settlingTime, pinCurrent: l.pinCurrent };
}
