import { jsonValue } from './jsonValue.js';
import type { Project } from '../project/types.js';
import type { MonteCarloResult } from '../tolerance/monteCarlo.js';
import type { ToleranceParameter } from '../tolerance/parameters.js';
import type { ToleranceStudyResult } from '../tolerance/study.js';
import { histogram, type Percentiles } from '../numeric/statistics.js';
import type { Effect, WorstCaseFigure, WorstCaseResult } from '../tolerance/worstCase.js';
import { formatEng } from '../units/index.js';
import type { Block, ReportDocument, Section } from './document.js';
import { percent, tidy, voltsAndLsb, ofFullScale } from './quantities.js';
import { htmlPage } from './htmlPage.js';
import { renderDocument } from './renderDocument.js';
import { svgHistogram } from './svgHistogram.js';
import { warningsSection } from './warnings.js';
import { wrapParagraph } from './wrapText.js';
import type { Align } from './table.js';

type ToleranceStudy = ToleranceStudyResult;

export type ToleranceFormat = 'text' | 'markdown' | 'json' | 'html';

export interface ToleranceReportOptions {
  /** Include the histograms (default true). */
  charts?: boolean;
  /** ANSI colour in text (default false). */
  color?: boolean;
  /** Rows of each histogram (default 12). */
  bins?: number;
  /** Text: the widest line, columns (default 80). */
  width?: number;
}

/**
 * The report of a tolerance study as text (aligned tables, ASCII histograms with the spec limit
 * marked) or GitHub-flavoured Markdown (the same document, drawn by renderDocument), one
 * self-contained HTML page (the same document, SVG histograms with the limits, the JSON embedded), or one JSON
 * object in SI units holding
 * at least worstCase.{worstRipple, droop, settlingTime} and monteCarlo.{samples, seed, yield}, and
 * `warnings` (the nominal circuit's, [{key, message}], empty when none); worstCase.gain is the gain
 * error as a signed fraction of full scale (null when spec.gain is off). The text and Markdown
 * reports end with the "Warnings" section when there are any.
 *
 * Syntax: toleranceReport(project, study, format[, { charts, color, bins }])
 * Example: toleranceReport(p, study, 'json')  // '{ "worstCase": { "worstRipple": { "value": ...'
 */
export function toleranceReport(
  project: Project,
  study: ToleranceStudy,
  format: ToleranceFormat,
  options: ToleranceReportOptions = {},
): string {
  if (format === 'json') return JSON.stringify(toleranceJson(project, study, options.bins ?? 12), null, 2) + '\n';
  if (format === 'html') {
    const bins = options.bins ?? 12;
    const doc = toleranceDocument(project, study, { charts: options.charts ?? true, bins, width: 80 });
    return htmlPage(doc, { charts: histogramPlots(study.monteCarlo, bins), json: JSON.stringify(toleranceJson(project, study, bins), null, 2) + '\n' });
  }
  const width = options.width ?? 80;
  const doc = toleranceDocument(project, study, { charts: options.charts ?? true, bins: options.bins ?? 12, width });
  return renderDocument(doc, format, { color: options.color ?? false, width });
}

// ---------------------------------------------------------------------------------------------
// Content

const FIGURE_NAMES: Record<WorstCaseFigure['figure'], string> = {
  ripple: 'worst ripple',
  droop: 'droop (DC error)',
  inl: 'INL',
  gain: 'gain error',
  settling: 'settling time',
};

/** A fraction of full scale (the gain check's unit) as text. */

function toleranceDocument(
  project: Project,
  study: ToleranceStudy,
  options: { charts: boolean; bins: number; width: number },
): ReportDocument {
  const { worstCase: wc, monteCarlo: mc } = study;
  const lsb = project.lsb ?? null;
  const fullScale = project.pwm.high - project.pwm.low;
  const sections: Section[] = [
    parametersSection(wc.parameters, mc),
    worstCaseSection(wc, lsb, fullScale),
    monteCarloSection(mc, lsb, fullScale),
  ];
  if (options.charts) sections.push(histogramSection(mc, options.bins, options.width));
  const warnings = warningsSection(study.warnings);
  if (warnings) sections.push(warnings);
  return {
    title: `Tolerance study: ${project.file}`,
    sections,
    verdict: { pass: study.pass, text: verdictText(study) },
  };
}

