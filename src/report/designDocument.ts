import { warningsSection } from './warnings.js';
import type { TradeoffCurve as AnyTradeoffCurve } from '../design/tradeoffCurves.js';
import type { RobustResult } from '../design/robustDesigns.js';
import type { AnyCandidateStage, AnyDesignResult, Candidate as AnyStageCandidate, CandidateStage, SallenKeyCandidateStage } from '../design/types.js';
import type { Project } from '../project/types.js';
import { formatEng, formatIec60062 } from '../units/index.js';
import type { Block, ReportDocument, Section } from './document.js';
import { lineChart } from './lineChart.js';
import { percent } from './quantities.js';
import { designColumnPriority } from './designColumns.js';

/** A design of either search (RC stages, or a version 1.1 circuit's stages and second output). */
type Candidate = AnyStageCandidate<AnyCandidateStage>;
type DesignResult = AnyDesignResult;
type TradeoffCurve = AnyTradeoffCurve<AnyCandidateStage>;

export interface DesignDocumentOptions {
  /** Trade-off curves to draw (none: no chart section). */
  tradeoff?: TradeoffCurve[];
  /** asciichart colour codes per curve (terminal only). */
  chartColors?: string[];
  /** The file a chosen design was written to. */
  written?: string;
  /** The tolerance check behind `--robust`. */
  robust?: RobustResult;
  /** Widest line the trade-off chart is drawn to, columns (default 80). */
  width?: number;
  /** The trade-off curves were asked for, but the time limit (--max-time) came first. */
  tradeoffOutOfTime?: boolean;
  /** Stage counts whose curve needed more than the effort limit and was not drawn. */
  tradeoffNotDrawn?: number[];
  /** That effort limit, fast-model evaluations (unnamed when not given). */
  curveEffort?: number;
}

/** Check names as the project file spells the limits. */
const LIMIT_LABEL: Record<string, string> = {
  ripple: 'ripple',
  droop: 'droop',
  inl: 'INL',
  gain: 'gain',
  settling: 'settling',
  pin_current: 'pin current',
};

/**
 * The resolution a voltage is counted at: its LSB (V, null when unknown), its bits, and whether
 * the report shows more than one resolution (then every LSB figure names its own).
 */
export interface LsbScale {
  lsb: number | null;
  bits: number | null;
  mixed: boolean;
}

/** A voltage in LSB when the resolution is known (3 significant digits, '@ 8 bit' when resolutions mix), else in volts. */
function volts(v: number, scale: LsbScale): string {
  if (scale.lsb === null) return formatEng(v, 'V', 3);
  const at = scale.mixed && scale.bits !== null ? ` @ ${scale.bits} bit` : '';
  return `${Number((v / scale.lsb).toPrecision(3))} LSB${at}`;
}

const isActive = (s: AnyCandidateStage): s is SallenKeyCandidateStage => 'active' in s && s.active === 'sallen-key';

/** One stage as 'R / C' in engineering form; a Sallen-Key stage as 'r1, r2 / c1, c2'. */
const stageText = (s: AnyCandidateStage) =>
  isActive(s)
    ? `${formatEng(s.r1, 'Ω', 3)}, ${formatEng(s.r2, 'Ω', 3)} / ${formatEng(s.c1, 'F', 3)}, ${formatEng(s.c2, 'F', 3)}`
    : `${formatEng((s as CandidateStage).r, 'Ω', 3)} / ${formatEng((s as CandidateStage).c, 'F', 3)}${(s as CandidateStage).buffered ? ' +follower' : ''}`;

/** A stage as IEC 60062 codes: '4k7-100n', a Sallen-Key stage 'SK 10k/22k-10n/4n7' (r1/r2-c1/c2). */
const stageCode = (s: AnyCandidateStage) =>
  isActive(s)
    ? `SK ${formatIec60062(s.r1, 'resistance')}/${formatIec60062(s.r2, 'resistance')}-${formatIec60062(s.c1, 'capacitance')}/${formatIec60062(s.c2, 'capacitance')}`
    : `${formatIec60062((s as CandidateStage).r, 'resistance')}-${formatIec60062((s as CandidateStage).c, 'capacitance')}`;

