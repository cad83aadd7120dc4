import type { Network, NetworkStage } from '../../../src/circuit/network.js';
import { networkCandidate } from '../../../src/design/network/networkCandidate.js';
import { networkProblem } from '../../../src/design/network/networkProblem.js';
import { rankCandidates, SETTLING_TIE } from '../../../src/design/rankCandidates.js';
import type { AnyCandidateStage, Candidate } from '../../../src/design/types.js';
import { networkCircuitEngine } from '../../../src/engine/index.js';
import { settlingSteps } from '../../../src/engine/settlingSteps.js';
import { networkFromProject } from '../../../src/project/networkFromProject.js';
import type { Project } from '../../../src/project/types.js';
import { seriesValues } from '../../../src/units/index.js';

/**
 * Exhaustive reference for the version 1.1 design search: the space is built here from the project
 * (every series value in each range; a Sallen-Key stage's c1 kept when model.md's
 * Q = sqrt(r1 r2 c1 c2) / (c2 (r1 + r2)) lies in search.q; the second output's parts from the
 * explicit search.second_pwm ranges, which every scenario here gives), every candidate gets the exact
 * engine's settling time, then full engine evaluations in ascending settling order until `top`
 * designs keep the margin and the next settling time is beyond the top-th (settling ranks first).
 * No bounds, no fast model.
 */
export function bruteForceNetwork(project: Project, top: number): { ranked: Candidate<AnyCandidateStage>[]; count: number } {
  const search = project.search!;
  const shape = networkFromProject(project);
  const R = seriesValues(search.series.resistor, search.resistance.min, search.resistance.max);
  const C = seriesValues(search.series.capacitor, search.capacitance.min, search.capacitance.max);
  const q = search.q ?? { min: 0.5, max: 0.8 };
  const choices: NetworkStage[][] = shape.stages.map((s) => {
    const out: NetworkStage[] = [];
    if (s.kind === 'rc') for (const r of R) for (const c of C) out.push({ kind: 'rc', r, c, buffered: s.buffered });
    else {
      for (const r1 of R) for (const r2 of R) for (const c1 of C) for (const c2 of C) {
        const Q = Math.sqrt(r1 * r2 * c1 * c2) / (c2 * (r1 + r2));
        if (Q >= q.min * (1 - 1e-12) && Q <= q.max * (1 + 1e-12)) out.push({ kind: 'sallen-key', r1, r2, c1, c2 });
      }
    }
    return out;
  });
  const second = shape.second;
  const secondR = second ? seriesValues(search.series.resistor, search.secondPwm!.r!.min, search.secondPwm!.r!.max) : [];
  const secondC = second?.c != null ? seriesValues(search.series.capacitor, search.secondPwm!.c!.min, search.secondPwm!.c!.max) : [null];
  const networks: Network[] = [];
  const pick = (k: number, stages: NetworkStage[]) => {
    if (k === choices.length) {
      if (!second) networks.push({ ...shape, stages });
      else for (const r of secondR) for (const c of secondC) networks.push({ ...shape, stages, second: { ...second, r, c } });
      return;
    }
    for (const s of choices[k]) pick(k + 1, [...stages, s]);
  };
  pick(0, []);

  const { band, steps, defaultStep } = settlingSteps(project);
  const { min, max } = project.pwm.duty;
  const timed = networks.map((n) => {
    const e = networkCircuitEngine(n);
    const s = defaultStep ? e.defaultSettling(min, max, band) : e.settling(steps[0][0], steps[0][1], band);
    return { n, t: s.time ?? Infinity };
  });
  timed.sort((a, b) => a.t - b.t);
  const problem = networkProblem(project);
  const margin = search.margin;
  // Recommendable: every check within its limit less search.margin, read from the checks themselves.
  const keeps = (c: Candidate<AnyCandidateStage>) => c.settlingTime !== null && c.checks.every((k) => k.value !== null && k.value <= k.limit * (1 - margin));
  const feasible: Candidate<AnyCandidateStage>[] = [];
  let tN = Infinity;
  for (const e of timed) {
    if (e.t === Infinity || e.t > tN * (1 + 10 * SETTLING_TIE)) break;
    const cand = networkCandidate(problem, e.n);
    if (!keeps(cand)) continue;
    feasible.push(cand);
    const ranked = rankCandidates(feasible);
    if (ranked.length >= top) tN = ranked[top - 1].settlingTime ?? Infinity;
  }
  return { ranked: rankCandidates(feasible).slice(0, top), count: networks.length };
}

/** A design as text, for comparing lists. */
export const networkKey = (c: Pick<Candidate<AnyCandidateStage>, 'stages' | 'secondPwm'>) =>
  c.stages.map((s) => ('active' in s ? `SK ${s.r1}/${s.r2}/${s.c1}/${s.c2}` : `${s.r}/${s.c}${s.buffered ? '+F' : ''}`)).join(' + ') +
  (c.secondPwm ? ` ; ${c.secondPwm.r}/${c.secondPwm.c}` : '');
