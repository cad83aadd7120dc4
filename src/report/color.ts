/** ANSI styling for terminal reports; every function is the identity when colour is off. */
export interface Palette {
  bold: (s: string) => string;
  dim: (s: string) => string;
  good: (s: string) => string;
  bad: (s: string) => string;
  warn: (s: string) => string;
  accent: (s: string) => string;
}

const wrap = (open: number, close: number) => (s: string) => `\x1b[${open}m${s}\x1b[${close}m`;
const plain = (s: string) => s;

/**
 * A palette of styling functions, ANSI SGR codes when `enabled`, plain text otherwise.
 *
 * Syntax: palette(enabled)
 * Example: palette(false).bad('FAIL')   // 'FAIL'
 */
export function palette(enabled: boolean): Palette {
  if (!enabled) return { bold: plain, dim: plain, good: plain, bad: plain, warn: plain, accent: plain };
  return {
    bold: wrap(1, 22),
    dim: wrap(2, 22),
    good: wrap(32, 39),
    bad: wrap(31, 39),
    warn: wrap(33, 39),
    accent: wrap(36, 39),
  };
}

/**
 * Whether to colour output to a stream: only on a terminal, and never when NO_COLOR is set to a
 * non-empty value (the NO_COLOR convention, no-color.org).
 *
 * Syntax: colorWanted(isTTY, env)
 * Example: colorWanted(process.stdout.isTTY, process.env)
 */
export function colorWanted(isTTY: boolean | undefined, env: Record<string, string | undefined>): boolean {
  if (env.NO_COLOR !== undefined && env.NO_COLOR !== '') return false;
  return isTTY === true;
}

/** Strip ANSI SGR sequences (to measure what a terminal shows). */
export function stripAnsi(s: string): string {
  // eslint-disable-next-line no-control-regex
  return s.replace(/\x1b\[[0-9;]*m/g, '');
}
