/**
 * A key path as the user reads it: mapping keys joined by dots, list indexes in brackets
 * (0-based, as YAML tools and JSON pointers count).
 *
 * Syntax: formatKeyPath(segments)
 * Example: formatKeyPath(['filter', 'stages', 1, 'c'])   // 'filter.stages[1].c'
 */
export function formatKeyPath(segments: ReadonlyArray<string | number>): string {
  let text = '';
  for (const segment of segments) {
    if (typeof segment === 'number') text += `[${segment}]`;
    else text += text === '' ? segment : `.${segment}`;
  }
  return text;
}
