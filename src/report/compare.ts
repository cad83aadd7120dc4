import { ofFullScale } from './quantities.js';
import { jsonValue } from './jsonValue.js';
import { plot } from 'asciichart';
import type { Analysis, CompareOverlays, Overlay } from '../engine/index.js';
import type { NetworkStage } from '../circuit/network.js';
import type { Project } from '../project/types.js';
import { formatEng } from '../units/index.js';
import { axisFormatter } from './axis.js';
import { palette, type Palette } from './color.js';
import type { ReportDocument } from './document.js';
import { htmlPage } from './htmlPage.js';
import { svgPlot } from './svgPlot.js';
import { table } from './table.js';
import { wrapParagraph } from './wrapText.js';

/** One side of a comparison: where it came from, the project and its analysis. */
export interface CompareSide {
  /** 'base.yaml', or 'main:boards/dac.yaml' for a file at a git revision. */
  label: string;
  project: Project;
  analysis: Analysis;
}

export type CompareFormat = 'text' | 'markdown' | 'json' | 'html';

export interface CompareOptions {
  /** ANSI colour in the text format (default false). */
  color?: boolean;
  /** Plot rows per chart (default 12). */
  height?: number;
  /** Text: the widest line, columns (default 80); charts take what it leaves beside their labels. */
  width?: number;
}

type InputValue = number | string | boolean | null;

/** An input that differs between the two files (`key` is the project-file path). */
interface InputRow {
  key: string;
  label: string;
  unit: string;
  base: InputValue;
  head: InputValue;
}

/** A figure of the analysis on both sides; null when it does not exist (never settles). */
interface MetricRow {
  key: string;
  label: string;
  unit: string;
  base: number | null;
  head: number | null;
  delta: number | null;
  /** Relative change, % of |base|; null when base is 0 or missing, or for logarithmic units. */
  deltaPercent: number | null;
}

type CheckStatus = 'passes' | 'still fails' | 'now FAILS' | 'now passes' | 'new, passes' | 'new, FAILS' | 'removed';

interface CheckSide {
  value: number | null;
  limit: number;
  pass: boolean;
}

interface CheckRow {
  name: string;
  unit: string;
  base: CheckSide | null;
  head: CheckSide | null;
  status: CheckStatus;
}

// ---------------------------------------------------------------- inputs

/** The stages of a project in file order (its `network` keeps the active ones too). */
function stagesOf(p: Project): readonly NetworkStage[] {
  return p.network?.stages ?? p.filter.stages.map((s) => ({ kind: 'rc' as const, r: s.r, c: s.c, buffered: s.buffered }));
}

/**
 * Every input the comparison looks at, in file order, with its SI unit ('fraction' for 0..1, '' for
 * none): for each stage both kinds' parts (null where the stage is of the other kind, or absent),
 * so that the two files' rows line up; the second PWM output's keys (model.md 1.1), null without one.
 */
