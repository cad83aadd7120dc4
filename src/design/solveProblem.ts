import { collectCandidates, keyOf, newCollectState, type FastEntry } from './collectCandidates.js';
import { REL } from './searchAllowance.js';
import type { Admit } from './cornerScreen.js';
import type { DesignProblem } from './designProblem.js';
import { exactCandidate } from './exactCandidate.js';
import { modalLadderOf, steadySwing, type SteadySwing } from '../engine/index.js';
import { dcTransferMiss } from './dcTransferMiss.js';
import { maximizeOverDuty } from './maximizeOverDuty.js';
import { rankCandidates, SETTLING_TIE } from './rankCandidates.js';
import type { Candidate } from './types.js';

/** What one problem (one resolution) gave. */
export interface ProblemOutcome {
  /** The `top` best feasible designs, ranked (engine figures). */
  feasible: Candidate[];
  /** Designs the engine evaluated that fail a check (for "closest" reports). */
  failing: Candidate[];
  evaluated: number;
  verified: number;
  /** Candidates in the discrete space over the problem's stage counts. */
  space: number;
  /** False when a budget stopped the walk: `feasible` is then true but not proven the best. */
  complete: boolean;
}

/** What solveProblem reports while it walks (for a progress line). */
export interface ProblemProgress {
  /** Stage count being walked. */
  stages: number;
  /** Best fast settling estimate among candidates that pass every fast check so far, s (null: none yet). */
  best: number | null;
}

export interface SolveOptions {
  /** Largest number of fast evaluations before the walk stops (side searches of explanations). */
  budget?: number;
  /** performance.now() in ms after which the search stops with what it has (`design --max-time`). */
  deadline?: number;
  /** Largest number of fast evaluations before the walk stops, every pruning kept (CollectState.cap; complete: false then). */
  cap?: number;
  /** Verify and rank only candidates this admits (DesignOptions.admit). */
  admit?: Admit;
}

/** Time past the deadline for verifying what a cut walk collected, ms. */
const VERIFY_GRACE = 1000;

/** Growth of theta per extra collection round when the walk's threshold proved too low. */
const WIDEN = 2;

/**
 * The `top` best feasible designs of one design problem, each evaluated by the exact engine, and
 * guaranteed to be the `top` best of the whole discrete space under the ranking rules
 * (rankCandidates.ts).
 *
 * Method: collectCandidates gathers every candidate whose settling lower bound is at most a
 * threshold theta that falls to the top-th best fast estimate as the walk proceeds. The engine
 * then evaluates them in ascending order of the bound until the bound exceeds the top-th best
 * exact settling time t_N (a candidate below the bound cannot beat t_N). If t_N came out above the
 * theta the walk used (fast estimates too optimistic, e.g. a design that fails INL, which only the
 * engine checks), the walk runs again with a wider theta (t_N, or twice the old theta while fewer
 * than `top` designs are known, up to the settling-time limit), until t_N <= theta: no pruning
 * rests on a wrong threshold.
 *
 * With options.budget the walk stops after that many fast evaluations (complete: false): designs
 * found are engine-verified and feasible, but an empty answer then proves nothing.
 *
 * Syntax: solveProblem(problem, top[, stageCounts][, onProgress][, { budget }])
 * Example: solveProblem(designProblem(p), 10).feasible[0].settlingTime   // s
 */
