import type { Analysis, ChartSeries } from '../engine/index.js';
import type { Project } from '../project/types.js';
import { reportDocument } from './content.js';
import { renderDocument } from './renderDocument.js';

export interface MarkdownOptions {
  /** The series to chart in fenced code blocks (engine chartSeries.ts); no charts when absent. */
  charts?: ChartSeries;
}

/**
 * The analysis as GitHub-flavoured Markdown: the same sections as the text report, tables as GFM
 * pipe tables, charts in fenced code blocks.
 *
 * Syntax: markdownReport(project, analysis[, { charts }])
 * Example: markdownReport(p, a, { charts: chartSeries(a, p.pwm.duty) }).startsWith('# ')   // true
 */
export function markdownReport(project: Project, analysis: Analysis, options: MarkdownOptions = {}): string {
  const doc = reportDocument(project, analysis, options.charts ? { charts: options.charts } : {});
  return renderDocument(doc, 'markdown');
}