function parametersSection(parameters: ToleranceParameter[], mc: MonteCarloResult): Section {
  const unit = (p: ToleranceParameter) => (p.unit === 'ohm' ? 'Ω' : p.unit);
  const spread = mc.distribution === 'normal' ? 'normal, σ = range/6, cut at the ends' : 'uniform over the range';
  const rows = parameters.map((p) => {
    return [p.label, formatEng(p.nominal, unit(p), 4), formatEng(p.min, unit(p), 4), formatEng(p.max, unit(p), 4), spreadText(p)];
  });
  const blocks: Block[] =
    parameters.length === 0
      ? [{ kind: 'text', text: 'No part has a tolerance: every sample is the nominal circuit.' }]
      : [
          { kind: 'table', header: ['part', 'nominal', 'min', 'max', 'spread'], rows },
          { kind: 'text', text: `Monte Carlo draws each part independently: ${spread}.` },
        ];
  return { title: 'Parts and tolerances', blocks };
}

/**
 * The range of a part relative to its nominal value: '±1 %' when symmetric, '-40 % / +60 %' when
 * not (a driver range such as 15..40 ohm around 25 ohm); '' when the nominal is 0.
 */
export function spreadText(p: { nominal: number; min: number; max: number }): string {
  if (p.nominal === 0) return '';
  const below = (100 * (p.nominal - p.min)) / Math.abs(p.nominal);
  const above = (100 * (p.max - p.nominal)) / Math.abs(p.nominal);
  const show = (x: number) => String(Number(x.toPrecision(2)));
  if (show(below) === show(above)) return `±${show(above)} %`;
  const signed = (x: number) => `${x < 0 ? '-' : '+'}${show(Math.abs(x))} %`;
  return `${signed(-below)} / ${signed(above)}`;
}

function figureText(
  f: WorstCaseFigure | { figure: WorstCaseFigure['figure']; value: number | null },
  lsb: number | null,
  fullScale: number,
): string {
  if (f.value === null) return 'never settles';
  if (f.figure === 'gain') return ofFullScale(tidy(f.value, 1));
  return f.figure === 'settling' ? formatEng(f.value, 's', 4) : voltsAndLsb(tidy(f.value, fullScale), lsb);
}

function limitText(f: WorstCaseFigure, lsb: number | null): string {
  if (f.limit === null) return '-';
  if (f.figure === 'gain') return ofFullScale(f.limit);
  return f.figure === 'settling' ? formatEng(f.limit, 's', 4) : voltsAndLsb(f.limit, lsb);
}

const verdictCell = (pass: boolean | null) => (pass === null ? '-' : pass ? 'PASS' : 'FAIL');

function worstCaseSection(wc: WorstCaseResult, lsb: number | null, fullScale: number): Section {
  const figures = [wc.worstRipple, wc.droop, ...(wc.inl ? [wc.inl] : []), ...(wc.gain ? [wc.gain] : []), wc.settlingTime];
  const nominalValue = (f: WorstCaseFigure): number | null => {
    const n = wc.nominal;
    switch (f.figure) {
      case 'ripple':
        return n.worstRipple.ripple;
      case 'droop':
        return n.droop.error;
      case 'inl':
        return n.inl?.error ?? 0;
      case 'gain':
        return n.gain ?? 0;
      case 'settling':
        return n.settlingTime;
    }
  };
  const rows = figures.map((f) => [
    FIGURE_NAMES[f.figure],
    figureText({ figure: f.figure, value: nominalValue(f) }, lsb, fullScale),
    figureText(f, lsb, fullScale),
    limitText(f, lsb),
    verdictCell(f.pass),
    f.duty === null ? '-' : percent(f.duty),
    f.method === 'corner' ? 'corner' : `searched ${f.searched.join(', ')}`,
  ]);
  const blocks: Block[] = [
    {
      kind: 'table',
      header: ['figure', 'nominal', 'worst case', 'limit', 'check', 'at duty', 'how found'],
      rows,
      align: ['left', 'right', 'right', 'right', 'left', 'right', 'left'],
    },
  ];
  if (wc.parameters.length > 0) {
    const place = (f: WorstCaseFigure, p: number) => {
      const z = f.z[p];
      const q = wc.parameters[p];
      const where = z === -1 ? 'min' : z === 1 ? 'max' : z === 0 ? 'centre' : formatEng(f.values[p], q.unit === 'ohm' ? 'Ω' : q.unit, 4);
      return `${where} (${EFFECT_WORDS[f.effects[p]]})`;
    };
    blocks.push({
      kind: 'table',
      header: ['part', ...figures.map((f) => FIGURE_NAMES[f.figure])],
      rows: wc.parameters.map((q, p) => [q.label, ...figures.map((f) => place(f, p))]),
      align: ['left', ...figures.map((): Align => 'left')],
    });
    blocks.push({
      kind: 'text',
      text:
        'Each cell: where the part sits at that figure\'s worst case, and how raising the part moves the figure ' +
        '(from the sign of its effect at several points of the tolerance box; "mixed" parts were searched along their range).',
    });
    const swept = figures.filter((f) => f.cornerSweepWorse).map((f) => FIGURE_NAMES[f.figure]);
    if (swept.length > 0) {
      blocks.push({
        kind: 'text',
        text: `The sweep over all corners found a worse corner than the sign scan predicted for: ${swept.join(', ')} (shown).`,
      });
    }
  }
  blocks.push({ kind: 'text', text: `${wc.evaluations} circuits evaluated exactly.` });
  return { title: 'Worst case over the tolerance box', blocks };
}

