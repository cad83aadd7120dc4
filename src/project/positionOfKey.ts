import { keyPositions } from './keyPositions.js';
import type { SourcePosition } from './locate.js';

/**
 * Line and column of one key path (`search.resistance`, `filter.stages[1].c`) in a project file,
 * for messages about problems found after loading (design space, numerical domain); an absent key
 * points at its deepest present parent. Undefined when the file cannot be read or parsed again.
 *
 * Method: keyPositions.ts for a single key.
 *
 * Syntax: positionOfKey(file, keyPath)
 * Example: positionOfKey('board.yaml', 'search.resistance')   // { line: 31, column: 3 }
 */
export function positionOfKey(file: string, keyPath: string): SourcePosition | undefined {
  const at = keyPositions(file, [keyPath]).get(keyPath);
  return at ? { line: at.line, column: at.column } : undefined;
}
