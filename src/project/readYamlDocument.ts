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
import { ProjectError, type ProjectIssue } from './projectError.js';

/** A project file is a few dozen lines; anything this big is not one. */
export const MAX_PROJECT_BYTES = 1 << 20;
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

  const lineCounter = new LineCounter();
  const doc = parseDocument(text, { lineCounter, uniqueKeys: true, prettyErrors: false, version: '1.2' });
  const issueAt = (offset: number, path: ReadonlyArray<string | number>, message: string): ProjectIssue => {
    const { line, col } = lineCounter.linePos(offset);
    return { file, path: formatKeyPath(path), line, column: col, message };
  };

  const syntax = [...doc.errors, ...doc.warnings].map((e) => {
    const path = keyPathAt(doc, e.pos[0]);
    return issueAt(e.pos[0], path, yamlMessage(e, text, path));
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
  const walk = (node: unknown, path: Array<string | number>): void => {
    if (isMap(node)) {
      for (const pair of node.items) {
        const keyStart = (pair.key as { range?: number[] } | null)?.range?.[0] ?? node.range?.[0] ?? 0;
        if (!isScalar(pair.key) || pair.key.value === null || typeof pair.key.value === 'object') {
          issues.push(issueAt(keyStart, path, 'a key must be a plain name, not a list, a mapping or nothing'));
          continue;
        }
        const name = String(pair.key.value);
        if (RESERVED_KEYS.has(name)) {
          issues.push(issueAt(keyStart, [...path, name], `the key '${name}' is not allowed (a reserved name in JavaScript objects)`));
          continue;
        }
        walk(pair.value, [...path, name]);
      }
    } else if (isSeq(node)) {
      node.items.forEach((item, index) => walk(item, [...path, index]));
    } else if (isScalar(node)) {
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

/** yaml's error, said for someone editing a project file. */
function yamlMessage(error: YAMLError, text: string, path: ReadonlyArray<string | number>): string {
  const at = text.slice(error.pos[0], error.pos[1]);
  switch (error.code) {
    case 'DUPLICATE_KEY': {
      const key = path.length > 0 ? String(path[path.length - 1]) : at;
      return `duplicate key '${key}'; a key may appear only once in a mapping`;
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
