/**
 * The base of every error that is the user's to fix: a value, a project file, a command line, a
 * design space or a circuit outside what the engine computes exactly. The command line reports
 * any InputError as bad input (exit 2) with its message and never a stack; every other error is
 * internal (exit 70). `key` is the project-file key path the problem belongs to, when there is one.
 *
 * Syntax: new InputError(message[, key])
 * Example: throw new InputError('board.yaml: filter.stages[0]: R1 C1 = 1e13 s is 2e17 PWM periods', 'filter.stages[0]')
 */
export class InputError extends Error {
  override name = 'InputError';
  constructor(
    message: string,
    readonly key?: string,
  ) {
    super(message);
  }
}
