import yargs from 'yargs';
import { hideBin } from 'yargs/helpers';
import pkg from '../../package.json' with { type: 'json' };
import { colorWanted } from '../report/color.js';
import { analyzeCommand, type CommandOutput } from './analyze.js';
import { checkCommand } from './check.js';
import { compareCommand } from './compare.js';
import { initCommand } from './init.js';
import { designCommand } from './design.js';
import { toleranceCommand } from './tolerance.js';
import { describeError, UsageError } from './errors.js';
import { InputError } from '../units/index.js';
import { checkOptionTokens, operandsAfterDoubleDash, type OptionKinds } from './checkOptionTokens.js';
import { completionCandidates, completionShell } from './completion.js';
import { readdirSync } from 'node:fs';

/** Print what a command produced and set the exit code; map thrown errors to messages and codes. */
async function run(work: () => Promise<CommandOutput>): Promise<void> {
  try {
    const out = await work();
    if (out.stderr) process.stderr.write(out.stderr);
    process.stdout.write(out.stdout);
    process.exitCode = out.code;
  } catch (error) {
    const { code, message } = describeError(error);
    process.stderr.write(`${(await withPosition(error)) ?? message}\n`);
    process.exitCode = code;
  }
}

/** `FILE:LINE:COL: key: detail` for an input error that names its file and key, when the key is found. */
async function withPosition(error: unknown): Promise<string | undefined> {
  if (!(error instanceof InputError) || error.file === undefined || error.key === undefined) return undefined;
  const { positionOfKey } = await import('../project/index.js');
  const at = positionOfKey(error.file, error.key);
  return at ? `${error.file}:${at.line}:${at.column}: ${error.key}: ${error.detail}` : undefined;
}

/**
 * A yargs middleware that holds the raw tokens to one reading (checkOptionTokens.ts) with the
 * options of the command being run. yargs passes itself as the second argument at run time; its
 * type declarations list only the first.
 */
function optionTokensChecker(argv: readonly string[]): (args: object) => void {
  const check = (_args: object, y: { getOptions(): OptionKinds }) => checkOptionTokens(argv, y.getOptions());
  return check as unknown as (args: object) => void;
}

/**
 * yargs' completion hook: its own candidates (commands, options, choices), or YAML files where a
 * command takes project files. The words come from the command line after --get-yargs-completions.
 */
function completeWord(
  current: string,
  _argv: unknown,
  defaults: (done: (error: Error | null, candidates: string[] | undefined) => void) => void,
  done: (candidates: string[]) => void,
): void {
  defaults((_error, candidates) => {
    const at = process.argv.indexOf('--get-yargs-completions');
    // the words after the program name, without the one being completed
    const words = process.argv.slice(at + 2, -1);
    const list = (dir: string) => {
      try {
        return readdirSync(dir, { withFileTypes: true });
      } catch {
        return [];
      }
    };
    done(completionCandidates(words, current, candidates ?? [], list));
  });
}

/**
 * The command-line shell: parse arguments with yargs and dispatch to one command module per file.
 * Argument errors print the message and a hint on standard error and exit 2.
 *
 * Syntax: main(argv)
 * Example: await main(['analyze', 'sample-configs/greenhouse-heater.yaml', '--format', 'json'])
 */
export async function main(argv: string[]): Promise<void> {
  // A reader that closes the pipe early (`| head`) has what it wanted: stop quietly with the
  // command's own exit code rather than Node's unhandled-error stack and exit 1 ("a spec fails").
  process.stdout.on('error', (error: NodeJS.ErrnoException) => {
    if (error.code !== 'EPIPE') throw error;
    process.exit();
  });
  const color = () => colorWanted(process.stdout.isTTY, process.env);
  const shell = completionShell(argv, process.env);
  if (shell.shell !== undefined) process.env.SHELL = shell.shell; // yargs picks the script's shell from $SHELL
  argv = shell.argv;
  const cli = yargs(operandsAfterDoubleDash(argv))
    .scriptName('dacsmith')
    .usage('$0 <command> [options]\n\nPlan the RC filter that turns a PWM output into an analog voltage.')
    .command(analyzeCommand(run, color))
    .command(designCommand(run, color))
    .command(toleranceCommand(run, color))
    .command(checkCommand(run, color))
    .command(compareCommand(run, color))
    .command(initCommand(run))
    .completion('completion', 'Print a shell completion script: dacsmith completion [bash|zsh] >> ~/.bashrc (commands, options, .yaml files)', completeWord)
    .middleware(optionTokensChecker(argv), true)
    .demandCommand(1, 'Name a command.')
    .recommendCommands()
    .strict()
    .help()
    .alias('h', 'help')
    .version(pkg.version)
    .example('$0 analyze board.yaml', 'Analyse the filter of board.yaml')
    .example('$0 analyze --help', 'Options and examples of analyze')
    .epilogue('Exit codes: 0 every spec holds, 1 a spec fails, 2 the input or the command line is wrong.')
    .wrap(Math.min(100, process.stdout.columns ?? 100))
    .fail((message, error) => {
      // yargs goes on to the command after fail() returns: stop it by throwing.
      if (!message && error) throw error;
      // yargs' command suggestion alone does not say that the command was not found
      const said = /^Did you mean/.test(message ?? '') ? `unknown command '${argv[0]}'. ${message}` : message;
      throw new UsageError(`${said}\nRun 'dacsmith --help' for usage.`);
    });
  try {
    await cli.parseAsync();
  } catch (error) {
    const { code, message } = describeError(error);
    process.stderr.write(`${message}\n`);
    process.exitCode = code;
  }
}

void main(hideBin(process.argv));
