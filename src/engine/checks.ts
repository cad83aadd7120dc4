import type { Project } from '../project/types.js';
import type { DcTransfer, Settling, WorstRipple } from './types.js';

/** Project-file key a check comes from. */
export type CheckName = 'ripple' | 'droop' | 'inl' | 'gain' | 'settling' | 'pin_current';

/** One spec limit compared with the analysis. `value` is null when it does not exist (never settles). */
export interface Check {
  name: CheckName;
  value: number | null;
  limit: number;
  pass: boolean;
  /** SI unit of value and limit ('1': a fraction of full scale). */
  unit: 'V' | 's' | 'A' | '1';
}

/** The figures the checks need. */
export interface CheckInputs {
  worstRipple: WorstRipple;
  dc: DcTransfer;
  settling: Settling;
  pinPeakCurrent: number;
}

/**
 * Compare the analysis with every limit the project states, in this order: ripple (worst ripple),
 * droop (largest |DC error|), inl (largest |INL|), gain (|endpoint-fit gain error| as a fraction of
 * full scale, model.md 1.1), settling (settling time; never settling fails),
 * pin_current (pin peak current, limit from `search.pin_current`). A value passes when it is at most
 * its limit. Absent limits give no check.
 *
 * Syntax: specChecks(project, { worstRipple, dc, settling, pinPeakCurrent })
 * Example: specChecks(p, figures).every((c) => c.pass)
 */
export function specChecks(project: Project, figures: CheckInputs): Check[] {
  const { spec } = project;
  const checks: Check[] = [];
  const add = (name: CheckName, value: number | null, limit: number, unit: Check['unit']) =>
    checks.push({ name, value, limit, unit, pass: value !== null && value <= limit });

  if (spec.ripple !== undefined) add('ripple', figures.worstRipple.ripple, spec.ripple, 'V');
  if (spec.droop !== undefined) add('droop', Math.abs(figures.dc.droop.error), spec.droop, 'V');
  if (spec.inl !== undefined) add('inl', Math.abs(figures.dc.inl.error), spec.inl, 'V');
  if (spec.gain !== undefined) add('gain', Math.abs(figures.dc.gainError) / (project.pwm.high - project.pwm.low), spec.gain, '1');
  if (spec.settling?.time !== undefined) add('settling', figures.settling.time, spec.settling.time, 's');
  const pinLimit = project.search?.pinCurrent;
  if (pinLimit !== undefined) add('pin_current', figures.pinPeakCurrent, pinLimit, 'A');
  return checks;
}
