import { describe, expect, it, vi } from 'vitest';
import { ladderFromProject } from '../../src/project/ladderFromProject.js';
import { designSearch } from '../../src/design/designSearch.js';
import { DesignInputError } from '../../src/design/designInputError.js';
import { robustDesigns, type RobustCheck } from '../../src/design/robustDesigns.js';
import { cornerScreen } from '../../src/design/cornerScreen.js';
import { designProblem } from '../../src/design/designProblem.js';
import { robustChecks as checks, worstCaseCheck, yieldCheck } from '../../src/tolerance/robustChecks.js';
import type { Candidate, DesignOptions, DesignResult } from '../../src/design/types.js';
import { parseProject } from '../../src/project/index.js';

// Invented scenario: a small E3 space so that the real search and checks stay quick.
const BASE = `pwm: { frequency: 20 kHz, bits: 10, high: 3.3 V, low: 0 V, driver: 30 ohm, duty: { min: 5 %, max: 95 % } }
spec:
  ripple: 0.5 LSB
  settling: { band: 1 LSB, time: 50 ms }
search:
  stages: [1, 2]
  series: E3
  margin: 0 %   # the tolerance check alone decides here
  resistance: { min: 1k, max: 100k }
  capacitance: { min: 10n, max: 1u }
`;
const TOL = (r: string, c: string) => `tolerance:\n  resistor: ${r}\n  capacitor: ${c}\n  samples: 200\n  seed: 5\n`;
const project = (yaml: string) => parseProject(yaml, 'robust.yaml');
// The same checks without the corners: robustDesigns then walks the unscreened nominal ranking.
const unscreened = { worstCase: checks.worstCase, yield: checks.yield };
const key = (c: Pick<Candidate, 'stages'>) => c.stages.map((s) => `${s.r}/${s.c}`).join('+');

describe('robustDesigns: scan of the nominal ranking', () => {
  it('returns a subset of the nominal list in the same order, and skips only designs that fail the check', () => {
    // 20 % capacitors: the nominal leaders sit near the ripple limit, so some must be skipped.
    const p = project(BASE + TOL('1 %', '20 %'));
    const robust = robustDesigns(p, 'worst-case', { checks: unscreened, top: 3 });
    const nominal = designSearch(p, { top: robust.asked, compare: false, diagnose: false }).candidates.map(key);
    const ranks = robust.candidates.map((r) => r.nominalRank);
    expect(robust.candidates.length).toBe(3);
    expect(ranks[0]).toBeGreaterThan(1); // the scenario really filters
    // Same order as the nominal ranking: strictly increasing ranks, each pointing at its own design.
    for (let i = 1; i < ranks.length; i++) expect(ranks[i]).toBeGreaterThan(ranks[i - 1]);
    robust.candidates.forEach((r) => expect(nominal[r.nominalRank - 1]).toBe(key(r.candidate)));
    // Nothing better was missed: every nominal design ranked above the last robust one and not listed fails the worst case.
    const listed = new Set(robust.candidates.map((r) => key(r.candidate)));
    const skipped = designSearch(p, { top: robust.asked, compare: false, diagnose: false })
      .candidates.slice(0, ranks[ranks.length - 1])
      .filter((c) => !listed.has(key(c)));
    expect(skipped.length).toBe(ranks[ranks.length - 1] - ranks.length);
    for (const c of skipped) {
      expect(worstCaseCheck(p, ladderFromProject(p, c.stages.map((s) => ({ r: s.r, c: s.c, buffered: false })))).pass).toBe(false);
    }
  });

  it('the corner screen changes the work, not the answer: same robust designs, and every design it screens out fails the check', () => {
    for (const tol of [TOL('1 %', '20 %'), TOL('5 %', '10 %'), TOL('1 %', '5 %')]) {
      const p = project(BASE + tol);
      const screened = robustDesigns(p, 'worst-case', { checks, top: 3 });
      const plain = robustDesigns(p, 'worst-case', { checks: unscreened, top: 3 });
      // behind the screen the first nominal list is N long (4N without it), then 4 times longer each round
      expect([3, 12, 48]).toContain(screened.asked);
      expect([12, 48, 192]).toContain(plain.asked);
      expect(screened.candidates.map((r) => key(r.candidate))).toEqual(plain.candidates.map((r) => key(r.candidate)));
      expect(screened.scanned).toBeLessThanOrEqual(plain.scanned);
      // Soundness on the whole nominal list the plain run walked: screened out => fails the full check.
      const problem = designProblem(p);
      const screen = cornerScreen(checks.corners!);
      let out = 0;
      for (const c of designSearch(p, { top: plain.asked, compare: false, diagnose: false }).candidates) {
        const r = c.stages.map((s) => s.r);
        const cs = c.stages.map((s) => s.c);
        if (screen(problem, r, cs)) continue;
        out++;
        expect(worstCaseCheck(p, problem.ladderOf(r, cs)).pass).toBe(false);
      }
      if (tol === TOL('1 %', '20 %')) expect(out).toBeGreaterThan(0); // the scenario really screens
    }
  });

  it('with 0 % tolerance the robust list equals the nominal list (worst case = nominal; common practice sanity check)', () => {
    const p = project(BASE + TOL('0 %', '0 %'));
    const robust = robustDesigns(p, 'worst-case', { checks, top: 5 });
    const nominal = designSearch(p, { top: 5, compare: false, diagnose: false }).candidates;
    expect(robust.candidates.map((r) => key(r.candidate))).toEqual(nominal.map(key));
    expect(robust.candidates.map((r) => r.nominalRank)).toEqual([1, 2, 3, 4, 5]);
    // And the worst-case figures are the nominal ones.
    robust.candidates.forEach((r) => {
      expect(r.verdict.worstCase!.worstRipple).toBeCloseTo(r.candidate.worstRipple, 9);
      expect(r.verdict.worstCase!.pinCurrent).toBeCloseTo(r.candidate.pinCurrent, 12);
    });
  });

  it('asks for longer nominal lists (4N, 16N, ... up to the cap) and memoizes the checks', () => {
    // Synthetic nominal ranking of 500 designs (search injected); every 40th passes the check.
    const all: Candidate[] = Array.from({ length: 500 }, (_, i) => ({ stages: [{ r: 1000 + i, c: 1e-7 }] }) as Candidate);
    const asked: number[] = [];
    const search = (_p: unknown, o: DesignOptions): DesignResult => {
      asked.push(o.top!);
      return { candidates: all.slice(0, o.top), feasible: true, resolutions: [] } as unknown as DesignResult;
    };
    let calls = 0;
    const check: RobustCheck = (_p, ladder) => {
      calls++;
      return { pass: (ladder.stages[0].r - 1000) % 40 === 39 };
    };
    const p = project(BASE + TOL('1 %', '10 %'));
    const r = robustDesigns(p, 'worst-case', { checks, top: 3, search, check });
    expect(asked).toEqual([12, 48, 192]);
    expect(r.candidates.map((x) => x.nominalRank)).toEqual([40, 80, 120]);
    expect(r.scanned).toBe(120);
    expect(calls).toBe(120); // each design checked once across the three rounds
    // A cap stops the growth; a short list is reported as exhausted.
    const capped = robustDesigns(p, 'worst-case', { checks, top: 20, search, check, cap: 100 });
    expect(capped.asked).toBe(100);
    expect(capped.candidates.length).toBe(2);
    const few = robustDesigns(p, 'worst-case', { checks, top: 50, search: (q, o) => search(q, { ...o, top: Math.min(o.top!, 130) }), check, cap: 2000 });
    expect(few.exhausted).toBe(true);
    expect(few.candidates.map((x) => x.nominalRank)).toEqual([40, 80, 120]);
  });
});