function inputsOf(p: Project, stageCount: number): InputRow[] {
  const { pwm, load, spec } = p;
  const rows: Array<Omit<InputRow, 'head' | 'base'> & { value: InputValue }> = [
    { key: 'pwm.frequency', label: 'PWM frequency', unit: 'Hz', value: pwm.frequency },
    { key: 'pwm.clock', label: 'timer clock', unit: 'Hz', value: pwm.clock ?? null },
    { key: 'pwm.bits', label: 'resolution (bits)', unit: '', value: pwm.bits ?? null },
    { key: 'pwm.prescaler', label: 'prescaler', unit: '', value: pwm.prescaler },
    { key: 'pwm.alignment', label: 'alignment', unit: '', value: pwm.alignment },
    { key: 'pwm.high', label: 'high level', unit: 'V', value: pwm.high },
    { key: 'pwm.low', label: 'low level', unit: 'V', value: pwm.low },
    { key: 'pwm.driver.high', label: 'driver resistance, high', unit: 'ohm', value: pwm.driver.high },
    { key: 'pwm.driver.low', label: 'driver resistance, low', unit: 'ohm', value: pwm.driver.low },
    { key: 'pwm.duty.min', label: 'duty min', unit: 'fraction', value: pwm.duty.min },
    { key: 'pwm.duty.max', label: 'duty max', unit: 'fraction', value: pwm.duty.max },
    { key: 'load.resistance', label: 'load resistance', unit: 'ohm', value: load.resistance ?? null },
    { key: 'load.capacitance', label: 'load capacitance', unit: 'F', value: load.capacitance },
  ];
  const stages = stagesOf(p);
  for (let i = 0; i < stageCount; i++) {
    const s: NetworkStage | undefined = stages[i];
    const rc = s?.kind === 'rc' ? s : null;
    const sk = s?.kind === 'sallen-key' ? s : null;
    const k = `filter.stages[${i}]`;
    rows.push(
      // An RC stage has no `active` key: null, as for a missing stage (showInput tells them apart).
      { key: `${k}.active`, label: `stage ${i + 1} active`, unit: '', value: sk ? 'sallen-key' : null },
      { key: `${k}.r`, label: `R${i + 1}`, unit: 'ohm', value: rc?.r ?? null },
      { key: `${k}.c`, label: `C${i + 1}`, unit: 'F', value: rc?.c ?? null },
      { key: `${k}.buffered`, label: `follower after stage ${i + 1}`, unit: '', value: rc ? rc.buffered : null },
      { key: `${k}.r1`, label: `stage ${i + 1} R1`, unit: 'ohm', value: sk?.r1 ?? null },
      { key: `${k}.r2`, label: `stage ${i + 1} R2`, unit: 'ohm', value: sk?.r2 ?? null },
      { key: `${k}.c1`, label: `stage ${i + 1} C1`, unit: 'F', value: sk?.c1 ?? null },
      { key: `${k}.c2`, label: `stage ${i + 1} C2`, unit: 'F', value: sk?.c2 ?? null },
    );
  }
  const second = p.network?.second ?? null;
  rows.push(
    { key: 'second_pwm.role', label: 'second output role', unit: '', value: second?.role ?? null },
    { key: 'second_pwm.bits', label: 'second output bits (fine)', unit: '', value: second?.bits ?? null },
    { key: 'second_pwm.into.stage', label: 'second output enters stage', unit: '', value: second ? second.stage + 1 : null },
    { key: 'second_pwm.into.r', label: 'second output R', unit: 'ohm', value: second?.r ?? null },
    { key: 'second_pwm.into.c', label: 'second output C', unit: 'F', value: second?.c ?? null },
    { key: 'second_pwm.high', label: 'second output high level', unit: 'V', value: second?.pin.high ?? null },
    { key: 'second_pwm.low', label: 'second output low level', unit: 'V', value: second?.pin.low ?? null },
    { key: 'second_pwm.driver.high', label: 'second output driver resistance, high', unit: 'ohm', value: second?.pin.driverHigh ?? null },
    { key: 'second_pwm.driver.low', label: 'second output driver resistance, low', unit: 'ohm', value: second?.pin.driverLow ?? null },
  );
  rows.push(
    { key: 'spec.ripple', label: 'ripple limit', unit: 'V', value: spec.ripple ?? null },
    { key: 'spec.droop', label: 'droop limit', unit: 'V', value: spec.droop ?? null },
    { key: 'spec.inl', label: 'INL limit', unit: 'V', value: spec.inl ?? null },
    { key: 'spec.gain', label: 'gain error limit (of full scale)', unit: 'fraction', value: spec.gain ?? null },
    { key: 'spec.settling.band', label: 'settling band', unit: 'V', value: spec.settling?.band ?? null },
    { key: 'spec.settling.time', label: 'settling time limit', unit: 's', value: spec.settling?.time ?? null },
    { key: 'spec.settling.from', label: 'settling step from', unit: 'fraction', value: spec.settling?.from ?? null },
    { key: 'spec.settling.to', label: 'settling step to', unit: 'fraction', value: spec.settling?.to ?? null },
    { key: 'search.pin_current', label: 'pin current limit', unit: 'A', value: p.search?.pinCurrent ?? null },
  );
  return rows.map(({ value, ...r }) => ({ ...r, base: value, head: value }));
}

