import { designProblem, type DesignProblem } from '../../src/design/designProblem.js';
import { exactCandidate } from '../../src/design/exactCandidate.js';
import { rankCandidates, SETTLING_TIE } from '../../src/design/rankCandidates.js';
import type { Candidate } from '../../src/design/types.js';
import { defaultSettling, settlingTime } from '../../src/engine/index.js';
import type { Project } from '../../src/project/types.js';
import type { Ladder } from '../../src/circuit/ladder.js';

/**
 * Exhaustive reference for the design search: every candidate of the discrete space gets the exact
 * engine's settling time; then, in ascending settling order, full engine evaluations until `top`
 * feasible designs are found and the next settling time is beyond the top-th (the ranking puts
 * settling time first, so nothing later can enter). No bounds, no fast model.
 */
export function bruteForce(project: Project, top: number, bits?: number): { ranked: Candidate[]; count: number } {
  const all: Array<{ p: DesignProblem; l: Ladder; t: number }> = [];
  for (const buffered of new Set(project.search?.buffered ?? [false])) {
    const p = designProblem(project, bits, buffered);
    const R = p.rValues;
    const C = p.cValues;
    const { pwm, load } = p.project;
    // The ladder as model.md defines it, built here: the real load, behind a follower when buffered.
    const ladderOf = (r: number[], c: number[]): Ladder => ({
      period: 1 / pwm.frequency,
      high: pwm.high,
      low: pwm.low,
      driverHigh: pwm.driver.high,
      driverLow: pwm.driver.low,
      stages: r.map((rr, k) => ({ r: rr, c: c[k], buffered: buffered && k === r.length - 1 })),
      loadResistance: load.resistance ?? null,
      loadCapacitance: load.capacitance,
    });
    for (const n of p.stageCounts) {
      for (const [r, c] of everyTuple(R, C, n)) {
        const l = ladderOf(r, c);
        const s = p.defaultStep ? defaultSettling(l, p.dutyMin, p.dutyMax, p.band) : settlingTime(l, p.steps[0][0], p.steps[0][1], p.band);
        all.push({ p, l, t: s.time ?? Infinity });
      }
    }
  }
  // Recommendable: every check within its limit less search.margin (model.md 1.1), read here from
  // the checks themselves, not from the search's own flag.
  const margin = project.search?.margin ?? 0;
  const keeps = (cand: Candidate) => cand.settlingTime !== null && cand.checks.every((k) => k.value !== null && k.value <= k.limit * (1 - margin));
  all.sort((a, b) => a.t - b.t);
  const feasible: Candidate[] = [];
  let tN = Infinity;
  for (const e of all) {
    if (e.t === Infinity || e.t > tN * (1 + 10 * SETTLING_TIE)) break;
    const cand = exactCandidate(e.p, e.l);
    if (!keeps(cand)) continue;
    feasible.push(cand);
    const ranked = rankCandidates(feasible);
    if (ranked.length >= top) tN = ranked[top - 1].settlingTime ?? Infinity;
  }
  return { ranked: rankCandidates(feasible).slice(0, top), count: all.length };
}

/** A design as text, for comparing lists ('+F': a follower after that stage). */
/**
 * Every n-stage choice of resistors from R and capacitors from C (pin side first), each once:
 * the whole discrete space the design search walks.
 *
 * Syntax: everyTuple(R, C, n)
 * Example: [...everyTuple([1e3, 2e3], [1e-9], 2)].length   // 4
 */
export function* everyTuple(R: readonly number[], C: readonly number[], n: number): Generator<[number[], number[]]> {
  const total = (R.length * C.length) ** n;
  for (let k = 0; k < total; k++) {
    let rest = k;
    const r: number[] = [];
    const c: number[] = [];
    for (let s = 0; s < n; s++) {
      r.push(R[rest % R.length]);
      rest = Math.floor(rest / R.length);
      c.push(C[rest % C.length]);
      rest = Math.floor(rest / C.length);
    }
    yield [r, c];
  }
}

export const designKey = (c: Pick<Candidate, 'stages'>) => c.stages.map((s) => `${s.r}/${s.c}${s.buffered ? '+F' : ''}`).join(' + ');
