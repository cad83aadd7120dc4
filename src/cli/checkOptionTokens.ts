import { UsageError } from './errors.js';

/** What yargs knows of the options of the command being run (yargs' getOptions()). */
export interface OptionKinds {
  boolean: string[];
  number: string[];
  string: string[];
  /** Options with a fixed list of values (`--format`): they always take a value. */
  choices: Record<string, unknown>;
  alias: Record<string, string[]>;
}

/** Options that may be given several times (each adds a value). */
const REPEATABLE = new Set(['duty']);

/**
 * Hold the raw command-line tokens to one reading before yargs interprets them, so that no option
 * is read differently than written: an option given twice (`--format json --format json`), a
 * boolean given a word other than true/false (`--quiet=maybe`), a whole-number option given
 * anything but decimal digits (`--seed ''`, `--samples 0x10`, `--samples 1e3`) or an option that
 * takes a value given none (`--format` at the end) is a UsageError (exit 2) naming the option.
 * Tokens after `--` are operands, never options.
 *
 * Syntax: checkOptionTokens(tokens, kinds)
 * Example: checkOptionTokens(['analyze', 'p.yaml', '--format', 'json', '--format', 'text'], kinds)
 *          // throws UsageError: --format is given more than once ...
 */
export function checkOptionTokens(tokens: readonly string[], kinds: OptionKinds): void {
  const canonical = new Map<string, string>();
  for (const [name, aliases] of Object.entries(kinds.alias)) {
    canonical.set(name, name);
    for (const a of aliases) canonical.set(a, canonical.get(a) ?? name);
  }
  const nameOf = (raw: string) => canonical.get(raw) ?? raw;
  const has = (list: string[], name: string) => list.includes(name);
  const seen = new Map<string, string>();

  for (let i = 0; i < tokens.length; i++) {
    const token = tokens[i];
    if (token === '--') break;
    if (!token.startsWith('-') || token === '-' || /^-\d/.test(token)) continue;
    const long = token.startsWith('--');
    const eq = token.indexOf('=');
    const written = long ? token.slice(2, eq > 0 ? eq : undefined) : token.slice(1, eq > 0 ? eq : undefined);
    // Short flags may be bundled (-qh): each letter is an option.
    const names = long ? [written.replace(/^no-/, (m) => (kinds.boolean.includes(nameOf(written.slice(3))) ? '' : m))] : [...written];
    const inline = eq > 0 ? token.slice(eq + 1) : undefined;
    for (const raw of names) {
      const name = nameOf(raw);
      const shown = `${raw.length === 1 && !long ? '-' : '--'}${raw}`;
      if (!REPEATABLE.has(name) && !has(['help', 'version'], name)) {
        if (seen.has(name)) throw new UsageError(`${shown} is given more than once (${seen.get(name)} and ${token}); give it once`);
        seen.set(name, token);
      }
      if (has(kinds.boolean, name)) {
        if (inline !== undefined && inline !== 'true' && inline !== 'false') {
          throw new UsageError(`${shown} is a switch: write ${shown} or --no-${raw}, or ${shown}=true / ${shown}=false, not '${inline}'`);
        }
        continue;
      }
      const takesValue = has(kinds.number, name) || has(kinds.string, name) || name in kinds.choices;
      if (!takesValue) continue;
      let value = inline;
      if (value === undefined) {
        const next = tokens[i + 1];
        if (next === undefined || next === '--' || (next.startsWith('-') && next !== '-' && !/^-\d/.test(next))) {
          throw new UsageError(`${shown} needs a value`);
        }
        value = next;
        i++;
      }
      if (has(kinds.number, name) && !/^[0-9]+$/.test(value)) {
        throw new UsageError(`${shown} must be a whole number written in decimal digits, got '${value}'`);
      }
    }
  }
}

/**
 * Operands after `--` that start with '-' would still be read as options by yargs: give them as
 * `./-name` (the same path) and drop the `--`, so `dacsmith analyze -- -x.yaml` reads the file `-x.yaml`.
 *
 * Syntax: operandsAfterDoubleDash(tokens)
 * Example: operandsAfterDoubleDash(['analyze', '--', '-x.yaml'])   // ['analyze', './-x.yaml']
 */
export function operandsAfterDoubleDash(tokens: readonly string[]): string[] {
  const at = tokens.indexOf('--');
  if (at < 0) return [...tokens];
  const after = tokens.slice(at + 1).map((t) => (t.startsWith('-') && t !== '-' ? `./${t}` : t));
  return [...tokens.slice(0, at), ...after];
}
