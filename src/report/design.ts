import { jsonValue } from './jsonValue.js';
import type { TradeoffCurve as AnyTradeoffCurve } from '../design/tradeoffCurves.js';
import type { RobustResult } from '../design/robustDesigns.js';
import type { AnyCandidateStage, AnyDesignResult, Candidate as AnyStageCandidate } from '../design/types.js';
import type { Project } from '../project/types.js';
import type { DesignEdit } from './designYaml.js';
import { designDocument, FOLLOWER_NOTE, stageCodes } from './designDocument.js';
import { htmlPage } from './htmlPage.js';
import { renderDocument } from './renderDocument.js';
import { tradeoffPlot } from './tradeoffPlot.js';

export type DesignFormat = 'text' | 'markdown' | 'json' | 'html';

/** A design of either search (RC stages, or a version 1.1 circuit's stages and second output). */
type Candidate = AnyStageCandidate<AnyCandidateStage>;
type DesignResult = AnyDesignResult;
type TradeoffCurve = AnyTradeoffCurve<AnyCandidateStage>;

export interface DesignReportOptions {
  tradeoff?: TradeoffCurve[];
  /** ANSI colour (text only). */
  color?: boolean;
  /** File the chosen design was written to. */
  written?: string;
  /** What `--write` changed in the file (designYaml.ts), for the JSON. */
  changes?: DesignEdit[];
  /** The tolerance check behind `--robust` (the result then lists only robust designs). */
  robust?: RobustResult;
  /** Text: the widest line, columns (default 80). */
  width?: number;
  /** The curves were asked for, but the time limit came first (text, Markdown, HTML say so). */
  tradeoffOutOfTime?: boolean;
  /** Stage counts whose curve needed more than the effort limit (--curve-effort) and was not drawn. */
  tradeoffNotDrawn?: number[];
  /** That limit, fast-model evaluations (text, Markdown, HTML name it). */
  curveEffort?: number;
}

// asciichart colour codes per curve (one stage, two, three), used only when colour is on.
const CURVE_COLORS = ['\x1b[33m', '\x1b[36m', '\x1b[35m'];

/** JSON has no Infinity or NaN. */
const finite = (v: number | null | undefined) => (v === null || v === undefined || !Number.isFinite(v) ? null : v);

function robustJson(r: RobustResult) {
  return {
    mode: r.mode,
    scanned: r.scanned,
    screened: r.screened,
    nominalFeasible: r.nominalFeasible,
    exhausted: r.exhausted,
    asked: r.asked,
    samples: r.samples,
    candidates: r.candidates.map((x) => ({
      nominalRank: x.nominalRank,
      codes: stageCodes(x.candidate),
      pass: x.verdict.pass,
      ...(x.verdict.worstCase && {
        worstCase: {
          ...x.verdict.worstCase,
          settlingTime: finite(x.verdict.worstCase.settlingTime),
          worstRipple: finite(x.verdict.worstCase.worstRipple),
          droop: finite(x.verdict.worstCase.droop),
        },
      }),
      ...(x.verdict.yield && { yield: x.verdict.yield }),
    })),
  };
}

function candidateJson(c: Candidate) {
  return {
    stages: c.stages.map((s) =>
      'active' in s ? { active: s.active, r1: s.r1, r2: s.r2, c1: s.c1, c2: s.c2 } : s.buffered ? { r: s.r, c: s.c, buffered: true } : { r: s.r, c: s.c },
    ),
    // A second PWM output's parts (version 1.1 circuits): { r } or { r, c } with a series capacitor.
    ...(c.secondPwm && { secondPwm: c.secondPwm.c !== null ? { r: c.secondPwm.r, c: c.secondPwm.c } : { r: c.secondPwm.r } }),
    ...(c.activeStages && { activeStages: c.activeStages }),
    worstRipple: c.worstRipple,
    settlingTime: finite(c.settlingTime),
    droop: c.droop,
    pass: c.pass,
    codes: stageCodes(c),
    rippleDuty: c.rippleDuty,
    droopDuty: c.droopDuty,
    inl: c.inl,
    gainError: c.gainError,
    pinCurrent: c.pinCurrent,
    totalCapacitance: c.totalCapacitance,
    bits: c.bits,
    frequency: c.frequency,
    checks: c.checks.map((k) => ({ ...k, value: finite(k.value) })),
    margins: Object.fromEntries(Object.entries(c.margins).map(([k, v]) => [k, finite(v)])),
    keepsMargin: c.keepsMargin,
    needsFollower: c.needsFollower,
    notes: c.needsFollower ? [FOLLOWER_NOTE] : [],
  };
}

/**
 * The ripple limit at the resolution the curves are drawn at (that of their designs when the search
 * chose the resolution): a limit the file gave in LSB is so many of that resolution's LSB, one in
 * V or % stays (as designDocument.ts reads it).
 */
function curveRippleLimit(project: Project, result: DesignResult, curves: TradeoffCurve[]): number | undefined {
  const bits = curves.flatMap((c) => c.points.map((p) => p.best?.bits ?? null)).find((b) => b !== null) ?? null;
  const lsb = result.resolutions.find((r) => r.bits === bits)?.lsb;
  const inLsb = project.specInLsb?.ripple;
  return inLsb !== undefined && lsb !== undefined ? inLsb * lsb : result.basis.limits.ripple;
}