/** The second output's parts as codes: 'r 2M55', 'r 10k c 1u'. */
const secondCode = (p: { r: number; c: number | null }) =>
  `r ${formatIec60062(p.r, 'resistance')}${p.c !== null ? ` c ${formatIec60062(p.c, 'capacitance')}` : ''}`;

/** The stages (and a second output's parts) as IEC 60062 codes: '4k7-100n + 47k-10n', '10k-1u + 10k-1u; 2nd r 2M55'. */
export const stageCodes = (c: Pick<Candidate, 'stages' | 'secondPwm'>) =>
  c.stages.map(stageCode).join(' + ') + (c.secondPwm ? `; 2nd ${secondCode(c.secondPwm)}` : '');

/** f0 and Q of a design's Sallen-Key stages: 'f0 1.2 kHz, Q 0.55'. */
const activeText = (c: Pick<Candidate, 'activeStages'>) =>
  (c.activeStages ?? []).map((a) => `f0 ${formatEng(a.f0, 'Hz', 3)}, Q ${a.q.toPrecision(3)}`).join('; ');

/** Note on a design that needs an op-amp after its last stage (JSON `notes`, text list). */
export const FOLLOWER_NOTE = 'needs an op-amp follower';

function marginText(c: Candidate): string {
  const parts = c.checks.map((k) => {
    const m = c.margins[k.name] ?? null;
    const label = LIMIT_LABEL[k.name] ?? k.name;
    if (m === null) return `${label}: never settles`;
    return m >= 0 ? `${label} ${percent(m).replace(' ', '')}` : `${label} MISSES by ${percent(-m).replace(' ', '')}`;
  });
  return parts.length > 0 ? parts.join(', ') : '-';
}

function candidateTable(result: DesignResult, lsbOf: (c: Candidate) => LsbScale): Block {
  const width = Math.max(...result.candidates.map((c) => c.stages.length));
  const withBits = result.resolutions.length > 0;
  // A version 1.1 circuit: every design has the file's topology, so the first one names the columns.
  const first = result.candidates[0];
  const stageHeader = (i: number) => {
    const s = first?.stages[i];
    return s && isActive(s) ? `stage ${i + 1} Sallen-Key: r1, r2 / c1, c2` : `R${i + 1} / C${i + 1}`;
  };
  const second = first?.secondPwm;
  const active = result.candidates.some((c) => (c.activeStages ?? []).length > 0);
  const header = [
    '#',
    ...Array.from({ length: width }, (_, i) => stageHeader(i)),
    ...(second ? [second.c !== null ? 'second output r / c' : 'second output r'] : []),
    ...(active ? ['f0, Q'] : []),
    'codes (IEC 60062)',
    ...(withBits ? ['bits', 'PWM'] : []),
    'settling',
    'worst ripple',
    'droop',
    'pin current',
    'margin to each limit',
  ];
  const rows = result.candidates.map((c, i) => [
    String(i + 1),
    ...Array.from({ length: width }, (_, k) => (c.stages[k] ? stageText(c.stages[k]) : '')),
    ...(second ? [c.secondPwm ? `${formatEng(c.secondPwm.r, 'Ω', 3)}${c.secondPwm.c !== null ? ` / ${formatEng(c.secondPwm.c, 'F', 3)}` : ''}` : ''] : []),
    ...(active ? [activeText(c)] : []),
    stageCodes(c),
    ...(withBits ? [String(c.bits ?? '-'), formatEng(c.frequency, 'Hz', 4)] : []),
    c.settlingTime === null ? 'never' : formatEng(c.settlingTime, 's', 4),
    volts(c.worstRipple, lsbOf(c)),
    volts(c.droop, lsbOf(c)),
    formatEng(c.pinCurrent, 'A', 3),
    marginText(c),
  ]);
  const extra = (second ? 1 : 0) + (active ? 1 : 0);
  const align = header.map((_, i) => (i === 0 || i === header.length - 1 || (i > 0 && i <= width + 1 + extra) ? 'left' : 'right')) as Array<
    'left' | 'right'
  >;
  return { kind: 'table', header, rows, align, priority: header.map(designColumnPriority) };
}

