import {
  isAlias,
  isMap,
  isScalar,
  isSeq,
  LineCounter,
  parseDocument,
  type Document,
  type YAMLError,
} from 'yaml';
import { formatKeyPath } from './keyPath.js';
import { keyPathAt } from './keyPathAt.js';
import { openFlowCollections } from './openFlowCollections.js';
import { ProjectError, type ProjectIssue } from './projectError.js';

/** A project file is a few dozen lines; anything this big is not one. */
export const MAX_PROJECT_BYTES = 1 << 20;
/** Lines of a project file: a commented two-stage project is under 100; checked before parsing. */
export const MAX_PROJECT_LINES = 5000;
/** Mapping keys and list items in all; the richest project file has under 200. */
export const MAX_PROJECT_NODES = 5000;
/** Nesting of mappings and lists; the deepest key of the schema (tolerance.driver.high.min) is 4 deep. */
export const MAX_NESTING_DEPTH = 12;
/** Characters of one value or key; a quantity or a comment-free name is a few dozen. */
export const MAX_STRING_LENGTH = 1000;
/** Aliases a document may expand; small, to stop "billion laughs" alias bombs early. */
export const MAX_ALIAS_COUNT = 20;
/** Keys that would reach an object's prototype in JavaScript. */
const RESERVED_KEYS = new Set(['__proto__', 'constructor', 'prototype']);

/** A parsed YAML project file: the node tree for positions and the plain data. */
export interface YamlSource {
  file: string;
  doc: Document;
  lineCounter: LineCounter;
  /** The top-level mapping as plain JavaScript values. */
  data: Record<string, unknown>;
}

/**
 * Parse the text of a project file as one YAML 1.2 document holding a mapping, refusing what a
 * project file never needs and what could harm the reader: duplicate keys, keys that are not
 * plain names, the keys `__proto__`/`constructor`/`prototype`, `.inf`/`.nan`, unknown tags,
 * aliases without an anchor and alias expansion beyond MAX_ALIAS_COUNT. Every problem found is
 * reported with its line and key path in one ProjectError.
 *
 * Method: yaml `parseDocument` (strict, `uniqueKeys`) with a `LineCounter`; a walk over the node
 * tree for the checks above; `toJS({ maxAliasCount })` for the data.
 *
 * Syntax: readYamlDocument(text, file)
 * Example: readYamlDocument('pwm:\n  high: 3.3 V\n', 'p.yaml').data   // { pwm: { high: '3.3 V' } }
 */
