import { longestChunk, textWidth, wrapChunks, wrappedLineCount, wrapParagraph, wrapText } from './wrapText.js';

export type Align = 'left' | 'right';

export interface TableOptions {
  /** Column alignment; default: left for the first column, right for the others. */
  align?: Align[];
  /** Spaces between columns (default 2). */
  gap?: number;
  /** Left margin in spaces (default 2). */
  indent?: number;
  /** Widest line allowed, columns (default: no limit). */
  maxWidth?: number;
  /**
   * Per column: how much it matters when the table is too wide. Columns with a priority below 1
   * may be left out (lowest first) before the others are wrapped hard; the rest are never dropped.
   */
  priority?: number[];
  /** Blank line between rows when some row wraps onto several lines (default true). */
  separate?: boolean;
}

/** Width of a cell as a terminal shows it (ANSI codes take no room; one column per code point). */
export function visibleWidth(s: string): number {
  return textWidth(s);
}

function pad(s: string, width: number, align: Align): string {
  const fill = ' '.repeat(Math.max(0, width - visibleWidth(s)));
  return align === 'right' ? fill + s : s + fill;
}

/** Column widths chosen to fit, the columns kept, and the names of the ones left out. */
interface Layout {
  keep: number[];
  /** Null: no column layout fits without splitting words; draw one record per row instead. */
  widths: number[] | null;
}

/** A column wider than this is wrapped before a droppable column is left out. */
const COMFORT = 20;

/**
 * Choose columns and widths so that the table fits `maxWidth`:
 * 1. natural widths when they fit;
 * 2. else wrap: each column may shrink to its comfortable width (its header wraps freely, its
 *    cells down to 20 columns or their widest unbreakable piece), where that adds the fewest lines;
 * 3. else leave out the lowest-priority droppable column and try 2 again;
 * 4. else shrink each column to its widest unbreakable piece;
 * 5. else give up columns: the caller draws one record per row.
 */
function layout(header: string[], rows: string[][], columns: number, room: (n: number) => number, priority: number[]): Layout {
  const all = Array.from({ length: columns }, (_, i) => i);
  const cells = (i: number) => [header[i] ?? '', ...rows.map((r) => r[i] ?? '')];
  const natural = all.map((i) => Math.max(0, ...cells(i).map(visibleWidth)));
  const chunk = all.map((i) => Math.max(longestChunk(header[i] ?? ''), ...rows.map((r) => longestChunk(r[i] ?? ''))));
  // Headers may wrap freely; body cells down to 20 columns.
  const body = all.map((i) => Math.max(0, ...rows.map((r) => visibleWidth(r[i] ?? ''))));
  const comfort = all.map((i) => Math.max(chunk[i], Math.min(body[i], COMFORT)));
  // Each cell's width and chunk widths, measured once (row 0 is the header).
  const measures = new Map<number, { whole: number; chunks: number[] }>();
  const measured = (row: number, column: number) => {
    const key = row * columns + column;
    let m = measures.get(key);
    if (m === undefined) {
      const text = (row === 0 ? header : rows[row - 1])[column] ?? '';
      m = { whole: visibleWidth(text), chunks: wrapChunks(text).map(textWidth) };
      measures.set(key, m);
    }
    return m;
  };

  /**
   * Narrow the columns one step at a time until the sum fits, none below its floor, each step
   * taken where it adds the fewest lines to the table (then the widest column); null when impossible.
   */
  const shrink = (keep: number[], floor: number[]): number[] | null => {
    const budget = room(keep.length);
    const widths = keep.map((i) => natural[i]);
    const floors = keep.map((i) => Math.min(natural[i], floor[i]));
    if (floors.reduce((a, b) => a + b, 0) > budget) return null;
    let total = widths.reduce((a, b) => a + b, 0);
    // Lines the table takes with these widths (header and body rows): the cost of a step. Each
    // column's line counts at a width are counted once (a step changes one column's width), from
    // each cell's chunk widths (wrappedLineCount: wrapText's count without wrapping strings).
    const grid = [header, ...rows];
    const wrapped = new Map<number, number[]>();
    const linesAt = (i: number, width: number): number[] => {
      const key = i * 65536 + width;
      let counts = wrapped.get(key);
      if (counts === undefined) {
        counts = grid.map((r, k) => {
          const m = measured(k, i);
          return wrappedLineCount(m.chunks, m.whole, width);
        });
        wrapped.set(key, counts);
      }
      return counts;
    };
    const height = (w: number[]) => {
      const columnsAt = keep.map((i, j) => linesAt(i, w[j]));
      let sum = 0;
      for (let r = 0; r < grid.length; r++) {
        let most = 1;
        for (const counts of columnsAt) if (counts[r] > most) most = counts[r];
        sum += most;
      }
      return sum;
    };
    let now = height(widths);
    const costs = new Map<number, number>();
    const cost = (j: number) => {
      if (!costs.has(j)) {
        widths[j]--;
        costs.set(j, height(widths) - now);
        widths[j]++;
      }
      return costs.get(j)!;
    };
    while (total > budget) {
      let k = -1;
      for (let j = 0; j < widths.length; j++) {
        if (widths[j] <= floors[j]) continue;
        if (k < 0 || cost(j) < cost(k) || (cost(j) === cost(k) && widths[j] > widths[k])) k = j;
      }
      widths[k]--;
      total--;
      now += cost(k);
      costs.clear();
    }
    return widths;
  };

  let keep = all;
  const droppable = all.filter((i) => (priority[i] ?? 1) < 1).sort((a, b) => (priority[a] ?? 1) - (priority[b] ?? 1) || b - a);
  for (;;) {
    const widths = shrink(keep, comfort);
    if (widths) return { keep, widths };
    const next = droppable.find((i) => keep.includes(i));
    if (next === undefined) break;
    keep = keep.filter((i) => i !== next);
  }
  const widths = shrink(keep, chunk);
  // Too narrow for columns without splitting numbers: one record per row, every column kept.
  return widths ? { keep, widths } : { keep: all, widths: null };
}

