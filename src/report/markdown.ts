import type { Analysis } from '../engine/index.js';
import type { Project } from '../project/types.js';
import { reportDocument } from './content.js';
import { renderDocument } from './renderDocument.js';

export interface MarkdownOptions {
  /** Include the ASCII charts in fenced code blocks (default true). */
  charts?: boolean;
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
  return renderDocument(doc, 'markdown');
}
