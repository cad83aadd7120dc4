import type { Argv, CommandModule } from 'yargs';
import type { CommandOutput } from './analyze.js';
import type { DesignProgress } from '../design/types.js';
import { EXIT_BAD_INPUT, EXIT_PASS, EXIT_SPEC_FAILS, UsageError } from './errors.js';
import { reportWidth, terminalColumns, widthOption } from './width.js';
import { TRADEOFF_EFFORT } from '../design/tradeoffEffort.js';

export interface DesignArgs {
  file: string;
  format: 'text' | 'json' | 'markdown' | 'html';
  top: number;
  html?: string;
  write?: string;
  /** Stop the search after this many seconds with the designs found so far (marked incomplete). */
  maxTime?: number;
  force: boolean;
  charts: boolean;
  quiet?: boolean;
  /** Keep only designs that meet the spec under part tolerances. */
  robust?: 'worst-case' | 'yield';
  /** Most fast-model evaluations one trade-off curve may take (default TRADEOFF_EFFORT). */
  curveEffort?: number;
  width?: number;
}

/** Progress on a terminal stream: silent for the first second, then redrawn at most every 100 ms, erased when done. */
function progressBar(
  stream: NodeJS.WriteStream,
  render: (fraction: number, detail: DesignProgress | undefined, width: number) => string,
): { update: (f: number, detail?: DesignProgress) => void; done: () => void } {
  const started = Date.now();
  let last = 0;
  let shown = 0;
  return {
    update: (f, detail) => {
      const now = Date.now();
      if (now - started < 1000 || (now - last < 100 && f < 1)) return;
      last = now;
      const line = render(f, detail, stream.columns || 80); // 0 when the terminal reports no size
      stream.write(`\r${line}${' '.repeat(Math.max(0, shown - line.length))}`);
      shown = line.length;
    },
    done: () => {
      if (shown > 0) stream.write(`\r${' '.repeat(shown)}\r`);
    },
  };
}

/**
 * Run `design`: load the project, search the standard-value filters, render the report, and with
 * `--write` save design #1 as a project file (never over an existing file without `--force`).
 * With `robust`, only designs that pass the tolerance check (design/robustDesigns.ts) are listed.
 * Exit 0 when a design meets every limit, 1 when none does, 2 for bad input.
 *
 * Syntax: runDesign(args, { color, progress })
 * Example: await runDesign({ file: 'p.yaml', format: 'json', top: 5, force: false, charts: false }, { color: false })
 */
/** Seconds a design search may take when --max-time is not given. */
export const DEFAULT_MAX_TIME = 60;

/**
 * When the search must stop (performance.now() in ms): --max-time seconds after `started`, or
 * DEFAULT_MAX_TIME when it is not given, so that no input keeps the command busy for hours (a
 * three-stage space with nothing feasible and no settling limit has no finite threshold to prune
 * with). --robust too: its nominal searches and checks stop there.
 *
 * Syntax: searchDeadline(args, started)
 * Example: searchDeadline({}, 0)   // 60000
 */
export function searchDeadline(args: Pick<DesignArgs, 'maxTime'>, started: number): number {
  return started + 1000 * (args.maxTime ?? DEFAULT_MAX_TIME);
}

export async function runDesign(
  args: DesignArgs,
  tty: { color: boolean; progress?: NodeJS.WriteStream; columns?: number },
): Promise<CommandOutput> {
  const started = performance.now();
  if (!Number.isInteger(args.top) || args.top < 1) throw new UsageError(`--top ${args.top}: give a whole number of at least 1`);
  if (args.maxTime !== undefined && !(Number.isInteger(args.maxTime) && args.maxTime >= 1)) {
    throw new UsageError(`--max-time ${args.maxTime}: give whole seconds, at least 1`);
  }
  if (args.curveEffort !== undefined && !(Number.isInteger(args.curveEffort) && args.curveEffort >= 1)) {
    throw new UsageError(`--curve-effort ${args.curveEffort}: give a whole number of evaluations, at least 1`);
  }
  const width = reportWidth(args.width, { isTTY: tty.columns !== undefined, columns: tty.columns });
  const fs = await import('node:fs');
  if (args.write !== undefined && !args.force && fs.existsSync(args.write)) {
    return { stdout: '', stderr: `dacsmith: ${args.write} exists; use --force to overwrite it\n`, code: EXIT_BAD_INPUT };
  }
  const [{ loadProject }, { designStudy }, { designReport }, { designProgressLine }] = await Promise.all([
    import('../project/index.js'),
    import('../api/designStudy.js'),
    import('../report/design.js'),
    import('../report/designProgress.js'),
  ]);
  const project = loadProject(args.file);
  // Progress only on a terminal, and not when asked to be quiet.
  const bar = tty.progress && !args.quiet ? progressBar(tty.progress, designProgressLine) : null;
  const deadline = searchDeadline(args, started);
  let study;
  try {
    study = designStudy(project, {
      top: args.top,
      tradeoff: args.charts,
      deadline,
      ...(args.curveEffort !== undefined && { curveEffort: args.curveEffort }),
      ...(args.robust && { robust: args.robust }),
      ...(bar && { onProgress: (f: number, d?: DesignProgress) => bar.update(f, d) }),
    });
  } finally {
    bar?.done();
  }
  // The study's other fields (curves, robust verdicts, curves not drawn) are the report's options by the same names.
  const { result, ...figures } = study;

  let written: string | undefined;
  let changes;
  let stderr = '';
  if (args.write !== undefined) {
    if (result.feasible) {
      const { withDesign, changeLine } = await import('../report/designYaml.js');
      const best = result.candidates[0];
      const edit = withDesign(fs.readFileSync(args.file, 'utf8'), best);
      // Atomic (temporary file and rename): a full disk never leaves half a project, even when
      // --force writes the design back over the project file itself.
      (await import('./writeOutputFile.js')).writeOutputFile(args.write, edit.text, { force: args.force, option: '--write' });
      written = args.write;
      changes = edit.changes;
      const how = edit.method === 'rewritten' ? ' (rewritten by the YAML writer: comments and key order kept, spacing may differ)' : '';
      const list = edit.changes.length > 0 ? edit.changes.map((c) => `  ${changeLine(c)}\n`).join('') : '  no change: the file already holds design #1\n';
      stderr = `design #1 written to ${args.write}${how}; changes from ${args.file}:\n${list}`;
    } else {
      stderr = `dacsmith: no feasible design, nothing written to ${args.write}\n`;
    }
  }
  const options = {
    ...figures,
    color: args.format === 'text' && tty.color,
    ...(written && { written, changes }),
    width,
  };
  const stdout = designReport(project, result, args.format, options);
  if (args.html !== undefined) {
    const { writeOutputFile } = await import('./writeOutputFile.js');
    const page = args.format === 'html' ? stdout : designReport(project, result, 'html', options);
    writeOutputFile(args.html, page, { force: args.force, inputs: [args.file], option: '--html' });
    stderr += `HTML report written to ${args.html}\n`;
  }
  return { stdout: args.quiet ? '' : stdout, stderr, code: result.feasible ? EXIT_PASS : EXIT_SPEC_FAILS };
}

