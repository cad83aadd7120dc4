import { InputError } from '../units/index.js';

/** Exit codes shared by every command (design notes: 0 all specs hold, 1 a spec fails, 2 bad input). */
export const EXIT_PASS = 0;
export const EXIT_SPEC_FAILS = 1;
export const EXIT_BAD_INPUT = 2;
/** Internal error (EX_SOFTWARE in BSD sysexits.h). */
export const EXIT_INTERNAL = 70;

/** A mistake on the command line or in an input file; its message is shown as is, with exit 2. */
export class UsageError extends InputError {
  override name = 'UsageError';
}

/** Anything with the project loader's `format()` (FILE:LINE:COL: key.path: message). */
interface Formattable {
  name: string;
  format(): string;
}

const isFormattable = (e: unknown): e is Formattable =>
  e instanceof InputError && typeof (e as Partial<Formattable>).format === 'function';

const FILE_ERRORS: Record<string, string> = {
  ENOENT: 'no such file',
  EACCES: 'permission denied',
  EISDIR: 'is a directory',
  ENOTDIR: 'a path component is not a directory',
  EPERM: 'operation not permitted',
};

/**
 * Turn an error into a message for standard error and an exit code: user errors (UsageError, the
 * project loader's ProjectError, unreadable files) give their message and exit 2, never a stack;
 * anything else is internal (exit 70) with a short message, and the stack only when DACSMITH_DEBUG
 * is set.
 *
 * Syntax: describeError(error[, env])
 * Example: describeError(new UsageError('--duty 1.5 is outside 0..1'))   // { code: 2, message: 'dacsmith: --duty 1.5 ...' }
 */
export function describeError(
  error: unknown,
  env: Record<string, string | undefined> = process.env,
): { code: number; message: string } {
  if (isFormattable(error)) return { code: EXIT_BAD_INPUT, message: error.format() };
  if (error instanceof InputError) return { code: EXIT_BAD_INPUT, message: `dacsmith: ${error.message}` };
  const sys = error as NodeJS.ErrnoException;
  if (sys && typeof sys.code === 'string' && sys.code in FILE_ERRORS && typeof sys.path === 'string') {
    return { code: EXIT_BAD_INPUT, message: `${sys.path}: ${FILE_ERRORS[sys.code]}` };
  }
  const text = error instanceof Error ? error.message : String(error);
  const stack = env.DACSMITH_DEBUG && error instanceof Error && error.stack ? `\n${error.stack}` : '';
  return {
    code: EXIT_INTERNAL,
    message: `dacsmith: internal error: ${text}${stack}\n(set DACSMITH_DEBUG=1 for details; please report it)`,
  };
}
