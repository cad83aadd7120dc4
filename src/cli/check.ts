import type { Argv, CommandModule } from 'yargs';
import type { CommandOutput } from './analyze.js';
import { describeError, EXIT_BAD_INPUT, EXIT_PASS, EXIT_SPEC_FAILS } from './errors.js';
import { reportWidth, terminalColumns, widthOption } from './width.js';
import type { CheckedFile, CheckFormat } from '../report/check.js';

export interface CheckArgs {
  files: string[];
  format: CheckFormat;
  quiet: boolean;
  width?: number;
}

/** Exit code of a set of results: 2 when any file is invalid, else 1 when any spec fails, else 0. */
export function checkExitCode(files: CheckedFile[]): number {
  if (files.some((f) => f.error !== undefined)) return EXIT_BAD_INPUT;
  return files.every((f) => f.pass) ? EXIT_PASS : EXIT_SPEC_FAILS;
}

/**
 * Run `check`: load and analyse every file, keep going past invalid ones, render one line (or
 * row) per file. Messages about invalid files go to standard error in every format.
 *
 * Syntax: runCheck(args, { color })
 * Example: await runCheck({ files: ['a.yaml', 'b.yaml'], format: 'text', quiet: false }, { color: false })
 */
export async function runCheck(args: CheckArgs, tty: { color: boolean; columns?: number }): Promise<CommandOutput> {
  const width = reportWidth(args.width, { isTTY: tty.columns !== undefined, columns: tty.columns });
  const [{ loadProject, requireFilter }, { analyzeProject }, { renderCheck }] = await Promise.all([
    import('../project/index.js'),
    import('../engine/analyze.js'),
    import('../report/check.js'),
  ]);
  const results: CheckedFile[] = args.files.map((file) => {
    try {
      const project = requireFilter(loadProject(file), 'check');
      const analysis = analyzeProject(project);
      return { file, pass: analysis.pass, checks: analysis.checks, lsb: analysis.lsb };
    } catch (error) {
      const { code, message } = describeError(error);
      if (code !== EXIT_BAD_INPUT) throw error; // a bug, not a bad file: do not hide it
      return { file, pass: false, checks: [], lsb: null, error: message };
    }
  });
  const stderr = results.flatMap((r) => (r.error !== undefined ? [`${r.error}\n`] : [])).join('');
  const stdout = args.quiet ? '' : renderCheck(results, args.format, { color: tty.color, width });
  return { stdout, stderr, code: checkExitCode(results) };
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
          choices: ['text', 'json', 'markdown'] as const,
          default: 'text' as const,
        })
        .option('quiet', { alias: 'q', describe: 'Print nothing but errors; the exit code tells', type: 'boolean', default: false })
        .example('$0 check dacsmith.yaml', 'PASS or FAIL with the failing specs, exit code 0 or 1')
        .example('$0 check boards/*.yaml --quiet', 'Only the exit code (and errors), for scripts')
        .example('$0 check boards/*.yaml --format markdown >> "$GITHUB_STEP_SUMMARY"', 'A table for a CI job summary')
        .epilogue('Exit codes: 0 every file passes, 1 a spec fails, 2 a file is invalid (the others are still checked).') as unknown as Argv<CheckArgs>,
    handler: (args) => run(() => runCheck(args, { color: args.format === 'text' && color(), ...terminalColumns() })),
  };
}
