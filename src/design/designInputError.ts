import { InputError } from '../units/index.js';

/**
 * The project cannot be designed as given (no `search:` section, empty series range, a stage
 * count outside 1..3). The command line reports it as bad input (exit 2).
 *
 * Syntax: new DesignInputError(message)
 * Example: throw new DesignInputError('search: missing; add a search section to design a filter')
 */
export class DesignInputError extends InputError {
  override name = 'DesignInputError';
}
