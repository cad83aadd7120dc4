import type { Project } from '../project/types.js';
import { SPEC_LIMITS, type CheckName } from '../project/specLimits.js';
import type { DcTransfer, Settling, WorstRipple } from './types.js';

export type { CheckName } from '../project/specLimits.js';

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
  const value: Record<CheckName, () => number | null> = {
    ripple: () => figures.worstRipple.ripple,
    droop: () => Math.abs(figures.dc.droop.error),
    inl: () => Math.abs(figures.dc.inl.error),
    gain: () => Math.abs(figures.dc.gainError) / (project.pwm.high - project.pwm.low),
    settling: () => figures.settling.time,
    pin_current: () => figures.pinPeakCurrent,
  };
  const checks: Check[] = [];
  for (const row of SPEC_LIMITS) {
    const limit = row.limitOf(project);
    if (limit === undefined) continue;
    const v = value[row.name]();
    checks.push({ name: row.name, value: v, limit, unit: row.unit, pass: v !== null && v <= limit });
  }
  return checks;
}
