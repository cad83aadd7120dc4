import { isSallenKeyStage } from './isSallenKeyStage.js';
import type { AnyCandidateStage, Candidate } from './types.js';

/** Settling times closer than this (relative) count as equal, so rounding does not decide. */
export const SETTLING_TIE = 1e-9;

/**
 * Candidates in recommendation order: shorter settling time first (a design that never settles
 * last), then fewer stages, then no follower before a follower, then smaller total capacitance; remaining ties by smaller total
 * resistance, then by the values stage by stage, so the order is fully determined. Every part
 * counts: a Sallen-Key stage's c1, c2, r1, r2 and the second PWM output's c and r (compared after
 * the stages) as much as an RC stage's c and r.
 *
 * Method: sort by settling time, then cut the sorted list into groups whose settling times lie
 * within SETTLING_TIE (relative) of the group's first, and order each group by the other keys.
 * Grouping after sorting keeps the order well defined (a tolerance comparison alone is not
 * transitive).
 *
 * Syntax: rankCandidates(list)
 * Example: rankCandidates([slow, fast]).map((c) => c.settlingTime)   // [fast, slow]
 */
export function rankCandidates<T extends Pick<Candidate<AnyCandidateStage>, 'stages' | 'settlingTime' | 'secondPwm'>>(list: readonly T[]): T[] {
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

type Ranked = Pick<Candidate<AnyCandidateStage>, 'stages' | 'secondPwm'>;

/** Every part value of a design, capacitors and resistors apart, in the order ties compare them. */
function partsOf(c: Ranked): { caps: number[]; res: number[]; order: number[] } {
  const caps: number[] = [];
  const res: number[] = [];
  const order: number[] = [];
  for (const s of c.stages) {
    if (isSallenKeyStage(s)) {
      caps.push(s.c1, s.c2);
      res.push(s.r1, s.r2);
      order.push(s.c1, s.c2, s.r1, s.r2);
    } else {
      caps.push(s.c);
      res.push(s.r);
      order.push(s.c, s.r);
    }
  }
  if (c.secondPwm) {
    if (c.secondPwm.c !== null) caps.push(c.secondPwm.c);
    res.push(c.secondPwm.r);
    order.push(c.secondPwm.c ?? 0, c.secondPwm.r);
  }
  return { caps, res, order };
}

function secondary(a: Ranked, b: Ranked): number {
  const sum = (xs: number[]) => xs.reduce((s, x) => s + x, 0);
  const byStages = a.stages.length - b.stages.length;
  if (byStages !== 0) return byStages;
  // Without an op-amp follower before with one (search.buffered).
  const follower = (c: Ranked) => {
    const last = c.stages[c.stages.length - 1];
    return last && !isSallenKeyStage(last) && last.buffered ? 1 : 0;
  };
  const byFollower = follower(a) - follower(b);
  if (byFollower !== 0) return byFollower;
  const pa = partsOf(a);
  const pb = partsOf(b);
  const byC = sum(pa.caps) - sum(pb.caps);
  if (byC !== 0) return byC;
  const byR = sum(pa.res) - sum(pb.res);
  if (byR !== 0) return byR;
  for (let k = 0; k < Math.min(pa.order.length, pb.order.length); k++) {
    const d = pa.order[k] - pb.order[k];
    if (d !== 0) return d;
  }
  return 0;
}
