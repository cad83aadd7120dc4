import type { Argv, CommandModule } from 'yargs';
import { parseDuties } from './duty.js';
import { EXIT_PASS, EXIT_SPEC_FAILS } from './errors.js';
import { reportWidth, terminalColumns, widthOption } from './width.js';

export interface AnalyzeArgs {
  file: string;
  duty?: string | string[];
  format: 'text' | 'json' | 'markdown' | 'html';
  charts: boolean;
  html?: string;
  quiet?: boolean;
  csv?: string;
  force?: boolean;
  width?: number;
}

/** What a command hands back to the shell: text for stdout and stderr, and the exit code. */
export interface CommandOutput {
  stdout: string;
  stderr: string;
  code: number;
}

/**
 * Run `analyze`: load the project, analyse it, render the report; heavy modules load here, lazily,
 * so that `--help` stays quick.
 *
 * Syntax: runAnalyze(args, { color })
 * Example: await runAnalyze({ file: 'p.yaml', format: 'json', charts: true }, { color: false })
 */
export async function runAnalyze(args: AnalyzeArgs, tty: { color: boolean; columns?: number }): Promise<CommandOutput> {
  const duties = parseDuties(args.duty);
  const width = reportWidth(args.width, { isTTY: tty.columns !== undefined, columns: tty.columns });
  const [{ loadProject, requireFilter }, { analyzeProject }] = await Promise.all([
    import('../project/index.js'),
    import('../engine/index.js'),
  ]);
  const project = requireFilter(loadProject(args.file), 'analyze');
  const analysis = analyzeProject(project, duties ? { duties } : {});
  // Chart series only for a report that draws them (JSON and --no-charts skip their cost).
  const charts =
    (args.format === 'text' || args.format === 'markdown') && args.charts && !args.quiet
      ? (await import('../engine/index.js')).chartSeries(analysis, project.pwm.duty, {
          // one sample per plot column; the text report's columns follow its width
          ...(args.format === 'text' && { columns: (await import('../report/charts.js')).chartColumns(width) }),
        })
      : undefined;
  // The page's plots are drawn at their own resolution (and always: a page is for looking at).
  const page = async () => {
    const [{ chartSeries }, { analysisHtml, HTML_PLOT_POINTS }] = await Promise.all([import('../engine/index.js'), import('../report/analysisHtml.js')]);
    return analysisHtml(project, analysis, args.charts ? chartSeries(analysis, project.pwm.duty, { columns: HTML_PLOT_POINTS }) : undefined);
  };
  let stdout: string;
  if (args.format === 'html') {
    stdout = args.quiet ? '' : await page();
  } else if (args.format === 'json') {
    stdout = (await import('../report/json.js')).jsonReport(project, analysis);
  } else if (args.format === 'markdown') {
    stdout = (await import('../report/markdown.js')).markdownReport(project, analysis, charts ? { charts } : {});
  } else {
    stdout = (await import('../report/text.js')).textReport(project, analysis, { ...(charts ? { charts } : {}), color: tty.color, width });
  }
  let stderr = '';
  if (args.csv !== undefined) {
    const [{ writeOutputFile }, { waveformCsv }, { waveformRecords }] = await Promise.all([
      import('./writeOutputFile.js'),
      import('../report/csv.js'),
      import('../engine/index.js'),
    ]);
    writeOutputFile(args.csv, waveformCsv(waveformRecords(analysis)), { force: args.force ?? false, inputs: [args.file], option: '--csv' });
    stderr = `waveforms written to ${args.csv}\n`;
  }
  if (args.html !== undefined) {
    const { writeOutputFile } = await import('./writeOutputFile.js');
    writeOutputFile(args.html, args.format === 'html' && !args.quiet ? stdout : await page(), { force: args.force ?? false, inputs: [args.file], option: '--html' });
    stderr += `HTML report written to ${args.html}\n`;
  }
  return { stdout: args.quiet ? '' : stdout, stderr, code: analysis.pass ? EXIT_PASS : EXIT_SPEC_FAILS };
}

/**
 * The `analyze` command for yargs: options, help and examples; the handler runs `runAnalyze`
 * through `run` (which prints and sets the exit code).
 *
 * Syntax: analyzeCommand(run)
 * Example: yargs(argv).command(analyzeCommand(run))
 */
export function analyzeCommand(
  run: (work: () => Promise<CommandOutput>) => Promise<void>,
  color: () => boolean,
): CommandModule<object, AnalyzeArgs> {
  return {
    command: 'analyze <file>',
    describe: 'Exact ripple, DC error, settling, cutoff and spec checks of a filter project',
    builder: (y: Argv) =>
      widthOption(y)
        .positional('file', { describe: 'Project file (YAML)', type: 'string', demandOption: true })
        .option('duty', {
          describe: 'Duty to evaluate, fraction or percent; repeat for more (default: 11 over the used range)',
          type: 'string',
          requiresArg: true,
        })
        .option('quiet', { alias: 'q', describe: 'Print nothing but errors; the exit code tells', type: 'boolean', default: false })
        .option('format', {
          describe: 'Report format',
          choices: ['text', 'json', 'markdown', 'html'] as const,
          default: 'text' as const,
        })
        .option('charts', { describe: 'Draw ASCII charts (--no-charts to leave them out)', type: 'boolean', default: true })
        .option('csv', {
          describe: 'Also write the waveforms to this CSV file (time_s,output_V,waveform,duty)',
          type: 'string',
          requiresArg: true,
        })
        .option('html', {
          describe: 'Also write the report as one self-contained HTML page with SVG plots to this file',
          type: 'string',
          requiresArg: true,
        })
        .option('force', { describe: 'Let --csv or --html replace an existing file (never the project file itself)', type: 'boolean', default: false })
        .example('$0 analyze board.yaml', 'Full report with charts')
        .example('$0 analyze board.yaml --duty 25% --duty 0.75', 'Report at two chosen duties')
        .example('$0 analyze board.yaml --format json', 'One JSON object, SI units')
        .example('$0 analyze board.yaml --no-charts --csv w.csv', 'Tables only; waveforms to w.csv')
        .example('$0 analyze board.yaml --html board.html', 'Text report, and the HTML page with plots in board.html')
        .epilogue(
          'Exit codes: 0 every spec holds, 1 a spec fails, 2 bad input. Warnings (values that are probably a typing slip, ' +
            "such as a load typed as 1m for 1M) are printed under 'Warnings' and never change the exit code; 'check --strict' fails on them.",
        ) as unknown as Argv<AnalyzeArgs>,
    handler: (args) => run(() => runAnalyze(args, { color: args.format === 'text' && color(), ...terminalColumns() })),
  };
}
