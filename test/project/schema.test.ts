import ajv2020Module from 'ajv/dist/2020.js';
import { describe, expect, it } from 'vitest';
import schema from '../../schemas/project.schema.json' with { type: 'json' };
import { AJV_OPTIONS, validateSchema } from '../../src/project/validateSchema.js';

const Ajv2020 = ((ajv2020Module as unknown as { default?: unknown }).default ?? ajv2020Module) as typeof ajv2020Module.default;

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
  it('is valid JSON Schema 2020-12 and passes Ajv strict mode (what the loader skips at run time)', () => {
    // Reference: the JSON Schema 2020-12 meta-schema, as bundled with Ajv.
    expect(schema.$schema).toBe('https://json-schema.org/draft/2020-12/schema');
    const ajv = new Ajv2020({ ...AJV_OPTIONS, validateSchema: true, code: { optimize: true } });
    ajv.addKeyword({ keyword: 'x-unit', schemaType: 'string' });
    expect(ajv.validateSchema(schema)).toBe(true);
    expect(ajv.errors ?? null).toBeNull();
    expect(() => ajv.compile(schema)).not.toThrow();
    // A broken copy must be caught by the same check, or the check proves nothing.
    const broken = { ...schema, properties: { ...schema.properties, version: { type: 'integr' } } };
    expect(ajv.validateSchema(broken)).toBe(false);
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
