import type { Block, ReportDocument, Section } from './document.js';
import { htmlEscape } from './htmlEscape.js';

export interface HtmlPageOptions {
  /** Plot figures (svgPlot.ts, svgHistogram.ts), shown in a "Plots" section. */
  plots?: string[];
  /** Put the plots before the first section with one of these titles (default: Warnings, Cautions; else last). */
  plotsBefore?: string[];
  /** Figures that take the place of the document's ASCII chart blocks, in document order. */
  charts?: string[];
  /** The command's JSON report, embedded verbatim so the page carries the same numbers. */
  json?: string;
}

// Colours: a light and a dark palette (prefers-color-scheme) and a print style (black on white,
// no backgrounds); series also differ by dash pattern so that a grey print tells them apart.
const STYLE = `
:root{color-scheme:light dark;--fg:#1b1f24;--bg:#ffffff;--muted:#5b6470;--grid:#e3e6ea;--frame:#8a939e;--band:rgba(46,125,50,.14);
--s0:#1f5fbf;--s1:#c2410c;--s2:#2e7d32;--s3:#7b3fa0;--mark:#6b7280;--bar:#4a7fc1;--over:#c62828;--pass:#2e7d32;--fail:#c62828;--rule:#d0d5db}
@media (prefers-color-scheme:dark){:root{--fg:#e6e9ed;--bg:#16191d;--muted:#a3acb7;--grid:#2c3137;--frame:#6b7480;--band:rgba(129,199,132,.18);
--s0:#7fb0ff;--s1:#ffa36b;--s2:#81c784;--s3:#ce93d8;--mark:#9aa4b0;--bar:#6f9fdc;--over:#ef6b6b;--pass:#81c784;--fail:#ef6b6b;--rule:#3a4047}}
*{box-sizing:border-box}
body{margin:0 auto;max-width:60rem;padding:1.5rem;font:15px/1.45 system-ui,-apple-system,"Segoe UI",Roboto,sans-serif;color:var(--fg);background:var(--bg)}
h1{font-size:1.5rem;margin:0 0 .5rem}h2{font-size:1.15rem;margin:1.8rem 0 .6rem;border-bottom:1px solid var(--rule);padding-bottom:.2rem}
.verdict{font-weight:600;padding:.5rem .8rem;border-left:4px solid}.verdict.pass{border-color:var(--pass);color:var(--pass)}.verdict.fail{border-color:var(--fail);color:var(--fail)}
table{border-collapse:collapse;margin:.5rem 0;font-variant-numeric:tabular-nums}th,td{padding:.2rem .6rem;border-bottom:1px solid var(--rule);vertical-align:top}
th{text-align:left;font-weight:600}td.r,th.r{text-align:right}dl.pairs{display:grid;grid-template-columns:max-content 1fr;gap:.15rem 1rem}dl.pairs dt{color:var(--muted)}dl.pairs dd{margin:0}
pre{white-space:pre-wrap;font-size:12px;overflow-x:auto}details{margin-top:1rem}
figure.plot{margin:1rem 0;break-inside:avoid;page-break-inside:avoid}figure.plot figcaption{font-weight:600;margin-bottom:.3rem}
svg.plot-svg{width:100%;height:auto;max-width:48rem;display:block;font:12px system-ui,sans-serif}
svg .grid line{stroke:var(--grid);stroke-width:1}svg .frame{fill:none;stroke:var(--frame)}svg text{fill:var(--fg)}svg .tick{fill:var(--muted);font-size:11px}
svg .series{fill:none;stroke-width:2;stroke-linejoin:round}svg .dot{stroke:none}
.s0{stroke:var(--s0);fill:var(--s0)}.s1{stroke:var(--s1);fill:var(--s1);stroke-dasharray:7 4}.s2{stroke:var(--s2);fill:var(--s2);stroke-dasharray:2 3}.s3{stroke:var(--s3);fill:var(--s3);stroke-dasharray:10 3 2 3}
path.series,line.series{fill:none}svg .mark line{stroke:var(--mark);stroke-dasharray:4 3}svg .mark text{fill:var(--mark);font-size:11px;paint-order:stroke;stroke:var(--bg);stroke-width:3px;stroke-linejoin:round}svg .mark.limit line{stroke:var(--over);stroke-dasharray:none;stroke-width:2}svg .mark.limit text{fill:var(--over);stroke:var(--bg)}
svg .band{fill:var(--band)}svg .bar{fill:var(--bar)}svg .bar.over{fill:var(--over)}
ul.legend{list-style:none;padding:0;margin:.2rem 0;display:flex;flex-wrap:wrap;gap:.3rem 1.2rem;font-size:13px}ul.legend svg{margin-right:.4rem;vertical-align:middle}ul.legend line{stroke-width:3}
.note{color:var(--muted);font-size:13px}
@media print{:root{color-scheme:light;--fg:#000;--bg:#fff;--muted:#333;--grid:#ddd;--frame:#555;--rule:#999;--band:rgba(0,0,0,.08);
--s0:#1f5fbf;--s1:#c2410c;--s2:#2e7d32;--s3:#7b3fa0;--mark:#444;--bar:#4a7fc1;--over:#c62828;--pass:#2e7d32;--fail:#c62828}
body{max-width:none;padding:0;font-size:11pt}details{display:none}h2{break-after:avoid;page-break-after:avoid}a{color:inherit}}
`;

