import { defaultBand } from '../engine/index.js';
import type { Project, SettlingSpec } from '../project/types.js';
import { designProblem } from './designProblem.js';
import { projectAtResolution } from './projectAtResolution.js';
import { relaxProject } from './relaxProject.js';
import { SETTLING_TIE } from './rankCandidates.js';
import { bestDesigns } from './bestDesigns.js';
import type { Candidate } from './types.js';

/** One point of a trade-off curve. */
export interface TradeoffPoint {
  /** Ripple limit, V. */
  ripple: number;
  /** Best exact settling time under that limit (other limits as specified, no time limit), s; null: no design. */
  settlingTime: number | null;
  best: Candidate | null;
}

export interface TradeoffCurve {
  stages: number;
  points: TradeoffPoint[];
}

export interface TradeoffOptions {
  /** Ripple limits to try, V (default: `points` values log-spaced over spec ripple / 8 .. spec ripple * 8). */
  ripples?: number[];
  points?: number;
  /** Resolution to draw the curves at (with a search over bits), default the project's. */
  bits?: number;
  onProgress?: (fraction: number) => void;
}

/**
 * Best achievable settling time against the allowed ripple, one curve per stage count: for each
 * ripple limit the design search (bestDesigns.ts, top 1, engine-verified) with that ripple limit,
 * the other limits as the project states them and no settling-time limit of the project's; like
 * the search, every point keeps search.margin below each limit (the ripple limit included).
 *
 * Method: repeated exact searches; ripple limits log-spaced around the spec's (or `center`), taken
 * from the tightest up. The best design under a tighter limit also meets every looser one, so its
 * settling time t bounds the looser optimum: each search after the first gets t (widened by a few
 * rounding tie widths, rankCandidates.ts, so the whole leading tie group stays in) as its settling
 * limit, which lets the search prune from its first candidate. Same answers as independent
 * searches (tested), several times faster.
 *
 * Syntax: tradeoffCurves(project, stageCounts, center[, { ripples, points, bits, onProgress }])
 * Example: tradeoffCurves(p, [1, 2], p.spec.ripple)[1].points[4].settlingTime   // s at the spec's ripple
 */
export function tradeoffCurves(project: Project, stageCounts: number[], center: number, options: TradeoffOptions = {}): TradeoffCurve[] {
  const count = options.points ?? 9;
  const ripples =
    options.ripples ?? Array.from({ length: count }, (_, i) => center * 8 ** ((2 * i) / Math.max(1, count - 1) - 1));
  // A limit in V here: drop the LSB record of the ripple so a resolution change keeps the value.
  const free = relaxProject(project, ['settling'], Infinity);
  const inLsb = free.specInLsb ? { ...free.specInLsb } : undefined;
  if (inLsb) delete inLsb.ripple;
  const tightestFirst = ripples.map((_, i) => i).sort((a, b) => ripples[a] - ripples[b]);
  // The band an unbounded search defaults to at the curves' resolution (designProblem.ts): the
  // bound must not change it, or bounded answers would differ from independent searches.
  const band = defaultBand(options.bits === undefined ? free : projectAtResolution(free, options.bits));
  const total = ripples.length * stageCounts.length;
  // The search keeps search.margin below every limit, the bound's too: widen it by that margin.
  const margin = project.search?.margin ?? 0;
  let done = 0;
  return stageCounts.map((n) => {
    const points: TradeoffPoint[] = new Array(ripples.length);
    let bound: number | null = null;
    for (const i of tightestFirst) {
      const ripple = ripples[i];
      const settling: SettlingSpec | undefined =
        bound === null ? free.spec.settling : { band, ...free.spec.settling, time: (bound * (1 + 4 * SETTLING_TIE)) / (1 - margin) };
      const spec = { ...free.spec, ripple, ...(settling && { settling }) };
      const at: Project = { ...free, spec, ...(inLsb && { specInLsb: inLsb }) };
      const found = bestDesigns(designProblem(at, options.bits), 1, [n]).feasible[0] ?? null;
      // The bound is the search's own device, not a limit of the user's: report no check for it.
      const best: Candidate | null = found && bound !== null ? { ...found, checks: found.checks.filter((c) => c.name !== 'settling'), margins: withoutSettling(found.margins) } : found;
      if (best?.settlingTime != null && Number.isFinite(best.settlingTime)) bound = best.settlingTime;
      points[i] = { ripple, settlingTime: best?.settlingTime ?? null, best };
      options.onProgress?.(++done / total);
    }
    return { stages: n, points };
  });
}

function withoutSettling(margins: Candidate['margins']): Candidate['margins'] {
  const out = { ...margins };
  delete out.settling;
  return out;
}
