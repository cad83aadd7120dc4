import type { Candidate } from './types.js';

/** Settling times closer than this (relative) count as equal, so rounding does not decide. */
export const SETTLING_TIE = 1e-9;

/**
 * Candidates in recommendation order: shorter settling time first (a design that never settles
 * last), then fewer stages, then no follower before a follower, then smaller total capacitance; remaining ties by smaller total
 * resistance, then by the values stage by stage, so the order is fully determined.
 *
 * Method: sort by settling time, then cut the sorted list into groups whose settling times lie
 * within SETTLING_TIE (relative) of the group's first, and order each group by the other keys.
 * Grouping after sorting keeps the order well defined (a tolerance comparison alone is not
 * transitive).
 *
 * Syntax: rankCandidates(list)
 * Example: rankCandidates([slow, fast]).map((c) => c.settlingTime)   // [fast, slow]
 */
export function rankCandidates<T extends Pick<Candidate, 'stages' | 'settlingTime'>>(list: readonly T[]): T[] {
  const time = (c: T) => c.settlingTime ?? Infinity;
  const sorted = [...list].sort((a, b) => time(a) - time(b) || secondary(a, b));
  const out: T[] = [];
  let i = 0;
  while (i < sorted.length) {
    const t0 = time(sorted[i]);
    let j = i + 1;
    while (j < sorted.length && (time(sorted[j]) === t0 || time(sorted[j]) - t0 <= SETTLING_TIE * t0)) j++;
    out.push(...sorted.slice(i, j).sort(secondary));
    i = j;
  }
  return out;
}

function secondary(a: Pick<Candidate, 'stages'>, b: Pick<Candidate, 'stages'>): number {
  const sum = (c: Pick<Candidate, 'stages'>, key: 'r' | 'c') => c.stages.reduce((s, st) => s + st[key], 0);
  const byStages = a.stages.length - b.stages.length;
  if (byStages !== 0) return byStages;
  // Without an op-amp follower before with one (search.buffered).
  const follower = (c: Pick<Candidate, 'stages'>) => (c.stages[c.stages.length - 1]?.buffered ? 1 : 0);
  const byFollower = follower(a) - follower(b);
  if (byFollower !== 0) return byFollower;
  const byC = sum(a, 'c') - sum(b, 'c');
  if (byC !== 0) return byC;
  const byR = sum(a, 'r') - sum(b, 'r');
  if (byR !== 0) return byR;
  for (let k = 0; k < a.stages.length; k++) {
    const d = a.stages[k].c - b.stages[k].c || a.stages[k].r - b.stages[k].r;
    if (d !== 0) return d;
  }
  return 0;
}
