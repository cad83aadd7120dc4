import type { Analysis, ChartSeries } from '../engine/index.js';
import type { Project } from '../project/types.js';
import { reportDocument } from './content.js';
import { renderDocument } from './renderDocument.js';

export interface TextOptions {
  /** The series to chart (engine chartSeries.ts); no charts when absent. */
  charts?: ChartSeries;
  /** ANSI colour (default false; the CLI turns it on for terminals without NO_COLOR). */
  color?: boolean;
  /** Widest line, columns (default 80). */
  width?: number;
}

// asciichart colour codes (ANSI SGR), used only when colour is on.
const SERIES_COLORS = ['\x1b[36m', '\x1b[36m'];

/**
 * The analysis as a plain-text terminal report (aligned tables, ASCII charts, cautions, verdict).
 *
 * Syntax: textReport(project, analysis[, { charts, color, width }])
 * Example: process.stdout.write(textReport(p, a, { charts: chartSeries(a, p.pwm.duty, { columns: chartColumns(80) }) }))
 */
export function textReport(project: Project, analysis: Analysis, options: TextOptions = {}): string {
  const color = options.color ?? false;
  const doc = reportDocument(project, analysis, {
    ...(options.charts ? { charts: options.charts } : {}),
    ...(color ? { chartColors: SERIES_COLORS } : {}),
    ...(options.width && { width: options.width }),
  });
  return renderDocument(doc, 'text', { color, ...(options.width && { width: options.width }) });
}