/** Nothing keeps the margin, and the designs shown meet the limits without it. */
const onlyWithoutMargin = (result: DesignResult) => !result.feasible && result.candidates.length > 0 && result.candidates.every((c) => c.pass);

/** Which listed designs need an op-amp follower, and the usual cautions about it. */
function followerNote(list: Candidate[]): Block[] {
  const which = list.map((c, i) => (c.needsFollower ? `#${i + 1}` : null)).filter((s): s is string => s !== null);
  if (which.length === 0) return [];
  return [
    {
      kind: 'text',
      text: `${which.join(', ')}: ${FOLLOWER_NOTE} (unity gain) after the last stage, marked +follower. The figures assume an ideal one: pick a part whose input and output ranges cover the signal (rail-to-rail where it must reach the supply), that is stable driving the load, and add its offset to the DC error; see its data sheet.`,
    },
  ];
}

/** The robust designs' figures under tolerance: worst case over the box, or Monte Carlo yield. */
function robustSection(r: RobustResult, lsbOf: (c: Candidate) => LsbScale): Section {
  const pairs: Array<[string, string]> = [
    ['Check', r.mode === 'worst-case' ? 'every limit at the worst case over the box of the tolerance: block' : `Monte Carlo yield, up to ${r.samples} samples per design (sampling stops once the yield's 3-sigma Wilson interval clears the target); pin current at the worst case of the box`],
    [
      'Scanned',
      `${r.scanned} nominally feasible design${r.scanned === 1 ? '' : 's'} in ranking order${r.exhausted ? ' (all of them)' : ''}` +
        (r.screened ? '; designs that a corner of the box (every part at its minimum, or at its maximum) already fails were left out first, and the nominal rank counts those that remain' : ''),
    ],
  ];
  const blocks: Block[] = [{ kind: 'pairs', pairs }];
  if (r.candidates.length > 0) {
    const wc = r.mode === 'worst-case';
    const header = wc
      ? ['#', 'nominal rank', 'codes', 'settling (worst)', 'ripple (worst)', 'droop (worst)', 'pin current (worst)']
      : ['#', 'nominal rank', 'codes', 'yield', 'target', 'pin current (worst)'];
    const rows = r.candidates.map((x, i) => {
      const head = [String(i + 1), String(x.nominalRank), stageCodes(x.candidate)];
      const w = x.verdict.worstCase;
      const y = x.verdict.yield;
      if (wc && w) {
        const lsb = lsbOf(x.candidate);
        return [
          ...head,
          w.settlingTime === null ? 'never' : formatEng(w.settlingTime, 's', 4),
          volts(w.worstRipple, lsb),
          volts(w.droop, lsb),
          formatEng(w.pinCurrent, 'A', 3),
        ];
      }
      return [...head, y ? percent(y.yield) : '-', y ? percent(y.target) : '-', y ? formatEng(y.pinCurrent, 'A', 3) : '-'];
    });
    blocks.push({ kind: 'table', header, rows, align: header.map((_, i) => (i === 2 ? 'left' : 'right')) as Array<'left' | 'right'> });
  }
  return { title: r.mode === 'worst-case' ? 'Under tolerance: worst case' : 'Under tolerance: yield', blocks };
}