/**
 * The `design` command for yargs: options, help and examples; the handler runs `runDesign`
 * through `run` (which prints and sets the exit code).
 *
 * Syntax: designCommand(run, color)
 * Example: yargs(argv).command(designCommand(run, color))
 */
export function designCommand(
  run: (work: () => Promise<CommandOutput>) => Promise<void>,
  color: () => boolean,
): CommandModule<object, DesignArgs> {
  return {
    command: 'design <file>',
    describe: 'Recommend standard-value RC filters that meet the spec (search over the search: section)',
    builder: (y: Argv) =>
      widthOption(y)
        .positional('file', { describe: 'Project file (YAML) with a search: section', type: 'string', demandOption: true })
        .option('quiet', { alias: 'q', describe: 'Print nothing but errors; the exit code tells', type: 'boolean', default: false })
        .option('format', { describe: 'Report format', choices: ['text', 'json', 'markdown', 'html'] as const, default: 'text' as const })
        .option('html', { describe: 'Also write the report as one self-contained HTML page with SVG plots to this file', type: 'string', requiresArg: true })
        .option('top', { describe: 'Number of designs to list', type: 'number', default: 10, requiresArg: true })
        .option('write', { describe: 'Write design #1 as a project file (the original with filter.stages replaced)', type: 'string', requiresArg: true })
        .option('force', { describe: 'Let --write or --html replace an existing file', type: 'boolean', default: false })
        .option('max-time', {
          describe: `Stop the search after this many seconds (default ${DEFAULT_MAX_TIME}) with the best designs found so far, marked incomplete (no trade-off curves then)`,
          type: 'number',
          requiresArg: true,
        })
        .option('robust', {
          describe: 'Keep only designs that meet every limit at the worst case of the tolerance: block, or whose Monte Carlo yield reaches tolerance.yield',
          choices: ['worst-case', 'yield'] as const,
          requiresArg: true,
        })
        .option('charts', { describe: 'Compute and draw the settling/ripple trade-off (--no-charts: faster)', type: 'boolean', default: true })
        .option('curve-effort', {
          describe: `Most fast-model evaluations one trade-off curve may take (default ${TRADEOFF_EFFORT}, a few seconds); a curve that needs more is not drawn, and the report says so`,
          type: 'number',
          requiresArg: true,
        })
        .example('$0 design sample-configs/design-tight-ripple.yaml', 'Ranked designs, trade-off chart, comparison')
        .example('$0 design board.yaml --top 3 --no-charts', 'Three best designs, no trade-off curves')
        .example('$0 design board.yaml --write board-designed.yaml', 'Save design #1 as a new project file')
        .example('$0 design board.yaml --robust worst-case --no-charts', 'Only designs that survive the tolerance box')
        .example('$0 design board.yaml --html designs.html', 'Text report, and the HTML page with the trade-off plot')
        .example('$0 design board.yaml --format json > designs.json', 'Machine-readable result (SI units)') as unknown as Argv<DesignArgs>,
    handler: (args) =>
      run(() =>
        runDesign(args, {
          color: args.format === 'text' && color(),
          ...(process.stderr.isTTY && { progress: process.stderr }),
          ...terminalColumns(),
        }),
      ),
  };
}
