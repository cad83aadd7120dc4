/**
 * Editors show a key's `description`, its `examples` and (our extension) its unit `x-unit` while
 * one types a project file (yaml-language-server reads JSON Schema; its hover and completion use
 * `description` and `examples`, from memory of its documentation). This walks every key of
 * schemas/project.schema.json and fails on any key without them.
 */
import { readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { Ajv2020 } from 'ajv/dist/2020.js';
import { describe, expect, it } from 'vitest';

const root = join(dirname(fileURLToPath(import.meta.url)), '..', '..');
const schema = JSON.parse(readFileSync(join(root, 'schemas', 'project.schema.json'), 'utf8')) as Node;

type Node = { [key: string]: unknown };

const isNode = (x: unknown): x is Node => typeof x === 'object' && x !== null && !Array.isArray(x);

/** Every property schema (a key a user can write), with its path ('pwm.driver.high', 'filter.stages[].r'). */
function keysOf(node: Node, path: string, out: Array<{ path: string; node: Node }> = []) {
  if (isNode(node.properties)) {
    for (const [name, child] of Object.entries(node.properties)) {
      if (!isNode(child)) continue;
      const p = path ? `${path}.${name}` : name;
      out.push({ path: p, node: child });
      keysOf(child, p, out);
    }
  }
  if (isNode(node.items)) keysOf(node.items, `${path}[]`, out);
  for (const word of ['oneOf', 'anyOf', 'allOf', 'prefixItems']) {
    const list = node[word];
    if (Array.isArray(list)) list.filter(isNode).forEach((s) => keysOf(s, path, out));
  }
  for (const word of ['$defs', 'patternProperties']) {
    const map = node[word];
    if (isNode(map)) Object.values(map).filter(isNode).forEach((s) => keysOf(s, path, out));
  }
  if (isNode(node.additionalProperties)) keysOf(node.additionalProperties, `${path}.*`, out);
  return out;
}

const keys = keysOf(schema, '');
const types = (n: Node): string[] => (Array.isArray(n.type) ? (n.type as string[]) : typeof n.type === 'string' ? [n.type] : []);
/** A quantity: written as a string with a unit or as a plain number in SI units (design notes). */
const isQuantity = (n: Node) => types(n).includes('string') && types(n).includes('number');

describe('project schema documents every key for editors', () => {
  it('finds the keys of the design notes (the walk reaches nested and array keys)', () => {
    // Keys named in the project-file section of the design notes (model.md, version 1 and 1.1).
    const paths = keys.map((k) => k.path);
    for (const p of ['pwm.frequency', 'pwm.driver.high', 'pwm.duty.min', 'load.resistance', 'filter.stages[].r', 'spec.settling.band', 'search.pin_current', 'tolerance.capacitor', 'second_pwm.role', 'second_pwm.into.stage', 'second_pwm.driver.high', 'filter.stages[].active', 'filter.stages[].c2']) {
      expect(paths).toContain(p);
    }
  });

  it('gives every key a description', () => {
    const missing = keys.filter((k) => typeof k.node.description !== 'string' || k.node.description.trim() === '').map((k) => k.path);
    expect(missing).toEqual([]);
  });

  it('gives every key at least one example', () => {
    const missing = keys.filter((k) => !Array.isArray(k.node.examples) || k.node.examples.length === 0).map((k) => k.path);
    expect(missing).toEqual([]);
  });

  it('gives every quantity key its SI unit (x-unit)', () => {
    const missing = keys.filter((k) => isQuantity(k.node) && !(typeof k.node['x-unit'] === 'string' && k.node['x-unit'] !== '')).map((k) => k.path);
    expect(missing).toEqual([]);
  });

  it('has examples that its own schema accepts (checked by Ajv, a JSON Schema 2020-12 validator)', () => {
    // Ajv compiles each key's schema on its own; an example the schema refuses would teach users a
    // wrong form. The root schema is compiled too, which checks it against the 2020-12 meta-schema.
    const ajv = new Ajv2020({ strict: false, allErrors: true });
    ajv.compile(schema);
    const refused: string[] = [];
    for (const { path, node } of keys) {
      if (!Array.isArray(node.examples)) continue;
      const validate = ajv.compile(node);
      node.examples.forEach((example, i) => {
        if (!validate(example)) refused.push(`${path} examples[${i}] ${JSON.stringify(example)}: ${ajv.errorsText(validate.errors)}`);
      });
    }
    expect(refused).toEqual([]);
  });
});