function tradeoffSection(curves: TradeoffCurve[], at: LsbScale, rippleLimit: number | undefined, options: DesignDocumentOptions): Section | null {
  if (curves.length === 0 || curves[0].points.length < 2) return null;
  const ripples = curves[0].points.map((p) => p.ripple);
  const lsb = at.lsb;
  const scale = lsb ?? 1;
  const finite = curves.flatMap((c) => c.points.map((p) => p.settlingTime)).filter((t): t is number => t !== null);
  if (finite.length === 0) {
    return { title: 'Trade-off: settling time against allowed ripple', blocks: [{ kind: 'text', text: 'No design is feasible at any of the ripple limits tried.' }] };
  }
  const top = Math.max(...finite) * 1.1;
  const limit = rippleLimit;
  // asciichart draws one column per sample: hold each computed point over several columns so the
  // chart is as wide as the others (no values are invented between the points).
  const plotColumns = Math.max(16, Math.min(64, (options.width ?? 80) - 14));
  const hold = Math.max(1, Math.floor(plotColumns / ripples.length));
  const widen = (ys: number[]) => ys.flatMap((y) => Array.from({ length: hold }, () => y));
  const chart = lineChart(
    curves.map((c) => widen(c.points.map((p) => p.settlingTime ?? Infinity))),
    {
      height: 12,
      yUnit: 's',
      yRange: { min: 0, max: top },
      x: { start: ripples[0] / scale, end: ripples[ripples.length - 1] / scale, unit: lsb === null ? 'V' : at.mixed && at.bits !== null ? `LSB @ ${at.bits} bit` : 'LSB', log: true, prefixed: lsb === null },
      markers: limit !== undefined ? [{ x: limit / scale, symbol: '^', label: `spec ripple limit ${volts(limit, at)}` }] : [],
      ...(options.chartColors ? { colors: options.chartColors } : {}),
      width: options.width ?? 80,
    },
  );
  const header = ['ripple limit', ...curves.map((c) => `${c.stages} stage${c.stages > 1 ? 's' : ''}`)];
  const rows = ripples.map((r, i) => [
    volts(r, at),
    ...curves.map((c) => {
      const p = c.points[i];
      return p.settlingTime === null ? 'none' : `${formatEng(p.settlingTime, 's', 3)}  ${p.best ? stageCodes(p.best) : ''}`;
    }),
  ]);
  const names = curves.map((c) => `${c.stages} stage${c.stages > 1 ? 's' : ''}`).join(', ');
  return {
    title: 'Trade-off: settling time against allowed ripple',
    blocks: [
      {
        kind: 'text',
        text: `Best exact settling time at each ripple limit (other limits as specified, no settling-time limit); curves: ${names}. A point at the top edge has no feasible design.`,
      },
      { kind: 'chart', title: 'settling time (s) vs ripple limit (log scale)', body: chart },
      { kind: 'table', header, rows, align: ['left', ...curves.map(() => 'left' as const)] },
    ],
  };
}

/** What the report says of curves given up at the effort limit (empty: none). */
function notDrawnText(stageCounts: number[], effort: number | undefined): string {
  if (stageCounts.length === 0) return '';
  const which = stageCounts.map((n) => `${n} stage${n > 1 ? 's' : ''}`).join(', ');
  const many = stageCounts.length > 1;
  // (plain digits: a grouped number could be wrapped across two lines)
  const limit = effort === undefined ? 'the limit' : `${effort}, the limit`;
  return (
    `Not drawn: ${which}. Proving ${many ? 'those curves' : 'that curve'} takes more fast-model evaluations than ${limit} ` +
    `of --curve-effort; a larger --curve-effort draws ${many ? 'them' : 'it'}, at the cost of time.`
  );
}

