import type { OperatingPoint } from './types.js';

/**
 * An operating point from the output at the period start and the extremes of the deviation from
 * it over the period: the ripple is taken from the deviations (maxW - minW), so a ripple of 1e-9 of
 * the level keeps its digits, and never as max - min of the levels.
 *
 * Syntax: operatingPointFrom(duty, average, yStart, { minW, maxW, tMin, tMax })
 * Example: operatingPointFrom(0.5, 1.65, 1.6, { minW: -0.01, maxW: 0.1, tMin: 0, tMax: 2.5e-5 }).ripple  // 0.11
 */
export function operatingPointFrom(
  duty: number,
  average: number,
  yStart: number,
  extremes: { minW: number; maxW: number; tMin: number; tMax: number },
): OperatingPoint {
  const { minW, maxW, tMin, tMax } = extremes;
  return { duty, average, min: yStart + minW, max: yStart + maxW, ripple: maxW - minW, tMin, tMax };
}