describe('robustDesigns: the deadline', () => {
  it('checks no design after it and reports the answer incomplete', () => {
    // Synthetic nominal ranking (search injected, complete); every 40th design passes the check. A
    // stepping clock (1 ms a reading) reads once per new check: 20 in the first list (4 x 5), 60 more
    // in the second (80), and the third list (320) stops at its first new check; the two robust
    // designs found in the checks already made are the answer.
    const all: Candidate[] = Array.from({ length: 500 }, (_, i) => ({ stages: [{ r: 1000 + i, c: 1e-7 }] }) as Candidate);
    const search = (_p: unknown, o: DesignOptions): DesignResult => ({ candidates: all.slice(0, o.top), feasible: true, complete: true, resolutions: [] }) as unknown as DesignResult;
    let calls = 0;
    const check: RobustCheck = (_p, ladder) => {
      calls++;
      return { pass: (ladder.stages[0].r - 1000) % 40 === 39 };
    };
    let now = 0;
    const spy = vi.spyOn(performance, 'now').mockImplementation(() => (now += 1));
    try {
      const r = robustDesigns(project(BASE + TOL('1 %', '10 %')), 'worst-case', { checks, top: 5, search, check, deadline: 80.5 });
      expect(calls).toBe(80);
      expect(r.candidates.map((x) => x.nominalRank)).toEqual([40, 80]);
      expect(r.nominal.complete).toBe(false);
      expect(r.exhausted).toBe(false);
    } finally {
      spy.mockRestore();
    }
  });
});