function comparisonSection(current: Candidate, best: Candidate | undefined, lsbOf: (c: Candidate) => LsbScale): Section {
  const column = (c: Candidate | undefined, f: (c: Candidate) => string) => (c ? f(c) : '-');
  const row = (label: string, f: (c: Candidate) => string) => [label, column(current, f), column(best, f)];
  const rows = [
    row('stages', (c) => c.stages.map(stageText).join(' + ')),
    ...(current.secondPwm ? [row('second output', (c) => (c.secondPwm ? secondCode(c.secondPwm) : '-'))] : []),
    ...((current.activeStages ?? []).length > 0 ? [row('Sallen-Key f0, Q', activeText)] : []),
    row('settling', (c) => (c.settlingTime === null ? 'never' : formatEng(c.settlingTime, 's', 4))),
    row('worst ripple', (c) => volts(c.worstRipple, lsbOf(c))),
    row('droop', (c) => volts(c.droop, lsbOf(c))),
    row('INL', (c) => volts(c.inl, lsbOf(c))),
    row('pin current', (c) => formatEng(c.pinCurrent, 'A', 3)),
    row('total capacitance', (c) => formatEng(c.totalCapacitance, 'F', 3)),
    row('meets every limit', (c) => (c.pass ? 'PASS' : 'FAIL')),
  ];
  return {
    title: 'Compared with the filter: design',
    blocks: [{ kind: 'table', header: ['', 'filter: (project)', best ? 'recommended #1' : 'closest #1'], rows, align: ['left', 'left', 'left'] }],
  };
}

/**
 * The design result as a report document (the same blocks for text and Markdown): search basis and
 * effort, the ranked designs with values, IEC 60062 codes and margins, the trade-off chart, the
 * best design per resolution, the comparison with the project's `filter:` design, and, when nothing
 * is feasible, what binds. With `robust`, the designs listed are the robust ones and a section
 * gives their figures under tolerance.
 *
 * Syntax: designDocument(project, result[, { tradeoff, chartColors, written }])
 * Example: designDocument(p, designSearch(p)).verdict.pass   // true when a design meets every limit
 */
