/** JSON has no Infinity or NaN: such a number (a step that never settles) is written as null. */
const finiteOrNull = (_key: string, v: unknown) => (typeof v === 'number' && !Number.isFinite(v) ? null : v);

/**
 * The type of `value` as JSON data: no functions, nothing readonly. (Numbers keep their type; the
 * few that can be infinite, such as a settling time that never ends, are null in the data.)
 */
export type JsonValue<T> = T extends number | string | boolean | null
    ? T
    : T extends ReadonlyArray<infer U>
      ? JsonValue<U>[]
      : T extends object
        ? { -readonly [K in keyof T as T[K] extends (...a: never[]) => unknown ? never : K]: JsonValue<T[K]> }
        : T;

/**
 * A report body as plain JSON data, exactly as a reader of the command's JSON output gets it:
 * non-finite numbers become null, undefined members disappear, nothing is shared with the
 * engine's objects. The command line prints `JSON.stringify` of this very value, and the library
 * API returns it, so the two cannot disagree.
 *
 * Syntax: jsonValue(body)
 * Example: jsonValue({ time: Infinity, note: undefined })   // { time: null }
 */
export function jsonValue<T>(body: T): JsonValue<T> {
  return JSON.parse(JSON.stringify(body, finiteOrNull)) as JsonValue<T>;
}
