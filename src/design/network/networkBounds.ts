import type { Duties, Network } from '../../circuit/network.js';
import { codeParts, networkDuties, networkIdeal, periodPowers, quantizedFraction } from '../../engine/index.js';
import { eachSample, fastOrbit, sampledOutput, type FastNetwork, type FastOrbit } from './fastNetwork.js';
import type { NetworkProblem } from './networkProblem.js';

/** Output samples per phase for the ripple bound (a 16-point period misses < 2 % of a sine's peak-to-peak). */
const SAMPLES_PER_PHASE = 8;
/** Largest period index the settling bound looks at (beyond it a count of periods is no longer exact). */
const MAX_PERIODS = 2 ** 52;

/** The orbits of one candidate, computed once per pair of duties. */
export interface Probe {
  readonly fast: FastNetwork;
  orbit(fraction: number): FastOrbit;
}

/**
 * A candidate's probe: its fast model and its periodic orbits at fractions of the code range
 * (networkCodes.ts: the fine output's code split, else the first output's duty), remembered.
 *
 * Syntax: probeOf(fast)
 * Example: probeOf(fastNetwork(n)).orbit(0.5).average
 */
export function probeOf(fast: FastNetwork): Probe {
  const orbits = new Map<number, FastOrbit>();
  return {
    fast,
    orbit(fraction) {
      let o = orbits.get(fraction);
      if (!o) {
        o = fastOrbit(fast, networkDuties(fast.network, fraction) as Duties);
        orbits.set(fraction, o);
      }
      return o;
    },
  };
}

/**
 * Fractions of the code range at which the engine's worst-ripple search certainly evaluates the
 * ripple, nearest first to the middle of the used range (where a PWM fundamental, sin(pi D), is
 * largest): for continuous duties the 33 grid points min + (max - min) i / 32 of
 * networkWorstRipple (maximizeOnInterval with 32 cells, which evaluates every grid point); for a
 * fine output the codes coarse * 2^b (fine code 0) of the coarse codes in range, which it scans.
 *
 * Syntax: rippleProbeFractions(problem, network, count)
 * Example: rippleProbeFractions(p, n, 1)   // [the grid point nearest 0.5]
 */
export function rippleProbeFractions(problem: NetworkProblem, network: Network, count: number): number[] {
  const { dutyMin, dutyMax } = problem.base;
  const second = network.second;
  let points: number[];
  if (second?.role === 'fine') {
    const b = second.bits!;
    const total = 2 ** (b + second.coarseBits!);
    const lo = codeParts(network, dutyMin).code;
    const hi = codeParts(network, dutyMax).code;
    points = [];
    for (let coarse = Math.ceil(lo / 2 ** b); coarse * 2 ** b <= hi; coarse++) points.push((coarse * 2 ** b) / total);
    if (points.length === 0) points = [lo / total];
  } else {
    points = dutyMax > dutyMin ? Array.from({ length: 33 }, (_, i) => (i === 32 ? dutyMax : dutyMin + ((dutyMax - dutyMin) * i) / 32)) : [dutyMin];
  }
  // The point nearest duty 1/2 first, then those nearest the quarter points of the range.
  const middle = (dutyMin + dutyMax) / 2;
  const targets = [Math.min(Math.max(0.5, dutyMin), dutyMax), (dutyMin + middle) / 2, (middle + dutyMax) / 2];
  const out: number[] = [];
  for (const t of targets.slice(0, count)) {
    let best = points[0];
    for (const x of points) if (Math.abs(x - t) < Math.abs(best - t)) best = x;
    if (!out.includes(best)) out.push(best);
  }
  return out;
}

/**
 * A lower bound on the candidate's worst ripple (model.md: the largest peak-to-peak over the used
 * range): the largest max - min of exact output samples (sampledOutput, 16 or more per period) at
 * fractions where the engine's own search evaluates the ripple exactly (rippleProbeFractions), so
 * the bound never exceeds the engine's worst ripple. No assumption on the drivers: the samples are
 * values of the exact switched solution.
 *
 * Syntax: rippleLowerBound(problem, probe, count)
 * Example: rippleLowerBound(p, probeOf(fastNetwork(n)), 1)   // V
 */
