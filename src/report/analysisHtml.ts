import type { Analysis, ChartSeries } from '../engine/index.js';
import type { Project } from '../project/types.js';
import { analysisPlots } from './analysisPlots.js';
import { reportDocument } from './content.js';
import { htmlPage } from './htmlPage.js';
import { jsonReport } from './json.js';

export { HTML_PLOT_POINTS } from './analysisPlots.js';

/**
 * The analysis as one self-contained HTML page: the text report's sections (inputs, output at each
 * duty, spec, figures, warnings, cautions) as HTML tables, the plots as inline SVG, and the
 * JSON report (jsonReport) embedded, so the page carries exactly the JSON's numbers.
 *
 * Syntax: analysisHtml(project, analysis[, series])
 * Example: analysisHtml(p, a, chartSeries(a, p.pwm.duty, { columns: 160 })).includes('data-plot="magnitude"')   // true
 */
export function analysisHtml(project: Project, analysis: Analysis, series?: ChartSeries): string {
  return htmlPage(reportDocument(project, analysis), {
    ...(series && { plots: analysisPlots(analysis, series) }),
    json: jsonReport(project, analysis),
  });
}
