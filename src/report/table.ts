import { stripAnsi } from './color.js';

export type Align = 'left' | 'right';

export interface TableOptions {
  /** Column alignment; default: left for the first column, right for the others. */
  align?: Align[];
  /** Spaces between columns (default 2). */
  gap?: number;
  /** Left margin in spaces (default 2). */
  indent?: number;
}

/** Width of a cell as a terminal shows it (ANSI codes take no room; one column per code point). */
export function visibleWidth(s: string): number {
  return [...stripAnsi(s)].length;
}

function pad(s: string, width: number, align: Align): string {
  const fill = ' '.repeat(Math.max(0, width - visibleWidth(s)));
  return align === 'right' ? fill + s : s + fill;
}

/**
 * Plain-text table: columns padded to their widest cell, a dashed rule under the header, no
 * vertical lines. Trailing spaces are trimmed. `header` may be empty for a key-value list.
 *
 * Syntax: table(header, rows[, { align, gap, indent }])
 * Example: table(['R', 'C'], [['4.7 kΩ', '100 nF']])
 *          // '  R       C\n  ------  ------\n  4.7 kΩ  100 nF'
 */
export function table(header: string[], rows: string[][], options: TableOptions = {}): string {
  const gap = ' '.repeat(options.gap ?? 2);
  const indent = ' '.repeat(options.indent ?? 2);
  const columns = Math.max(header.length, ...rows.map((r) => r.length));
  const align = (i: number): Align => options.align?.[i] ?? (i === 0 ? 'left' : 'right');
  const widths = Array.from({ length: columns }, (_, i) =>
    Math.max(visibleWidth(header[i] ?? ''), ...rows.map((r) => visibleWidth(r[i] ?? ''))),
  );
  const line = (cells: string[]) =>
    (indent + widths.map((w, i) => pad(cells[i] ?? '', w, align(i))).join(gap)).trimEnd();
  const out: string[] = [];
  if (header.length > 0) {
    out.push(line(header));
    out.push(line(widths.map((w) => '-'.repeat(w))));
  }
  for (const r of rows) out.push(line(r));
  return out.join('\n');
}