/** Equal to the last few of 15 significant digits (both parsed from text, so noise is tiny). */
function same(a: InputValue, b: InputValue): boolean {
  if (typeof a === 'number' && typeof b === 'number') return Math.abs(a - b) <= 1e-12 * Math.max(Math.abs(a), Math.abs(b));
  return a === b;
}

function changedInputs(base: Project, head: Project): InputRow[] {
  const n = Math.max(stagesOf(base).length, stagesOf(head).length);
  const b = inputsOf(base, n);
  const h = inputsOf(head, n);
  return b.map((row, i) => ({ ...row, head: h[i].head })).filter((r) => !same(r.base, r.head));
}

// ---------------------------------------------------------------- figures and checks

const FIGURES: Array<{ key: string; label: string; unit: string; get: (a: Analysis) => number | null }> = [
  { key: 'worstRipple', label: 'worst ripple (peak-to-peak)', unit: 'V', get: (a) => a.worstRipple.ripple },
  { key: 'droop', label: 'droop (largest DC error)', unit: 'V', get: (a) => Math.abs(a.dc.droop.error) },
  { key: 'inl', label: 'INL (endpoint fit)', unit: 'V', get: (a) => Math.abs(a.dc.inl.error) },
  { key: 'gainError', label: 'gain error (endpoint fit, ideal - actual)', unit: 'V', get: (a) => a.dc.gainError },
  { key: 'settlingTime', label: 'settling time', unit: 's', get: (a) => a.settling.time },
  { key: 'cutoff', label: 'cutoff (-3 dB)', unit: 'Hz', get: (a) => a.cutoff },
  { key: 'attenuation', label: 'attenuation at the PWM frequency', unit: 'dB', get: (a) => a.attenuation },
  { key: 'pinPeakCurrent', label: 'pin peak current', unit: 'A', get: (a) => a.pinPeakCurrent },
];

function metrics(base: Analysis, head: Analysis): MetricRow[] {
  return FIGURES.map(({ key, label, unit, get }) => {
    const b = get(base);
    const h = get(head);
    const delta = b !== null && h !== null ? h - b : null;
    const deltaPercent = delta !== null && b !== 0 && unit !== 'dB' ? (100 * delta) / Math.abs(b as number) : null;
    return { key, label, unit, base: b, head: h, delta, deltaPercent };
  });
}

function checkRows(base: Analysis, head: Analysis): CheckRow[] {
  const names = [...new Set([...base.checks, ...head.checks].map((c) => c.name))];
  return names.map((name) => {
    const b = base.checks.find((c) => c.name === name);
    const h = head.checks.find((c) => c.name === name);
    const side = (c: typeof b): CheckSide | null => (c ? { value: c.value, limit: c.limit, pass: c.pass } : null);
    let status: CheckStatus;
    if (!h) status = 'removed';
    else if (!b) status = h.pass ? 'new, passes' : 'new, FAILS';
    else if (b.pass) status = h.pass ? 'passes' : 'now FAILS';
    else status = h.pass ? 'now passes' : 'still fails';
    return { name, unit: (h ?? b)!.unit, base: side(b), head: side(h), status };
  });
}

// asciichart symbols: axis (2), unused (2), then the line glyphs. The head is drawn with heavy
// box-drawing glyphs so that the two curves stay apart without colour.
const THIN = ['┼', '┤', '╶', '╴', '─', '╰', '╭', '╮', '╯', '│'] as const;
const HEAVY = ['┼', '┤', '╶', '╴', '━', '┗', '┏', '┓', '┛', '┃'] as const;
const HEAVY_LINE = new Set<string>(HEAVY.slice(4));
const THIN_LINE = new Set<string>(THIN.slice(4));

