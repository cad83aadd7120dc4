import type { Argv, CommandModule } from 'yargs';
import type { CommandOutput } from './analyze.js';
import { describeError, EXIT_BAD_INPUT, EXIT_PASS, EXIT_SPEC_FAILS, UsageError } from './errors.js';
import { reportWidth, terminalColumns, widthOption } from './width.js';
import type { CheckedFile, CheckFormat } from '../report/check.js';
import type { ProjectIssue } from '../project/index.js';

export interface CheckArgs {
  files: string[];
  format: CheckFormat;
  quiet: boolean;
  /** Warnings count as failures (exit 1). */
  strict?: boolean;
  width?: number;
  /** Also write a JUnit XML report to this file. */
  junit?: string;
}

/** Exit code of a set of results: 2 when any file is invalid, else 1 when any spec fails, else 0. */
export function checkExitCode(files: CheckedFile[]): number {
  if (files.some((f) => f.error !== undefined)) return EXIT_BAD_INPUT;
  return files.every((f) => f.pass) ? EXIT_PASS : EXIT_SPEC_FAILS;
}

/**
 * Run `check`: load and analyse every file, keep going past invalid ones, render one line (or
 * row) per file. Messages about invalid files go to standard error in every format. Warnings
 * never change the exit code, except with `strict`, where a file with a warning fails (exit 1).
 *
 * Syntax: runCheck(args, { color })
 * Example: await runCheck({ files: ['a.yaml', 'b.yaml'], format: 'text', quiet: false }, { color: false })
 */
export async function runCheck(args: CheckArgs, tty: { color: boolean; columns?: number }): Promise<CommandOutput> {
  // yargs hands a lone '-' over as ''. A gate that checked nothing must not pass.
  if (args.files.length === 0 || args.files.some((f) => f === '' || f === '-')) {
    throw new UsageError("check reads project files by name, not standard input ('-'); name at least one file (a check of no file does not pass)");
  }
  const width = reportWidth(args.width, { isTTY: tty.columns !== undefined, columns: tty.columns });
  const [{ loadProject, requireFilter, keyPositions, ProjectError }, { analyzeProject }, { renderCheck }, { checkKey }] = await Promise.all([
    import('../project/index.js'),
    import('../engine/index.js'),
    import('../report/check.js'),
    import('../report/checkKey.js'),
  ]);
  // Annotations and JUnit cases point at the line of each limit: read the positions only for them.
  const wantPositions = args.format === 'github' || args.junit !== undefined;
  const strict = args.strict ?? false;
  const results: CheckedFile[] = await mapInOrder(args.files, async (file) => {
    try {
      const loaded = loadProject(file);
      if (loaded.filter.stages.length === 0 && !loaded.network) {
        // A design-only file has no filter to hold to a spec: listed, never passing on its own.
        return { file, pass: true, checks: [], warnings: [], lsb: null, skipped: "design-only: a search and no filter; 'dacsmith design' reads it" };
      }
      const project = requireFilter(loaded, 'check');
      const analysis = analyzeProject(project);
      const pass = analysis.pass && !(strict && analysis.warnings.length > 0);
      const keys = [...analysis.checks.map((c) => checkKey(c.name)), ...analysis.warnings.map((w) => w.key)];
      const positions = wantPositions ? { positions: keyPositions(file, keys) } : {};
      return { file, pass, checks: analysis.checks, warnings: analysis.warnings, lsb: analysis.lsb, ...positions };
    } catch (error) {
      const { code, message } = describeError(error);
      if (code !== EXIT_BAD_INPUT) throw error; // a bug, not a bad file: do not hide it
      const problems = error instanceof ProjectError ? { problems: error.issues } : await inputProblem(error, file);
      return { file, pass: false, checks: [], warnings: [], lsb: null, error: message, ...problems };
    }
  });
  if (results.every((r) => r.skipped !== undefined)) {
    throw new UsageError(`every file given is design-only (a search and no filter): nothing to check; run 'dacsmith design' on ${results.length > 1 ? 'them' : 'it'}`);
  }
  const stderr = results.flatMap((r) => (r.error !== undefined ? [`${r.error}\n`] : [])).join('');
  const stdout = args.quiet ? '' : renderCheck(results, args.format, { color: tty.color, strict, width });
  if (args.junit !== undefined) {
    const [{ writeOutputFile }, { junitReport }] = await Promise.all([import('./writeOutputFile.js'), import('../report/junit.js')]);
    // A CI report is rewritten at every run; the project files themselves are never written over.
    writeOutputFile(args.junit, junitReport(results, { strict }), { force: true, inputs: args.files, option: '--junit' });
  }
  return { stdout, stderr, code: checkExitCode(results) };
}

