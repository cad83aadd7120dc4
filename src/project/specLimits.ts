import type { Project } from './types.js';

/**
 * The spec limits dacsmith checks, in report order: the check's name (as JSON and reports spell
 * it), the project-file key that sets the limit (for messages and CI annotations on its line), the
 * SI unit of value and limit ('1': a fraction of full scale), whether a limit written in LSB scales
 * with the resolution (a search over `search.bits`), and where the limit is read in a `Project`.
 * One table, so that the set of names is declared once.
 */
export const SPEC_LIMITS = [
  { name: 'ripple', key: 'spec.ripple', unit: 'V', scalesWithLsb: true, limitOf: (p: Project) => p.spec.ripple },
  { name: 'droop', key: 'spec.droop', unit: 'V', scalesWithLsb: true, limitOf: (p: Project) => p.spec.droop },
  { name: 'inl', key: 'spec.inl', unit: 'V', scalesWithLsb: true, limitOf: (p: Project) => p.spec.inl },
  { name: 'gain', key: 'spec.gain', unit: '1', scalesWithLsb: false, limitOf: (p: Project) => p.spec.gain },
  { name: 'settling', key: 'spec.settling.time', unit: 's', scalesWithLsb: false, limitOf: (p: Project) => p.spec.settling?.time },
  { name: 'pin_current', key: 'search.pin_current', unit: 'A', scalesWithLsb: false, limitOf: (p: Project) => p.search?.pinCurrent },
] as const;

/** Name of a spec check (`ripple`, ..., `pin_current`). */
export type CheckName = (typeof SPEC_LIMITS)[number]['name'];

/**
 * The table row of a check name.
 *
 * Syntax: specLimit(name)
 * Example: specLimit('pin_current').key   // 'search.pin_current'
 */
export function specLimit(name: CheckName): (typeof SPEC_LIMITS)[number] {
  return SPEC_LIMITS.find((row) => row.name === name)!;
}
