import type { Argv, CommandModule } from 'yargs';
import type { CommandOutput } from './analyze.js';
import { EXIT_PASS, EXIT_SPEC_FAILS, UsageError } from './errors.js';
import { reportWidth, terminalColumns, widthOption } from './width.js';

export interface ToleranceArgs {
  file: string;
  samples?: number;
  seed?: number;
  distribution?: 'normal' | 'uniform';
  workers?: number;
  format: 'text' | 'json' | 'markdown' | 'html';
  html?: string;
  force?: boolean;
  charts: boolean;
  quiet?: boolean;
  width?: number;
}

/** Where progress goes: a terminal line that is redrawn in place, or nowhere. */
export interface ProgressSink {
  isTTY: boolean;
  write: (s: string) => boolean;
}

/**
 * Run `tolerance`: load the project, run the worst case and the Monte Carlo study, render the
 * report. A progress bar is drawn on standard error only when it is a terminal.
 *
 * Syntax: await runTolerance(args, { color, progress })
 * Example: await runTolerance({ file: 'p.yaml', format: 'json', charts: true }, { color: false })
 */
export async function runTolerance(
  args: ToleranceArgs,
  tty: { color: boolean; progress?: ProgressSink; columns?: number },
): Promise<CommandOutput> {
  const width = reportWidth(args.width, { isTTY: tty.columns !== undefined, columns: tty.columns });
  for (const [name, value, min] of [
    ['--samples', args.samples, 1],
    ['--seed', args.seed, 0],
    ['--workers', args.workers, 1],
  ] as const) {
    if (value !== undefined && !(Number.isInteger(value) && value >= min)) {
      // yargs turns a word given to a number option into NaN: say so rather than echo 'NaN'
      const given = Number.isNaN(value) ? 'something that is not a number' : String(value);
      throw new UsageError(`${name} must be a whole number >= ${min}, got ${given}`);
    }
  }
  // The project file's own limit (schemas/project.schema.json, tolerance.samples), so the command
  // line cannot ask for what the file refuses.
  if (args.samples !== undefined && args.samples > MAX_SAMPLES) {
    throw new UsageError(`--samples ${args.samples}: at most ${MAX_SAMPLES} (as tolerance.samples in a project file)`);
  }
  const [{ loadProject, requireFilter }, { toleranceStudy }, { toleranceReport }, { availableParallelism }] =
    await Promise.all([
      import('../project/index.js'),
      import('../tolerance/index.js'),
      import('../report/tolerance.js'),
      import('node:os'),
    ]);
  // Ladders and version 1.1 circuits alike (second_pwm, active stages: the general engine).
  const project = requireFilter(loadProject(args.file), 'tolerance');
  const bar = tty.progress?.isTTY ? progressBar(tty.progress) : undefined;
  let study;
  try {
    study = await toleranceStudy(project, undefined, {
      ...(args.samples !== undefined ? { samples: args.samples } : {}),
      ...(args.seed !== undefined ? { seed: args.seed } : {}),
      ...(args.distribution !== undefined ? { distribution: args.distribution } : {}),
      // More threads than cores only wait for each other (and each costs memory).
      workers: Math.min(args.workers ?? 4, availableParallelism()),
      ...(bar ? { onProgress: bar.update } : {}),
    });
  } finally {
    bar?.clear();
  }
  const stdout = toleranceReport(project, study, args.format, { charts: args.charts, color: tty.color, width });
  let stderr = '';
  if (args.html !== undefined) {
    const { writeOutputFile } = await import('./writeOutputFile.js');
    const page = args.format === 'html' ? stdout : toleranceReport(project, study, 'html', { charts: args.charts });
    writeOutputFile(args.html, page, { force: args.force ?? false, inputs: [args.file], option: '--html' });
    stderr = `HTML report written to ${args.html}\n`;
  }
  return { stdout: args.quiet ? '' : stdout, stderr, code: study.pass ? EXIT_PASS : EXIT_SPEC_FAILS };
}

/** Largest Monte Carlo sample count, as the project schema allows for tolerance.samples. */
const MAX_SAMPLES = 1_000_000;

/** A one-line progress bar redrawn at most every 100 ms. */
function progressBar(sink: ProgressSink): { update: (done: number, total: number) => void; clear: () => void } {
  let last = 0;
  let drawn = false;
  return {
    update(done, total) {
      const now = Date.now();
      if (now - last < 100 && done < total) return;
      last = now;
      const width = 30;
      const filled = Math.round((width * done) / total);
      sink.write(`\r  Monte Carlo [${'#'.repeat(filled)}${'.'.repeat(width - filled)}] ${done}/${total}`);
      drawn = true;
    },
    clear() {
      if (drawn) sink.write('\r\x1b[2K');
    },
  };
}

/**
 * The `tolerance` command for yargs: options, help and examples; the handler runs runTolerance
 * through `run` (which prints and sets the exit code).
 *
 * Syntax: toleranceCommand(run, color)
 * Example: yargs(argv).command(toleranceCommand(run, color))
 */
export function toleranceCommand(
  run: (work: () => Promise<CommandOutput>) => Promise<void>,
  color: () => boolean,
): CommandModule<object, ToleranceArgs> {
  return {
    command: 'tolerance <file>',
    describe: 'Worst case over the part tolerances and Monte Carlo yield against the spec',
    builder: (y: Argv) =>
      widthOption(y)
        .positional('file', { describe: 'Project file (YAML) with a tolerance block', type: 'string', demandOption: true })
        .option('samples', { describe: 'Monte Carlo samples (default: tolerance.samples, else 10000)', type: 'number', requiresArg: true })
        .option('seed', { describe: 'Random seed; the same seed gives the same result (default: tolerance.seed)', type: 'number', requiresArg: true })
        .option('distribution', {
          describe: 'Part value distribution (default: tolerance.distribution)',
          choices: ['normal', 'uniform'] as const,
        })
        .option('workers', { describe: 'Threads for the Monte Carlo run, this one included (default and most: the cores, up to 4 by default)', type: 'number', requiresArg: true })
        .option('quiet', { alias: 'q', describe: 'Print nothing but errors; the exit code tells', type: 'boolean', default: false })
        .option('format', { describe: 'Report format', choices: ['text', 'json', 'markdown', 'html'] as const, default: 'text' as const })
        .option('html', { describe: 'Also write the report as one self-contained HTML page with SVG histograms to this file', type: 'string', requiresArg: true })
        .option('force', { describe: 'Let --html replace an existing file (never the project file itself)', type: 'boolean', default: false })
        .option('charts', { describe: 'Draw the histograms (--no-charts to leave them out)', type: 'boolean', default: true })
        .example('$0 tolerance board.yaml', 'Worst case, yield and histograms')
        .example('$0 tolerance board.yaml --samples 100000 --seed 7', 'A larger, reproducible run')
        .example('$0 tolerance board.yaml --format json', 'One JSON object, SI units')
        .example('$0 tolerance board.yaml --html tolerance.html', 'Text report, and the HTML page with histograms')
        .epilogue('Exit codes: 0 every limit holds at the worst case and the yield meets its target, 1 not, 2 bad input. Warnings never change the exit code.') as unknown as Argv<ToleranceArgs>,
    handler: (args) =>
      run(() =>
        runTolerance(args, {
          color: args.format === 'text' && color(),
          progress: { isTTY: process.stderr.isTTY === true, write: (s) => process.stderr.write(s) },
          ...terminalColumns(),
        }),
      ),
  };
}
