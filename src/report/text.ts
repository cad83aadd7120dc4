import type { Analysis } from '../engine/analyze.js';
import type { Project } from '../project/types.js';
import { palette } from './color.js';
import { reportDocument } from './content.js';
import type { Block } from './document.js';
import { table } from './table.js';

export interface TextOptions {
  /** Include the ASCII charts (default true). */
  charts?: boolean;
  /** ANSI colour (default false; the CLI turns it on for terminals without NO_COLOR). */
  color?: boolean;
}

// asciichart colour codes (ANSI SGR), used only when colour is on.
const SERIES_COLORS = ['\x1b[36m', '\x1b[36m'];

/**
 * The analysis as a plain-text terminal report (aligned tables, ASCII charts, cautions, verdict).
 *
 * Syntax: textReport(project, analysis[, { charts, color }])
 * Example: process.stdout.write(textReport(p, analyzeProject(p), { charts: false }))
 */
export function textReport(project: Project, analysis: Analysis, options: TextOptions = {}): string {
  const color = options.color ?? false;
  const paint = palette(color);
  const doc = reportDocument(project, analysis, {
    charts: options.charts ?? true,
    ...(color ? { chartColors: SERIES_COLORS } : {}),
  });
  const block = (b: Block): string => {
    switch (b.kind) {
      case 'table': {
        const rows = b.rows.map((r) => r.map((c) => (c === 'PASS' ? paint.good(c) : c === 'FAIL' ? paint.bad(c) : c)));
        return table(b.header, rows, { align: b.align });
      }
      case 'pairs':
        return table([], b.pairs.map(([k, v]) => [`${k}:`, v]), { align: ['left', 'left'] });
      case 'list':
        return b.items.map((i) => `  - ${i}`).join('\n');
      case 'text':
        return `  ${b.text}`;
      case 'chart':
        return `  ${paint.accent(b.title)}\n${b.body}`;
    }
  };
  const out = [paint.bold(doc.title)];
  for (const s of doc.sections) {
    out.push('', paint.bold(s.title), ...s.blocks.flatMap((b, i) => (i > 0 ? ['', block(b)] : [block(b)])));
  }
  out.push('', doc.verdict.pass ? paint.good(doc.verdict.text) : paint.bad(doc.verdict.text));
  return out.join('\n') + '\n';
}