const EFFECT_WORDS: Record<Effect, string> = {
  raises: 'raising it worsens',
  lowers: 'raising it improves',
  none: 'no effect',
  mixed: 'mixed',
};

function monteCarloSection(mc: MonteCarloResult, lsb: number | null, fullScale: number): Section {
  const [lo, hi] = mc.yieldInterval;
  const yieldText = `${percent4(mc.yield)} (${mc.passed} of ${mc.samples}; 95 % interval ${percent4(lo)} to ${percent4(hi)})`;
  const pairs: Array<[string, string]> = [
    ['samples', `${mc.samples}, seed ${mc.seed}, ${mc.distribution} distribution`],
    ['yield', yieldText],
    ['yield target', mc.target === null ? 'none set (tolerance.yield)' : `${percent4(mc.target)}: ${mc.pass ? 'met' : 'NOT met'}`],
  ];
  if (mc.target !== null && mc.target > lo && mc.target < hi) {
    pairs.push(['note', 'the target lies inside the 95 % interval: more samples would settle it']);
  }
  if (mc.values.engineSamples > 0) {
    pairs.push(['note', `${mc.values.engineSamples} samples used the engine's matrix-exponential path`]);
  }
  const specRows = (['ripple', 'droop', 'inl', 'gain', 'settling'] as const)
    .filter((k) => mc.yieldBySpec[k] !== undefined)
    .map((k) => [FIGURE_NAMES[k], percent4(mc.yieldBySpec[k]!)]);
  const volts = (v: number) => voltsAndLsb(tidy(v, fullScale), lsb);
  const seconds = (s: number) => (Number.isFinite(s) ? formatEng(s, 's', 4) : 'never');
  const row = (name: string, p: Percentiles, fmt: (v: number) => string, limit: number | undefined) => [
    name,
    fmt(p.p50),
    fmt(p.p99),
    fmt(p.p999),
    limit === undefined ? '-' : fmt(limit),
  ];
  const { limits } = mc.plan;
  const percentileRows = [
    row('worst ripple', mc.percentiles.worstRipple, volts, limits.ripple),
    row('|droop|', mc.percentiles.droop, volts, limits.droop),
    ...(mc.percentiles.inl ? [row('|INL|', mc.percentiles.inl, volts, limits.inl)] : []),
    ...(mc.percentiles.gain ? [row('|gain error|', mc.percentiles.gain, ofFullScale, limits.gain)] : []),
    row('settling time', mc.percentiles.settlingTime, seconds, limits.settling),
  ];
  const blocks: Block[] = [{ kind: 'pairs', pairs }];
  if (specRows.length > 0) blocks.push({ kind: 'table', header: ['spec', 'yield'], rows: specRows });
  else blocks.push({ kind: 'text', text: 'The spec sets no limit: every sample counts as passing.' });
  blocks.push({ kind: 'table', header: ['figure', 'p50', 'p99', 'p99.9', 'limit'], rows: percentileRows });
  if (mc.neverSettles > 0) {
    blocks.push({ kind: 'text', text: `${mc.neverSettles} samples never settle: their ripple alone leaves the settling band.` });
  }
  return { title: 'Monte Carlo', blocks };
}

function histogramSection(mc: MonteCarloResult, bins: number, width: number): Section {
  const { limits } = mc.plan;
  const volts = (v: number, digits: number) => formatEng(v, 'V', digits);
  const charts: Block[] = [
    { kind: 'chart', title: 'Worst ripple', body: histogramChart(mc.values.worstRipple, bins, limits.ripple, volts, width) },
    {
      kind: 'chart',
      title: '|DC error| (droop)',
      body: histogramChart(mc.values.droop.map(Math.abs), bins, limits.droop, volts, width),
    },
    {
      kind: 'chart',
      title: 'Settling time',
      body: histogramChart(mc.values.settlingTime, bins, limits.settling, (t, digits) => formatEng(t, 's', digits), width),
    },
  ];
  return { title: 'Distributions', blocks: charts };
}

