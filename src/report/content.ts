import type { Analysis, ChartSeries } from '../engine/index.js';
import type { Project } from '../project/types.js';
import { formatEng, formatIec60062 } from '../units/index.js';
import { cautions } from './cautions.js';
import { reportCharts } from './charts.js';
import type { Block, ReportDocument, Section } from './document.js';
import { checkQuantity, fixed, lsbCount, millivolts, percent, tidy, voltsAndLsb } from './quantities.js';
import { warningsSection } from './warnings.js';

export interface ContentOptions {
  /** The series to chart (engine chartSeries.ts); no charts when absent. */
  charts?: ChartSeries;
  /** asciichart colour codes for chart series (terminal only). */
  chartColors?: string[];
  /** Widest line the charts are drawn to, columns (default 80). */
  width?: number;
}

function inputsSection(project: Project, analysis: Analysis): Section {
  const { pwm, load } = project;
  const timer =
    pwm.clock !== undefined
      ? `clock ${formatEng(pwm.clock, 'Hz', 4)}, prescaler ${pwm.prescaler}, ${pwm.alignment}-aligned`
      : `${pwm.alignment}-aligned`;
  const fineBits = project.network?.second?.role === 'fine' ? (project.network.second.bits ?? 0) : 0;
  const resolution =
    pwm.bits !== undefined && analysis.lsb !== null
      ? fineBits > 0
        ? `${pwm.bits} + ${fineBits} bits (coarse and fine outputs, ${2 ** (pwm.bits + fineBits)} codes), LSB ${formatEng(analysis.lsb, 'V', 4)}`
        : `${pwm.bits} bits (${2 ** pwm.bits} steps), LSB ${formatEng(analysis.lsb, 'V', 4)}`
      : 'not given (pwm.bits): errors shown in volts only';
  const loadText =
    (load.resistance !== undefined ? formatEng(load.resistance, 'Ω', 3) : 'open (no resistance)') +
    (load.capacitance > 0 ? ` in parallel with ${formatEng(load.capacitance, 'F', 3)}` : '');
  const pairs: Array<[string, string]> = [
    ['File', project.file],
    ['PWM frequency', `${formatEng(pwm.frequency, 'Hz', 4)} (period ${formatEng(1 / pwm.frequency, 's', 4)})`],
    ['Timer', timer],
    ['Resolution', resolution],
    ['Levels', `low ${formatEng(pwm.low, 'V', 4)}, high ${formatEng(pwm.high, 'V', 4)}`],
    ['Duty range', `${percent(pwm.duty.min)} to ${percent(pwm.duty.max)}`],
    ['Driver', `high ${formatEng(pwm.driver.high, 'Ω', 3)}, low ${formatEng(pwm.driver.low, 'Ω', 3)}`],
    ['Load', loadText],
    ['Time constants', analysis.timeConstants.map((t) => formatEng(t, 's', 3)).join(', ')],
  ];
  const second = project.network?.second;
  if (second) {
    const path = `${formatEng(second.r, 'Ω', 3)}${second.c !== null ? ` + ${formatEng(second.c, 'F', 3)} in series` : ''}`;
    const what = second.role === 'fine' ? `fine output, ${second.bits} bits` : 'complement of the first output (high while it is low)';
    pairs.splice(7, 0, ['Second PWM', `${what}, into the node of stage ${second.stage + 1} through ${path}`]);
  }
  if (project.network) {
    const table: Block = {
      kind: 'table',
      header: ['stage', 'parts', 'time scale', 'follower after'],
      rows: project.network.stages.map((s, i) => {
        if (s.kind === 'rc') {
          const parts = `R ${formatEng(s.r, 'Ω', 3)} (${formatIec60062(s.r, 'resistance')}), C ${formatEng(s.c, 'F', 3)} (${formatIec60062(s.c, 'capacitance')})`;
          return [String(i + 1), parts, `R x C ${formatEng(s.r * s.c, 's', 3)}`, s.buffered ? 'yes' : 'no'];
        }
        const f = analysis.activeStages.find((a) => a.stage === i);
        const parts =
          `Sallen-Key: r1 ${formatIec60062(s.r1, 'resistance')}, r2 ${formatIec60062(s.r2, 'resistance')}, ` +
          `c1 ${formatIec60062(s.c1, 'capacitance')}, c2 ${formatIec60062(s.c2, 'capacitance')}`;
        return [String(i + 1), parts, f ? `f0 ${formatEng(f.f0, 'Hz', 3)}, Q ${f.q.toFixed(3)}` : '', 'op-amp'];
      }),
      align: ['left', 'left', 'left', 'left'],
    };
    return { title: 'Inputs', blocks: [{ kind: 'pairs', pairs }, table] };
  }
  const stages: Block = {
    kind: 'table',
    header: ['stage', 'R', 'R code', 'C', 'C code', 'R x C', 'follower after'],
    rows: project.filter.stages.map((s, i) => [
      String(i + 1),
      formatEng(s.r, 'Ω', 3),
      formatIec60062(s.r, 'resistance'),
      formatEng(s.c, 'F', 3),
      formatIec60062(s.c, 'capacitance'),
      formatEng(s.r * s.c, 's', 3),
      s.buffered ? 'yes' : 'no',
    ]),
    align: ['left', 'right', 'right', 'right', 'right', 'right', 'left'],
  };
  return { title: 'Inputs', blocks: [{ kind: 'pairs', pairs }, stages] };
}

