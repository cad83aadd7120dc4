import type { Argv, CommandModule } from 'yargs';
import type { CommandOutput } from './analyze.js';
import { EXIT_PASS, UsageError } from './errors.js';

export interface InitArgs {
  /** '-' for standard output. */
  file: string;
  stages: number;
  search: boolean;
  bits: number;
  frequency: string;
  force: boolean;
  quiet: boolean;
}

const SCHEMA_IN_PACKAGE = 'schemas/project.schema.json';

/**
 * Where the editor finds the schema, seen from the directory of the new file: the schema shipped
 * with this installation of dacsmith (found by walking up from this module to the package root),
 * as a relative path with forward slashes.
 */
async function schemaReference(targetDir: string): Promise<string> {
  const [{ existsSync, readFileSync }, path, { fileURLToPath }] = await Promise.all([
    import('node:fs'),
    import('node:path'),
    import('node:url'),
  ]);
  let dir = path.dirname(fileURLToPath(import.meta.url));
  for (;;) {
    const pkg = path.join(dir, 'package.json');
    if (existsSync(pkg) && existsSync(path.join(dir, SCHEMA_IN_PACKAGE))) {
      const name = (JSON.parse(readFileSync(pkg, 'utf8')) as { name?: string }).name;
      if (name === 'dacsmith') {
        const rel = path.relative(path.resolve(targetDir), path.join(dir, SCHEMA_IN_PACKAGE));
        return rel.split(path.sep).join('/');
      }
    }
    const up = path.dirname(dir);
    if (up === dir) return `node_modules/dacsmith/${SCHEMA_IN_PACKAGE}`; // not found: the usual install place
    dir = up;
  }
}

/**
 * Run `init`: write a commented starter project that `check` passes, never over an existing file
 * unless `force`; `-` writes it to standard output.
 *
 * Syntax: runInit(args)
 * Example: await runInit({ file: '-', stages: 2, search: false, bits: 10, frequency: '20 kHz', force: false, quiet: false })
 */
export async function runInit(args: InitArgs): Promise<CommandOutput> {
  const [{ starterProject }, { parseQuantity }, path, { writeOutputFile }] = await Promise.all([
    import('../project/starter.js'),
    import('../units/index.js'),
    import('node:path'),
    import('./writeOutputFile.js'),
  ]);
  if (args.stages !== 1 && args.stages !== 2) throw new UsageError(`--stages ${args.stages}: choose 1 or 2`);
  if (!Number.isInteger(args.bits) || args.bits < 4 || args.bits > 16) {
    throw new UsageError(`--bits ${args.bits}: a whole number from 4 to 16`);
  }
  let frequency: number;
  try {
    frequency = parseQuantity(args.frequency, 'frequency', { sign: 'positive' });
  } catch (error) {
    throw new UsageError(`--frequency: ${(error as Error).message}`);
  }

  const toStdout = args.file === '-';
  const text = starterProject({
    stages: args.stages,
    bits: args.bits,
    frequency,
    search: args.search,
    schema: await schemaReference(toStdout ? '.' : path.dirname(args.file)),
    name: toStdout ? 'dacsmith.yaml' : path.basename(args.file),
  });
  if (toStdout) return { stdout: text, stderr: '', code: EXIT_PASS };

  writeOutputFile(args.file, text, { force: args.force, option: 'init' });
  const note = `wrote ${args.file} (${args.stages} stage${args.stages > 1 ? 's' : ''}, ${args.bits} bits); next: dacsmith check ${args.file}\n`;
  return { stdout: '', stderr: args.quiet ? '' : note, code: EXIT_PASS };
}

/**
 * The `init` command for yargs: a starter project file with editor support (schema modeline).
 *
 * Syntax: initCommand(run)
 * Example: yargs(argv).command(initCommand(run))
 */
export function initCommand(run: (work: () => Promise<CommandOutput>) => Promise<void>): CommandModule<object, InitArgs> {
  return {
    command: 'init [file]',
    describe: 'Write a commented starter project file that passes its own spec',
    builder: (y: Argv) =>
      y
        .positional('file', { describe: "File to write ('-' for standard output) [default: dacsmith.yaml]", type: 'string' })
        .option('stages', { describe: 'RC stages in the starter filter', choices: [1, 2], type: 'number', default: 2 })
        .option('bits', { describe: 'PWM resolution, bits (4 to 16)', type: 'number', default: 10, requiresArg: true })
        .option('frequency', { describe: 'PWM frequency', type: 'string', default: '20 kHz', requiresArg: true })
        .option('search', { describe: 'Add a design-search block (parts range, series, pin current)', type: 'boolean', default: false })
        .option('force', { describe: 'Overwrite an existing file', type: 'boolean', default: false })
        .option('quiet', { alias: 'q', describe: 'Print nothing but errors', type: 'boolean', default: false })
        .example('$0 init', 'Write dacsmith.yaml: 2 stages, 10 bits, 20 kHz')
        .example('$0 init board.yaml --stages 1 --bits 8 --frequency 62.5kHz --search', 'Sized for another PWM, with a search block')
        .example('$0 init - > board.yaml', 'To standard output') as unknown as Argv<InitArgs>,
    // yargs hands a lone '-' positional over as '' (and no default applies then): map it back.
    handler: (args) => run(() => runInit({ ...args, file: args.file === '' ? '-' : (args.file ?? 'dacsmith.yaml') })),
  };
}