const NUMERIC = /^[-+±]?[\d.]/;

function blockHtml(block: Block, nextChart: () => string | undefined): string {
  switch (block.kind) {
    case 'table': {
      const align = (i: number, cell: string) => (block.align ? block.align[i] === 'right' : NUMERIC.test(cell) && i > 0) ? ' class="r"' : '';
      const head = block.header.map((h, i) => `<th${block.align?.[i] === 'right' ? ' class="r"' : ''}>${htmlEscape(h)}</th>`).join('');
      const rows = block.rows.map((r) => `<tr>${r.map((c, i) => `<td${align(i, c)}>${htmlEscape(c)}</td>`).join('')}</tr>`).join('\n');
      return `<table><thead><tr>${head}</tr></thead><tbody>\n${rows}\n</tbody></table>`;
    }
    case 'pairs':
      return `<dl class="pairs">${block.pairs.map(([k, v]) => `<dt>${htmlEscape(k)}</dt><dd>${htmlEscape(v)}</dd>`).join('')}</dl>`;
    case 'list':
      return `<ul>${block.items.map((i) => `<li>${htmlEscape(i)}</li>`).join('')}</ul>`;
    case 'text':
      return `<p>${htmlEscape(block.text)}</p>`;
    case 'chart': {
      const plot = nextChart();
      if (plot !== undefined) return plot;
      // ASCII charts belong to the terminal; a page keeps one only where no plot replaces it.
      return `<figure><figcaption>${htmlEscape(block.title)}</figcaption><pre>${htmlEscape(block.body)}</pre></figure>`;
    }
  }
}

const sectionHtml = (s: Section, nextChart: () => string | undefined) =>
  `<section>\n<h2>${htmlEscape(s.title)}</h2>\n${s.blocks.map((b) => blockHtml(b, nextChart)).join('\n')}\n</section>`;

/**
 * A report document (document.ts) as one self-contained HTML page: inline CSS with light, dark
 * (prefers-color-scheme) and print styles, the sections as HTML tables and lists, the plots as
 * inline SVG, and the command's JSON in a collapsed block (`<script type="application/json"
 * id="report-data">` carries it for other programs too; no script runs, nothing is fetched).
 *
 * Syntax: htmlPage(doc[, { plots, plotsBefore, charts, json }])
 * Example: htmlPage(reportDocument(p, a), { plots: [svgPlot(...)], json: jsonReport(p, a) }).startsWith('<!DOCTYPE html>')
 */
export function htmlPage(doc: ReportDocument, options: HtmlPageOptions = {}): string {
  const charts = [...(options.charts ?? [])];
  const sections = doc.sections.map((s) => sectionHtml(s, () => charts.shift()));
  if (options.plots && options.plots.length > 0) {
    const before = options.plotsBefore ?? ['Warnings', 'Cautions'];
    const at = doc.sections.findIndex((s) => before.includes(s.title));
    const plots = `<section class="plots">\n<h2>Plots</h2>\n${options.plots.join('')}</section>`;
    sections.splice(at < 0 ? sections.length : at, 0, plots);
  }
  const json = options.json
    ? // '<' is escaped so that no text inside the JSON can close the script element
      `<script type="application/json" id="report-data">${options.json.trim().replace(/</g, '\\u003c')}</script>\n` +
      `<details><summary>The same report as JSON (SI units)</summary><pre>${htmlEscape(options.json.trim())}</pre></details>`
    : '';
  return [
    '<!DOCTYPE html>',
    '<html lang="en">',
    '<head>',
    '<meta charset="utf-8">',
    '<meta name="viewport" content="width=device-width, initial-scale=1">',
    // nothing may be fetched: no scripts, images, fonts or styles from anywhere
    `<meta http-equiv="Content-Security-Policy" content="default-src 'none'; style-src 'unsafe-inline'; img-src data:">`,
    `<title>${htmlEscape(doc.title)}</title>`,
    `<style>${STYLE}</style>`,
    '</head>',
    '<body>',
    `<h1>${htmlEscape(doc.title)}</h1>`,
    `<p class="verdict ${doc.verdict.pass ? 'pass' : 'fail'}">${htmlEscape(doc.verdict.text)}</p>`,
    ...sections,
    json,
    '</body>',
    '</html>',
    '',
  ].join('\n');
}