export function designDocument(project: Project, result: DesignResult, options: DesignDocumentOptions = {}): ReportDocument {
  const { basis, stats } = result;
  const lsbByBits = new Map(result.resolutions.map((r) => [r.bits, r.lsb]));
  // More than one resolution in the report: every LSB figure then names the one it is counted at.
  const shown = new Set([project.pwm.bits, ...result.resolutions.map((r) => r.bits)].filter((b) => b !== undefined));
  const mixed = shown.size > 1;
  const projectScale: LsbScale = { lsb: basis.lsb, bits: project.pwm.bits ?? null, mixed };
  const lsbOf = (c: Candidate): LsbScale =>
    c.bits !== null && lsbByBits.has(c.bits) ? { lsb: lsbByBits.get(c.bits)!, bits: c.bits, mixed } : projectScale;
  const L = basis.limits;
  // A limit the file gave in LSB holds at every resolution as so many LSB; one given in V or %
  // is a voltage, shown as such when resolutions mix.
  const inLsb = project.specInLsb ?? {};
  const limitText = (v: number, lsbCount: number | undefined) =>
    !mixed ? volts(v, projectScale) : lsbCount !== undefined ? `${Number(lsbCount.toPrecision(3))} LSB at each resolution` : formatEng(v, 'V', 3);
  const limitList = [
    L.ripple !== undefined ? `ripple ${limitText(L.ripple, inLsb.ripple)}` : null,
    L.droop !== undefined ? `droop ${limitText(L.droop, inLsb.droop)}` : null,
    L.inl !== undefined ? `INL ${limitText(L.inl, inLsb.inl)}` : null,
    L.gain !== undefined ? `gain error ${percent(L.gain)} of full scale` : null,
    L.settlingTime !== undefined ? `settling ${formatEng(L.settlingTime, 's', 4)}` : null,
    L.pinCurrent !== undefined ? `pin current ${formatEng(L.pinCurrent, 'A', 3)}` : null,
  ].filter((s): s is string => s !== null);
  const step =
    basis.steps.length === 2
      ? `${percent(basis.steps[0][0])} to ${percent(basis.steps[0][1])} and back (slower counts)`
      : `${percent(basis.steps[0][0])} to ${percent(basis.steps[0][1])}`;
  const pairs: Array<[string, string]> = [
    ['File', project.file],
    ...(basis.network
      ? ([['Circuit', `${basis.network.topology} (the file's; the search chooses every part)`]] as Array<[string, string]>)
      : ([['Stages tried', basis.stageCounts.join(', ')]] as Array<[string, string]>)),
    ['Values', `${basis.series} (IEC 60063), R ${formatEng(basis.resistance.min, 'Ω', 3)} to ${formatEng(basis.resistance.max, 'Ω', 3)}, C ${formatEng(basis.capacitance.min, 'F', 3)} to ${formatEng(basis.capacitance.max, 'F', 3)}`],
    ...(basis.network?.q
      ? ([['Sallen-Key', `Q from ${basis.network.q.min} to ${basis.network.q.max} (search.q): for each r1, r2, c2 only the c1 values that put Q in the window`]] as Array<[string, string]>)
      : []),
    ...(basis.network?.secondPwm
      ? ([
          [
            'Second output',
            `${basis.network.secondPwm.role}: r ${basis.network.secondPwm.r}${basis.network.secondPwm.c ? `, c ${formatEng(basis.network.secondPwm.c.min, 'F', 3)} to ${formatEng(basis.network.secondPwm.c.max, 'F', 3)}` : ''}`,
          ],
        ] as Array<[string, string]>)
      : []),
    ['Limits', limitList.length > 0 ? limitList.join(', ') : 'none'],
    ['Settling', `to within ${limitText(basis.band, inLsb.band)} after a step ${step}`],
    ['Margin', `every recommended design keeps ${percent(basis.margin)} of each limit in reserve (search.margin); the table shows each design's own margins`],
    ...(basis.buffered.includes(true)
      ? ([['Follower', `${basis.buffered.includes(false) ? 'also' : 'only'} designs with an ideal unity-gain follower after the last stage (search.buffered); such a design ${FOLLOWER_NOTE}`]] as Array<[string, string]>)
      : []),
    ['Ranking', `settling time, ${basis.network ? '' : 'then fewer stages, '}${basis.buffered.includes(true) ? 'then no follower, ' : ''}then smaller total capacitance`],
    [
      'Search',
      `${stats.space.toExponential(2).replace('e+', 'e')} candidates, ${stats.evaluated} evaluated by the fast model${basis.network ? ' (exact period map: proven bounds)' : ''}, ${stats.verified} by the exact engine, ${formatEng(stats.elapsed, 's', 3)}`,
    ],
  ];
  const sections: Section[] = [{ title: 'Search', blocks: [{ kind: 'pairs', pairs }] }];
  if (result.complete === false) {
    sections.push({
      title: 'Incomplete: stopped at the time limit (--max-time)',
      blocks: [
        {
          kind: 'text',
          text: result.feasible
            ? 'The designs below meet the spec (exact figures) but are the best found before the time limit, not proven the best of the space; allow more time for the full search.'
            : 'No design meeting the spec was found before the time limit; that does not prove there is none. Allow more time for the full search and its explanation.',
        },
      ],
    });
  }

  const robust = options.robust;
  if (robust) {
    if (result.feasible) sections.push({ title: 'Recommended robust designs (nominal figures)', blocks: [candidateTable(result, lsbOf)] });
    sections.push(robustSection(robust, lsbOf));
  } else if (result.feasible) {
    sections.push({ title: 'Recommended designs (exact figures)', blocks: [candidateTable(result, lsbOf), ...followerNote(result.candidates)] });
  } else if (result.complete !== false || result.diagnosis.length > 0 || result.candidates.length > 0) {
    // (cut by the time limit with nothing found: the section above says all there is to say)
    const blocks: Block[] = [{ kind: 'list', items: result.diagnosis }];
    if (result.candidates.length > 0) blocks.push(candidateTable(result, lsbOf), ...followerNote(result.candidates));
    sections.push({ title: onlyWithoutMargin(result) ? `No design meets every limit with the ${percent(basis.margin)} margin` : 'No design meets every limit', blocks });
  }
  // The curves are drawn at one resolution (that of design #1 when the search chose it).
  const curveBits = (options.tradeoff ?? []).flatMap((c) => c.points.map((p) => p.best?.bits ?? null)).find((b) => b !== null) ?? null;
  const curveScale = curveBits !== null && lsbByBits.has(curveBits) ? { lsb: lsbByBits.get(curveBits)!, bits: curveBits, mixed } : projectScale;
  const curveLimit = inLsb.ripple !== undefined && curveScale.lsb !== null ? inLsb.ripple * curveScale.lsb : L.ripple;
  const chart = tradeoffSection(options.tradeoff ?? [], curveScale, curveLimit, options);
  const notDrawn = notDrawnText(options.tradeoffNotDrawn ?? [], options.curveEffort);
  if (chart) {
    if (notDrawn) chart.blocks.push({ kind: 'text', text: notDrawn });
    sections.push(chart);
  } else if (notDrawn) sections.push({ title: 'Trade-off: not drawn', blocks: [{ kind: 'text', text: notDrawn }] });
  // (an incomplete search says so above, curves included)
  else if (options.tradeoffOutOfTime && result.complete !== false) {
    sections.push({
      title: 'Trade-off: not drawn',
      blocks: [{ kind: 'text', text: 'The search ended in time, but the time limit (--max-time) came before the trade-off curves were done; allow more time for them.' }],
    });
  }
  const warnings = warningsSection(result.warnings);
  if (warnings) sections.push(warnings);
  if (result.resolutions.length > 0) {
    sections.push({
      title: 'Best design per resolution',
      blocks: [
        {
          kind: 'table',
          header: ['bits', 'PWM frequency', 'LSB', 'best design', 'settling', 'worst ripple'],
          rows: result.resolutions.map((r) => [
            String(r.bits),
            formatEng(r.frequency, 'Hz', 4),
            formatEng(r.lsb, 'V', 3),
            r.best ? stageCodes(r.best) : 'none feasible',
            r.best?.settlingTime != null ? formatEng(r.best.settlingTime, 's', 4) : '-',
            r.best ? volts(r.best.worstRipple, { lsb: r.lsb, bits: r.bits, mixed }) : '-',
          ]),
          align: ['right', 'right', 'right', 'left', 'right', 'right'],
        },
      ],
    });
  }
  if (result.current) sections.push(comparisonSection(result.current, result.candidates[0], lsbOf));
  if (options.written) sections.push({ title: 'Written', blocks: [{ kind: 'text', text: `Design #1 written to ${options.written}` }] });

  const best = result.candidates[0];
  const under = robust?.mode === 'worst-case' ? 'at the worst case over the tolerance box' : `with a yield of at least the target`;
  const verdict = robust
    ? result.feasible
      ? { pass: true, text: `PASS: ${result.candidates.length} design${result.candidates.length > 1 ? 's' : ''} meet every limit ${under}; #1 settles in ${formatEng(best.settlingTime ?? NaN, 's', 4)} (nominal)` }
      : {
          pass: false,
          text:
            robust.scanned === 0
              ? robust.nominalFeasible
                ? `FAIL: every nominally feasible design misses a limit at a corner of the tolerance box (every part at its minimum, or at its maximum)`
                : 'FAIL: no design in the search space meets every limit even with nominal parts'
              : robust.scanned === 1
                ? `FAIL: the only nominally feasible design misses a limit ${under}`
                : `FAIL: none of the ${robust.scanned} nominally feasible designs scanned meets every limit ${under}`,
        }
    : result.feasible
    ? { pass: true, text: `PASS: ${result.candidates.length} design${result.candidates.length > 1 ? 's' : ''} meet every limit; #1 settles in ${formatEng(best.settlingTime ?? NaN, 's', 4)}` }
    : onlyWithoutMargin(result)
      ? { pass: false, text: `FAIL: no design keeps the ${percent(basis.margin)} margin to every limit; ${result.candidates.length} meet the limits without it (listed)` }
      : result.complete === false
        ? { pass: false, text: 'FAIL: no design found before the time limit (--max-time); the search did not finish, so whether one exists is open' }
        : { pass: false, text: 'FAIL: no design in the search space meets every limit' };
  return { title: `dacsmith design: ${project.file}`, sections, verdict };
}