/**
 * The Monte Carlo histograms as SVG figures with the spec limits drawn in: the same bins as the
 * JSON `monteCarlo.histograms` (equal-width bins spanning the samples and the limit).
 */
function histogramPlots(mc: MonteCarloResult, bins: number): string[] {
  const { limits } = mc.plan;
  const one = (id: string, title: string, label: string, unit: string, values: ArrayLike<number>, limit: number | undefined) => {
    const h = histogram(values, bins, limit === undefined ? [] : [limit]);
    return svgHistogram({
      id,
      title: `${title}: ${mc.samples} samples`,
      x: { label, unit },
      lo: h.lo,
      hi: h.hi,
      counts: h.counts,
      notFinite: h.notFinite,
      ...(limit !== undefined && { limit: { at: limit, label: `limit ${formatEng(limit, unit, 3)}` } }),
    });
  };
  return [
    one('mc-ripple', 'Worst ripple', 'worst ripple (peak-to-peak)', 'V', mc.values.worstRipple, limits.ripple),
    one('mc-droop', '|DC error| (droop)', '|droop|', 'V', mc.values.droop.map(Math.abs), limits.droop),
    one('mc-settling', 'Settling time', 'settling time', 's', mc.values.settlingTime, limits.settling),
  ];
}

/**
 * A horizontal ASCII histogram over the range of the data: one row per bin (range, bar, count),
 * bins beyond the limit drawn with `x` instead of `#`, and a rule where the limit lies. When the
 * limit falls inside the data the bins are shifted so that it lies on a bin edge; a limit outside
 * the data gets its rule above or below the bins with the margin to the nearest sample.
 */
function histogramChart(
  values: ArrayLike<number>,
  bins: number,
  limit: number | undefined,
  fmtDigits: (v: number, digits: number) => string,
  lineWidth = 80,
): string {
  const h = histogram(values, bins);
  // No finite sample (every one never settles): no bins to draw, only that row and the limit.
  if (h.notFinite > 0 && h.notFinite === values.length) {
    const barWidth = Math.max(10, Math.min(40, lineWidth - 13 - String(h.notFinite).length - 5));
    const lines = limit === undefined ? [] : [wrapParagraph(`limit ${fmtDigits(limit, 3)}: no sample settles`, lineWidth, `  ${'-'.repeat(13)}  `, ' '.repeat(17))];
    lines.push(`  ${'never settles'} |${'x'.repeat(barWidth)} ${h.notFinite}`);
    return lines.join('\n');
  }
  let { lo, hi } = h;
  let counts = h.counts;
  const inside = limit !== undefined && limit > lo && limit < hi;
  if (inside) {
    const width = (hi - lo) / bins;
    lo = limit - Math.ceil((limit - lo) / width - 1e-9) * width;
    const n = Math.max(1, Math.ceil((hi - lo) / width - 1e-9));
    hi = lo + n * width;
    counts = new Array<number>(n).fill(0);
    for (let i = 0; i < values.length; i++) {
      const v = values[i];
      if (Number.isFinite(v)) counts[Math.min(n - 1, Math.max(0, Math.floor((v - lo) / width)))]++;
    }
  }
  const width = (hi - lo) / counts.length;
  // Enough significant digits that neighbouring bin edges read differently.
  const digits = Math.min(6, Math.max(3, Math.ceil(Math.log10(Math.max(Math.abs(lo), Math.abs(hi)) / width)) + 1));
  const fmt = (v: number) => fmtDigits(v, digits);
  const most = Math.max(1, ...counts, h.notFinite);
  const labels = counts.map((_, i) => `${fmt(lo + i * width)} .. ${fmt(lo + (i + 1) * width)}`);
  const labelWidth = Math.max(13, ...labels.map((l) => l.length));
  // Bars fill what the line width leaves beside the labels and counts (at most 40 columns).
  const countWidth = String(Math.max(...counts, h.notFinite)).length;
  const barWidth = Math.max(10, Math.min(40, lineWidth - labelWidth - countWidth - 5));
  const rule = (text: string) => wrapParagraph(text, lineWidth, `  ${'-'.repeat(labelWidth)}  `, ' '.repeat(labelWidth + 4));
  const bar = (c: number, ch: string) => ch.repeat(c === 0 ? 0 : Math.max(1, Math.round((barWidth * c) / most)));
  const lines: string[] = [];
  if (limit !== undefined && !inside && limit <= lo) lines.push(rule(`limit ${fmt(limit)}: every sample is beyond it`));
  let ruled = false;
  counts.forEach((c, i) => {
    const beyond = limit !== undefined && lo + i * width >= limit - 1e-9 * width;
    if (inside && beyond && !ruled) {
      lines.push(rule(`limit ${fmt(limit!)}`));
      ruled = true;
    }
    lines.push(`  ${labels[i].padStart(labelWidth)} |${bar(c, beyond ? 'x' : '#').padEnd(barWidth)} ${c}`);
  });
  if (limit !== undefined && !inside && limit >= hi) {
    lines.push(rule(`limit ${fmt(limit)}: every sample is within it (largest ${fmt(hi)})`));
  }
  if (h.notFinite > 0) lines.push(`  ${'never settles'.padStart(labelWidth)} |${bar(h.notFinite, 'x').padEnd(barWidth)} ${h.notFinite}`);
  return lines.join('\n');
}