function pointsSection(project: Project, analysis: Analysis): Section {
  const { lsb } = analysis;
  const { high, low } = project.pwm;
  const withLsb = lsb !== null;
  const header = ['duty (%)', 'average (V)', 'ideal (V)', 'DC error (mV)', ...(withLsb ? ['DC error (LSB)'] : []), 'ripple (mV)', ...(withLsb ? ['ripple (LSB)'] : [])];
  const rows = analysis.points.map((p) => {
    const ideal = low + p.duty * (high - low);
    const error = tidy(ideal - p.average, high - low);
    return [
      (100 * p.duty).toFixed(1),
      fixed(p.average, 5),
      fixed(ideal, 5),
      millivolts(error),
      ...(withLsb ? [lsbCount(error, lsb)] : []),
      millivolts(p.ripple),
      ...(withLsb ? [lsbCount(p.ripple, lsb)] : []),
    ];
  });
  return {
    title: 'Output at each duty (steady state)',
    // On a narrow terminal the ideal output (it follows from the duty) and, with LSB columns beside
    // them, the millivolt columns are the first left out.
    blocks: [{ kind: 'table', header, rows, align: header.map(() => 'right'), priority: header.map((h) => (h === 'ideal (V)' ? 0.2 : withLsb && h.endsWith('(mV)') ? 0.5 : 1)) }],
  };
}

function specSection(project: Project, analysis: Analysis): Section {
  const fullScale = project.pwm.high - project.pwm.low;
  if (analysis.checks.length === 0) {
    return {
      title: 'Spec',
      blocks: [
        {
          kind: 'text',
          text: 'No limits given (spec.ripple, spec.droop, spec.inl, spec.gain, spec.settling.time, search.pin_current); spec.gain is off (none).',
        },
      ],
    };
  }
  const rows = analysis.checks.map((c) => {
    const value = c.value === null ? null : c.unit === 'V' ? tidy(c.value, fullScale) : c.unit === '1' ? tidy(c.value, 1) : c.value;
    const margin =
      value === null ? '-' : `${c.limit - value >= 0 ? '+' : ''}${checkQuantity(c.limit - value, c.unit, analysis.lsb)}`;
    return [
      c.name,
      value === null ? 'never settles' : checkQuantity(value, c.unit, analysis.lsb),
      checkQuantity(c.limit, c.unit, analysis.lsb),
      margin,
      c.pass ? 'PASS' : 'FAIL',
    ];
  });
  return {
    title: 'Spec',
    blocks: [{ kind: 'table', header: ['check', 'value', 'limit', 'margin', 'result'], rows, align: ['left', 'right', 'right', 'right', 'left'] }],
  };
}

