import { specChecks, dcTransfer, defaultSettling, pinPeakCurrent, settlingTime, worstRipple, type Settling } from '../engine/index.js';
import type { Ladder } from '../circuit/ladder.js';
import type { DesignProblem } from './designProblem.js';
import type { Candidate } from './types.js';

/**
 * A design evaluated by the exact engine: worst ripple, droop, INL, settling time (the problem's
 * step and band), pin peak current and the project's spec checks at the problem's resolution.
 * Every number the design report shows for a candidate comes from here.
 *
 * Method: engine/index.ts (worstRipple, dcTransfer, settlingTime or defaultSettling,
 * pinPeakCurrent) and engine/checks.ts (specChecks), exactly as `analyze` computes them.
 *
 * Syntax: exactCandidate(problem, ladder)
 * Example: exactCandidate(problem, problem.ladderOf([4700], [100e-9])).settlingTime   // s, or null
 */
export function exactCandidate(problem: DesignProblem, ladder: Ladder): Candidate {
  const { dutyMin, dutyMax, band, steps } = problem;
  const ripple = worstRipple(ladder, dutyMin, dutyMax);
  const dc = dcTransfer(ladder, dutyMin, dutyMax);
  const settling: Settling = problem.defaultStep
    ? defaultSettling(ladder, dutyMin, dutyMax, band)
    : settlingTime(ladder, steps[0][0], steps[0][1], band);
  const pinCurrent = pinPeakCurrent(ladder);
  const checks = specChecks(problem.project, { worstRipple: ripple, dc, settling, pinPeakCurrent: pinCurrent });
  let totalCapacitance = 0;
  for (const s of ladder.stages) totalCapacitance += s.c;
  return {
    stages: ladder.stages.map((s) => (s.buffered ? { r: s.r, c: s.c, buffered: true } : { r: s.r, c: s.c })),
    bits: problem.bits,
    frequency: problem.frequency,
    worstRipple: ripple.ripple,
    rippleDuty: ripple.duty,
    droop: Math.abs(dc.droop.error),
    droopDuty: dc.droop.duty,
    inl: Math.abs(dc.inl.error),
    settlingTime: settling.time,
    pinCurrent,
    totalCapacitance,
    checks,
    pass: settling.time !== null && checks.every((k) => k.pass),
  };
}
