import { brentMaximize } from '../numeric/maximizeOnInterval.js';
import type { Project } from '../project/types.js';
import { circuitMetrics } from './circuitMetrics.js';
import { metricPlan, type MetricPlan } from './metricPlan.js';
import type { CircuitMetrics } from './metrics.js';
import { requireTolerance } from './monteCarlo.js';
import { toleranceParameters, type ToleranceParameter } from './parameters.js';
import { circuitAt, circuitScale, toleranceCircuitOf, type ToleranceCircuit } from './toleranceCircuit.js';

export type Figure = 'ripple' | 'droop' | 'inl' | 'gain' | 'settling';

/** How raising a parameter across its range moves a figure's severity. */
export type Effect = 'raises' | 'lowers' | 'none' | 'mixed';

/** The worst case of one figure over the tolerance box. */
export interface WorstCaseFigure {
  figure: Figure;
  /**
   * V (ripple; signed error for droop and INL), a signed fraction of full scale (gain error), or s
   * (settling; null = never settles).
   */
  value: number | null;
  /** Duty where the figure occurs (ripple, droop, INL), else null. */
  duty: number | null;
  /** The worst point: deviates in [-1, 1] and part values, one per parameter. */
  z: number[];
  values: number[];
  /** Effect of each parameter, from the sign scan. */
  effects: Effect[];
  /** `corner` when every parameter acts one way; `search` when some were searched along. */
  method: 'corner' | 'search';
  /** Keys of the parameters searched along (their effect changes sign). */
  searched: string[];
  /** The sweep over all corners found a point worse than the scan predicted (reported value). */
  cornerSweepWorse: boolean;
  limit: number | null;
  /** Within the limit at the worst case (null when the spec has no limit). */
  pass: boolean | null;
}

export interface WorstCaseResult {
  parameters: ToleranceParameter[];
  plan: MetricPlan;
  nominal: CircuitMetrics;
  worstRipple: WorstCaseFigure;
  droop: WorstCaseFigure;
  inl: WorstCaseFigure | null;
  /** Gain error (fraction of full scale), when asked for (options.gain) and limited by spec.gain. */
  gain: WorstCaseFigure | null;
  settlingTime: WorstCaseFigure;
  /** Every limited figure passes at its worst case. */
  pass: boolean;
  /** Circuits evaluated. */
  evaluations: number;
}

export interface WorstCaseOptions {
  /** Also evaluate all 2^P corners as a check (default: when P <= 10). */
  cornerSweep?: boolean;
  /** Recompute each worst point with the engine's matrix-exponential path (default false). */
  confirmWithEngine?: boolean;
  /** Also find the worst gain error when spec.gain limits it (default false; see MetricPlanOptions). */
  gain?: boolean;
}

const SCAN_LEVELS = [-1, 0, 1];
const LINE_POINTS = 9;

/**
 * Worst case of worst ripple, droop, INL (when limited) and settling time over the tolerance box
 * of a circuit, ladder or network (default: the project's, toleranceCircuit.ts).
 *
 * Method: (1) sign scan: at several points of the box (centre, all-low and all-high corners, two
 * alternating corners, a half-and-half corner) each parameter is set to its minimum, centre and
 * maximum; the signs of the two differences of each figure's severity (ripple, |droop|, |INL|,
 * settling time) classify the parameter as raising, lowering, not affecting or mixed. (2) Monotone
 * parameters go to the bound that makes the figure worse; mixed ones are searched along their range
 * (9-point line plus Brent's maximization, brentMaximize, coordinate by coordinate, two rounds).
 * (3) Unless disabled, all 2^P corners are evaluated too and a worse corner replaces the result
 * (flagged). Figures come from circuitMetrics (exact; searches started from the nominal's peaks);
 * optionally each worst point is recomputed by the engine alone (its full searches).
 *
 * Syntax: worstCase(project[, circuit, { cornerSweep, confirmWithEngine }])
 * Example: worstCase(p).worstRipple.value  // V at the worst corner
 */