/** Two series in one ASCII chart: base thin, head heavy (drawn over the base), shared axes. */
function overlayChart(o: Overlay, yUnit: string, yPrefixed: boolean, height: number, paint: Palette, colored: boolean): string {
  const values = [...o.base, ...o.head].filter(Number.isFinite);
  let min = Math.min(...values);
  let max = Math.max(...values);
  if (!(max > min)) {
    const half = Math.abs(min) * 1e-3 || 1e-12;
    min -= half;
    max += half;
  }
  const label = axisFormatter(min, max, height, yUnit, yPrefixed);
  const width = Math.max(label(min).length, label(max).length, label(0).length) + 1;
  const config = { height, offset: 2, min, max, format: (y: number) => label(y).padStart(width) };
  const thin = plot([o.base], { ...config, symbols: [...THIN] }).split('\n');
  const heavy = plot([o.head], { ...config, symbols: [...HEAVY] }).split('\n');
  const rows = thin.map((row, r) => {
    const a = [...row];
    const b = [...(heavy[r] ?? '')];
    return a
      .map((ch, i) => {
        if (HEAVY_LINE.has(b[i])) return colored ? paint.accent(b[i]) : b[i];
        return colored && THIN_LINE.has(ch) ? paint.warn(ch) : ch;
      })
      .join('')
      .trimEnd();
  });
  const n = o.t.length;
  const x = axisFormatter(o.t[0], o.t[n - 1], 4, 's');
  const left = x(o.t[0]);
  const right = x(o.t[n - 1]);
  rows.push(' '.repeat(width) + '└' + '─'.repeat(n - 1));
  rows.push(' '.repeat(width) + left + ' '.repeat(Math.max(1, n + 1 - left.length - right.length)) + right);
  return rows.join('\n');
}

// ---------------------------------------------------------------- text

const pct = (d: number) => `${(100 * d).toFixed(1)} %`;

/** Unit symbol for display. */
const symbol = (unit: string) => (unit === 'ohm' ? 'Ω' : unit);

/** An input's value as text; `stageCount` is that side's number of stages (a null part of a stage that exists belongs to the other kind). */
function showInput(v: InputValue, unit: string, key: string, stageCount: number): string {
  if (v === null) {
    if (key === 'load.resistance') return 'open';
    const stage = /^filter\.stages\[(\d+)\]/.exec(key);
    if (!stage) return '(none)';
    if (Number(stage[1]) >= stageCount) return '(no stage)';
    return key.endsWith('.active') ? 'no (RC)' : '-';
  }
  if (typeof v === 'boolean') return v ? 'yes' : 'no';
  if (typeof v === 'string') return v;
  if (unit === 'fraction') return pct(v);
  if (unit === '') return String(v);
  return formatEng(v, symbol(unit), 4);
}

const signed = (text: string, x: number) => (x > 0 ? `+${text}` : text);

function showDelta(delta: number | null, deltaPercent: number | null, unit: string): string {
  if (delta === null) return '-';
  if (delta === 0) return '0';
  const abs =
    unit === 'dB' ? `${delta.toFixed(1)} dB` : unit === 'fraction' ? `${(100 * delta).toFixed(1)} points` : formatEng(delta, symbol(unit), 3);
  const rel = deltaPercent === null ? '' : ` (${signed(deltaPercent.toFixed(deltaPercent !== 0 && Math.abs(deltaPercent) < 1 ? 2 : 1), deltaPercent)} %)`;
  return `${signed(abs, delta)}${rel}`;
}

function inputDelta(r: InputRow): string {
  if (typeof r.base !== 'number' || typeof r.head !== 'number') return '-';
  const delta = r.head - r.base;
  if (r.unit === '') return signed(String(delta), delta); // counts: bits, prescaler
  return showDelta(delta, r.unit === 'fraction' || r.base === 0 ? null : (100 * delta) / Math.abs(r.base), r.unit);
}

