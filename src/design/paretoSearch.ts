import { bestDesigns } from './bestDesigns.js';
import { collectCandidates, newCollectState, type FastEntry } from './collectCandidates.js';
import { REL } from './searchAllowance.js';
import { followerOptions, withFollower, type DesignProblem } from './designProblem.js';
import { exactCandidate } from './exactCandidate.js';
import { infeasibilityBounds } from './infeasibilityBounds.js';
import { rankCandidates, SETTLING_TIE } from './rankCandidates.js';
import type { Candidate } from './types.js';

/** What paretoSearch did, for tests and the bench. */
export interface ParetoStats {
  /** Candidates the fast model evaluated, over every walk (the fallbacks' included). */
  evaluated: number;
  /** Limits whose proof failed and were searched alone (bestDesigns). */
  fallbacks: number;
}

/**
 * The best design (top 1, rankCandidates.ts, engine-verified) of one stage count under each of
 * several design problems that differ only in their ripple limit, from one walk of the space:
 * `problems[i]` is the project with the i-th ripple limit (same band, steps and other limits).
 * Same answers as `bestDesigns(problems[i], 1, [stages])` for every i (tested).
 *
 * Method: one bounded walk (collectCandidates.ts in Pareto mode, one staircase per limit, each
 * point evaluated once) in the loosest limit's tuple order, keeping the best fast settling bound
 * per limit; a candidate is dropped only when its settling lower bound exceeds the best already
 * found under every limit its worst ripple meets (dominated in (worst ripple, settling time)), and
 * the walk's threshold is the largest of those bests. Each limit then takes the collected
 * candidates that meet it, engine-verifies them in ascending order of the bound until the bound
 * passes the best exact settling time, and is proven when that time lies within the threshold the
 * walk used for it, as in solveProblem.ts. A limit that is not proven so (the engine rejected what
 * the fast model kept, e.g. by INL) is searched alone by bestDesigns. Stage counts proven out of
 * reach (infeasibilityBounds.ts) under every follower option give null. With follower options
 * (search.buffered) one walk per option, merged by rankCandidates.
 *
 * With a `deadline` (performance.now() in ms) a walk still running then stops and the answer is
 * null: no point is proven. With a `cap` likewise once the walks (fallbacks included) have made
 * that many fast evaluations: a deterministic stop, where the deadline depends on the machine.
 *
 * Syntax: paretoSearch(problems, stages[, stats[, deadline[, cap]]])
 * Example: paretoSearch(limits.map((r) => designProblem(withRipple(p, r))), 2).map((c) => c?.settlingTime)
 */
export function paretoSearch(problems: DesignProblem[], stages: number, stats?: ParetoStats): Array<Candidate | null>;
export function paretoSearch(problems: DesignProblem[], stages: number, stats: ParetoStats | undefined, deadline: number | undefined, cap?: number): Array<Candidate | null> | null;
export function paretoSearch(problems: DesignProblem[], stages: number, stats: ParetoStats = { evaluated: 0, fallbacks: 0 }, deadline?: number, cap?: number): Array<Candidate | null> | null {
  // Evaluations this call may still make (stats may arrive with a count from earlier calls).
  const start = stats.evaluated;
  const left = () => (cap === undefined ? undefined : Math.max(0, cap - (stats.evaluated - start)));
  const out: Array<Candidate | null> = problems.map(() => null);
  const base = problems[0];
  if (!base) return out;
  const rippleOf = (p: DesignProblem) => p.searchLimits.ripple ?? Infinity;
  const options = followerOptions(base);
  // Open: some follower option is not proven out of reach (a follower removes the load the bounds
  // use, so a limit out of reach without one may be reached with one).
  const open = problems.map((_, i) => i).filter((i) => options.some((b) => infeasibilityBounds(withFollower(problems[i], b), stages).misses.length === 0));
  if (open.length === 0) return out;
  const order = [...open].sort((a, b) => rippleOf(problems[a]) - rippleOf(problems[b]));
  const loosest = problems[order[order.length - 1]];
  const fallback = new Set<number>();
  const found: Candidate[][] = problems.map(() => []);

  // Every open limit in the one walk, thresholds from what it finds. (Seeding the looser limits
  // with the tightest limit's best, searched alone first, cost more than it pruned: measured on the
  // wide E24 bench project, 92 881 evaluations in all without it against 90 075 with, but 15 to
  // 20 ms less whole-process, as the separate search's set-up and verification go.)
  for (const buffered of options) {
    const variant = (p: DesignProblem) => withFollower(p, buffered);
    const walkProblem = variant(loosest);
    // Proven out of reach for this variant at the loosest limit: out of reach at every tighter one.
    if (infeasibilityBounds(walkProblem, stages).misses.length > 0) continue;
    const state = newCollectState(walkProblem, 1);
    const limits = order.map((i) => rippleOf(problems[i]));
    state.pareto = { limits, best: limits.map(() => Infinity) };
    if (deadline !== undefined) state.deadline = deadline;
    const capLeft = left();
    if (capLeft !== undefined) state.cap = capLeft;
    collectCandidates(walkProblem, stages, state);
    stats.evaluated += state.evaluated;
    // Out of time or effort: no point of this curve is proven.
    if (state.cut) return null;
    const entries = [...state.entries].sort((a, b) => a.lb - b.lb || a.totalC - b.totalC);
    const verified = new Map<FastEntry, Candidate>();
    order.forEach((i, k) => {
      const problem = variant(problems[i]);
      if (infeasibilityBounds(problem, stages).misses.length > 0) return;
      const theta = state.pareto!.best[k] * (1 + REL) + 1e-12;
      let ranked: Candidate[] = [];
      let tN = Infinity;
      for (const e of entries) {
        if (e.lb > tN * (1 + REL) + 1e-12) break;
        if (e.worst! > limits[k] * (1 + REL)) continue;
        // Figures are the ladder's; checks and margins are this limit's.
        const candidate = exactCandidate(problem, problem.ladderOf(e.r, e.c));
        verified.set(e, candidate);
        if (candidate.keepsMargin) {
          ranked = rankCandidates([...ranked, candidate]).slice(0, 1);
          tN = ranked[0].settlingTime ?? Infinity;
        }
      }
      // Proven as in solveProblem.ts: the best lies within the threshold this limit's pruning used
      // (an infinite one pruned nothing, so an empty answer is proven too).
      if (theta !== Infinity && !(tN * (1 + 10 * SETTLING_TIE) <= theta)) fallback.add(i);
      else found[i].push(...ranked);
    });
  }
  for (const i of order) {
    if (fallback.has(i)) {
      stats.fallbacks++;
      const capLeft = left();
      const alone = bestDesigns(problems[i], 1, [stages], undefined, { ...(deadline !== undefined && { deadline }), ...(capLeft !== undefined && { cap: capLeft }) });
      stats.evaluated += alone.evaluated;
      if (!alone.complete) return null;
      out[i] = alone.feasible[0] ?? null;
    } else out[i] = rankCandidates(found[i])[0] ?? null;
  }
  return out;
}
