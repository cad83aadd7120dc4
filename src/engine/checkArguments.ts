/** Argument checks shared by the public engine functions (RangeError with the argument named). */

/**
 * Reject a duty outside 0..1 (or not a number) with a RangeError naming the argument.
 *
 * Syntax: checkDuty(value, name)
 * Example: checkDuty(1.2, 'duty')  // throws RangeError: duty 1.2 is outside 0..1
 */
export function checkDuty(value: number, name: string): void {
  if (!(value >= 0 && value <= 1)) throw new RangeError(`${name} ${value} is outside 0..1`);
}

/**
 * Reject a duty range whose ends are not duties or that runs backwards.
 *
 * Syntax: checkRange(dutyMin, dutyMax)
 * Example: checkRange(0.9, 0.1)  // throws RangeError
 */
export function checkRange(dutyMin: number, dutyMax: number): void {
  checkDuty(dutyMin, 'dutyMin');
  checkDuty(dutyMax, 'dutyMax');
  if (dutyMin > dutyMax) throw new RangeError(`dutyMin ${dutyMin} is above dutyMax ${dutyMax}`);
}

/**
 * Reject a count that is not a positive finite number (or not an integer when `integer`).
 *
 * Syntax: checkCount(value, name, integer)
 * Example: checkCount(0, 'samples', true)  // throws RangeError
 */
export function checkCount(value: number, name: string, integer: boolean): void {
  if (!(value > 0) || !Number.isFinite(value) || (integer && !Number.isInteger(value))) {
    throw new RangeError(`${name} ${value} must be a positive ${integer ? 'integer' : 'number'}`);
  }
}