const percent4 = (x: number) => `${(100 * x).toFixed(2)} %`;

function verdictText(study: ToleranceStudy): string {
  const { worstCase: wc, monteCarlo: mc } = study;
  const failing = [wc.worstRipple, wc.droop, wc.inl, wc.gain, wc.settlingTime]
    .filter((f): f is WorstCaseFigure => f !== null && f.pass === false)
    .map((f) => FIGURE_NAMES[f.figure]);
  const parts: string[] = [];
  if (failing.length > 0) parts.push(`worst case fails: ${failing.join(', ')}`);
  if (!mc.pass) parts.push(`yield ${percent4(mc.yield)} is below the target ${percent4(mc.target ?? 0)}`);
  return parts.length === 0
    ? `PASS: every limit holds at the worst case${mc.target !== null ? ' and the yield meets its target' : ''}`
    : `FAIL: ${parts.join('; ')}`;
}

// ---------------------------------------------------------------------------------------------
// JSON

/**
 * The object `tolerance --format json` prints (see toleranceReport), as plain JSON data: what the
 * library API's tolerance() returns.
 *
 * Syntax: toleranceJson(project, study[, bins])
 * Example: toleranceJson(p, await toleranceStudy(p)).monteCarlo.yield
 */
export function toleranceJson(project: Project, study: ToleranceStudy, bins = 12) {
  const { worstCase: wc, monteCarlo: mc } = study;
  const keyed = <T>(values: T[]) => Object.fromEntries(wc.parameters.map((p, i) => [p.key, values[i]]));
  const figure = (f: WorstCaseFigure | null) =>
    f && {
      value: f.value,
      duty: f.duty,
      limit: f.limit,
      pass: f.pass,
      method: f.method,
      searched: f.searched,
      at: keyed(f.values),
      effects: keyed(f.effects),
      cornerSweepWorse: f.cornerSweepWorse,
    };
  const { limits } = mc.plan;
  const body = {
    file: project.file,
    warnings: study.warnings,
    parameters: wc.parameters.map(({ key, label, unit, nominal, min, max }) => ({ key, label, unit, nominal, min, max })),
    settling: { band: mc.plan.band, steps: mc.plan.steps },
    limits,
    worstCase: {
      nominal: wc.nominal,
      worstRipple: figure(wc.worstRipple),
      droop: figure(wc.droop),
      inl: figure(wc.inl),
      gain: figure(wc.gain),
      settlingTime: figure(wc.settlingTime),
      evaluations: wc.evaluations,
      pass: wc.pass,
    },
    monteCarlo: {
      samples: mc.samples,
      seed: mc.seed,
      distribution: mc.distribution,
      yield: mc.yield,
      passed: mc.passed,
      yieldInterval: mc.yieldInterval,
      yieldBySpec: mc.yieldBySpec,
      target: mc.target,
      pass: mc.pass,
      percentiles: mc.percentiles,
      neverSettles: mc.neverSettles,
      engineSamples: mc.values.engineSamples,
      histograms: {
        worstRipple: histogram(mc.values.worstRipple, bins, limits.ripple === undefined ? [] : [limits.ripple]),
        droop: histogram(mc.values.droop.map(Math.abs), bins, limits.droop === undefined ? [] : [limits.droop]),
        settlingTime: histogram(mc.values.settlingTime, bins, limits.settling === undefined ? [] : [limits.settling]),
      },
    },
    pass: study.pass,
  };
  // JSON has no Infinity: a step that never settles is null.
  return jsonValue(body);
}