export function worstCase(project: Project, circuit?: ToleranceCircuit, options: WorstCaseOptions = {}): WorstCaseResult {
  const settings = requireTolerance(project);
  const nominalCircuit = circuit ?? toleranceCircuitOf(project);
  const parameters = toleranceParameters(settings, nominalCircuit);
  const plan = metricPlan(project, nominalCircuit, { gain: options.gain });
  const scale = circuitScale(nominalCircuit);
  const P = parameters.length;
  const memo = new Map<string, CircuitMetrics>();
  const evaluate = (z: number[]): CircuitMetrics => {
    const key = z.join(',');
    let m = memo.get(key);
    if (!m) {
      m = circuitMetrics(circuitAt(nominalCircuit, parameters, z), plan);
      memo.set(key, m);
    }
    return m;
  };

  const figures: Figure[] = ['ripple', 'droop', ...(plan.inl ? (['inl'] as Figure[]) : []), ...(plan.gain ? (['gain'] as Figure[]) : []), 'settling'];
  // Below these a change is rounding noise: 1e-12 of full scale for voltages (and for the gain
  // error, a fraction of full scale), 1e-9 T for time.
  const floorOf = (f: Figure) =>
    f === 'settling' ? 1e-9 * scale.period : f === 'gain' ? 1e-12 : 1e-12 * scale.fullScale;
  const scanPoints = distinctPoints([
    new Array(P).fill(0),
    new Array(P).fill(-1),
    new Array(P).fill(1),
    Array.from({ length: P }, (_, p) => (p % 2 === 0 ? 1 : -1)),
    Array.from({ length: P }, (_, p) => (p % 2 === 0 ? -1 : 1)),
    Array.from({ length: P }, (_, p) => (p < P / 2 ? 1 : -1)),
  ]);
  const effects = new Map<Figure, Effect[]>(figures.map((f) => [f, new Array<Effect>(P).fill('none')]));
  for (let p = 0; p < P; p++) {
    const signs = new Map<Figure, Set<number>>(figures.map((f) => [f, new Set<number>()]));
    for (const x of scanPoints) {
      const line = SCAN_LEVELS.map((level) => evaluate(withCoordinate(x, p, level)));
      for (const f of figures) {
        const s = line.map((m) => severity(m, f));
        signs.get(f)!.add(compare(s[1], s[0], floorOf(f))).add(compare(s[2], s[1], floorOf(f)));
      }
    }
    for (const f of figures) {
      const set = signs.get(f)!;
      set.delete(0);
      effects.get(f)![p] = set.size === 0 ? 'none' : set.size === 2 ? 'mixed' : set.has(1) ? 'raises' : 'lowers';
    }
  }

  const results = new Map<Figure, { z: number[]; searched: string[]; sweptWorse: boolean }>();
  for (const f of figures) {
    const eff = effects.get(f)!;
    let z: number[] = eff.map((e) => (e === 'raises' ? 1 : e === 'lowers' ? -1 : 0));
    const mixed = eff.flatMap((e, p) => (e === 'mixed' ? [p] : []));
    for (let round = 0; round < (mixed.length > 1 ? 2 : 1); round++) {
      for (const p of mixed) z = lineSearch(z, p, (y) => severity(evaluate(y), f), floorOf(f));
    }
    results.set(f, { z, searched: mixed.map((p) => parameters[p].key), sweptWorse: false });
  }

  if (options.cornerSweep ?? P <= 10) {
    for (let mask = 0; mask < 2 ** P; mask++) {
      const corner = Array.from({ length: P }, (_, p) => ((mask >> p) & 1 ? 1 : -1));
      const m = evaluate(corner);
      for (const f of figures) {
        const r = results.get(f)!;
        if (compare(severity(m, f), severity(evaluate(r.z), f), floorOf(f)) > 0) {
          results.set(f, { ...r, z: corner, sweptWorse: true });
        }
      }
    }
  }

  // Figures often share their worst point: the engine confirms each point once.
  const confirmed = new Map<string, CircuitMetrics>();
  const confirm = (z: number[]): CircuitMetrics => {
    const key = z.join(',');
    let m = confirmed.get(key);
    if (!m) {
      m = circuitMetrics(circuitAt(nominalCircuit, parameters, z), plan, { engineOnly: true });
      confirmed.set(key, m);
    }
    return m;
  };
  const figureResult = (f: Figure): WorstCaseFigure => {
    const r = results.get(f)!;
    const m = options.confirmWithEngine ? confirm(r.z) : evaluate(r.z);
    const { value, duty } = figureValue(m, f);
    const limit = limitOf(plan, f);
    return {
      figure: f,
      value,
      duty,
      z: r.z,
      values: parameters.map((q, p) => 0.5 * (q.min + q.max) + r.z[p] * 0.5 * (q.max - q.min)),
      effects: effects.get(f)!,
      method: r.searched.length > 0 ? 'search' : 'corner',
      searched: r.searched,
      cornerSweepWorse: r.sweptWorse,
      limit,
      pass: limit === null ? null : value !== null && Math.abs(value) <= limit,
    };
  };
  const worstRipple = figureResult('ripple');
  const droop = figureResult('droop');
  const inl = plan.inl ? figureResult('inl') : null;
  const gain = plan.gain ? figureResult('gain') : null;
  const settlingTime = figureResult('settling');
  const all = [worstRipple, droop, inl, gain, settlingTime].filter((x): x is WorstCaseFigure => x !== null);
  return {
    parameters,
    plan,
    nominal: circuitMetrics(nominalCircuit, plan),
    worstRipple,
    droop,
    inl,
    gain,
    settlingTime,
    pass: all.every((x) => x.pass !== false),
    evaluations: memo.size,
  };
}

