import { specLimit, type CheckName } from '../project/index.js';

/**
 * The key path of the limit a check is held to, where a review annotation belongs (the SPEC_LIMITS
 * table of src/project/specLimits.ts). The gain check also runs without `spec.gain` (its 2 %
 * default): the key is then absent, and the caller's position lookup falls back to `spec` or the
 * top of the file.
 *
 * Syntax: checkKey(name)
 * Example: checkKey('pin_current')   // 'search.pin_current'
 */
export function checkKey(name: CheckName): string {
  return specLimit(name).key;
}