function figuresSection(project: Project, analysis: Analysis): Section {
  const { lsb, dc, settling, worstRipple } = analysis;
  const fullScale = project.pwm.high - project.pwm.low;
  const v = (x: number) => voltsAndLsb(tidy(x, fullScale), lsb);
  // Where an error peaks means nothing when it is zero.
  const at = (x: number, duty: number) => (tidy(x, fullScale) === 0 ? '' : ` at duty ${percent(duty)}`);
  const settlingText =
    settling.time === null ? 'never settles: ripple exceeds the band' : formatEng(settling.time, 's', 3);
  const pairs: Array<[string, string]> = [
    ['Worst ripple (peak-to-peak)', `${voltsAndLsb(worstRipple.ripple, lsb)} at duty ${percent(worstRipple.duty)}`],
    ['Droop (largest DC error)', `${v(dc.droop.error)}${at(dc.droop.error, dc.droop.duty)}`],
    ['Offset error (endpoint fit)', v(dc.offsetError)],
    ['Gain error (endpoint fit)', `${v(dc.gainError)}, ${checkQuantity(tidy(dc.gainError, fullScale) / fullScale, '1', lsb)}`],
    ['INL (endpoint fit)', `${v(dc.inl.error)}${at(dc.inl.error, dc.inl.duty)}`],
    ['Cutoff (-3 dB)', formatEng(analysis.cutoff, 'Hz', 3)],
    ['Attenuation at the PWM frequency', `${analysis.attenuation.toFixed(1)} dB`],
    ['Pin peak current', formatEng(analysis.pinPeakCurrent, 'A', 3)],
    [
      `Settling ${percent(settling.from)} -> ${percent(settling.to)} (band ±${formatEng(settling.band, 'V', 3)})`,
      settlingText,
    ],
  ];
  const signs = 'DC error, droop, offset error, gain error and INL are signed ideal minus actual: a positive value means the output is below the ideal (or the endpoint line).';
  return { title: 'Figures', blocks: [{ kind: 'pairs', pairs }, { kind: 'text', text: signs }] };
}

/**
 * The analysis report as a document (sections of tables, lists and charts), ready for the text or
 * Markdown renderer: inputs and stages, the output at each duty, spec checks, other figures, charts,
 * warnings (when any) and cautions, and a one-line verdict (which counts the warnings).
 *
 * Syntax: reportDocument(project, analysis[, { charts, chartColors }])
 * Example: reportDocument(p, a, { charts: chartSeries(a, p.pwm.duty) }).verdict.pass
 */
export function reportDocument(project: Project, analysis: Analysis, options: ContentOptions = {}): ReportDocument {
  const sections = [
    inputsSection(project, analysis),
    pointsSection(project, analysis),
    specSection(project, analysis),
    figuresSection(project, analysis),
  ];
  if (options.charts) {
    const charts = reportCharts(analysis, options.charts, { colors: options.chartColors, ...(options.width && { width: options.width }) });
    sections.push({ title: 'Charts', blocks: charts.map((c) => ({ kind: 'chart', title: c.title, body: c.body })) });
  }
  const warnings = warningsSection(analysis.warnings);
  if (warnings) sections.push(warnings);
  sections.push({ title: 'Cautions', blocks: [{ kind: 'list', items: cautions(project, analysis) }] });

  const failed = analysis.checks.filter((c) => !c.pass).map((c) => c.name);
  const n = analysis.checks.length;
  const w = analysis.warnings.length;
  const warned = w === 0 ? '' : ` ${w} warning${w > 1 ? 's' : ''} (see Warnings).`;
  const text =
    (n === 0
      ? 'No spec limits given: nothing to check.'
      : failed.length === 0
        ? `PASS: all ${n} spec check${n > 1 ? 's' : ''} hold.`
        : `FAIL: ${failed.join(', ')} (${failed.length} of ${n} spec checks).`) + warned;
  return { title: `dacsmith analysis of ${project.file}`, sections, verdict: { pass: analysis.pass, text } };
}