export function solveProblem(
  problem: DesignProblem,
  top: number,
  stageCounts: number[] = problem.stageCounts,
  onProgress?: (fraction: number, detail?: ProblemProgress) => void,
  options: SolveOptions = {},
): ProblemOutcome {
  const state = newCollectState(problem, top);
  if (options.budget !== undefined) state.budget = options.budget;
  if (options.deadline !== undefined) state.deadline = options.deadline;
  if (options.cap !== undefined) state.cap = options.cap;
  if (options.admit) state.admit = options.admit;
  const thetaLimit = state.theta; // the settling-time limit (or Infinity) before any lowering
  const collectAll = () => {
    stageCounts.forEach((n, i) =>
      collectCandidates(problem, n, state, (f) => onProgress?.((i + f) / stageCounts.length, { stages: n, best: state.best[0] ?? null })),
    );
  };
  collectAll();

  const verified = new Map<FastEntry, Candidate>();
  const feasible: Candidate[] = [];
  const failing: Candidate[] = [];
  let ranked: Candidate[] = [];
  for (;;) {
    const entries = [...state.entries].sort((a, b) => a.lb - b.lb || a.r.length - b.r.length || a.totalC - b.totalC);
    let tN = ranked.length === top ? (ranked[top - 1].settlingTime ?? Infinity) : Infinity;
    for (const e of entries) {
      if (e.lb > tN * (1 + REL) + 1e-12) break;
      if (options.deadline !== undefined && performance.now() > options.deadline) {
        // Out of time: the designs verified so far stand, unproven as the best. A walk the deadline
        // cut has verified none yet: its best candidates still are, until `top` pass or for
        // VERIFY_GRACE more, so that the answer shows what the walk found.
        state.cut = true;
        if (ranked.length >= top || performance.now() > options.deadline + VERIFY_GRACE) break;
      }
      if (e.ruledOut || verified.has(e)) continue;
      if (problem.searchLimits.ripple !== undefined) {
        e.worst ??= worstRippleOf(problem, e.r, e.c);
        if (e.worst > problem.searchLimits.ripple * (1 + REL)) {
          e.ruledOut = true;
          continue;
        }
      }
      const at = fastPoint(problem, e.r, e.c);
      if (droopExceeds(problem, e.r, e.c) || dcTransferMiss(problem, (d) => at(d).average) !== null) {
        e.ruledOut = true;
        continue;
      }
      if (options.admit && !e.admitted && !options.admit(problem, e.r, e.c)) {
        e.ruledOut = true;
        continue;
      }
      const candidate = exactCandidate(problem, problem.ladderOf(e.r, e.c));
      verified.set(e, candidate);
      // Recommendable: every limit met with search.margin to spare (exactCandidate.ts, marginsOf).
      (candidate.keepsMargin ? feasible : failing).push(candidate);
      if (candidate.keepsMargin) {
        ranked = rankCandidates(feasible).slice(0, top);
        if (ranked.length === top) tN = ranked[top - 1].settlingTime ?? Infinity;
      }
    }
    const thetaUsed = state.theta;
    if (tN * (1 + 10 * SETTLING_TIE) <= thetaUsed || thetaUsed >= thetaLimit || state.cut) break;
    // The walk pruned with a threshold below the truth: walk again with a wider one.
    state.theta = Math.min(thetaLimit, tN < Infinity ? tN * (1 + REL) + 1e-12 : Math.max(thetaUsed * WIDEN, 1e-9));
    state.dynamic = false;
    for (const e of state.entries) state.seen.add(keyOf(e.r, e.c));
    collectAll();
  }

  let space = 0;
  for (const n of stageCounts) space += (problem.rValues.length * problem.cValues.length) ** n;
  return { feasible: ranked, failing, evaluated: state.evaluated, verified: verified.size, space, complete: !state.cut };
}

/** Fast steady state (ripple, average) of a candidate at a duty: the engine's modal form (steadySwing). */
function fastPoint(problem: DesignProblem, r: number[], c: number[]): (d: number) => SteadySwing {
  const model = modalLadderOf(problem.circuit, r, c);
  return (d) => steadySwing(model, d);
}

/** The fast worst ripple (a lower bound) of a candidate. */
function worstRippleOf(problem: DesignProblem, r: number[], c: number[]): number {
  const at = fastPoint(problem, r, c);
  return maximizeOverDuty((d) => at(d).ripple, problem.dutyMin, problem.dutyMax);
}

/** Unequal drivers: the fast worst droop (a lower bound) is over the limit. */
function droopExceeds(problem: DesignProblem, r: number[], c: number[]): boolean {
  const { pwm } = problem.project;
  const limit = problem.searchLimits.droop;
  if (limit === undefined || pwm.driver.high === pwm.driver.low) return false;
  const at = fastPoint(problem, r, c);
  const droop = maximizeOverDuty((d) => Math.abs(pwm.low + d * (pwm.high - pwm.low) - at(d).average), problem.dutyMin, problem.dutyMax);
  return droop > limit * (1 + REL) + 1e-15;
}