describe('robustDesigns: worst-case figures', () => {
  // One RC stage driven by an ideal source (driver 0 ohm, open output): the periodic steady state
  // of a first-order low-pass under a square wave has ripple
  //   V (1 - e^(-DT/tau)) (1 - e^(-(1-D)T/tau)) / (1 - e^(-T/tau)),   largest at D = 1/2: V tanh(T / (4 tau))
  // (textbook RC charging/discharging, e.g. Horowitz & Hill, The Art of Electronics, ch. 1; from memory).
  // Smallest R and C give the smallest tau and so the largest ripple: the worst corner is (R-tol, C-tol).
  const ONE = `pwm: { frequency: 10 kHz, bits: 8, high: 5 V, low: 0 V, driver: 0 ohm, duty: { min: 10 %, max: 90 % } }
spec:
  ripple: 2 LSB
search:
  stages: [1]
  series: E3
  resistance: { min: 1k, max: 100k }
  capacitance: { min: 100n, max: 10u }
tolerance:
  resistor: 5 %
  capacitor: 20 %
`;
  it('matches the closed-form one-stage ripple at (R - tol, C - tol) and Ohm\'s law for the pin current', () => {
    const p = project(ONE);
    const r = robustDesigns(p, 'worst-case', { checks, top: 4 });
    expect(r.candidates.length).toBe(4);
    const T = 1e-4;
    const V = 5;
    for (const x of r.candidates) {
      const { r: R, c: C } = x.candidate.stages[0];
      const tau = R * 0.95 * C * 0.8;
      const ripple = (D: number) => (V * (1 - Math.exp((-D * T) / tau)) * (1 - Math.exp((-(1 - D) * T) / tau))) / (1 - Math.exp(-T / tau));
      expect(x.verdict.worstCase!.worstRipple).toBeCloseTo(ripple(0.5), 9);
      expect(x.verdict.worstCase!.worstRipple / (V * Math.tanh(T / (4 * tau)))).toBeCloseTo(1, 9);
      expect(x.verdict.worstCase!.worstRipple).toBeLessThanOrEqual(2 * (V / 256));
      // Pin peak current V / (driver + R1) at R1's minimum (Ohm's law).
      expect(x.verdict.worstCase!.pinCurrent).toBeCloseTo(V / (R * 0.95), 12);
    }
  });
});

describe('robustDesigns: input', () => {
  it('needs a tolerance block, and a yield target for yield mode', () => {
    expect(() => robustDesigns(project(BASE), 'worst-case', { checks })).toThrow(DesignInputError);
    expect(() => robustDesigns(project(BASE), 'worst-case', { checks })).toThrow(/tolerance/);
    expect(() => robustDesigns(project(BASE + TOL('1 %', '10 %')), 'yield', { checks })).toThrow(/tolerance\.yield/);
  });

  it('yield mode uses min(tolerance.samples, 2000) samples and keeps designs whose yield reaches the target', () => {
    const p = project(BASE + TOL('1 %', '5 %') + '  yield: 90 %\n');
    const r = robustDesigns(p, 'yield', { checks, top: 2 });
    expect(r.samples).toBe(200);
    expect(r.candidates.length).toBeGreaterThan(0);
    for (const x of r.candidates) {
      expect(x.verdict.yield!.samples).toBe(200);
      expect(x.verdict.yield!.yield).toBeGreaterThanOrEqual(0.9);
    }
  });

  it('yield mode holds the pin current at its worst corner too: an absolute rating is not a yield', () => {
    // 3.3 mA limit, 10 % resistors, driver 30 ohm: R1 = 1k passes nominally (3.3 V / 1030 ohm =
    // 3.20 mA, Ohm's law) but not at R1 - 10 % (3.3 V / 930 ohm = 3.55 mA).
    const p = project(BASE.replace('search:\n', 'search:\n  pin_current: 3.3 mA\n') + TOL('10 %', '5 %') + '  yield: 50 %\n');
    const nominal = designSearch(p, { top: 40, compare: false, diagnose: false }).candidates;
    expect(nominal.slice(0, 10).some((c) => c.stages[0].r === 1000)).toBe(true); // the case really arises
    const r = robustDesigns(p, 'yield', { checks, top: 3 });
    expect(r.candidates.length).toBe(3);
    for (const x of r.candidates) {
      expect(x.candidate.stages[0].r).toBeGreaterThan(1000);
      expect(x.verdict.yield!.pinCurrent).toBeLessThanOrEqual(3.3e-3);
      expect(x.verdict.yield!.pinCurrent).toBeCloseTo(3.3 / (30 + 0.9 * x.candidate.stages[0].r), 12);
    }
    // Every design ranked above the last one kept and not kept fails the same check.
    const last = r.candidates[r.candidates.length - 1].nominalRank;
    const kept = new Set(r.candidates.map((x) => key(x.candidate)));
    const skipped = nominal.slice(0, last).filter((c) => !kept.has(key(c)));
    expect(skipped.length).toBeGreaterThan(0);
    for (const c of skipped) {
      expect(yieldCheck(200)(p, ladderFromProject(p, c.stages.map((st) => ({ r: st.r, c: st.c, buffered: false })))).pass).toBe(false);
    }
  });
});