export function rippleLowerBound(problem: NetworkProblem, probe: Probe, count: number): number {
  let best = 0;
  for (const f of rippleProbeFractions(problem, probe.fast.network, count)) {
    const s = sampledOutput(probe.fast, probe.orbit(f), SAMPLES_PER_PHASE);
    best = Math.max(best, s.max - s.min);
  }
  return best;
}

/**
 * A lower bound on the settling time (model.md: the smallest t_s with |v(t) - average_to| <= band
 * for every t >= t_s, the slower of the steps when there are two), in s.
 *
 * Method: after the step the deviation from the new periodic orbit at the start of period m is
 * exactly delta_m = M^m delta_0 (M = I - S the one-period map of the switched circuit, delta_0 the
 * old orbit's start state less the new one's), so the output at t = m T is exactly y_to(0) +
 * c delta_m. When |y_to(0) - average_to + c delta_m| > band, the output is outside the band at
 * t = m T and t_s > m T. The search doubles m from 1 while the period start violates the band, then
 * bisects between the last violating and the first clean power of two; whatever violating m it
 * ends on gives a valid bound m T (a transient that rings may make it end early; the bound is then
 * lower, still valid). With `refine`, a period counts as violating when any of sampledOutput's
 * instants inside it (from the exact state delta_m) leaves the band, and the bound is the last such
 * instant of the period found: this catches the periods whose start is inside the band while the
 * ripple on top of the transient is not, and brings the bound to within a sample of the settling
 * time. A violation must exceed the band by a relative 1e-9 to count, so
 * rounding never makes the bound exceed the engine's figure. Powers of M by repeated squaring in
 * the I - S form (engine/periodPowers.ts), which keeps their digits when M is close to the
 * identity. Valid for any drivers and either output role: nothing here linearizes the switched
 * circuit. (A bound from the slowest pole alone would need a linear circuit and the amplitude at
 * which the step excites that mode; the period map gives the exact deviation instead.) The bound
 * is against the settling time as model.md defines it; the tests hold it to the engine's figure
 * (periodicSettling.ts, whose scan of late periods assumes one band crossing between samples).
 *
 * Syntax: settlingLowerBound(problem, probe[, refine])
 * Example: settlingLowerBound(p, probeOf(fastNetwork(n)))   // s
 */
export function settlingLowerBound(problem: NetworkProblem, probe: Probe, refine = false): number {
  const { steps, band } = problem.base;
  let best = 0;
  for (const [from, to] of steps) best = Math.max(best, stepBound(probe, from, to, band, refine));
  return best;
}

function stepBound(probe: Probe, from: number, to: number, band: number, refine: boolean): number {
  const { n, equations, network } = probe.fast;
  const T = network.period;
  const c = equations.output;
  const start = probe.orbit(from);
  const end = probe.orbit(to);
  const offset = end.yStart - end.average;
  const delta0 = start.start.map((v, i) => v - end.start[i]);
  const limit = band * (1 + 1e-9);
  // Whether period m (deviation delta at its start) leaves the band: at its start, or with
  // `refine` at any of its samples.
  const atStart = (delta: readonly number[]) => {
    let y = offset;
    for (let i = 0; i < n; i++) y += c[i] * delta[i];
    return Math.abs(y) > limit;
  };
  const late = (delta: readonly number[]) => lastSampleOutside(probe, end, end.start.map((v, i) => v + delta[i]), end.average, limit);
  const violates = refine ? (delta: readonly number[]) => late(delta) >= 0 : atStart;
  if (!violates(delta0)) return 0;
  const powers = periodPowers([...end.S], n);
  let lo = 0;
  let loDelta: number[] = delta0;
  // Doubling: delta at 2m = 2^(j+1) from delta at m = 2^j by M^(2^j).
  let m = 1;
  let delta = powers.apply(0, delta0);
  let j = 0;
  while (violates(delta)) {
    lo = m;
    loDelta = delta;
    if (m >= MAX_PERIODS) return m * T;
    delta = powers.apply(j, delta);
    j++;
    m *= 2;
  }
  let hi = m;
  while (hi - lo > 1) {
    const mid = Math.floor((lo + hi) / 2);
    const midDelta = powers.applyPower(mid - lo, loDelta);
    if (violates(midDelta)) {
      lo = mid;
      loDelta = midDelta;
    } else hi = mid;
  }
  return refine ? lo * T + late(loDelta) : lo * T;
}

