import { specChecks, dcTransfer, defaultSettling, pinPeakCurrent, settlingTime, worstRipple, type Check, type Settling } from '../engine/index.js';
import type { Ladder } from '../circuit/ladder.js';
import type { DesignProblem } from './designProblem.js';
import type { Project } from '../project/types.js';
import type { Candidate } from './types.js';

/**
 * A design evaluated by the exact engine: worst ripple, droop, INL, settling time (the problem's
 * step and band), pin peak current and the project's spec checks at the problem's resolution.
 * Every number the design report shows for a candidate comes from here.
 *
 * Method: engine/index.ts (worstRipple, dcTransfer, settlingTime or defaultSettling,
 * pinPeakCurrent) and engine/checks.ts (specChecks), exactly as `analyze` computes them; the
 * margins against the file's limits and against search.margin by marginsOf below.
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
  let totalCapacitance = 0;
  for (const s of ladder.stages) totalCapacitance += s.c;
  return {
    stages: ladder.stages.map((s) => (s.buffered ? { r: s.r, c: s.c, buffered: true } : { r: s.r, c: s.c })),
    bits: problem.bits,
    frequency: problem.frequency,
    ...candidateFigures(problem.project, problem.margin, { worstRipple: ripple, dc, settling, pinPeakCurrent: pinPeakCurrent(ladder) }),
    totalCapacitance,
    needsFollower: ladder.stages[ladder.stages.length - 1].buffered,
  };
}

/** The exact figures of one design as the engine gives them (analyze's inputs to the checks). */
export type DesignFigures = Parameters<typeof specChecks>[1];

/**
 * The fields every candidate takes from its exact figures, whatever its circuit: worst ripple,
 * droop, INL, gain error, settling time, pin current, the project's spec checks, pass, and the
 * margins against the file's limits and search.margin (marginsOf). Shared by exactCandidate (RC
 * ladders) and design/network/networkCandidate.ts (version 1.1 circuits).
 *
 * Syntax: candidateFigures(project, margin, figures)
 * Example: candidateFigures(p, 0.1, { worstRipple, dc, settling, pinPeakCurrent: 0.005 }).keepsMargin
 */
export function candidateFigures(
  project: Project,
  margin: number,
  figures: DesignFigures,
): Pick<Candidate, 'worstRipple' | 'rippleDuty' | 'droop' | 'droopDuty' | 'inl' | 'gainError' | 'settlingTime' | 'pinCurrent' | 'checks' | 'pass' | 'margins' | 'keepsMargin'> {
  const { worstRipple: ripple, dc, settling, pinPeakCurrent: pinCurrent } = figures;
  const checks = specChecks(project, figures);
  const pass = settling.time !== null && checks.every((k) => k.pass);
  return {
    worstRipple: ripple.ripple,
    rippleDuty: ripple.duty,
    droop: Math.abs(dc.droop.error),
    droopDuty: dc.droop.duty,
    inl: Math.abs(dc.inl.error),
    gainError: dc.gainError,
    settlingTime: settling.time,
    pinCurrent,
    checks,
    pass,
    ...marginsOf(checks, margin, pass),
  };
}

/**
 * Headroom per check, (limit - value) / limit, and whether every check meets its limit scaled by
 * (1 - margin) (the same comparison the search prunes with, designProblem.ts searchLimits).
 *
 * Syntax: marginsOf(checks, margin, pass)
 * Example: marginsOf([{ name: 'ripple', value: 0.8, limit: 1, pass: true, unit: 'V' }], 0.1, true)
 *          // { margins: { ripple: 0.2 }, keepsMargin: true }
 */
export function marginsOf(checks: readonly Check[], margin: number, pass: boolean): Pick<Candidate, 'margins' | 'keepsMargin'> {
  const margins: Candidate['margins'] = {};
  let keepsMargin = pass;
  for (const k of checks) {
    margins[k.name] = k.value === null ? null : (k.limit - k.value) / k.limit;
    if (k.value === null || !(k.value <= k.limit * (1 - margin))) keepsMargin = false;
  }
  return { margins, keepsMargin };
}
