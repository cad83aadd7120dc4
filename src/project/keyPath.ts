/** Longest key path printed in full; longer ones keep their start and end. */
export const MAX_KEY_PATH_LENGTH = 80;

/**
 * A key path as the user reads it: mapping keys joined by dots, list indexes in brackets
 * (0-based, as YAML tools and JSON pointers count). Control characters in keys are escaped
 * (a message stays on one line), and a path longer than MAX_KEY_PATH_LENGTH keeps its first
 * and last parts around '...'.
 *
 * Syntax: formatKeyPath(segments)
 * Example: formatKeyPath(['filter', 'stages', 1, 'c'])   // 'filter.stages[1].c'
 */
export function formatKeyPath(segments: ReadonlyArray<string | number>): string {
  let text = '';
  for (const segment of segments) {
    if (typeof segment === 'number') text += `[${segment}]`;
    else {
      const name = /[\u0000-\u001f\u007f]/.test(segment) ? JSON.stringify(segment).slice(1, -1) : segment;
      text += text === '' ? name : `.${name}`;
    }
  }
  if (text.length <= MAX_KEY_PATH_LENGTH) return text;
  const keep = (MAX_KEY_PATH_LENGTH - 3) / 2;
  return `${text.slice(0, Math.ceil(keep))}...${text.slice(text.length - Math.floor(keep))}`;
}
