import type { CheckName } from '../engine/index.js';

/** The project-file key that sets each check's limit. */
const KEYS: Record<CheckName, string> = {
  ripple: 'spec.ripple',
  droop: 'spec.droop',
  inl: 'spec.inl',
  gain: 'spec.gain',
  settling: 'spec.settling.time',
  pin_current: 'search.pin_current',
};

/**
 * The key path of the limit a check is held to, where a review annotation belongs. The gain check
 * also runs without `spec.gain` (its 2 % default): the key is then absent, and the caller's
 * position lookup falls back to `spec` or the top of the file.
 *
 * Syntax: checkKey(name)
 * Example: checkKey('pin_current')   // 'search.pin_current'
 */
export function checkKey(name: CheckName): string {
  return KEYS[name];
}
