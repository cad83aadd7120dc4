import ajv2020Module, { type CodeOptions, type ValidateFunction } from 'ajv/dist/2020.js';
import schema from '../../schemas/project.schema.json' with { type: 'json' };

// ajv is CommonJS: its class is the module itself under Node, `.default` under some bundlers.
const Ajv2020 = ((ajv2020Module as unknown as { default?: unknown }).default ?? ajv2020Module) as typeof ajv2020Module.default;

/**
 * Ajv options for the project schema. Strict mode, every error, the failing schema node in each
 * error (`verbose`, for messages). The schema is a fixed file whose validity against the 2020-12
 * meta-schema is checked by the tests, so the run-time meta-validation and code optimisation
 * passes are skipped: they cost more than half of the compile time on every CLI start.
 */
export const AJV_OPTIONS = {
  strict: true,
  allErrors: true,
  verbose: true,
  allowUnionTypes: true,
  validateSchema: false,
  code: { optimize: false },
} as const;

/**
 * The ajv instance that compiles the project schema: AJV_OPTIONS plus the `x-unit` annotation
 * keyword. `code` adds code-generation options; scripts/build.mjs passes `{ source: true, esm:
 * true }` to emit the same validator as a standalone module at build time, so that the bundled
 * CLI neither loads ajv nor compiles the schema at start-up.
 *
 * Syntax: projectSchemaAjv([code])
 * Example: projectSchemaAjv({ source: true, esm: true }).compile(schema)
 */
export function projectSchemaAjv(code: CodeOptions = {}): InstanceType<typeof Ajv2020> {
  const ajv = new Ajv2020({ ...AJV_OPTIONS, code: { ...AJV_OPTIONS.code, ...code } });
  // Annotation only: the SI unit of a key, for people and editors.
  ajv.addKeyword({ keyword: 'x-unit', schemaType: 'string' });
  return ajv;
}

let validator: ValidateFunction | undefined;

/**
 * The compiled validator of schemas/project.schema.json, built on first use (ajv compiles to
 * code: slow once, fast after). The bundle replaces this module with the build-time standalone
 * code of the same validator (scripts/build.mjs), keeping this signature.
 *
 * Syntax: projectValidator()
 * Example: projectValidator()({ pwm: { high: '3.3 V' } })   // false; .errors lists what is wrong
 */
export function projectValidator(): ValidateFunction {
  validator ??= projectSchemaAjv().compile(schema);
  return validator;
}
