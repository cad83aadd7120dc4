import { stripAnsi } from './color.js';

/** Width of a text as a terminal shows it (ANSI codes take no room; one column per code point). */
export function textWidth(s: string): number {
  return [...stripAnsi(s)].length;
}

/**
 * The pieces a line may break between: words, with a number kept together with the unit that
 * follows it ('4.7 kΩ', '5.0 %', '6 bit'), '@' with what follows it ('@ 6 bit') and a joining
 * '/' or '+' with what it follows ('1 kΩ /').
 *
 * Syntax: wrapChunks(text)
 * Example: wrapChunks('ripple 0.46 LSB @ 6 bit')   // ['ripple', '0.46 LSB', '@ 6 bit']
 */
export function wrapChunks(text: string): string[] {
  const words = text.split(' ').filter((w) => w !== '');
  const out: string[] = [];
  for (let i = 0; i < words.length; i++) {
    let w = words[i];
    // '@' and a lone sign belong to what follows; a number to its unit.
    while (i + 1 < words.length && (/^(?:@|[-+±~≈<>≤≥])$/.test(stripAnsi(w)) || (/\d$/.test(stripAnsi(w)) && /^[^\d\s(\-+=<>~@]/u.test(stripAnsi(words[i + 1])) && !/^(?:to|and|or|at|of|in|from|for|by|on|x)\b/.test(words[i + 1])))) {
      w = `${w} ${words[++i]}`;
    }
    // A joining sign stays at the end of the line it continues: '1 kΩ /', '1k0-680n +'.
    while (i + 1 < words.length && /^[/+&]$/.test(stripAnsi(words[i + 1]))) w = `${w} ${words[++i]}`;
    out.push(w);
  }
  return out;
}

/** Split a chunk wider than `width` into pieces of `width` columns (ANSI codes are dropped). */
function hardSplit(chunk: string, width: number): string[] {
  const chars = [...stripAnsi(chunk)];
  const out: string[] = [];
  for (let i = 0; i < chars.length; i += width) out.push(chars.slice(i, i + width).join(''));
  return out;
}

/**
 * Greedy word wrap to `width` columns at the breaks of wrapChunks; a piece wider than the line is
 * split hard. A text that fits comes back as one line unchanged (colour codes included).
 *
 * Syntax: wrapText(text, width)
 * Example: wrapText('settling 7.35 ms, ripple 0.25 LSB', 16)   // ['settling', '7.35 ms, ripple', '0.25 LSB']
 */
export function wrapText(text: string, width: number): string[] {
  if (textWidth(text) <= width) return [text];
  const w = Math.max(1, width);
  const lines: string[] = [];
  let line = '';
  for (const chunk of wrapChunks(text)) {
    const pieces = textWidth(chunk) > w ? hardSplit(chunk, w) : [chunk];
    for (const piece of pieces) {
      if (line === '') line = piece;
      else if (textWidth(line) + 1 + textWidth(piece) <= w) line = `${line} ${piece}`;
      else {
        lines.push(line);
        line = piece;
      }
    }
  }
  if (line !== '' || lines.length === 0) lines.push(line);
  return lines;
}

/**
 * How many lines wrapText(text, width) gives, from the widths of the text's chunks alone
 * (`chunkWidths` = wrapChunks(text).map(textWidth), `whole` = textWidth(text)): the same greedy
 * wrap, counted without building strings, so a table can try many widths cheaply.
 *
 * Syntax: wrappedLineCount(chunkWidths, whole, width)
 * Example: wrappedLineCount([8, 15, 8], 33, 16)   // 3, as wrapText('settling 7.35 ms, ripple 0.25 LSB', 16)
 *
 * See also: wrapText
 */
export function wrappedLineCount(chunkWidths: readonly number[], whole: number, width: number): number {
  if (whole <= width) return 1;
  const w = Math.max(1, width);
  let lines = 0;
  // width of the line being filled; -1: empty
  let line = -1;
  for (const cw of chunkWidths) {
    // a chunk wider than the line is split hard into pieces of w columns (the last one shorter)
    const pieces = cw > w ? Math.ceil(cw / w) : 1;
    for (let k = 0; k < pieces; k++) {
      const piece = pieces === 1 ? cw : k < pieces - 1 ? w : cw - w * (pieces - 1);
      if (line < 0) line = piece;
      else if (line + 1 + piece <= w) line += 1 + piece;
      else {
        lines++;
        line = piece;
      }
    }
  }
  return line >= 0 || lines === 0 ? lines + 1 : lines;
}

/** The widest piece of a text wrapChunks gives (its narrowest width without a hard split). */
export function longestChunk(text: string): number {
  return Math.max(0, ...wrapChunks(text).map(textWidth));
}

/**
 * A paragraph wrapped to `width` columns with a first-line prefix and a hanging indent for the rest.
 *
 * Syntax: wrapParagraph(text, width, first, rest)
 * Example: wrapParagraph('a b c', 5, '  - ', '    ')   // '  - a\n    b\n    c'
 */
export function wrapParagraph(text: string, width: number, first: string, rest: string): string {
  const room = Math.max(8, width - Math.max(textWidth(first), textWidth(rest)));
  return wrapText(text, room)
    .map((l, i) => `${i === 0 ? first : rest}${l}`)
    .join('\n');
}
