import type { Alignment } from './types.js';

/**
 * PWM frequency of a timer from its clock, prescaler and resolution.
 *
 * Method (common practice for microcontroller timers): an edge-aligned timer counts 2^bits
 * prescaled clock ticks per period, f = clock / (prescaler * 2^bits); a center-aligned timer
 * counts up and then down, two counts per step, f = clock / (2 * prescaler * 2^bits). Data sheets
 * that count to TOP instead of 2^bits (phase-correct modes) differ by one count per ramp; the
 * project file defines the resolution as 2^bits steps, so this form is used.
 *
 * Syntax: derivePwmFrequency({ clock, bits[, prescaler][, alignment] })
 * Example: derivePwmFrequency({ clock: 20e6, bits: 10 })                        // 19531.25
 *          derivePwmFrequency({ clock: 64e6, bits: 12, alignment: 'center' })   // 7812.5
 */
export function derivePwmFrequency(timer: { clock: number; bits: number; prescaler?: number; alignment?: Alignment }): number {
  const { clock, bits, prescaler = 1, alignment = 'edge' } = timer;
  if (!(clock > 0 && Number.isFinite(clock)) || !Number.isInteger(bits) || bits < 1 || !Number.isInteger(prescaler) || prescaler < 1) {
    throw new RangeError(`derivePwmFrequency: need clock > 0, whole bits >= 1 and prescaler >= 1, got ${clock}, ${bits}, ${prescaler}`);
  }
  const counts = prescaler * 2 ** bits * (alignment === 'center' ? 2 : 1);
  return clock / counts;
}
