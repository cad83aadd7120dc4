import type { ErrorObject } from 'ajv/dist/2020.js';
import schema from '../../schemas/project.schema.json' with { type: 'json' };
import { closestName } from './closestName.js';
import { formatKeyPath } from './keyPath.js';
import type { IssueDraft } from './projectError.js';
import { projectValidator } from './projectValidator.js';

export { AJV_OPTIONS } from './projectValidator.js';

/** The part of a JSON Schema node these messages read. */
interface SchemaNode {
  description?: string;
  type?: string | string[];
  enum?: unknown[];
  const?: unknown;
  examples?: unknown[];
  properties?: Record<string, SchemaNode>;
  items?: SchemaNode;
  'x-unit'?: string;
}

let homes: Map<string, string[]> | undefined;

/**
 * Check raw project data against `schemas/project.schema.json` (JSON Schema 2020-12, ajv in
 * strict mode, all errors) and say what is wrong in an engineer's words: unknown keys with a
 * "did you mean", missing keys with what they are, wrong kinds of value with an example.
 *
 * Syntax: validateSchema(data)
 * Example: validateSchema({ pwm: { high: '3.3 V', frequncy: '20 kHz' } })
 *          // [{ path: ['pwm', 'frequncy'], at: 'key', message: "unknown key 'frequncy'; did you mean 'frequency'?" }]
 */
export function validateSchema(data: unknown): IssueDraft[] {
  const validate = projectValidator();
  if (validate(data)) return [];
  const drafts = (validate.errors ?? []).map((error) => describe(error, data));
  const seen = new Set<string>();
  return drafts.filter((d) => {
    const key = `${formatKeyPath(d.path)}\u0000${d.message}`;
    if (seen.has(key)) return false;
    seen.add(key);
    return true;
  });
}

function describe(error: ErrorObject, root: unknown): IssueDraft {
  const path = pointerToPath(error.instancePath, root);
  const parent = (error.parentSchema ?? {}) as SchemaNode;
  const params = error.params as Record<string, unknown>;
  switch (error.keyword) {
    case 'additionalProperties': {
      const key = String(params.additionalProperty);
      return { path: [...path, key], at: 'key', message: unknownKey(key, Object.keys(parent.properties ?? {}), path) };
    }
    case 'required': {
      const key = String(params.missingProperty);
      const property = parent.properties?.[key];
      return { path: [...path, key], at: 'key', message: `missing${property ? `; ${whatItIs(property)}` : ''}` };
    }
    case 'dependentRequired': {
      const key = String(params.property);
      const other = String(params.missingProperty);
      return { path: [...path, key], at: 'key', message: `'${key}' needs '${other}' as well; give both or neither` };
    }
    case 'type':
      return { path, message: `expected ${kindOf(parent)}, got ${valueText(error.data)}` };
    case 'enum': {
      const choices = (parent.enum ?? []).map(String);
      const guess = typeof error.data === 'string' ? closestName(error.data, choices) : undefined;
      return {
        path,
        message: `expected one of ${choices.join(', ')}, got ${valueText(error.data)}${guess ? `; did you mean '${guess}'?` : ''}`,
      };
    }
    case 'const':
      return { path, message: `expected ${JSON.stringify(parent.const)}, got ${valueText(error.data)}${path.join() === 'version' ? ' (this dacsmith reads version 1 project files)' : ''}` };
    case 'minimum':
    case 'exclusiveMinimum':
      return { path, message: `must be ${error.keyword === 'minimum' ? 'at least' : 'more than'} ${params.limit}, got ${valueText(error.data)}` };
    case 'maximum':
    case 'exclusiveMaximum':
      return { path, message: `must be ${error.keyword === 'maximum' ? 'at most' : 'less than'} ${params.limit}, got ${valueText(error.data)}` };
    case 'minItems':
    case 'maxItems': {
      const count = Array.isArray(error.data) ? error.data.length : 0;
      const limit = Number(params.limit);
      const entries = (n: number) => `${n} ${n === 1 ? 'entry' : 'entries'}`;
      return {
        path,
        message: `needs ${error.keyword === 'minItems' ? 'at least' : 'at most'} ${entries(limit)}, got ${entries(count)}`,
      };
    }
    case 'uniqueItems': {
      const list = Array.isArray(error.data) ? error.data : [];
      return { path, message: `lists ${valueText(list[Number(params.i)])} twice` };
    }
    default:
      return { path, message: error.message ?? `does not match the schema (${error.keyword})` };
  }
}

