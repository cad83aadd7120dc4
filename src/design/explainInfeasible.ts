import type { Project } from '../project/types.js';
import { formatEng } from '../units/index.js';
import { boundedSearch, type SearchBudget } from './boundedSearch.js';
import { designLabel } from './designLabel.js';
import { followerOptions, withFollower, type DesignProblem } from './designProblem.js';
import { infeasibilityBounds, type ProvenMiss } from './infeasibilityBounds.js';
import { nearestFixes, type NearestFix } from './nearestFix.js';
import { oneStageRipple } from './oneStageRipple.js';
import { exactCandidate } from './exactCandidate.js';
import { relaxProject, type LimitName } from './relaxProject.js';
import type { Candidate } from './types.js';

/** Factors by which all limits are relaxed together to find the closest designs. */
const RELAX = [1.25, 1.6, 2.5, 4, 10, 100];
/** Closest designs shown. */
const CLOSEST = 3;
/**
 * Fast evaluations each side search of an explanation may use (one per limit removed, one per kind
 * of change, one for the closest designs), and one resolution's share: fixed counts, so the same
 * project always gets the same explanation and its time stays bounded (about 100k evaluations a
 * second on one core of a slow machine).
 */
export const EXPLAIN_BUDGET = { perLimit: 40_000, perFix: 30_000, closest: 60_000, perProblem: 30_000 };

/** Why nothing is feasible, and the designs that come closest. */
export interface Explanation {
  lines: string[];
  /** Designs found under relaxed limits, checked against the real ones (pass false). */
  closest: Candidate[];
  /** The limits that alone make the space empty (removing one of them gives a feasible design). */
  binding: LimitName[];
  /** Changes of the project verified to make it feasible (nearestFix.ts). */
  fixes: NearestFix[];
  /** Limits proven out of reach before any search, per stage count (at the most favourable resolution). */
  proven: ProvenMiss[];
}

/**
 * Explain an empty result: what is proven out of reach, which limit binds and the figure the best
 * design without it reaches, the nearest changes that make the project feasible, and the designs
 * that come closest; every number from a bound or a search of the engine.
 *
 * Method: (1) infeasibilityBounds.ts per stage count and resolution: a stage count missed at every
 * resolution is reported with its proof at the highest PWM frequency searched. (2) Each limit
 * removed in turn and the search rerun (top 1, boundedSearch.ts): a limit whose removal gives a
 * feasible design binds, and that design's figure is a limit that would admit it (true by
 * construction). (3) nearestFixes (fewer bits, faster PWM, one more stage, wider ranges), each
 * verified by a search. (4) All limits relaxed together by growing factors until designs appear:
 * those, checked against the real limits, are the closest. Side searches share a budget of fast
 * evaluations; a search cut by it claims nothing.
 *
 * With a `deadline` (performance.now() in ms) the side searches stop there as at the end of their
 * budget, and the explanation says so.
 *
 * Syntax: explainInfeasible(project, problems, stageCounts[, budgets[, deadline]])
 * Example: explainInfeasible(p, [designProblem(p)], [1, 2]).lines
 *          // ['INL binds: ${which} meeting every other limit reaches 5.28 LSB against 0.500 LSB ...', ...]
 */
