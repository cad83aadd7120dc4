import { describe, expect, it } from 'vitest';
import schema from '../../schemas/project.schema.json' with { type: 'json' };
import { validateSchema } from '../../src/project/validateSchema.js';

type Node = Record<string, unknown>;

/** Every object schema in the tree, with its key path. */
function objectSchemas(node: Node, path: string, out: Array<{ path: string; node: Node }> = []) {
  const types = Array.isArray(node.type) ? node.type : [node.type];
  if (types.includes('object')) out.push({ path: path || '(top)', node });
  for (const [name, child] of Object.entries((node.properties ?? {}) as Record<string, Node>)) {
    objectSchemas(child, path ? `${path}.${name}` : name, out);
  }
  if (node.items) objectSchemas(node.items as Node, `${path}[]`, out);
  return out;
}

describe('schemas/project.schema.json', () => {
  it('is JSON Schema 2020-12', () => {
    expect(schema.$schema).toBe('https://json-schema.org/draft/2020-12/schema');
  });

  it('closes every mapping with additionalProperties: false', () => {
    const open = objectSchemas(schema as Node, '').filter((o) => o.node.additionalProperties !== false);
    expect(open.map((o) => o.path)).toEqual([]);
  });

  it('accepts the keys of model.md and refuses a misspelt one', () => {
    expect(validateSchema({ pwm: { frequency: '19.5 kHz', high: '3.3 V' }, filter: { stages: [{ r: '4.7k', c: '100n' }] } })).toEqual([]);
    // An editor's `$schema` key is allowed and ignored.
    expect(validateSchema({ $schema: '../schemas/project.schema.json', pwm: { frequency: 20e3, high: 3.3 } })).toEqual([]);
    expect(validateSchema({ pwm: { high: '3.3 V', frequncy: '20 kHz' } })).toEqual([
      { path: ['pwm', 'frequncy'], at: 'key', message: "unknown key 'frequncy'; did you mean 'frequency'?" },
    ]);
  });
});
