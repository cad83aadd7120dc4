import type { Dirent } from 'node:fs';

/** Commands whose operands are project files. */
const FILE_COMMANDS = new Set(['analyze', 'design', 'tolerance', 'check', 'compare']);

/** Shells `dacsmith completion SHELL` writes a script for (yargs' templates, chosen by $SHELL). */
export const COMPLETION_SHELLS = ['bash', 'zsh'] as const;

/**
 * What to offer for the word being completed when yargs' own candidates (commands, options, the
 * choices of an option) are known: those, unless the word is an operand of a command that reads
 * project files, where the YAML files (`.yaml`, `.yml`) and folders that start with the word are
 * offered instead (folders with a trailing '/'). After an option with a fixed list of values
 * (`--format`), yargs' candidates are those values and are kept. `words` are the command-line words
 * before the current one, without the program name; `list(dir)` reads a folder (none: empty).
 *
 * Syntax: completionCandidates(words, current, yargsCandidates, list)
 * Example: completionCandidates(['analyze'], 'sam', ['--help', '--format'], list)   // ['sample-configs/']
 */
export function completionCandidates(
  words: readonly string[],
  current: string,
  yargsCandidates: readonly string[],
  list: (dir: string) => Dirent[],
): string[] {
  const command = words.find((w) => !w.startsWith('-'));
  const previous = words.at(-1) ?? '';
  // yargs answers with the option's choices (words without a dash) right after such an option
  const afterValueOption = previous.startsWith('-') && yargsCandidates.length > 0 && yargsCandidates.every((c) => !c.startsWith('-'));
  if (command === undefined || !FILE_COMMANDS.has(command) || current.startsWith('-') || afterValueOption) return [...yargsCandidates];
  const slash = current.lastIndexOf('/');
  const dir = slash >= 0 ? current.slice(0, slash + 1) : '';
  const prefix = current.slice(slash + 1);
  const entries = list(dir === '' ? '.' : dir).filter((e) => e.name.startsWith(prefix) && (prefix.startsWith('.') || !e.name.startsWith('.')));
  return entries
    .filter((e) => e.isDirectory() || /\.ya?ml$/i.test(e.name))
    .map((e) => `${dir}${e.name}${e.isDirectory() ? '/' : ''}`)
    .sort();
}

/**
 * `dacsmith completion zsh` (or bash): yargs writes the script for the shell named in $SHELL, so
 * the shell word is taken off the command line and put there. Anything else passes unchanged.
 *
 * Syntax: completionShell(argv, env)
 * Example: completionShell(['completion', 'zsh'], {})   // { argv: ['completion'], shell: '/bin/zsh' }
 */
export function completionShell(argv: readonly string[], env: Record<string, string | undefined>): { argv: string[]; shell: string | undefined } {
  if (argv[0] === 'completion' && (COMPLETION_SHELLS as readonly string[]).includes(argv[1] ?? '')) {
    return { argv: [argv[0], ...argv.slice(2)], shell: `/bin/${argv[1]}` };
  }
  return { argv: [...argv], shell: env.SHELL };
}
