import type { Network } from '../../circuit/network.js';
import { sallenKeyFigures } from '../../circuit/sallenKeyFigures.js';
import { networkCircuitEngine, type Settling } from '../../engine/index.js';
import { candidateFigures } from '../exactCandidate.js';
import type { AnyCandidateStage, Candidate } from '../types.js';
import type { NetworkProblem } from './networkProblem.js';

/**
 * A version 1.1 design evaluated by the exact engine (src/engine/periodic through
 * networkCircuitEngine): worst ripple, DC transfer, settling (the problem's step and band), pin
 * peak current and the project's spec checks, exactly as `analyze` computes them for the same
 * circuit; margins against the file's limits and search.margin as for RC ladders (exactCandidate.ts).
 *
 * Syntax: networkCandidate(problem, network)
 * Example: networkCandidate(p, p.networkOf(stages, { r: 2.55e6, c: null })).settlingTime   // s, or null
 */
export function networkCandidate(problem: NetworkProblem, network: Network): Candidate<AnyCandidateStage> {
  const { dutyMin, dutyMax, band, steps, defaultStep, project, margin } = problem.base;
  const engine = networkCircuitEngine(network, project.file);
  const ripple = engine.worstRipple(dutyMin, dutyMax);
  const dc = engine.dcTransfer(dutyMin, dutyMax);
  const settling: Settling = defaultStep ? engine.defaultSettling(dutyMin, dutyMax, band) : engine.settling(steps[0][0], steps[0][1], band);
  let totalCapacitance = 0;
  const stages = network.stages.map((s): AnyCandidateStage => {
    if (s.kind === 'rc') {
      totalCapacitance += s.c;
      return s.buffered ? { r: s.r, c: s.c, buffered: true } : { r: s.r, c: s.c };
    }
    totalCapacitance += s.c1 + s.c2;
    return { active: 'sallen-key', r1: s.r1, r2: s.r2, c1: s.c1, c2: s.c2 };
  });
  const second = network.second;
  if (second?.c != null) totalCapacitance += second.c;
  const last = network.stages[network.stages.length - 1];
  const active = network.stages.flatMap((s, stage) => (s.kind === 'sallen-key' ? [{ stage, ...sallenKeyFigures(s) }] : []));
  return {
    stages,
    ...(second && { secondPwm: { r: second.r, c: second.c } }),
    ...(active.length > 0 && { activeStages: active }),
    bits: problem.base.bits,
    frequency: problem.base.frequency,
    ...candidateFigures(project, margin, { worstRipple: ripple, dc, settling, pinPeakCurrent: engine.pinPeakCurrent() }),
    totalCapacitance,
    needsFollower: last.kind === 'rc' && last.buffered,
  };
}