export function explainInfeasible(
  project: Project,
  problems: DesignProblem[],
  stageCounts: number[],
  budgets: typeof EXPLAIN_BUDGET = EXPLAIN_BUDGET,
  deadline?: number,
): Explanation {
  const spent: SearchBudget[] = [];
  const part = (left: number): SearchBudget => {
    const b: SearchBudget = { left, perProblem: budgets.perProblem, ...(deadline !== undefined && { deadline }) };
    spent.push(b);
    return b;
  };
  const closestBudget = part(budgets.closest);
  const base = problems[0];
  const searchBits = problems.length > 1 || project.search?.bits !== undefined;
  const bitsList = problems.map((p) => (searchBits && p.bits !== null ? p.bits : undefined));
  const solveAll = (p: Project, top: number, budget: SearchBudget) => boundedSearch(p, stageCounts, bitsList, top, budget);

  const names: LimitName[] = [];
  const { limits } = base;
  if (limits.ripple !== undefined) names.push('ripple');
  if (limits.droop !== undefined) names.push('droop');
  if (limits.inl !== undefined) names.push('inl');
  if (base.project.spec.gain !== undefined) names.push('gain');
  if (limits.settlingTime !== undefined) names.push('settling');
  if (limits.pinCurrent !== undefined) names.push('pin_current');

  const lines: string[] = [];
  const volts = (v: number, p: DesignProblem = base) =>
    // With several resolutions in play, an LSB count names the resolution it is counted at.
    p.lsb !== null ? `${formatEng(v, 'V')} (${(v / p.lsb).toPrecision(3)} LSB${searchBits && p.bits !== null ? ` @ ${p.bits} bit` : ''})` : formatEng(v, 'V');
  // The search's follower options (search.buffered), and a problem with or without the follower.
  const followers = followerOptions(base);
  // A design's own problem: its resolution, and its follower (a follower design is evaluated with one).
  const problemOf = (c: Candidate) => {
    const p = problems.find((q) => q.bits === c.bits) ?? base;
    return withFollower(p, c.stages[c.stages.length - 1]?.buffered === true);
  };

  // (1) Proven before any search: at every resolution and with every follower option searched
  // (a follower removes the load, so each option has its own proof).
  const proven: ProvenMiss[] = [];
  for (const n of stageCounts) {
    const per = problems.map((p) => ({ p, misses: followers.map((b) => infeasibilityBounds(withFollower(p, b), n).misses) }));
    if (per.some((x) => x.misses.some((m) => m.length === 0))) continue;
    // Report it at the highest PWM frequency searched (fewest bits), where filtering is easiest.
    const best = per.reduce((a, x) => (x.p.frequency > a.p.frequency ? x : a));
    const misses = best.misses.map((m) => m.reduce((a, x) => (x.reach / x.limitValue > a.reach / a.limitValue ? x : a)));
    const miss = misses[0];
    proven.push(...misses.map((m, k) => ({ ...m, follower: followers[k] })));
    const where = searchBits ? ` (even at ${best.p.bits} bits, ${formatEng(best.p.frequency, 'Hz')})` : '';
    const why =
      followers.length === 1
        ? `${followers[0] ? 'with the follower: ' : ''}${miss.reason}`
        : misses.map((m, k) => `${followers[k] ? 'with a follower' : 'without a follower'}: ${m.reason}`).join('; ');
    lines.push(`${n} stage${n === 1 ? '' : 's'} proven out of reach${where}: ${why}`);
    // One stage into an open output: the time constant the ripple needs, exactly (oneStageRipple.ts).
    const p = best.p;
    if (n === 1 && followers.length === 1 && !followers[0] && miss.limit === 'ripple' && p.project.load.resistance === undefined && p.limits.ripple !== undefined) {
      const { pwm } = p.project;
      const span = Math.abs(pwm.high - pwm.low);
      const d = Math.min(p.dutyMax, Math.max(p.dutyMin, 0.5));
      const need = timeConstantFor(p.limits.ripple, span, d, p.period);
      const have = (p.rValues[p.rValues.length - 1] + Math.max(pwm.driver.high, pwm.driver.low)) * (p.cValues[p.cValues.length - 1] + p.project.load.capacitance);
      lines.push(`one stage needs a time constant of about ${formatEng(need, 's')} for that ripple at ${formatEng(p.frequency, 'Hz')}; the largest R and C allowed give ${formatEng(have, 's')}`);
    }
  }

  // (2) Which limit binds, and the figure reached without it.
  const binding: LimitName[] = [];
  let allComplete = true;
  for (const name of names) {
    const result = solveAll(relaxProject(project, [name], Infinity), 1, part(budgets.perLimit));
    allComplete &&= result.complete;
    const without = result.designs[0];
    if (!without) continue;
    binding.push(name);
    const at = problemOf(without);
    const lim = at.limits;
    const label = `${designLabel(without)}${searchBits ? `, ${without.bits} bits` : ''}`;
    // "the best" only when that search ran to the end (not cut at its budget).
    const which = result.complete ? 'the best design' : 'a design';
    switch (name) {
      case 'ripple':
        lines.push(`ripple binds: ${which} meeting every other limit (${label}) has ${volts(without.worstRipple, at)} of ripple against ${volts(lim.ripple!, at)}; a ripple limit of ${volts(without.worstRipple, at)} would admit it`);
        break;
      case 'droop':
        lines.push(`droop binds: ${which} meeting every other limit (${label}) has ${volts(without.droop, at)} of droop against ${volts(lim.droop!, at)}; a droop limit of ${volts(without.droop, at)} would admit it`);
        break;
      case 'inl':
        lines.push(`INL binds: ${which} meeting every other limit (${label}) has an INL of ${volts(without.inl, at)} against ${volts(lim.inl!, at)}; an INL limit of ${volts(without.inl, at)} would admit it`);
        break;
      case 'gain': {
        // Found without the gain limit: evaluated again against the real limits for the figure.
        const gain = Math.abs(exactAgain(at, without).checks.find((k) => k.name === 'gain')?.value ?? NaN);
        lines.push(`gain binds: ${which} meeting every other limit (${label}) loses ${(100 * gain).toPrecision(3)} % of full scale against ${(100 * at.project.spec.gain!).toPrecision(3)} %`);
        break;
      }
      case 'settling':
        lines.push(
          `settling binds: ${result.complete ? 'the fastest design' : 'a design'} meeting every other limit (${label}) settles in ${formatEng(without.settlingTime ?? Infinity, 's')} against ${formatEng(lim.settlingTime!, 's')}`,
        );
        break;
      case 'pin_current':
        lines.push(`pin current binds: ${which} meeting every other limit (${label}) draws ${formatEng(without.pinCurrent, 'A')} against ${formatEng(lim.pinCurrent!, 'A')}`);
        break;
    }
  }
  if (binding.length === 0 && allComplete && names.length > 1) lines.push('no single limit is to blame: with any one of them removed, still no design meets the others');

  // (3) Nearest changes that work.
  const fixes = nearestFixes(project, problems, stageCounts, () => part(budgets.perFix));
  lines.push(...fixes.map((f) => f.line));

  // (4) Closest designs.
  let closest: Candidate[] = [];
  for (const k of RELAX) {
    const found = solveAll(relaxProject(project, names, k), CLOSEST, closestBudget).designs;
    if (found.length > 0) {
      // Evaluated again against the real limits (recheck.ts keeps no gain error, so not it).
      closest = found.map((c) => exactAgain(problemOf(c), c));
      lines.push(`the closest designs below meet every limit relaxed ${k}-fold`);
      break;
    }
  }
  const outOfTime = deadline !== undefined && performance.now() > deadline;
  // (out of time the relaxed searches may not have run at all: nothing to say about the ranges)
  if (closest.length === 0 && names.length > 0 && !outOfTime) lines.push(`no design found with every limit relaxed up to ${RELAX[RELAX.length - 1]}-fold: check the ranges in search:`);
  if (outOfTime) {
    lines.push('(the side searches behind this explanation stopped at the time limit (--max-time); changes not listed were not proven either way)');
  } else if (spent.some((b) => b.left <= 0)) lines.push('(the side searches behind this explanation stopped at their budget; changes not listed were not proven either way)');
  return { lines, closest, binding, fixes, proven };
}

/** The one-stage time constant whose ripple at duty d equals `ripple` (bisection in log tau). */
function timeConstantFor(ripple: number, span: number, d: number, period: number): number {
  if (ripple >= span) return 0;
  let lo = period * 1e-6;
  let hi = period * 1e12;
  for (let i = 0; i < 200 && hi / lo > 1 + 1e-9; i++) {
    const mid = Math.sqrt(lo * hi);
    if (oneStageRipple(span, d, period, mid) > ripple) lo = mid;
    else hi = mid;
  }
  return hi;
}

/** A design the exact engine evaluates again under a problem's limits (same circuit). */
function exactAgain(problem: DesignProblem, c: Candidate): Candidate {
  return exactCandidate(problem, problem.ladderOf(c.stages.map((s) => s.r), c.stages.map((s) => s.c)));
}
