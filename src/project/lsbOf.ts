import type { Project } from './types.js';

/**
 * One LSB of the PWM DAC: (high - low) / 2^bits, in V; with a fine channel of b bits
 * (`second_pwm.role: fine`), full scale over the combined code range, (high - low) / 2^(bits + b)
 * (model.md 1.1). Undefined when the resolution is not known.
 *
 * Syntax: lsbOf(project)
 * Example: lsbOf(p)   // 3.3 / 1024 = 3.22e-3 for a 10-bit, 0..3.3 V output
 *          lsbOf(q)   // 3.3 / 65536 for 8-bit pwm with an 8-bit fine channel
 */
export function lsbOf(project: Pick<Project, 'pwm' | 'network'>): number | undefined {
  const { bits, high, low } = project.pwm;
  const second = project.network?.second;
  const fine = second?.role === 'fine' && second.bits !== null ? second.bits : 0;
  return bits === undefined ? undefined : (high - low) / 2 ** (bits + fine);
}