function showFigure(v: number | null, unit: string, key: string): string {
  if (v === null) return key === 'settlingTime' ? 'never settles' : '-';
  return unit === 'dB' ? `${v.toFixed(1)} dB` : formatEng(v, unit, 4);
}

/** A check value or limit: a fraction of full scale (unit '1') in percent, else engineering units. */
const checkText = (x: number, unit: string) => (unit === '1' ? ofFullScale(x) : formatEng(x, unit, 3));

function showCheckSide(c: CheckSide | null, unit: string): string {
  if (c === null) return '-';
  const value = c.value === null ? 'never settles' : checkText(c.value, unit);
  return `${value} ${c.pass ? 'pass' : 'FAIL'}`;
}

function showLimit(r: CheckRow): string {
  const b = r.base ? checkText(r.base.limit, r.unit) : null;
  const h = r.head ? checkText(r.head.limit, r.unit) : null;
  if (b === null) return h as string;
  if (h === null || b === h) return b;
  return `${b} -> ${h}`;
}

/** The document both text renderers draw. */
interface Sections {
  title: string;
  verdict: string;
  inputs: { header: string[]; rows: string[][] };
  figures: { header: string[]; rows: string[][] };
  checks: { header: string[]; rows: string[][] };
  /** The head's warnings, `key: message`. */
  warnings: string[];
  charts: Array<{ title: string; body: string }>;
}

function verdictText(checks: CheckRow[], headPass: boolean, inputsChanged: number): string {
  const live = checks.filter((c) => c.head !== null);
  const changed = checks.filter((c) => c.status === 'now FAILS' || c.status === 'now passes' || c.status.startsWith('new') || c.status === 'removed');
  const changes = changed.length > 0 ? `; ${changed.map((c) => `${c.name} ${c.status}`).join(', ')}` : '';
  const inputs = `${inputsChanged} input${inputsChanged === 1 ? '' : 's'} changed`;
  if (live.length === 0) return `PASS: head has no spec limits (${inputs}${changes})`;
  if (headPass) return `PASS: head holds all ${live.length} spec check${live.length > 1 ? 's' : ''} (${inputs}${changes})`;
  const failing = live.filter((c) => !c.head!.pass).map((c) => c.name);
  return `FAIL: head fails ${failing.join(', ')} (${inputs}${changes})`;
}

// ---------------------------------------------------------------- main

/**
 * Plot columns of the overlay charts for a report of `width` columns: what the width leaves beside
 * the y labels and the legend's indent, at most 72, at least 16.
 *
 * Syntax: overlayColumns(width)
 * Example: overlayColumns(80)   // 66
 */
export function overlayColumns(width: number): number {
  return Math.max(16, Math.min(72, width - 14));
}

/**
 * Compare two versions of a project (base, then head): the inputs that changed, every figure side
 * by side with its change (absolute and %), each spec check with a change of status called out
 * ('now FAILS', 'now passes'), and two overlay charts: the steady states at the head's
 * worst-ripple duty (output minus ideal, two periods of the slower PWM) and the step responses to
 * the head's settling step. Base is drawn thin (─), head heavy (━).
 *
 * Formats: `text` for a terminal; `markdown` for a pull-request comment or a CI job summary (a
 * heading, a verdict line, GFM tables, charts in fenced blocks); `html`: one self-contained page,
 * the same tables, both overlays as SVG plots, the JSON embedded; `json`: { base, head, inputs,
 * figures, checks, warnings, waveforms, pass }, SI units, `pass` and `warnings` being the head's.
 * The head's warnings are printed under "Warnings (head)" after the checks (compare prints no
 * cautions); they never change `pass`.
 *
 * Formats only: every number comes from the engine's analyses, and the overlays (both sides on one
 * time grid, one sample per plot column) from the engine's compareOverlays.ts.
 *
 * Syntax: compareReport(base, head, overlays, format[, { color, height, width }])
 * Example: compareReport({ label: 'a.yaml', project: a, analysis: aa }, { label: 'b.yaml', project: b, analysis: ab },
 *                        compareOverlays(aa, ab, overlayColumns(80)), 'markdown')
 */
