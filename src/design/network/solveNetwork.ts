import type { NetworkStage } from '../../circuit/network.js';
import { networkPinPeakCurrent, OutsideDomainError } from '../../engine/index.js';
import { REL } from '../searchAllowance.js';
import { rankCandidates } from '../rankCandidates.js';
import { recheck } from '../recheck.js';
import type { AnyCandidateStage, Candidate, DesignLimits } from '../types.js';
import { fastNetwork } from './fastNetwork.js';
import { dcBounds, probeOf, rippleLowerBound, settlingLowerBound, type DcBounds, type Probe } from './networkBounds.js';
import { networkCandidate } from './networkCandidate.js';
import type { NetworkProblem, SecondParts } from './networkProblem.js';

/** Ripple probe points: one first (most candidates fail there), then three before an exact evaluation. */
const FIRST_PROBES = 1;
const CHECK_PROBES = 3;

/** Why candidates were ruled out before the exact engine, counted (for an empty result's explanation). */
export interface RuledOut {
  pinCurrent: number;
  ripple: number;
  settling: number;
  /** Droop, INL or gain error by their bounds (dcBounds). */
  dc: number;
  /** Outside the engine's numerical domain (numericalDomain.ts), or without a DC state. */
  domain: number;
}

/** What the search over one version 1.1 design problem gave. */
export interface NetworkOutcome {
  /** The `top` best designs that keep search.margin to every limit, ranked (exact figures). */
  feasible: Candidate<AnyCandidateStage>[];
  /** Designs the exact engine evaluated that miss a limit or its margin. */
  failing: Candidate<AnyCandidateStage>[];
  /** Candidates the fast model evaluated (settling bound, and for some the ripple and DC bounds). */
  evaluated: number;
  /** Candidates the exact engine evaluated. */
  verified: number;
  space: number;
  /** False when the deadline stopped the search: `feasible` is then not proven the best. */
  complete: boolean;
  ruledOut: RuledOut;
  /** The smallest settling bound among candidates that passed the ripple bound, s (null: none). */
  fastest: number | null;
}

export interface SolveNetworkOptions {
  /** performance.now() in ms after which the search stops with what it has (`design --max-time`). */
  deadline?: number;
  onProgress?: (fraction: number, best: number | null) => void;
}

/**
 * A candidate with its settling bound, and what later steps learn about it (kept, so that a
 * second pass under other limits, as for the trade-off curves, reuses it).
 */
export interface NetworkEntry {
  readonly stages: readonly NetworkStage[];
  readonly second: SecondParts | null;
  /** Lower bound on the settling time, s (period starts; settlingLowerBound). */
  readonly lb: number;
  /** The bound sharpened inside the last violating periods, s. */
  refined?: number;
  /** Ripple lower bound at one probe, then at three, V. */
  ripple1?: number;
  ripple3?: number;
  dc?: DcBounds;
  /** The exact engine's design, or null outside the numerical domain. */
  exact?: Candidate<AnyCandidateStage> | null;
}

/**
 * The walk over the whole space: every candidate within the pin-current limit, with its settling
 * bound. It depends on neither the ripple nor the settling-time limit, so the trade-off curves reuse
 * the search's walk.
 */
export interface NetworkWalk {
  /** Ascending settling bound. */
  entries: NetworkEntry[];
  evaluated: number;
  ruledOut: RuledOut;
  complete: boolean;
}

/** Share of the time left before a deadline that the walk may take: the rest verifies what it found. */
const WALK_SHARE = 0.7;

/**
 * The walk's own deadline within a search's (performance.now() ms): WALK_SHARE of the time left,
 * so that a walk cut short still leaves time to verify the candidates it collected.
 *
 * Syntax: walkDeadline(deadline)
 * Example: walkDeadline(performance.now() + 10000)   // about 7 s from now
 */
export function walkDeadline(deadline: number | undefined): number | undefined {
  return deadline === undefined ? undefined : performance.now() + WALK_SHARE * Math.max(0, deadline - performance.now());
}

const over = (value: number, limit: number | undefined) => limit !== undefined && value > limit * (1 + REL) + 1e-15;

