import type { Argv } from 'yargs';
import { UsageError } from './errors.js';

/** Narrowest report width accepted, columns (narrower leaves no room for a table or a chart). */
export const MIN_WIDTH = 50;

/**
 * The width a text report is drawn to: `--width N` when given (a whole number of at least 40),
 * else the terminal's width when standard output is a terminal, else 80 columns.
 *
 * Syntax: reportWidth(given, stdout)
 * Example: reportWidth(undefined, { isTTY: false })   // 80
 *          reportWidth(120, process.stdout)           // 120
 */
export function reportWidth(given: number | undefined, stdout: { isTTY?: boolean; columns?: number }): number {
  if (given !== undefined) {
    if (!Number.isInteger(given) || given < MIN_WIDTH) {
      const what = Number.isNaN(given) ? 'something that is not a number' : String(given);
      throw new UsageError(`--width must be a whole number of at least ${MIN_WIDTH} columns, got ${what}`);
    }
    return given;
  }
  if (stdout.isTTY && stdout.columns !== undefined && stdout.columns > 0) return Math.max(MIN_WIDTH, stdout.columns);
  return 80;
}

/** The `--width` option of the commands with a text report. */
export function widthOption<T>(y: Argv<T>): Argv<T> {
  return y.option('width', {
    describe: `Widest line of the text report, columns (default: the terminal's width, else 80; at least ${MIN_WIDTH})`,
    type: 'number',
    requiresArg: true,
  }) as unknown as Argv<T>;
}

/** `{ columns }` of standard output when it is a terminal, else nothing (then reports take 80). */
export function terminalColumns(): { columns?: number } {
  return process.stdout.isTTY && process.stdout.columns ? { columns: process.stdout.columns } : {};
}