/** How bad a figure is: larger is worse (a step that never settles is infinitely bad). */
function severity(m: CircuitMetrics, f: Figure): number {
  switch (f) {
    case 'ripple':
      return m.worstRipple.ripple;
    case 'droop':
      return Math.abs(m.droop.error);
    case 'inl':
      return Math.abs(m.inl?.error ?? 0);
    case 'gain':
      return Math.abs(m.gain ?? 0);
    case 'settling':
      return m.settlingTime ?? Infinity;
  }
}

function figureValue(m: CircuitMetrics, f: Figure): { value: number | null; duty: number | null } {
  switch (f) {
    case 'ripple':
      return { value: m.worstRipple.ripple, duty: m.worstRipple.duty };
    case 'droop':
      return { value: m.droop.error, duty: m.droop.duty };
    case 'inl':
      return { value: m.inl?.error ?? 0, duty: m.inl?.duty ?? null };
    case 'gain':
      return { value: m.gain ?? 0, duty: null };
    case 'settling':
      return { value: m.settlingTime, duty: null };
  }
}

function limitOf(plan: MetricPlan, f: Figure): number | null {
  const l = plan.limits;
  const v = f === 'ripple' ? l.ripple : f === 'droop' ? l.droop : f === 'inl' ? l.inl : f === 'gain' ? l.gain : l.settling;
  return v ?? null;
}

/**
 * Sign of b - a, treating differences below 1e-9 of the larger magnitude, or below `floor`, as no
 * change (rounding noise, e.g. the DC error of an open output, which is zero).
 */
function compare(b: number, a: number, floor = 0): number {
  if (a === b) return 0;
  if (!Number.isFinite(a) || !Number.isFinite(b)) return b > a ? 1 : -1;
  const scale = Math.max(Math.abs(a), Math.abs(b));
  if (Math.abs(b - a) <= Math.max(1e-9 * scale, floor)) return 0;
  return b > a ? 1 : -1;
}

function withCoordinate(z: number[], p: number, value: number): number[] {
  const y = z.slice();
  y[p] = value;
  return y;
}

function distinctPoints(points: number[][]): number[][] {
  const seen = new Set<string>();
  return points.filter((x) => {
    const key = x.join(',');
    if (seen.has(key)) return false;
    seen.add(key);
    return true;
  });
}

/** Maximize g along coordinate p of z over [-1, 1]: a 9-point line, then Brent around the best. */
function lineSearch(z: number[], p: number, g: (y: number[]) => number, floor: number): number[] {
  const xs = Array.from({ length: LINE_POINTS }, (_, i) => -1 + (2 * i) / (LINE_POINTS - 1));
  const gs = xs.map((x) => g(withCoordinate(z, p, x)));
  let best = 0;
  for (let i = 1; i < xs.length; i++) if (compare(gs[i], gs[best], floor) > 0) best = i;
  let bestX = xs[best];
  let bestG = gs[best];
  if (Number.isFinite(bestG)) {
    const lo = xs[Math.max(best - 1, 0)];
    const hi = xs[Math.min(best + 1, xs.length - 1)];
    const refined = brentMaximize((x) => g(withCoordinate(z, p, x)), lo, hi, 1e-7);
    if (compare(refined.value, bestG, floor) > 0) {
      bestX = refined.x;
      bestG = refined.value;
    }
  }
  return withCoordinate(z, p, bestX);
}
