import { readFileSync } from 'node:fs';
import { locate, type SourcePosition } from './locate.js';
import { readYamlDocument } from './readYamlDocument.js';

/**
 * Line and column of a key path (`search.resistance`, `filter.stages[1].c`) in a project file, for
 * messages about problems found after loading (design space, numerical domain); undefined when the
 * file cannot be read or parsed again.
 *
 * Method: read and parse the file (readYamlDocument), split the path into keys and list indexes,
 * and walk the node tree (locate.ts).
 *
 * Syntax: positionOfKey(file, keyPath)
 * Example: positionOfKey('board.yaml', 'search.resistance')   // { line: 31, column: 3 }
 */
export function positionOfKey(file: string, keyPath: string): SourcePosition | undefined {
  try {
    const source = readYamlDocument(readFileSync(file, 'utf8'), file);
    const path: Array<string | number> = [];
    for (const part of keyPath.matchAll(/([^.[\]]+)|\[(\d+)\]/g)) path.push(part[2] !== undefined ? Number(part[2]) : part[1]);
    return locate(source.doc, source.lineCounter, path, 'key');
  } catch {
    return undefined;
  }
}