/** JSON pointer `/filter/stages/1/c` -> ['filter', 'stages', 1, 'c'], indexes as numbers. */
function pointerToPath(pointer: string, root: unknown): Array<string | number> {
  if (pointer === '') return [];
  const path: Array<string | number> = [];
  let node = root;
  for (const raw of pointer.slice(1).split('/')) {
    const segment = raw.replace(/~1/g, '/').replace(/~0/g, '~');
    if (Array.isArray(node)) {
      path.push(Number(segment));
      node = node[Number(segment)];
    } else {
      path.push(segment);
      node = node && typeof node === 'object' ? (node as Record<string, unknown>)[segment] : undefined;
    }
  }
  return path;
}

function unknownKey(key: string, allowed: string[], parent: ReadonlyArray<string | number>): string {
  const guess = closestName(key, allowed);
  if (guess) return `unknown key '${key}'; did you mean '${guess}'?`;
  const here = formatKeyPath(parent.map((s) => (typeof s === 'number' ? 0 : s)));
  const elsewhere = (keyHomes().get(key) ?? []).filter((home) => home !== here);
  if (elsewhere.length > 0) return `unknown key '${key}' here; '${key}' belongs under ${elsewhere.join(' or ')}`;
  return `unknown key '${key}'; expected one of: ${allowed.join(', ')}`;
}

/** Where each key name of the schema may appear, as key paths of its mapping (lists as [0]). */
function keyHomes(): Map<string, string[]> {
  if (homes) return homes;
  const found = new Map<string, string[]>();
  const visit = (node: SchemaNode, path: Array<string | number>): void => {
    for (const [name, child] of Object.entries(node.properties ?? {})) {
      const list = found.get(name) ?? [];
      const home = formatKeyPath(path) || 'the top level';
      if (!list.includes(home)) list.push(home);
      found.set(name, list);
      visit(child, [...path, name]);
    }
    if (node.items) visit(node.items, [...path, 0]);
  };
  visit(schema as SchemaNode, []);
  homes = found;
  return found;
}

/** "the pin's high level (V), e.g. '3.3 V'" from a schema node. */
function whatItIs(node: SchemaNode): string {
  const description = (node.description ?? '').split(/(?<=\.)\s/)[0].replace(/\.$/, '');
  const first = description ? description[0].toLowerCase() + description.slice(1) : '';
  const example = node.examples?.[0];
  return `${first}${example !== undefined ? `, e.g. ${exampleText(example)}` : ''}`;
}

/** What kind of value a schema node wants, with an example. */
function kindOf(node: SchemaNode): string {
  const types = Array.isArray(node.type) ? node.type : node.type ? [node.type] : [];
  const words: string[] = [];
  const scalarExample = node.examples?.find((e) => typeof e !== 'object');
  if (types.includes('string') || types.includes('number')) {
    const unit = node['x-unit'];
    const level = node.examples?.some((e) => typeof e === 'string' && /LSB/.test(e));
    const what = level
      ? 'a level in V, mV, LSB or % of full scale'
      : unit === '1' ? 'a fraction or percentage' : unit ? `a quantity in ${unit}` : 'a value';
    words.push(scalarExample !== undefined ? `${what} such as ${exampleText(scalarExample)}` : what);
  }
  if (types.includes('integer')) words.push('a whole number');
  if (types.includes('boolean')) words.push('true or false');
  if (types.includes('array')) words.push('a list');
  if (types.includes('object')) {
    const keys = Object.keys(node.properties ?? {});
    words.push(keys.length > 0 ? `a mapping with keys ${keys.join(', ')}` : 'a mapping');
  }
  return words.length > 0 ? words.join(', or ') : 'another kind of value';
}

function exampleText(example: unknown): string {
  if (typeof example === 'string') return `'${example}'`;
  if (example && typeof example === 'object' && !Array.isArray(example)) {
    const inner = Object.entries(example).map(([k, v]) => `${k}: ${typeof v === 'object' ? JSON.stringify(v) : v}`);
    return `{ ${inner.join(', ')} }`;
  }
  return JSON.stringify(example);
}

function valueText(value: unknown): string {
  if (value === null || value === undefined) return 'nothing (an empty value)';
  if (Array.isArray(value)) return 'a list';
  if (typeof value === 'object') return 'a mapping';
  if (typeof value === 'string') return `'${value}'`;
  return String(value);
}
