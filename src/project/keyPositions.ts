import { readFileSync } from 'node:fs';
import { locate, type SourcePosition } from './locate.js';
import { readYamlDocument } from './readYamlDocument.js';

/** Where a key path sits in a file; `exact` is false when the key is absent and the position is that of its deepest present parent. */
export interface KeyPosition extends SourcePosition {
  exact: boolean;
}

/** `filter.stages[1].c` as path segments: ['filter', 'stages', 1, 'c']. */
function segments(keyPath: string): Array<string | number> {
  const path: Array<string | number> = [];
  for (const part of keyPath.matchAll(/([^.[\]]+)|\[(\d+)\]/g)) path.push(part[2] !== undefined ? Number(part[2]) : part[1]);
  return path;
}

/**
 * Line and column of several key paths of one project file, read and parsed once, for annotations
 * that point at the line of a limit (`spec.ripple`, `search.pin_current`). A key that is absent
 * (the default gain check has no `spec.gain`) points at its deepest present parent (`spec`), marked
 * `exact: false`; when not even the first key is there, at line 1, column 1. The result is empty
 * when the file cannot be read or parsed again (it changed since it was loaded).
 *
 * Method: yaml's parsed document with a LineCounter (readYamlDocument); `Document.hasIn` tells
 * whether the whole path exists, locate.ts walks the node tree.
 *
 * Syntax: keyPositions(file, keyPaths)
 * Example: keyPositions('board.yaml', ['spec.ripple', 'spec.gain'])
 *          // Map { 'spec.ripple' => { line: 24, column: 3, exact: true }, 'spec.gain' => { line: 23, column: 1, exact: false } }
 */
export function keyPositions(file: string, keyPaths: readonly string[]): Map<string, KeyPosition> {
  const found = new Map<string, KeyPosition>();
  let source;
  try {
    source = readYamlDocument(readFileSync(file, 'utf8'), file);
  } catch {
    return found;
  }
  for (const keyPath of keyPaths) {
    const path = segments(keyPath);
    if (path.length === 0) continue;
    if (!source.doc.hasIn(path.slice(0, 1))) {
      found.set(keyPath, { line: 1, column: 1, exact: false });
      continue;
    }
    found.set(keyPath, { ...locate(source.doc, source.lineCounter, path, 'key'), exact: source.doc.hasIn(path) });
  }
  return found;
}
