import type { Dimension } from './dimension.js';
import { InputError } from './inputError.js';

/**
 * A value that is not the quantity it should be. The message is meant for the person who wrote
 * the value; callers add where the value was (file, key path, line).
 *
 * Syntax: new QuantityError(message, input, expected)
 * Example: new QuantityError("expected a capacitance (F), got '3.3 V' (a voltage)", '3.3 V', 'capacitance')
 */
export class QuantityError extends InputError {
  override name = 'QuantityError';
  constructor(
    message: string,
    /** The value as written. */
    readonly input: string | number,
    /** The dimension that was expected. */
    readonly expected: Dimension,
  ) {
    super(message);
  }
}