/** The last of sampledOutput's instants in one period from `state` at which |y - average| > limit, or -1. */
function lastSampleOutside(probe: Probe, orbit: FastOrbit, state: readonly number[], average: number, limit: number): number {
  let last = -1;
  eachSample(probe.fast, orbit, state, SAMPLES_PER_PHASE, (t, y) => {
    if (Math.abs(y - average) > limit) last = t;
  });
  return last;
}

/** Lower bounds on the DC transfer figures, and the exact endpoint-fit gain error. */
export interface DcBounds {
  /** Largest |ideal - average| over the probes, V (<= the engine's droop). */
  droop: number;
  /** Largest |fit - average| over the probes, V (<= the engine's INL). */
  inl: number;
  /** Endpoint-fit gain error, V (exact: the same two averages as the engine's fit). */
  gainError: number;
}

/**
 * DC transfer figures of a candidate from exact averages at a few points the engine's DC search
 * evaluates too (endpointFit.ts): the ends of the used range (the fit's own points, so the gain
 * error is exact), and either the 16-cell grid points at a quarter, half and three quarters of the
 * range (continuous duties; maximizeOnInterval evaluates every grid point) or, for a fine output,
 * the codes at fine 0 and full of the coarse codes next to the ends and in the middle (the codes
 * networkDcTransfer scans). The engine's droop and INL are the largest over a superset of these
 * points, so the values here bound them from below.
 *
 * Syntax: dcBounds(problem, probe)
 * Example: dcBounds(p, probeOf(fastNetwork(n))).gainError   // V
 */
export function dcBounds(problem: NetworkProblem, probe: Probe): DcBounds {
  const { dutyMin, dutyMax } = problem.base;
  const network = probe.fast.network;
  const span = network.pin.high - network.pin.low;
  const q = (f: number) => quantizedFraction(network, f);
  const yMin = probe.orbit(dutyMin).average;
  const yMax = probe.orbit(dutyMax).average;
  const qMin = q(dutyMin);
  const qMax = q(dutyMax);
  const slope = qMax > qMin ? (yMax - yMin) / (qMax - qMin) : span;
  const points = [dutyMin, dutyMax, ...dcProbeFractions(problem, network)];
  let droop = 0;
  let inl = 0;
  for (const f of points) {
    const y = probe.orbit(f).average;
    droop = Math.max(droop, Math.abs(networkIdeal(network, f) - y));
    inl = Math.max(inl, Math.abs(yMin + slope * (q(f) - qMin) - y));
  }
  return { droop, inl, gainError: span - slope };
}

/** The inner probe points of dcBounds. */
function dcProbeFractions(problem: NetworkProblem, network: Network): number[] {
  const { dutyMin, dutyMax } = problem.base;
  if (!(dutyMax > dutyMin)) return [];
  const second = network.second;
  if (second?.role !== 'fine') return [4, 8, 12].map((i) => dutyMin + ((dutyMax - dutyMin) * i) / 16);
  const b = second.bits!;
  const total = 2 ** (b + second.coarseBits!);
  const lo = codeParts(network, dutyMin).code;
  const hi = codeParts(network, dutyMax).code;
  const first = Math.floor(lo / 2 ** b);
  const last = Math.floor(hi / 2 ** b);
  const out = new Set<number>();
  for (const coarse of [first + 1, Math.floor((first + last) / 2), last - 1]) {
    for (const fine of [0, 2 ** b - 1]) {
      const code = Math.min(Math.max(coarse * 2 ** b + fine, lo), hi);
      out.add(code / total);
    }
  }
  return [...out];
}