/** One after the other, in order (each file's positions are read right after its analysis). */
async function mapInOrder<T, U>(items: readonly T[], f: (item: T) => Promise<U>): Promise<U[]> {
  const out: U[] = [];
  for (const item of items) out.push(await f(item));
  return out;
}

/** An input error found after loading (design space, numerical domain) as one problem, with the line of its key when found. */
async function inputProblem(error: unknown, file: string): Promise<{ problems?: ProjectIssue[] }> {
  const { InputError } = await import('../units/index.js');
  if (!(error instanceof InputError) || error.key === undefined) return {};
  const { positionOfKey } = await import('../project/index.js');
  const at = positionOfKey(error.file ?? file, error.key);
  return { problems: [{ file: error.file ?? file, path: error.key, message: error.detail, ...(at && { line: at.line, column: at.column }) }] };
}

/**
 * The `check` command for yargs: every project file against its own spec, for CI.
 *
 * Syntax: checkCommand(run, color)
 * Example: yargs(argv).command(checkCommand(run, color))
 */
export function checkCommand(
  run: (work: () => Promise<CommandOutput>) => Promise<void>,
  color: () => boolean,
): CommandModule<object, CheckArgs> {
  return {
    command: 'check <files..>',
    describe: 'Check project files against their spec, one line per file (for CI)',
    builder: (y: Argv) =>
      widthOption(y)
        .positional('files', { describe: 'Project files (YAML)', type: 'string', array: true, demandOption: true })
        .option('format', {
          describe: 'Output format',
          choices: ['text', 'json', 'markdown', 'github'] as const,
          default: 'text' as const,
        })
        .option('junit', { describe: 'Also write a JUnit XML report to this file (one test suite per file, one test case per check)', type: 'string', requiresArg: true })
        .option('quiet', { alias: 'q', describe: 'Print nothing but errors; the exit code tells', type: 'boolean', default: false })
        .option('strict', {
          describe: 'Treat plausibility warnings (a part value or span that is probably a typing slip) as failures: exit 1',
          type: 'boolean',
          default: false,
        })
        .example('$0 check dacsmith.yaml', 'PASS or FAIL with the failing specs, exit code 0 or 1')
        .example('$0 check boards/*.yaml --quiet', 'Only the exit code (and errors), for scripts')
        .example('$0 check boards/*.yaml --strict', 'Also fail (exit 1) on a warning, e.g. a load typed as 1m (milliohm)')
        .example('$0 check boards/*.yaml --format markdown >> "$GITHUB_STEP_SUMMARY"', 'A table for a CI job summary')
        .example('$0 check boards/*.yaml --format github --junit dacsmith-junit.xml', 'GitHub annotations on the line of each failing limit, and a JUnit report')
        .epilogue(
          'Exit codes: 0 every file passes, 1 a spec fails (with --strict: or a file has a warning), 2 a file is invalid (the others are still checked). ' +
            'Without --strict a warning is printed but never changes the exit code.',
        ) as unknown as Argv<CheckArgs>,
    handler: (args) => run(() => runCheck(args, { color: args.format === 'text' && color(), ...terminalColumns() })),
  };
}
