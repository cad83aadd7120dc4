import { isMap, isScalar, isSeq, type Document } from 'yaml';

type Ranged = { range?: [number, number, number] } | null | undefined;

const startOf = (node: unknown) => (node as Ranged)?.range?.[0];
const endOf = (node: unknown) => (node as Ranged)?.range?.[2];

/**
 * The key path of the deepest key or value that covers a character offset of the source, for
 * problems that yaml reports by offset only (duplicate keys, tags, bad indentation). A pair covers
 * everything from its key to the end of its value, tags and anchors included.
 *
 * Syntax: keyPathAt(doc, offset)
 * Example: keyPathAt(parseDocument('pwm:\n  high: 1\n  high: 2\n'), 20)   // ['pwm', 'high']
 */
export function keyPathAt(doc: Document, offset: number): Array<string | number> {
  const path: Array<string | number> = [];
  let node: unknown = doc.contents;
  for (;;) {
    let next: unknown;
    if (isMap(node)) {
      for (const pair of node.items) {
        if (!isScalar(pair.key)) continue;
        const start = startOf(pair.key);
        const end = endOf(pair.value) ?? endOf(pair.key);
        if (start === undefined || end === undefined || offset < start || offset >= Math.max(end, start + 1)) continue;
        path.push(String(pair.key.value));
        const keyEnd = endOf(pair.key) ?? start;
        next = offset < keyEnd ? undefined : pair.value;
        if (next === undefined || next === null) return path;
        break;
      }
    } else if (isSeq(node)) {
      const index = node.items.findIndex((item) => {
        const start = startOf(item);
        const end = endOf(item);
        return start !== undefined && end !== undefined && offset >= start && offset < Math.max(end, start + 1);
      });
      if (index >= 0) {
        path.push(index);
        next = node.items[index];
      }
    }
    if (next === undefined || next === null) return path;
    node = next;
  }
}
