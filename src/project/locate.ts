import { isAlias, isMap, isScalar, isSeq, type Document, type LineCounter } from 'yaml';

export interface SourcePosition {
  /** 1-based. */
  line: number;
  /** 1-based. */
  column: number;
}

/** Start offset of a parsed node, if it has a position. */
function startOf(node: unknown): number | undefined {
  const range = (node as { range?: [number, number, number] } | null)?.range;
  return range ? range[0] : undefined;
}

/**
 * Line and column of the key or value at a key path in a parsed YAML document.
 *
 * Method: walk the document's node tree (yaml `parseDocument`) along the path, using the node
 * ranges and a `LineCounter`. When the path leaves the file (a missing key), the position is that
 * of the deepest key that exists, so "missing" messages point at the mapping that lacks it. An
 * alias stops the walk at the alias itself. An empty value points at its key.
 *
 * Syntax: locate(doc, lineCounter, path[, at])
 * Example: locate(doc, lc, ['filter', 'stages', 0, 'c'])   // { line: 21, column: 23 }
 */
export function locate(
  doc: Document,
  lineCounter: LineCounter,
  path: ReadonlyArray<string | number>,
  at: 'key' | 'value' = 'value',
): SourcePosition {
  let node: unknown = doc.contents;
  let offset = startOf(node) ?? 0;
  for (let i = 0; i < path.length; i++) {
    const segment = path[i];
    const last = i === path.length - 1;
    if (isMap(node)) {
      const pair = node.items.find((p) => isScalar(p.key) && String(p.key.value) === String(segment));
      if (!pair) break;
      const keyStart = startOf(pair.key);
      const valueStart = isScalar(pair.value) && pair.value.value === null ? undefined : startOf(pair.value);
      offset = (last && at === 'key') || !last ? (keyStart ?? offset) : (valueStart ?? keyStart ?? offset);
      node = pair.value;
    } else if (isSeq(node) && typeof segment === 'number' && segment < node.items.length) {
      node = node.items[segment];
      offset = startOf(node) ?? offset;
    } else {
      break;
    }
    if (isAlias(node)) {
      offset = startOf(node) ?? offset;
      break;
    }
  }
  const { line, col } = lineCounter.linePos(offset);
  return { line, column: col };
}