/**
 * Step 1 of solveNetwork: walk the space (networkProblem.ts) and keep every candidate whose pin
 * peak current (closed form, as the engine computes it) stays within the problem's search limit,
 * with its settling bound (settlingLowerBound, from the exact period map), sorted by the bound.
 *
 * Syntax: walkNetworkSpace(problem[, { deadline, onProgress }])
 * Example: walkNetworkSpace(networkProblem(p)).entries[0].lb   // s
 */
export function walkNetworkSpace(problem: NetworkProblem, options: SolveNetworkOptions = {}): NetworkWalk {
  const limits = problem.base.searchLimits;
  const ruledOut: RuledOut = { pinCurrent: 0, ripple: 0, settling: 0, dc: 0, domain: 0 };
  const entries: NetworkEntry[] = [];
  let evaluated = 0;
  let visited = 0;
  let complete = true;
  const progressEvery = Math.max(1, Math.floor(problem.space / 200));
  problem.enumerate((stages, second) => {
    visited++;
    if (visited % progressEvery === 0) {
      options.onProgress?.(visited / problem.space, null);
      if (options.deadline !== undefined && performance.now() > options.deadline) {
        complete = false;
        return false;
      }
    }
    const network = problem.networkOf(stages, second);
    if (over(networkPinPeakCurrent(network), limits.pinCurrent)) {
      ruledOut.pinCurrent++;
      return;
    }
    try {
      const lb = settlingLowerBound(problem, probeOf(fastNetwork(network)));
      evaluated++;
      entries.push({ stages, second, lb });
    } catch (error) {
      // A circuit without a DC state or periodic orbit (singular matrices) cannot be a design.
      if (!(error instanceof RangeError)) throw error;
      ruledOut.domain++;
    }
  });
  entries.sort((a, b) => a.lb - b.lb);
  return { entries, evaluated, ruledOut, complete };
}

/**
 * Step 2 of solveNetwork: the entries in ascending order of their settling bound, each checked
 * against the problem's search limits by its ripple, settling and DC bounds (cheapest first, kept
 * on the entry) and then by the exact engine, until an entry's bound exceeds the top-th best exact
 * settling time t_N: its settling time is at least its bound, and so is every later entry's, so
 * none of them can enter the list.
 *
 * Syntax: verifyInOrder(problem, walk, top[, { deadline, onProgress }])
 * Example: verifyInOrder(p, walkNetworkSpace(p), 5).feasible.length
 */
