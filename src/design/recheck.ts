import { specChecks } from '../engine/index.js';
import type { DesignProblem } from './designProblem.js';
import { marginsOf } from './exactCandidate.js';
import type { AnyCandidateStage, Candidate } from './types.js';

/**
 * A candidate's checks against another problem's limits (same circuit figures: the band and the
 * step must be the same, only limits differ), e.g. a design found under relaxed limits measured
 * against the real ones.
 *
 * Method: engine/checks.ts on the candidate's stored engine figures (no new evaluation).
 *
 * Syntax: recheck(problem, candidate)
 * Example: recheck(strict, relaxedBest).pass   // false: it misses a real limit
 */
export function recheck<S extends AnyCandidateStage>(problem: DesignProblem, candidate: Candidate<S>): Candidate<S> {
  const checks = specChecks(problem.project, {
    worstRipple: { duty: candidate.rippleDuty, ripple: candidate.worstRipple },
    dc: {
      droop: { duty: candidate.droopDuty, error: candidate.droop },
      inl: { duty: 0, error: candidate.inl },
      offsetError: 0,
      gainError: candidate.gainError,
    },
    settling: { from: problem.steps[0][0], to: problem.steps[0][1], band: problem.band, time: candidate.settlingTime },
    pinPeakCurrent: candidate.pinCurrent,
  });
  const pass = candidate.settlingTime !== null && checks.every((c) => c.pass);
  return { ...candidate, checks, pass, ...marginsOf(checks, problem.margin, pass) };
}
