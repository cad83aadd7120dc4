import type { Analysis } from '../engine/analyze.js';
import type { Project } from '../project/types.js';
import { reportDocument } from './content.js';
import type { Block } from './document.js';
import type { Align } from './table.js';

export interface MarkdownOptions {
  /** Include the ASCII charts in fenced code blocks (default true). */
  charts?: boolean;
}

/** Escape what would end a GitHub-flavoured Markdown table cell. */
const cell = (s: string) => s.replace(/\\/g, '\\\\').replace(/\|/g, '\\|');

function gfmTable(header: string[], rows: string[][], align: Align[] = []): string {
  const rule = header.map((_, i) => ((align[i] ?? (i === 0 ? 'left' : 'right')) === 'right' ? '---:' : ':---'));
  const line = (cells: string[]) => `| ${cells.map(cell).join(' | ')} |`;
  return [line(header), `|${rule.join('|')}|`, ...rows.map(line)].join('\n');
}

/**
 * The analysis as GitHub-flavoured Markdown: the same sections as the text report, tables as GFM
 * pipe tables, charts in fenced code blocks.
 *
 * Syntax: markdownReport(project, analysis[, { charts }])
 * Example: markdownReport(p, analyzeProject(p)).startsWith('# ')   // true
 */
export function markdownReport(project: Project, analysis: Analysis, options: MarkdownOptions = {}): string {
  const doc = reportDocument(project, analysis, { charts: options.charts ?? true });
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