export function verifyInOrder(problem: NetworkProblem, walk: NetworkWalk, top: number, options: SolveNetworkOptions = {}): NetworkOutcome {
  const limits: DesignLimits = problem.base.searchLimits;
  const ruledOut = { ...walk.ruledOut };
  const span = problem.base.project.pwm.high - problem.base.project.pwm.low;
  const feasible: Candidate<AnyCandidateStage>[] = [];
  const failing: Candidate<AnyCandidateStage>[] = [];
  let ranked: Candidate<AnyCandidateStage>[] = [];
  let tN = Infinity;
  let verified = 0;
  let complete = walk.complete;
  let fastest: number | null = null;
  const { entries } = walk;
  const slowest = limits.settlingTime === undefined ? Infinity : limits.settlingTime * (1 + REL) + 1e-12;
  // A walk cut at its deadline: its candidates are verified all the same (the result then says incomplete).
  for (let i = 0; i < entries.length; i++) {
    const e = entries[i];
    if (e.lb > slowest) {
      // This and every later entry settle slower than the limit allows.
      ruledOut.settling += entries.length - i;
      break;
    }
    if (e.lb > tN * (1 + REL) + 1e-12) break;
    if (options.deadline !== undefined && performance.now() > options.deadline) {
      complete = false;
      break;
    }
    if (i % 64 === 0) options.onProgress?.(i / entries.length, ranked[0]?.settlingTime ?? fastest);
    let probe: Probe | undefined;
    const probeNow = () => (probe ??= probeOf(fastNetwork(problem.networkOf(e.stages, e.second))));
    if (limits.ripple !== undefined) {
      e.ripple1 ??= rippleLowerBound(problem, probeNow(), FIRST_PROBES);
      if (over(e.ripple1, limits.ripple) || over((e.ripple3 ??= rippleLowerBound(problem, probeNow(), CHECK_PROBES)), limits.ripple)) {
        ruledOut.ripple++;
        continue;
      }
    }
    if (fastest === null) fastest = e.lb;
    // The bound sharpened inside the last violating periods: cheap beside an exact evaluation.
    e.refined ??= settlingLowerBound(problem, probeNow(), true);
    if (e.refined > tN * (1 + REL) + 1e-12) continue;
    e.dc ??= dcBounds(problem, probeNow());
    if (over(e.dc.droop, limits.droop) || over(e.dc.inl, limits.inl) || over(Math.abs(e.dc.gainError) / span, limits.gain)) {
      ruledOut.dc++;
      continue;
    }
    if (e.exact === undefined) {
      try {
        e.exact = networkCandidate(problem, problem.networkOf(e.stages, e.second));
        verified++;
      } catch (error) {
        if (!(error instanceof OutsideDomainError)) throw error;
        e.exact = null;
      }
    }
    if (e.exact === null) {
      ruledOut.domain++;
      continue;
    }
    // Figures are the circuit's; checks and margins are this problem's (another pass may differ in limits).
    const candidate = recheck(problem.base, e.exact);
    if (!candidate.keepsMargin) {
      failing.push(candidate);
      continue;
    }
    feasible.push(candidate);
    ranked = rankCandidates(feasible).slice(0, top);
    if (ranked.length === top) tN = ranked[top - 1].settlingTime ?? Infinity;
  }
  options.onProgress?.(1, ranked[0]?.settlingTime ?? fastest);
  return { feasible: ranked, failing, evaluated: walk.evaluated, verified, space: problem.space, complete, ruledOut, fastest };
}

/**
 * The `top` best designs of a version 1.1 design problem, each evaluated by the exact engine and
 * proven the `top` best of the whole discrete space under the ranking rules (rankCandidates.ts:
 * settling time, then smaller total capacitance, total resistance, then the values part by part).
 *
 * Method (every pruning step compares a proven lower bound with a limit; networkBounds.ts):
 * 1. walkNetworkSpace: per candidate of the space (networkProblem.ts: the Q window fixes the
 *    Sallen-Key c1 choices, the fine window the weighting resistor's), the pin peak current
 *    (closed form) and a lower bound on the settling time (the last period start found outside the
 *    band, from the exact period map of the switched circuit); a candidate over the pin-current
 *    search limit (the file's limit less search.margin) cannot be recommended and is dropped.
 * 2. verifyInOrder: the rest in ascending order of that bound, up to the settling-time limit; a
 *    lower bound on the worst ripple
 *    (exact output samples at one, then three duties the engine's own search evaluates), the
 *    settling bound sharpened inside the period, the DC figures (exact endpoint-fit gain error,
 *    droop and INL bounds at points the engine evaluates), then the exact engine; stop once the
 *    bound exceeds the top-th best exact settling time.
 * Nothing assumes equal drivers or linearizes the switching: the bounds are values of the exact
 * solution (period starts, samples, averages), so they hold for any driver resistances.
 *
 * With options.walk (a walk of the same space and pin-current limit) step 1 is skipped.
 *
 * Syntax: solveNetwork(problem, top[, { deadline, onProgress, walk }])
 * Example: solveNetwork(networkProblem(p), 5).feasible[0].settlingTime   // s
 */
export function solveNetwork(problem: NetworkProblem, top: number, options: SolveNetworkOptions & { walk?: NetworkWalk } = {}): NetworkOutcome {
  const report = options.onProgress;
  const cut = walkDeadline(options.deadline);
  const walk = options.walk ?? walkNetworkSpace(problem, {
    ...(cut !== undefined && { deadline: cut }),
    ...(report && { onProgress: (f: number, b: number | null) => report(0.8 * f, b) }),
  });
  return verifyInOrder(problem, walk, top, {
    ...(options.deadline !== undefined && { deadline: options.deadline }),
    ...(report && { onProgress: (f: number, b: number | null) => report(0.8 + 0.2 * f, b) }),
  });
}