/**
 * The design result as text (terminal), GitHub-flavoured Markdown, one self-contained HTML page
 * (the Markdown's sections, the trade-off as an SVG plot, the JSON embedded), or one JSON object (model.md:
 * `candidates` best first, each { stages: [{ r, c[, buffered] }], worstRipple, settlingTime, droop,
 * pass } and more; for a version 1.1 circuit a Sallen-Key stage is { active: 'sallen-key', r1, r2,
 * c1, c2 }, a second output's parts `secondPwm: { r[, c] }` and each Sallen-Key stage's f0 and Q
 * `activeStages: [{ stage, f0, q }]`; `margins` per limit (fractions of the limit), `keepsMargin`, `needsFollower` and
 * `notes`; `evaluated`; with `robust`, `robust: { mode, scanned, candidates: [{ nominalRank, worstCase |
 * yield }] }`; all numbers SI, null for never / unknown). The JSON holds no wall time, so two
 * identical runs print identical JSON; the text and Markdown reports state the search time.
 *
 * Syntax: designReport(project, result, format[, { tradeoff, color, written }])
 * Example: JSON.parse(designReport(p, designSearch(p), 'json')).candidates[0].settlingTime
 */
export function designReport(project: Project, result: DesignResult, format: DesignFormat, options: DesignReportOptions = {}): string {
  if (format === 'json') return JSON.stringify(designJson(result, options), null, 2) + '\n';
  // What the HTML page and the text / Markdown document share.
  const shared = {
    ...(options.tradeoff ? { tradeoff: options.tradeoff } : {}),
    ...(options.written ? { written: options.written } : {}),
    ...(options.robust ? { robust: options.robust } : {}),
    ...(options.tradeoffOutOfTime && { tradeoffOutOfTime: true }),
    ...(options.tradeoffNotDrawn && { tradeoffNotDrawn: options.tradeoffNotDrawn }),
    ...(options.curveEffort !== undefined && { curveEffort: options.curveEffort }),
  };
  if (format === 'html') {
    const doc = designDocument(project, result, shared);
    // The trade-off curve replaces the ASCII chart in its section; the page embeds the JSON.
    const curves = options.tradeoff ?? [];
    return htmlPage(doc, {
      charts: curves.length > 0 ? [tradeoffPlot(curves, curveRippleLimit(project, result, curves))] : [],
      json: designReport(project, result, 'json', options),
    });
  }
  const color = format === 'text' && (options.color ?? false);
  const doc = designDocument(project, result, {
    ...shared,
    ...(color ? { chartColors: CURVE_COLORS } : {}),
    ...(options.width && { width: options.width }),
  });
  return renderDocument(doc, format, { color, ...(options.width && { width: options.width }) });
}

/**
 * The object `design --format json` prints (see designReport), as plain JSON data: what the
 * library API's design() returns.
 *
 * Syntax: designJson(result[, { tradeoff, written, changes, robust, tradeoffOutOfTime, tradeoffNotDrawn }])
 * Example: designJson(designSearch(p)).candidates[0].settlingTime
 */
export function designJson(
  result: DesignResult,
  options: Pick<DesignReportOptions, 'tradeoff' | 'written' | 'changes' | 'robust' | 'tradeoffOutOfTime' | 'tradeoffNotDrawn'> = {},
) {
  const body = {
    pass: result.feasible,
    // false: stopped at --max-time; the designs meet the spec but are not proven the best
    complete: result.complete !== false,
    candidates: result.candidates.map(candidateJson),
    evaluated: result.stats.evaluated,
    verified: result.stats.verified,
    space: result.stats.space,
    diagnosis: result.diagnosis,
    warnings: result.warnings,
    // When nothing is feasible: changes verified by a search, and limits proven out of reach.
    fixes: (result.fixes ?? []).map((f) => ({ kind: f.kind, change: f.change, design: candidateJson(f.best) })),
    proven: (result.proven ?? []).map((m) => ({ stages: m.stages, limit: m.limit, reach: m.reach, limitValue: m.limitValue, reason: m.reason, follower: m.follower ?? false })),
    current: result.current ? candidateJson(result.current) : null,
    resolutions: result.resolutions.map((r) => ({ ...r, best: r.best ? candidateJson(r.best) : null })),
    tradeoff: (options.tradeoff ?? []).map((c) => ({
      stages: c.stages,
      points: c.points.map((p) => ({ ripple: p.ripple, settlingTime: finite(p.settlingTime), best: p.best ? candidateJson(p.best) : null })),
    })),
    // true: the curves were given up at the time limit (--max-time), so `tradeoff` is empty
    // although they were asked for (an empty `tradeoff` otherwise: --no-charts or nothing feasible).
    tradeoffOutOfTime: options.tradeoffOutOfTime ?? false,
    // Stage counts whose curve needed more fast-model evaluations than --curve-effort allows: not drawn.
    tradeoffNotDrawn: options.tradeoffNotDrawn ?? [],
    basis: result.basis,
    written: options.written ?? null,
    changes: options.written ? (options.changes ?? []) : null,
    ...(options.robust && { robust: robustJson(options.robust) }),
  };
  return jsonValue(body);
}