/**
 * Plain-text table: columns padded to their widest cell, a dashed rule under the header, no
 * vertical lines. Trailing spaces are trimmed. `header` may be empty for a key-value list.
 * With `maxWidth`, a table that would be wider wraps its cells at word breaks (keeping a number
 * with its unit), leaves out low-priority columns (`priority` below 1, named in a note under the
 * table) and, as a last resort, splits long words; rows that take several lines are separated by
 * blank lines.
 *
 * Syntax: table(header, rows[, { align, gap, indent, maxWidth, priority, separate }])
 * Example: table(['R', 'C'], [['4.7 kΩ', '100 nF']])
 *          // '  R       C\n  ------  ------\n  4.7 kΩ  100 nF'
 */
export function table(header: string[], rows: string[][], options: TableOptions = {}): string {
  const gapWidth = options.gap ?? 2;
  const gap = ' '.repeat(gapWidth);
  const indentWidth = options.indent ?? 2;
  const indent = ' '.repeat(indentWidth);
  const columns = Math.max(header.length, ...rows.map((r) => r.length));
  const alignOf = (i: number): Align => options.align?.[i] ?? (i === 0 ? 'left' : 'right');
  const max = options.maxWidth ?? Infinity;
  const room = (n: number) => max - indentWidth - gapWidth * Math.max(0, n - 1);
  const { keep, widths: fitted } = layout(header, rows, columns, room, options.priority ?? []);
  if (fitted === null) return records(header, rows, indent, max);
  const widths = fitted;
  const dropped = Array.from({ length: columns }, (_, i) => i).filter((i) => !keep.includes(i));

  /** One table row as one or more text lines. */
  const lines = (cells: string[]): string[] => {
    const wrapped = keep.map((i, k) => wrapText(cells[i] ?? '', widths[k]));
    const height = Math.max(1, ...wrapped.map((w) => w.length));
    return Array.from({ length: height }, (_, l) =>
      (indent + keep.map((i, k) => pad(wrapped[k][l] ?? '', widths[k], alignOf(i))).join(gap)).trimEnd(),
    );
  };
  const out: string[] = [];
  if (header.length > 0) {
    out.push(...lines(header));
    out.push((indent + widths.map((w) => '-'.repeat(w)).join(gap)).trimEnd());
  }
  const body = rows.map(lines);
  const tall = (options.separate ?? true) && body.some((b) => b.length > 1);
  body.forEach((b, k) => {
    if (tall && k > 0) out.push('');
    out.push(...b);
  });
  if (dropped.length > 0) {
    const names = dropped.map((i) => header[i] || `column ${i + 1}`).join(', ');
    out.push(...wrapText(`(not shown at this width: ${names}; a wider --width or --format markdown shows them)`, Math.max(20, max - indentWidth)).map((l) => indent + l));
  }
  return out.join('\n');
}

/**
 * A table too wide for any column layout, as one record per row: the first cell as a heading,
 * then `column: value` lines (or bare values without a header), wrapped to `max` columns.
 */
function records(header: string[], rows: string[][], indent: string, max: number): string {
  const out: string[] = [];
  const inner = `${indent}  `;
  rows.forEach((r, k) => {
    if (k > 0 && header.length > 0) out.push('');
    out.push(wrapParagraph(r[0] ?? '', max, indent, inner));
    for (let i = 1; i < r.length; i++) {
      const label = header[i] ? `${header[i]}: ` : '';
      out.push(wrapParagraph(`${label}${r[i] ?? ''}`, max, inner, `${inner}  `));
    }
  });
  return out.join('\n');
}
