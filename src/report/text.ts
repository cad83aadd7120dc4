import type { Analysis } from '../engine/index.js';
import type { Project } from '../project/types.js';
import { reportDocument } from './content.js';
import { renderDocument } from './renderDocument.js';

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
  const doc = reportDocument(project, analysis, {
    charts: options.charts ?? true,
    ...(color ? { chartColors: SERIES_COLORS } : {}),
  });
  return renderDocument(doc, 'text', { color });
}
