import type { Warning } from '../engine/index.js';
import type { Section } from './document.js';

/**
 * The "Warnings" section of a report (values that are legal but probably not meant), one list item
 * per warning as `key: message`; null when there is none, so that clean reports stay short.
 *
 * Syntax: warningsSection(warnings[, title])
 * Example: warningsSection([{ key: 'load.resistance', message: '...' }])
 *          // { title: 'Warnings', blocks: [{ kind: 'list', items: ['load.resistance: ...'] }] }
 */
export function warningsSection(warnings: Warning[], title = 'Warnings'): Section | null {
  if (warnings.length === 0) return null;
  return { title, blocks: [{ kind: 'list', items: warnings.map((w) => `${w.key}: ${w.message}`) }] };
}
