import { palette } from './color.js';
import { DEFAULT_WIDTH, type Block, type ReportDocument } from './document.js';
import { table, type Align } from './table.js';
import { wrapParagraph } from './wrapText.js';

export type DocumentFormat = 'text' | 'markdown';

export interface RenderOptions {
  /** ANSI colour (text only, default false). */
  color?: boolean;
  /** Text only: the widest line, columns (default 80); tables wrap or leave out columns, paragraphs wrap. */
  width?: number;
}

/**
 * A report document drawn as terminal text (aligned tables, indented paragraphs, bold headings,
 * PASS green and FAIL / "MISSES" red when colour is on) or as GitHub-flavoured Markdown (pipe
 * tables, charts in fenced code blocks). Every report built as a ReportDocument renders here, so
 * the formats of all reports stay alike.
 *
 * In text, every line fits `width` columns: paragraphs and list items wrap with a hanging indent,
 * tables wrap cells or leave out low-priority columns (table.ts); chart bodies are drawn to the
 * width by whoever builds the document.
 *
 * Syntax: renderDocument(doc, format[, { color, width }])
 * Example: renderDocument({ title: 'T', sections: [], verdict: { pass: true, text: 'PASS' } }, 'markdown')
 *          // '# T\n\n**PASS**\n'
 */
export function renderDocument(doc: ReportDocument, format: DocumentFormat, options: RenderOptions = {}): string {
  return format === 'markdown' ? markdown(doc) : text(doc, options.color ?? false, options.width ?? DEFAULT_WIDTH);
}

function text(doc: ReportDocument, color: boolean, width: number): string {
  const paint = palette(color);
  const flag = (c: string) => (c === 'PASS' ? paint.good(c) : c === 'FAIL' || c.includes('MISSES') ? paint.bad(c) : c);
  const block = (b: Block): string => {
    switch (b.kind) {
      case 'table':
        return table(b.header, color ? b.rows.map((r) => r.map(flag)) : b.rows, { align: b.align, maxWidth: width, ...(b.priority && { priority: b.priority }) });
      case 'pairs':
        return table([], b.pairs.map(([k, v]) => [`${k}:`, v]), { align: ['left', 'left'], maxWidth: width, separate: false });
      case 'list':
        return b.items.map((i) => wrapParagraph(i, width, '  - ', '    ')).join('\n');
      case 'text':
        return wrapParagraph(b.text, width, '  ', '  ');
      case 'chart':
        return `${paint.accent(wrapParagraph(b.title, width, '  ', '  '))}\n${b.body}`;
    }
  };
  const out = [paint.bold(wrapParagraph(doc.title, width, '', '  '))];
  for (const s of doc.sections) {
    out.push('', paint.bold(wrapParagraph(s.title, width, '', '')), ...s.blocks.flatMap((b, i) => (i > 0 ? ['', block(b)] : [block(b)])));
  }
  const verdict = wrapParagraph(doc.verdict.text, width, '', '  ');
  out.push('', doc.verdict.pass ? paint.good(verdict) : paint.bad(verdict));
  return out.join('\n') + '\n';
}

function markdown(doc: ReportDocument): string {
  const block = (b: Block): string => {
    switch (b.kind) {
      case 'table':
        return gfmTable(b.header, b.rows, b.align);
      case 'pairs':
        return gfmTable(['item', 'value'], b.pairs, ['left', 'left']);
      case 'list':
        return b.items.map((i) => `- ${i}`).join('\n');
      case 'text':
        return b.text;
      case 'chart':
        return `**${b.title}**\n\n\`\`\`text\n${b.body}\n\`\`\``;
    }
  };
  const out = [`# ${doc.title}`];
  for (const s of doc.sections) out.push('', `## ${s.title}`, ...s.blocks.flatMap((b) => ['', block(b)]));
  out.push('', `**${doc.verdict.text}**`);
  return out.join('\n') + '\n';
}

/** Escape what would end a GitHub-flavoured Markdown table cell. */
const cell = (s: string) => s.replace(/\\/g, '\\\\').replace(/\|/g, '\\|');

/** A GFM pipe table; an empty header cell becomes a space so the header row stays well-formed. */
function gfmTable(header: string[], rows: string[][], align: Align[] = []): string {
  const rule = header.map((_, i) => ((align[i] ?? (i === 0 ? 'left' : 'right')) === 'right' ? '---:' : ':---'));
  const line = (cells: string[]) => `| ${cells.map(cell).join(' | ')} |`;
  return [line(header.map((h) => h || ' ')), `|${rule.join('|')}|`, ...rows.map(line)].join('\n');
}
