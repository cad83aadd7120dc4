import type { TradeoffCurve } from '../design/tradeoffCurves.js';
import type { Candidate, DesignResult } from '../design/types.js';
import type { Project } from '../project/types.js';
import { palette } from './color.js';
import { designDocument, margins, stageCodes } from './designDocument.js';
import type { Block } from './document.js';
import { table, type Align } from './table.js';

export type DesignFormat = 'text' | 'markdown' | 'json';

export interface DesignReportOptions {
  tradeoff?: TradeoffCurve[];
  /** ANSI colour (text only). */
  color?: boolean;
  /** File the chosen design was written to. */
  written?: string;
}

// asciichart colour codes per curve (one stage, two, three), used only when colour is on.
const CURVE_COLORS = ['\x1b[33m', '\x1b[36m', '\x1b[35m'];

/** Escape what would end a GitHub-flavoured Markdown table cell. */
const cell = (s: string) => s.replace(/\\/g, '\\\\').replace(/\|/g, '\\|');

function gfmTable(header: string[], rows: string[][], align: Align[] = []): string {
  const rule = header.map((_, i) => ((align[i] ?? (i === 0 ? 'left' : 'right')) === 'right' ? '---:' : ':---'));
  const line = (cells: string[]) => `| ${cells.map(cell).join(' | ')} |`;
  return [line(header.map((h) => h || ' ')), `|${rule.join('|')}|`, ...rows.map(line)].join('\n');
}

/** JSON has no Infinity or NaN. */
const finite = (v: number | null | undefined) => (v === null || v === undefined || !Number.isFinite(v) ? null : v);

function candidateJson(c: Candidate) {
  return {
    stages: c.stages.map((s) => (s.buffered ? { r: s.r, c: s.c, buffered: true } : { r: s.r, c: s.c })),
    worstRipple: c.worstRipple,
    settlingTime: finite(c.settlingTime),
    droop: c.droop,
    pass: c.pass,
    codes: stageCodes(c),
    rippleDuty: c.rippleDuty,
    droopDuty: c.droopDuty,
    inl: c.inl,
    pinCurrent: c.pinCurrent,
    totalCapacitance: c.totalCapacitance,
    bits: c.bits,
    frequency: c.frequency,
    checks: c.checks.map((k) => ({ ...k, value: finite(k.value) })),
    margins: margins(c),
  };
}

/**
 * The design result as text (terminal), GitHub-flavoured Markdown, or one JSON object (model.md:
 * `candidates` best first, each { stages: [{ r, c }], worstRipple, settlingTime, droop, pass } and
 * more; `evaluated`; all numbers SI, null for never / unknown).
 *
 * Syntax: designReport(project, result, format[, { tradeoff, color, written }])
 * Example: JSON.parse(designReport(p, designSearch(p), 'json')).candidates[0].settlingTime
 */
export function designReport(project: Project, result: DesignResult, format: DesignFormat, options: DesignReportOptions = {}): string {
  if (format === 'json') {
    const body = {
      pass: result.feasible,
      candidates: result.candidates.map(candidateJson),
      evaluated: result.stats.evaluated,
      verified: result.stats.verified,
      space: result.stats.space,
      elapsed: result.stats.elapsed,
      diagnosis: result.diagnosis,
      current: result.current ? candidateJson(result.current) : null,
      resolutions: result.resolutions.map((r) => ({ ...r, best: r.best ? candidateJson(r.best) : null })),
      tradeoff: (options.tradeoff ?? []).map((c) => ({
        stages: c.stages,
        points: c.points.map((p) => ({ ripple: p.ripple, settlingTime: finite(p.settlingTime), best: p.best ? candidateJson(p.best) : null })),
      })),
      basis: result.basis,
      written: options.written ?? null,
    };
    return JSON.stringify(body, null, 2) + '\n';
  }
  const color = format === 'text' && (options.color ?? false);
  const doc = designDocument(project, result, {
    ...(options.tradeoff ? { tradeoff: options.tradeoff } : {}),
    ...(color ? { chartColors: CURVE_COLORS } : {}),
    ...(options.written ? { written: options.written } : {}),
  });
  if (format === 'markdown') {
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
  const paint = palette(color);
  const block = (b: Block): string => {
    switch (b.kind) {
      case 'table': {
        const rows = b.rows.map((r) => r.map((c) => (c === 'PASS' ? paint.good(c) : c === 'FAIL' ? paint.bad(c) : c.includes('MISSES') ? paint.bad(c) : c)));
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
  for (const s of doc.sections) out.push('', paint.bold(s.title), ...s.blocks.flatMap((b, i) => (i > 0 ? ['', block(b)] : [block(b)])));
  out.push('', doc.verdict.pass ? paint.good(doc.verdict.text) : paint.bad(doc.verdict.text));
  return out.join('\n') + '\n';
}
