/**
 * The base of every error that is the user's to fix: a value, a project file, a command line, a
 * design space or a circuit outside what the engine computes exactly. The command line reports
 * any InputError as bad input (exit 2) with its message and never a stack; every other error is
 * internal (exit 70). With `file` and `key` (the project-file key path) the message reads
 * `FILE: key: detail`, and the command line adds the line and column of the key where it can.
 *
 * Syntax: new InputError(detail[, key[, file]])
 * Example: throw new InputError('no E3 value lies in the range', 'search.resistance', 'board.yaml')
 *          // message 'board.yaml: search.resistance: no E3 value lies in the range'
 */
export class InputError extends Error {
  override name = 'InputError';
  /** The message without the file and key in front. */
  readonly detail: string;
  constructor(
    detail: string,
    readonly key?: string,
    readonly file?: string,
  ) {
    super([file, key, detail].filter((part) => part !== undefined && part !== '').join(': '));
    this.detail = detail;
  }
}
