import { collectCandidates, keyOf, newCollectState, REL, type FastEntry } from './collectCandidates.js';
import type { DesignProblem } from './designProblem.js';
import { exactCandidate } from './exactCandidate.js';
import { fastLadderOf } from './fast/fastLadder.js';
import { fastSteadyState } from './fast/fastSteadyState.js';
import { fastWorstRipple } from './fast/fastWorstRipple.js';
import { twoStageSteady } from './fast/twoStageSteady.js';
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
}

/** Collection rounds before giving up on lowering work (each round widens theta to the truth). */
const MAX_ROUNDS = 4;

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
 * engine checks), the walk runs again with theta = t_N, so no pruning rested on a wrong threshold.
 *
 * Syntax: solveProblem(problem, top[, stageCounts][, onProgress])
 * Example: solveProblem(designProblem(p), 10).feasible[0].settlingTime   // s
 */
export function solveProblem(
  problem: DesignProblem,
  top: number,
  stageCounts: number[] = problem.stageCounts,
  onProgress?: (fraction: number) => void,
): ProblemOutcome {
  const state = newCollectState(problem, top);
  const collectAll = () => {
    stageCounts.forEach((n, i) =>
      collectCandidates(problem, n, state, (done, total) => onProgress?.((i + done / Math.max(1, total)) / stageCounts.length)),
    );
  };
  collectAll();

  const verified = new Map<FastEntry, Candidate>();
  const feasible: Candidate[] = [];
  const failing: Candidate[] = [];
  const cap = state.theta; // the settling-time limit (or Infinity) before any lowering
  let ranked: Candidate[] = [];
  for (let round = 0; round < MAX_ROUNDS; round++) {
    const entries = [...state.entries].sort((a, b) => a.lb - b.lb || a.r.length - b.r.length || a.totalC - b.totalC);
    let tN = ranked.length === top ? (ranked[top - 1].settlingTime ?? Infinity) : Infinity;
    for (const e of entries) {
      if (e.lb > tN * (1 + REL) + 1e-12) break;
      if (e.ruledOut || verified.has(e)) continue;
      if (problem.limits.ripple !== undefined) {
        e.worst ??= worstRippleOf(problem, e.r, e.c);
        if (e.worst > problem.limits.ripple * (1 + REL)) {
          e.ruledOut = true;
          continue;
        }
      }
      const candidate = exactCandidate(problem, problem.ladderOf(e.r, e.c));
      verified.set(e, candidate);
      (candidate.pass ? feasible : failing).push(candidate);
      if (candidate.pass) {
        ranked = rankCandidates(feasible).slice(0, top);
        if (ranked.length === top) tN = ranked[top - 1].settlingTime ?? Infinity;
      }
    }
    const thetaUsed = state.theta;
    if (tN * (1 + 10 * SETTLING_TIE) <= thetaUsed || thetaUsed >= cap) break;
    // The walk pruned with a threshold below the truth: walk again with theta = t_N (or the cap).
    state.theta = Math.min(cap, tN * (1 + REL) + 1e-12);
    state.dynamic = false;
    for (const e of state.entries) state.seen.add(keyOf(e.r, e.c));
    collectAll();
  }

  let space = 0;
  for (const n of stageCounts) space += (problem.rValues.length * problem.cValues.length) ** n;
  return { feasible: ranked, failing, evaluated: state.evaluated, verified: verified.size, space };
}

/** The fast worst ripple (a lower bound) of a candidate: scalar code for two stages. */
function worstRippleOf(problem: DesignProblem, r: number[], c: number[]): number {
  if (r.length === 2) {
    const k = problem.circuit;
    return fastWorstRipple((d) => twoStageSteady(k, r[0], c[0], r[1], c[1], d).ripple, problem.dutyMin, problem.dutyMax);
  }
  const model = fastLadderOf(problem.circuit, r, c);
  return fastWorstRipple((d) => fastSteadyState(model, d).ripple, problem.dutyMin, problem.dutyMax);
}
