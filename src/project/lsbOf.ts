import type { Project } from './types.js';

/**
 * One LSB of the PWM DAC: (high - low) / 2^bits, in V; undefined when the resolution is not known.
 *
 * Syntax: lsbOf(project)
 * Example: lsbOf(p)   // 3.3 / 1024 = 3.22e-3 for a 10-bit, 0..3.3 V output
 */
export function lsbOf(project: Pick<Project, 'pwm'>): number | undefined {
  const { bits, high, low } = project.pwm;
  return bits === undefined ? undefined : (high - low) / 2 ** bits;
}
