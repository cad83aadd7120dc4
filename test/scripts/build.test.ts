import { build } from 'esbuild';
import fc from 'fast-check';
import { mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import stringWidth from 'string-width';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { parse } from 'yaml';
import schema from '../../schemas/project.schema.json' with { type: 'json' };
import { lazyStringWidth, standaloneProjectValidator } from '../../scripts/build.mjs';
import { projectSchemaAjv } from '../../src/project/projectValidator.js';

const root = join(dirname(fileURLToPath(import.meta.url)), '..', '..');
type Validate = ((data: unknown) => boolean) & { errors?: unknown[] | null };

let work: string;
beforeAll(() => {
  work = mkdtempSync(join(tmpdir(), 'dacsmith-build-test-'));
});
afterAll(() => rmSync(work, { recursive: true, force: true }));

/** Every project document the repository holds: fixtures (those that are YAML at all) and samples. */
function repositoryDocuments(): Array<[string, unknown]> {
  const dirs = [join(root, 'test', 'fixtures', 'projects'), join(root, 'sample-configs')];
  const docs: Array<[string, unknown]> = [];
  for (const dir of dirs) {
    for (const name of readdirSync(dir).filter((n) => n.endsWith('.yaml'))) {
      try {
        docs.push([name, parse(readFileSync(join(dir, name), 'utf8'), { maxAliasCount: 100 })]);
      } catch {
        // not YAML (bad syntax, alias bomb, wrong encoding): the loader stops before the schema
      }
    }
  }
  return docs;
}

describe('build-time project-schema validator (scripts/build.mjs)', () => {
  // Reference: Ajv itself, compiling the schema at run time with the loader's own options
  // (the path the TypeScript sources take); standalone code must report exactly the same errors.
  let standalone: Validate;
  let compiled: Validate;
  beforeAll(async () => {
    const file = join(work, 'project-validator.mjs');
    writeFileSync(file, await standaloneProjectValidator());
    standalone = (await import(pathToFileURL(file).href)).default as Validate;
    compiled = projectSchemaAjv().compile(schema) as unknown as Validate;
  });

  const verdict = (validate: Validate, data: unknown) => ({ valid: validate(data), errors: validate.errors ?? null });

  it('agrees with run-time Ajv on every fixture and sample, errors and all', () => {
    const docs = repositoryDocuments();
    expect(docs.length).toBeGreaterThan(15);
    expect(docs.some(([, d]) => !compiled(d))).toBe(true); // the set holds invalid documents too
    for (const [name, data] of docs) {
      expect(verdict(standalone, data), name).toEqual(verdict(compiled, data));
    }
  });

  it('agrees with run-time Ajv on random project-shaped documents', () => {
    const value = fc.oneof(
      fc.string({ maxLength: 8 }),
      fc.constantFrom('3.3 V', '20 kHz', '4k7', '5 %', 'E24', 'edge', 'centre'),
      fc.integer({ min: -3, max: 40 }),
      fc.double({ noNaN: true }),
      fc.boolean(),
      fc.constant(null),
    );
    const keys = ['frequency', 'frequncy', 'clock', 'bits', 'high', 'low', 'driver', 'duty', 'alignment', 'r', 'c', 'min', 'max', 'stages', 'series'];
    const mapping = fc.dictionary(fc.constantFrom(...keys), fc.oneof(value, fc.dictionary(fc.constantFrom(...keys), value, { maxKeys: 3 })), { maxKeys: 5 });
    const document = fc.record(
      {
        version: fc.oneof(fc.constant(1), fc.constant(2)),
        pwm: mapping,
        load: mapping,
        filter: fc.oneof(fc.record({ stages: fc.array(mapping, { maxLength: 5 }) }), mapping),
        spec: mapping,
        search: mapping,
        tolerance: mapping,
        extra: value,
      },
      { requiredKeys: [] },
    );
    fc.assert(
      fc.property(document, (data) => {
        expect(verdict(standalone, data)).toEqual(verdict(compiled, data));
      }),
      { numRuns: 300 },
    );
  });
});

describe('terminal width front for yargs (scripts/build.mjs lazyStringWidth)', () => {
  // Reference: npm string-width (the hoisted copy), the library the front stands in for.
  let front: (text: string, options?: object) => number;
  beforeAll(async () => {
    const bundled = await build({
      stdin: { contents: "export { default } from 'string-width';", resolveDir: root, loader: 'js' },
      bundle: true,
      format: 'esm',
      platform: 'node',
      write: false,
      logLevel: 'silent',
      plugins: [lazyStringWidth()],
    });
    const file = join(work, 'string-width-front.mjs');
    writeFileSync(file, bundled.outputFiles[0].text);
    front = (await import(pathToFileURL(file).href)).default;
  });

  it('measures printable ASCII as string-width does', () => {
    fc.assert(fc.property(fc.string({ maxLength: 80 }), (text) => front(text) === stringWidth(text)));
  });

  it('hands everything else to string-width: wide, combining, emoji, ANSI colours', () => {
    const samples = ['µF Ω', '漢字', 'e\u0301', '👍🏽', '\u001b[31mred\u001b[39m', 'tab\there', ''];
    for (const s of samples) expect(front(s), JSON.stringify(s)).toBe(stringWidth(s));
    fc.assert(fc.property(fc.string({ unit: 'grapheme', maxLength: 20 }), (text) => front(text) === stringWidth(text)));
    expect(front('\u001b[1mbold\u001b[22m', { countAnsiEscapeCodes: true })).toBe(stringWidth('\u001b[1mbold\u001b[22m', { countAnsiEscapeCodes: true }));
  });
});