export function compareReport(
  base: CompareSide,
  head: CompareSide,
  overlays: CompareOverlays,
  format: CompareFormat,
  options: CompareOptions = {},
): string {
  const width = options.width ?? 80;
  const height = options.height ?? 12;
  const inputs = changedInputs(base.project, head.project);
  const figures = metrics(base.analysis, head.analysis);
  const checks = checkRows(base.analysis, head.analysis);
  const { duty, ...steady } = overlays.steady;
  const { from, to, ...step } = overlays.step;
  const pass = head.analysis.pass;

  if (format === 'json') return JSON.stringify(compareJson(base, head, overlays), null, 2) + '\n';

  const colored = format === 'text' && (options.color ?? false);
  const paint = palette(colored);
  const status = (s: CheckStatus) => (s === 'now FAILS' || s === 'new, FAILS' || s === 'still fails' ? paint.bad(s) : s === 'now passes' ? paint.good(s) : s);
  const doc: Sections = {
    title: `dacsmith compare: ${base.label} -> ${head.label}`,
    verdict: verdictText(checks, pass, inputs.length),
    inputs: {
      header: ['input', 'base', 'head', 'change'],
      rows: inputs.map((r) => [
        r.label,
        showInput(r.base, r.unit, r.key, stagesOf(base.project).length),
        showInput(r.head, r.unit, r.key, stagesOf(head.project).length),
        inputDelta(r),
      ]),
    },
    figures: {
      header: ['figure', 'base', 'head', 'change'],
      rows: figures.map((m) => [m.label, showFigure(m.base, m.unit, m.key), showFigure(m.head, m.unit, m.key), showDelta(m.delta, m.deltaPercent, m.unit)]),
    },
    checks: {
      header: ['check', 'limit', 'base', 'head', 'status'],
      rows: checks.map((c) => [c.name, showLimit(c), showCheckSide(c.base, c.unit), showCheckSide(c.head, c.unit), status(c.status)]),
    },
    warnings: head.analysis.warnings.map((w) => `${w.key}: ${w.message}`),
    charts: [
      {
        title: `Steady state at duty ${pct(duty)} (head's worst ripple): output minus ideal`,
        body: overlayChart(steady, 'V', true, height, paint, colored),
      },
      {
        title: `Step response ${pct(from)} -> ${pct(to)} (head's settling step): output`,
        body: overlayChart(step, 'V', true, height, paint, colored),
      },
    ],
  };
  const legend = `─ base: ${base.label}    ━ head: ${head.label}`;

  if (format === 'html') {
    const page: ReportDocument = {
      title: doc.title,
      verdict: { pass, text: doc.verdict },
      sections: [
        { title: 'Inputs changed', blocks: [doc.inputs.rows.length > 0 ? { kind: 'table', ...doc.inputs } : { kind: 'text', text: 'No input changed.' }] },
        { title: 'Figures', blocks: [{ kind: 'table', ...doc.figures }] },
        {
          title: 'Spec checks',
          blocks: [doc.checks.rows.length > 0 ? { kind: 'table', ...doc.checks, align: ['left', 'right', 'right', 'right', 'left'] } : { kind: 'text', text: 'Neither file states a spec limit.' }],
        },
        ...(doc.warnings.length > 0 ? [{ title: 'Warnings (head)', blocks: [{ kind: 'list' as const, items: doc.warnings }] }] : []),
      ],
    };
    const sides = (o: Overlay) => [
      { name: `base: ${base.label}`, x: o.t, y: o.base },
      { name: `head: ${head.label}`, x: o.t, y: o.head },
    ];
    const plots = [
      svgPlot({
        id: 'compare-steady',
        title: doc.charts[0].title,
        x: { label: 'time', unit: 's' },
        y: { label: 'output − ideal', unit: 'V', minSpan: 1e-6 },
        series: sides(steady),
      }),
      svgPlot({ id: 'compare-step', title: doc.charts[1].title, x: { label: 'time after the step', unit: 's' }, y: { label: 'output', unit: 'V' }, series: sides(step) }),
    ];
    return htmlPage(page, { plots, json: compareReport(base, head, overlays, 'json', options) });
  }

  if (format === 'markdown') {
    const esc = (s: string) => s.replace(/\\/g, '\\\\').replace(/\|/g, '\\|');
    const gfm = (t: { header: string[]; rows: string[][] }) => {
      const align = t.header.map((h, i) => (i === 0 || h === 'status' ? ':---' : '---:'));
      const line = (cells: string[]) => `| ${cells.map(esc).join(' | ')} |`;
      return [line(t.header), `|${align.join('|')}|`, ...t.rows.map(line)].join('\n');
    };
    const out = [`## ${doc.title}`, '', `**${doc.verdict}**`, '', '### Inputs changed', ''];
    out.push(doc.inputs.rows.length > 0 ? gfm(doc.inputs) : 'No input changed.');
    out.push('', '### Figures', '', gfm(doc.figures), '', '### Spec checks', '');
    out.push(doc.checks.rows.length > 0 ? gfm(doc.checks) : 'Neither file states a spec limit.');
    if (doc.warnings.length > 0) out.push('', '### Warnings (head)', '', ...doc.warnings.map((w) => `- ${w}`));
    for (const c of doc.charts) out.push('', `**${c.title}**`, '', '```text', c.body, legend, '```');
    return out.join('\n') + '\n';
  }

  const wrap = (text: string, first = '', rest = '  ') => wrapParagraph(text, width, first, rest);
  const verdict = wrap(doc.verdict);
  const out = [paint.bold(wrap(doc.title)), '', pass ? paint.good(verdict) : paint.bad(verdict), '', paint.bold('Inputs changed')];
  out.push(doc.inputs.rows.length > 0 ? table(doc.inputs.header, doc.inputs.rows, { maxWidth: width }) : '  No input changed.');
  out.push('', paint.bold('Figures'), table(doc.figures.header, doc.figures.rows, { maxWidth: width }));
  out.push('', paint.bold('Spec checks'));
  out.push(
    doc.checks.rows.length > 0
      ? table(doc.checks.header, doc.checks.rows, { align: ['left', 'right', 'right', 'right', 'left'], maxWidth: width })
      : '  Neither file states a spec limit.',
  );
  if (doc.warnings.length > 0) out.push('', paint.bold('Warnings (head)'), ...doc.warnings.map((w) => wrap(w, '  - ', '    ')));
  for (const c of doc.charts) out.push('', paint.accent(wrap(c.title, '  ', '  ')), c.body, wrap(legend, '  ', '    '));
  return out.join('\n') + '\n';
}

/**
 * The object `compare --format json` prints (see compareReport): { base, head, inputs, figures,
 * checks, warnings, waveforms, pass }, as plain JSON data: what the library API's compare() returns.
 *
 * Syntax: compareJson(base, head, overlays)
 * Example: compareJson(baseSide, headSide, compareOverlays(aa, ab, 72)).figures
 */
export function compareJson(base: CompareSide, head: CompareSide, overlays: CompareOverlays) {
  const { duty, ...steady } = overlays.steady;
  const { from, to, ...step } = overlays.step;
  const side = (s: CompareSide) => ({ label: s.label, file: s.project.file, pass: s.analysis.pass });
  const body = {
    base: side(base),
    head: side(head),
    inputs: changedInputs(base.project, head.project),
    figures: metrics(base.analysis, head.analysis),
    checks: checkRows(base.analysis, head.analysis),
    warnings: head.analysis.warnings,
    waveforms: { steady: { duty, ...steady, quantity: 'output minus ideal, V' }, step: { from, to, ...step, quantity: 'output, V' } },
    pass: head.analysis.pass,
  };
  return jsonValue(body);
}
