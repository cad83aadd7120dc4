import { derivePwmFrequency } from '../project/derivePwmFrequency.js';
import type { Project } from '../project/types.js';
import { DesignInputError } from './designInputError.js';

/**
 * The project at another resolution: pwm.bits and the timer frequency, the LSB, and the limits
 * the file gave in LSB (project.specInLsb) rescaled; limits in V or % of full scale stay.
 *
 * Syntax: projectAtResolution(project, bits)
 * Example: projectAtResolution(p, 8).spec.ripple   // 0.5 LSB of 8 bits when the file said 0.5 LSB
 */
export function projectAtResolution(project: Project, bits: number): Project {
  const { pwm } = project;
  if (pwm.clock === undefined) throw new DesignInputError('needs pwm.clock', 'search.bits', project.file);
  const frequency = derivePwmFrequency({ clock: pwm.clock, bits, prescaler: pwm.prescaler, alignment: pwm.alignment });
  const lsb = (pwm.high - pwm.low) / 2 ** bits;
  const inLsb = project.specInLsb ?? {};
  const spec = { ...project.spec };
  if (inLsb.ripple !== undefined) spec.ripple = inLsb.ripple * lsb;
  if (inLsb.droop !== undefined) spec.droop = inLsb.droop * lsb;
  if (inLsb.inl !== undefined) spec.inl = inLsb.inl * lsb;
  if (inLsb.band !== undefined && spec.settling) spec.settling = { ...spec.settling, band: inLsb.band * lsb };
  return { ...project, pwm: { ...pwm, bits, frequency }, lsb, spec };
}
