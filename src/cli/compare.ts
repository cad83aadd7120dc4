import type { Argv, CommandModule } from 'yargs';
import type { CommandOutput } from './analyze.js';
import { EXIT_PASS, EXIT_SPEC_FAILS, UsageError } from './errors.js';
import { reportWidth, terminalColumns, widthOption } from './width.js';
import type { CompareFormat } from '../report/compare.js';
import type { Analysis } from '../engine/index.js';

export interface CompareArgs {
  base: string;
  head?: string;
  git?: string;
  format: CompareFormat | 'github';
  quiet: boolean;
  width?: number;
  html?: string;
  force?: boolean;
}

/**
 * Run `compare`: two project files, or one file against its version at a git revision
 * (`--git REF`: the base is `git show REF:path`, the head the file as it is now).
 * The exit code is the head's spec status.
 *
 * Syntax: runCompare(args, { color })
 * Example: await runCompare({ base: 'dac.yaml', git: 'main', format: 'markdown', quiet: false }, { color: false })
 */
export async function runCompare(args: CompareArgs, tty: { color: boolean; columns?: number }): Promise<CommandOutput> {
  const width = reportWidth(args.width, { isTTY: tty.columns !== undefined, columns: tty.columns });
  if (args.git !== undefined && args.head !== undefined) {
    throw new UsageError('compare --git takes one file (compared with itself at that revision), not two');
  }
  if (args.git === undefined && args.head === undefined) {
    throw new UsageError('compare needs two files (BASE HEAD), or one file and --git REF');
  }
  const [{ loadProject, parseProject, requireFilter }, { analyzeProject, compareOverlays }, { compareReport, overlayColumns }] = await Promise.all([
    import('../project/index.js'),
    import('../engine/index.js'),
    import('../report/compare.js'),
  ]);

  let base;
  let head;
  let baseLabel: string;
  if (args.git !== undefined) {
    const { fileAtRevision, GitShowError } = await import('../project/gitShow.js');
    head = requireFilter(loadProject(args.base), 'compare'); // first, so that a missing file is named as such
    let old;
    try {
      old = fileAtRevision(args.base, args.git);
    } catch (error) {
      if (error instanceof GitShowError) throw new UsageError(`compare --git ${args.git}: ${error.message}`);
      throw error;
    }
    base = requireFilter(parseProject(old.text, old.label), 'compare');
    baseLabel = old.label;
  } else {
    base = requireFilter(loadProject(args.base), 'compare');
    head = requireFilter(loadProject(args.head as string), 'compare');
    baseLabel = args.base;
  }
  const headLabel = args.head ?? args.base;
  const headAnalysis = analyzeProject(head);
  let stdout = '';
  const format = args.format;
  if (args.quiet) {
    // the exit code tells
  } else if (format === 'github') {
    stdout = await headAnnotations(headLabel, headAnalysis, analyzeProject(base), baseLabel);
  } else {
    const baseAnalysis = analyzeProject(base);
    stdout = compareReport(
      { label: baseLabel, project: base, analysis: baseAnalysis },
      { label: headLabel, project: head, analysis: headAnalysis },
      compareOverlays(baseAnalysis, headAnalysis, format === 'text' ? overlayColumns(width) : 72),
      format,
      { color: tty.color, width },
    );
  }
  let stderr = '';
  if (args.html !== undefined) {
    const baseAnalysis = analyzeProject(base);
    const page = compareReport(
      { label: baseLabel, project: base, analysis: baseAnalysis },
      { label: headLabel, project: head, analysis: headAnalysis },
      // the JSON's grid, so that the page and --format json hold the same waveforms
      compareOverlays(baseAnalysis, headAnalysis, 72),
      'html',
    );
    const { writeOutputFile } = await import('./writeOutputFile.js');
    writeOutputFile(args.html, page, { force: args.force ?? false, inputs: [args.base, ...(args.head !== undefined ? [args.head] : [])], option: '--html' });
    stderr = `HTML report written to ${args.html}\n`;
  }
  return { stdout, stderr, code: headAnalysis.pass ? EXIT_PASS : EXIT_SPEC_FAILS };
}

/**
 * GitHub annotations for the head of a comparison: each failing check on the line of its limit in
 * the head file, with what the base said of it, and each warning of the head.
 */
async function headAnnotations(
  headFile: string,
  head: Analysis,
  base: Analysis,
  baseLabel: string,
): Promise<string> {
  const [{ keyPositions }, { renderCheck }, { checkKey }] = await Promise.all([
    import('../project/index.js'),
    import('../report/check.js'),
    import('../report/checkKey.js'),
  ]);
  const checkNotes: Record<string, string> = {};
  for (const c of head.checks) {
    const was = base.checks.find((b) => b.name === c.name);
    checkNotes[c.name] = was === undefined ? `no such limit in ${baseLabel}` : was.pass ? `passes in ${baseLabel}` : `fails in ${baseLabel} too`;
  }
  const keys = [...head.checks.map((c) => checkKey(c.name)), ...head.warnings.map((w) => w.key)];
  const file = { file: headFile, pass: head.pass, checks: head.checks, warnings: head.warnings, lsb: head.lsb, positions: keyPositions(headFile, keys), checkNotes };
  return renderCheck([file], 'github', { command: `dacsmith compare ${baseLabel} -> ${headFile}` });
}

/**
 * The `compare` command for yargs: what a change to a project file does to its figures and checks.
 *
 * Syntax: compareCommand(run, color)
 * Example: yargs(argv).command(compareCommand(run, color))
 */
export function compareCommand(
  run: (work: () => Promise<CommandOutput>) => Promise<void>,
  color: () => boolean,
): CommandModule<object, CompareArgs> {
  return {
    command: 'compare <base> [head]',
    describe: 'Compare two versions of a project: changed inputs, figures side by side, checks, overlay charts',
    builder: (y: Argv) =>
      widthOption(y)
        .positional('base', { describe: 'Base project file (with --git: the file to compare with its older version)', type: 'string', demandOption: true })
        .positional('head', { describe: 'Head project file', type: 'string' })
        .option('git', { describe: 'Compare the file with its version at this git revision (branch, tag, commit)', type: 'string', requiresArg: true })
        .option('format', {
          describe: 'Output format',
          choices: ['text', 'json', 'markdown', 'github', 'html'] as const,
          default: 'text' as const,
        })
        .option('quiet', { alias: 'q', describe: "Print nothing but errors; the exit code is the head's spec status", type: 'boolean', default: false })
        .option('html', { describe: 'Also write the comparison as one self-contained HTML page with SVG overlays to this file', type: 'string', requiresArg: true })
        .option('force', { describe: 'Let --html replace an existing file (never an input file)', type: 'boolean', default: false })
        .example('$0 compare old.yaml new.yaml', 'Two files side by side')
        .example('$0 compare dacsmith.yaml --git main', 'The file against its version on branch main')
        .example('$0 compare old.yaml new.yaml --html change.html', 'Text report, and the HTML page with the overlays')
        .example('$0 compare dacsmith.yaml --git HEAD --format markdown >> "$GITHUB_STEP_SUMMARY"', 'Uncommitted changes, as Markdown for a CI summary')
        .example('$0 compare dacsmith.yaml --git origin/main --format github', "GitHub annotations on the head's failing limits, saying whether the base passed")
        .epilogue("Exit codes: 0 the head passes its spec, 1 it fails, 2 bad input (a file, or git). Warnings shown are the head's; they never change the exit code.") as unknown as Argv<CompareArgs>,
    handler: (args) => run(() => runCompare(args, { color: args.format === 'text' && color(), ...terminalColumns() })),
  };
}
