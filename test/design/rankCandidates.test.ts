import { describe, expect, it } from 'vitest';
import { rankCandidates } from '../../src/design/rankCandidates.js';

const c = (t: number | null, stages: Array<[number, number]>) => ({ settlingTime: t, stages: stages.map(([r, cap]) => ({ r, c: cap })) });

describe('rankCandidates', () => {
  it('puts shorter settling first and never-settling last', () => {
    const list = [c(null, [[1, 1]]), c(2e-3, [[1, 1]]), c(1e-3, [[1, 1], [1, 1]])];
    expect(rankCandidates(list).map((x) => x.settlingTime)).toEqual([1e-3, 2e-3, null]);
  });

  it('breaks a settling tie by fewer stages, then smaller total capacitance, then smaller total resistance', () => {
    const t = 5e-3;
    const twoStages = c(t, [[1e3, 1e-9], [1e3, 1e-9]]);
    const bigC = c(t * (1 + 1e-12), [[1e3, 1e-6]]); // equal within rounding
    const smallC = c(t, [[1e4, 1e-7]]);
    const smallCsmallR = c(t, [[1e3, 1e-7]]);
    expect(rankCandidates([twoStages, bigC, smallC, smallCsmallR])).toEqual([smallCsmallR, smallC, bigC, twoStages]);
  });

  it('does not treat clearly different settling times as ties', () => {
    const fast = c(1e-3, [[1e3, 1e-6], [1e3, 1e-6]]);
    const slow = c(1.001e-3, [[1e3, 1e-9]]);
    expect(rankCandidates([slow, fast])[0]).toBe(fast);
  });
});