export function readYamlDocument(text: string, file: string): YamlSource {
  const fileIssue = (message: string, line?: number, column?: number): ProjectError =>
    new ProjectError([{ file, path: '', message, ...(line !== undefined && { line, column }) }]);
  if (text.length > MAX_PROJECT_BYTES) {
    throw fileIssue(`the file holds ${text.length} characters; a project file is at most ${MAX_PROJECT_BYTES} bytes`);
  }
  // YAML 1.2 (5.4) counts a lone CR as a line break; the parser does not, so make it LF (same length,
  // offsets stay).
  if (text.includes('\r')) text = text.replace(/\r(?!\n)/g, '\n');
  // Before parsing: yaml's work grows with the size of the tree, and a real project is small.
  let lines = 1;
  for (let i = text.indexOf('\n'); i >= 0 && lines <= MAX_PROJECT_LINES; i = text.indexOf('\n', i + 1)) lines++;
  if (lines > MAX_PROJECT_LINES) {
    throw fileIssue(`the file has more than ${MAX_PROJECT_LINES} lines; a project file is a few dozen (is this the right file?)`, MAX_PROJECT_LINES + 1, 1);
  }

  const flow = openFlowCollections(text);
  if (flow.deepest > MAX_NESTING_DEPTH) {
    const { open } = openFlowCollections(text, deepestOpening(text));
    const at = open[open.length - 1] ?? 0;
    const line = text.slice(0, at).split('\n').length;
    throw fileIssue(`brackets nested more than ${MAX_NESTING_DEPTH} levels deep; a project file nests at most 4`, line, at - text.lastIndexOf('\n', at - 1));
  }

  const lineCounter = new LineCounter();
  // Duplicate keys are found by the walk below: yaml's own check compares every pair of keys.
  const doc = parseDocument(text, { lineCounter, uniqueKeys: false, prettyErrors: false, version: '1.2' });
  const issueAt = (offset: number, path: ReadonlyArray<string | number>, message: string): ProjectIssue => {
    const { line, col } = lineCounter.linePos(offset);
    return { file, path: formatKeyPath(path), line, column: col, message };
  };

  const syntax = [...doc.errors, ...doc.warnings].map((e) => {
    // Inside a flow collection left open, the parser notices at a later line: point at the opening.
    const open = openFlowCollections(text, e.pos[0]).open;
    const at = open.length > 0 && /flow (sequence|mapping|collection)/i.test(e.message) ? open[0] : e.pos[0];
    const path = keyPathAt(doc, at);
    const message = yamlMessage(e, text, path);
    return issueAt(at, path, at === e.pos[0] ? message : `${message} (this bracket is not closed)`);
  });
  if (syntax.length > 0) throw new ProjectError(syntax);

  const contents = doc.contents;
  if (contents === null || (isScalar(contents) && contents.value === null)) {
    throw fileIssue('the file is empty; a project needs at least a pwm section and a filter (or search) section', 1, 1);
  }
  if (!isMap(contents)) {
    const { line, col } = lineCounter.linePos(contents.range?.[0] ?? 0);
    const what = isSeq(contents) ? 'a list' : isAlias(contents) ? 'an alias' : `the single value '${String(contents)}'`;
    throw fileIssue(`a project file is a mapping of sections (pwm, load, filter, spec, search, tolerance), but this one holds ${what}`, line, col);
  }

  const issues: ProjectIssue[] = [];
  const aliases: Array<{ offset: number; path: Array<string | number> }> = [];
  let nodes = 0;
  const startOf = (node: unknown, fallback: number): number => (node as { range?: number[] } | null)?.range?.[0] ?? fallback;
  const walk = (node: unknown, path: Array<string | number>): void => {
    if ((isMap(node) || isSeq(node)) && path.length >= MAX_NESTING_DEPTH) {
      throw new ProjectError([issueAt(startOf(node, 0), path, `nested more than ${MAX_NESTING_DEPTH} levels deep; a project file nests at most 4`)]);
    }
    if (isMap(node)) {
      const seen = new Set<string>();
      for (const pair of node.items) {
        if (++nodes > MAX_PROJECT_NODES) {
          throw new ProjectError([issueAt(startOf(pair.key, 0), path, `more than ${MAX_PROJECT_NODES} keys and list items; a project file has a few dozen`)]);
        }
        const keyStart = startOf(pair.key, node.range?.[0] ?? 0);
        if (!isScalar(pair.key) || pair.key.value === null || typeof pair.key.value === 'object') {
          issues.push(issueAt(keyStart, path, 'a key must be a plain name, not a list, a mapping or nothing'));
          continue;
        }
        const name = String(pair.key.value);
        if (name.length > MAX_STRING_LENGTH) {
          issues.push(issueAt(keyStart, path, `a key of ${name.length} characters; a key is a short name`));
          continue;
        }
        if (RESERVED_KEYS.has(name)) {
          issues.push(issueAt(keyStart, [...path, name], `the key '${name}' is not allowed (a reserved name in JavaScript objects)`));
          continue;
        }
        if (seen.has(name)) {
          issues.push(issueAt(keyStart, [...path, name], `duplicate key '${printable(name)}'; a key may appear only once in a mapping`));
          continue;
        }
        seen.add(name);
        walk(pair.value, [...path, name]);
      }
    } else if (isSeq(node)) {
      node.items.forEach((item, index) => {
        if (++nodes > MAX_PROJECT_NODES) {
          throw new ProjectError([issueAt(startOf(item, 0), path, `more than ${MAX_PROJECT_NODES} keys and list items; a project file has a few dozen`)]);
        }
        walk(item, [...path, index]);
      });
    } else if (isScalar(node)) {
      if (typeof node.value === 'string' && node.value.length > MAX_STRING_LENGTH) {
        issues.push(issueAt(node.range?.[0] ?? 0, path, `a value of ${node.value.length} characters; a value is at most ${MAX_STRING_LENGTH}`));
      }
      if (typeof node.value === 'number' && !Number.isFinite(node.value)) {
        const written = node.source ?? String(node.value);
        issues.push(issueAt(node.range?.[0] ?? 0, path, `'${written}' is not a finite number; write a finite value`));
      }
    } else if (isAlias(node)) {
      const offset = node.range?.[0] ?? 0;
      if (!node.resolve(doc)) {
        issues.push(issueAt(offset, path, `the alias *${node.source} has no anchor &${node.source} before it`));
      } else {
        aliases.push({ offset, path });
      }
    }
  };
  walk(contents, []);
  if (issues.length > 0) throw new ProjectError(issues);

  let data: unknown;
  try {
    data = doc.toJS({ maxAliasCount: MAX_ALIAS_COUNT });
  } catch (error) {
    const first = aliases[0] ?? { offset: 0, path: [] };
    const excessive = /alias count/i.test((error as Error).message);
    throw new ProjectError([
      issueAt(
        first.offset,
        first.path,
        excessive
          ? `the aliases in this file expand too far (more than ${MAX_ALIAS_COUNT} copies, as in an alias bomb); write the values out`
          : `cannot read the file: ${(error as Error).message}`,
      ),
    ]);
  }
  return { file, doc, lineCounter, data: data as Record<string, unknown> };
}

/** Offset just past the opening bracket where flow nesting first exceeds MAX_NESTING_DEPTH. */
function deepestOpening(text: string): number {
  let lo = 0;
  let hi = text.length;
  // openFlowCollections(text, end).deepest grows with end: bisect for the first end past the limit.
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (openFlowCollections(text, mid).deepest > MAX_NESTING_DEPTH) hi = mid;
    else lo = mid + 1;
  }
  return lo;
}

/** A name as it can be printed on one line: control characters escaped, long names cut. */
export function printable(name: string): string {
  const escaped = JSON.stringify(name).slice(1, -1);
  return escaped.length > 60 ? `${escaped.slice(0, 57)}...` : escaped;
}

/** yaml's error, said for someone editing a project file. */
function yamlMessage(error: YAMLError, text: string, path: ReadonlyArray<string | number>): string {
  const at = text.slice(error.pos[0], error.pos[1]);
  switch (error.code) {
    case 'DUPLICATE_KEY': {
      const key = path.length > 0 ? String(path[path.length - 1]) : at;
      return `duplicate key '${printable(key)}'; a key may appear only once in a mapping`;
    }
    case 'MULTIPLE_DOCS':
      return "more than one YAML document (a second '---'); a project file holds one";
    case 'TAB_AS_INDENT':
      return 'a tab is used for indentation; YAML indents with spaces';
    case 'TAG_RESOLVE_FAILED':
      return `unknown tag ${at.split(/\s/)[0]}; write plain values without tags`;
    default:
      return `YAML syntax error: ${error.message.split('\n')[0]}`;
  }
}
