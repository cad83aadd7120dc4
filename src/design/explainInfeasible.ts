import type { Project } from '../project/types.js';
import { formatEng } from '../units/index.js';
import { gainFloor } from './gainFloor.js';
import { designProblem, type DesignProblem } from './designProblem.js';
import { rankCandidates } from './rankCandidates.js';
import { recheck } from './recheck.js';
import { relaxProject, type LimitName } from './relaxProject.js';
import { oneStageRipple } from './oneStageRipple.js';
import { bestDesigns } from './bestDesigns.js';
import type { Candidate } from './types.js';

/** Factors by which all limits are relaxed together to find the closest designs. */
const RELAX = [1.25, 1.6, 2.5, 4, 10, 100];
/** Closest designs shown. */
const CLOSEST = 3;

/** Why nothing is feasible, and the designs that come closest. */
export interface Explanation {
  lines: string[];
  /** Designs found under relaxed limits, checked against the real ones (pass false). */
  closest: Candidate[];
  /** The limits that alone make the space empty (removing one of them gives a feasible design). */
  binding: LimitName[];
}

/**
 * Explain an empty result: which limit binds and by how much, in words an engineer can act on,
 * and the designs that come closest.
 *
 * Method: (1) each limit is removed in turn and the search rerun (top 1): a limit whose removal
 * gives a feasible design binds; the best design without it shows by how much. (2) Physical
 * reasons, from the circuit alone: pin current needs R1 >= (high - low) / I - driver (Ohm's law);
 * droop caps the series resistance at R_L droop / (ideal - droop) (DC current balance, see
 * collectCandidates.ts); ripple of one stage needs a time constant tau with
 * (high - low) (1 - e^-a)(1 - e^-b) / (1 - e^-(a+b)) <= limit, a = D T / tau, b = (1 - D) T / tau
 * (oneStageRipple.ts), compared with the largest R and C allowed. (3) All limits relaxed together
 * by growing factors until designs appear: those, checked against the real limits, are the closest.
 *
 * Syntax: explainInfeasible(project, problems, stageCounts)
 * Example: explainInfeasible(p, [designProblem(p)], [1, 2]).lines
 *          // ['ripple: ... needs a time constant of about 33 ms with one stage; the largest ... give 18 ms', ...]
 */
export function explainInfeasible(project: Project, problems: DesignProblem[], stageCounts: number[]): Explanation {
  const base = problems[0];
  const bitsList = problems.map((p) => p.bits);
  const searchBits = problems.length > 1 || project.search?.bits !== undefined;
  const solveAll = (p: Project, top: number): Candidate[] =>
    rankCandidates(
      bitsList.flatMap((b) => bestDesigns(designProblem(p, searchBits && b !== null ? b : undefined), top, stageCounts).feasible),
    ).slice(0, top);

  const names: LimitName[] = [];
  const { limits } = base;
  if (limits.ripple !== undefined) names.push('ripple');
  if (limits.droop !== undefined) names.push('droop');
  if (limits.inl !== undefined) names.push('inl');
  if (limits.gain !== undefined) names.push('gain');
  if (limits.settlingTime !== undefined) names.push('settling');
  if (limits.pinCurrent !== undefined) names.push('pin_current');

  const lines: string[] = [];
  const binding: LimitName[] = [];
  const volts = (v: number, p: DesignProblem = base) =>
    // With several resolutions in play, an LSB count names the resolution it is counted at.
    p.lsb !== null ? `${formatEng(v, 'V')} (${(v / p.lsb).toPrecision(3)} LSB${searchBits && p.bits !== null ? ` @ ${p.bits} bit` : ''})` : formatEng(v, 'V');

  for (const name of names) {
    const without = solveAll(relaxProject(project, [name], Infinity), 1)[0];
    if (!without) continue;
    binding.push(name);
    const at = problems.find((p) => p.bits === without.bits) ?? base;
    const lim = at.limits;
    switch (name) {
      case 'ripple':
        lines.push(`ripple binds: the best design without the ripple limit has ${volts(without.worstRipple, at)} of ripple; the limit is ${volts(lim.ripple!, at)}`);
        break;
      case 'droop':
        lines.push(`droop binds: the best design without the droop limit has ${volts(without.droop, at)} of droop; the limit is ${volts(lim.droop!, at)}`);
        break;
      case 'inl':
        lines.push(`INL binds: the best design without the INL limit has ${volts(without.inl, at)}; the limit is ${volts(lim.inl!, at)}`);
        break;
      case 'gain':
        lines.push(
          `gain binds: the best design without the gain limit has a gain error of ${percentOf(without.gainError / (at.project.pwm.high - at.project.pwm.low))} of full scale; the limit is ${percentOf(lim.gain!)}`,
        );
        break;
      case 'settling':
        lines.push(
          `settling binds: the fastest design that meets the other limits settles in ${formatEng(without.settlingTime ?? Infinity, 's')}; the limit is ${formatEng(lim.settlingTime!, 's')}`,
        );
        break;
      case 'pin_current':
        lines.push(`pin current binds: the best design without that limit draws ${formatEng(without.pinCurrent, 'A')}; the limit is ${formatEng(lim.pinCurrent!, 'A')}`);
        break;
    }
  }
  if (binding.length === 0) lines.push('no single limit is to blame: with any one of them removed, still no design meets the others');
  lines.push(...physicalReasons(base, stageCounts, volts));

  let closest: Candidate[] = [];
  for (const k of RELAX) {
    const found = solveAll(relaxProject(project, names, k), CLOSEST);
    if (found.length > 0) {
      closest = found.map((c) => recheck(problems.find((p) => p.bits === c.bits) ?? base, c));
      lines.push(`the closest designs below meet every limit relaxed ${k}-fold`);
      break;
    }
  }
  if (closest.length === 0 && names.length > 0) lines.push(`even with every limit relaxed ${RELAX[RELAX.length - 1]}-fold no design works: check the ranges in search:`);
  return { lines, closest, binding };
}

const percentOf = (x: number) => `${Number((Math.abs(x) * 100).toPrecision(3))} %`;

/** Statements from the circuit alone (no search): pin current, droop, gain, one-stage ripple. */
function physicalReasons(p: DesignProblem, stageCounts: number[], volts: (v: number) => string): string[] {
  const out: string[] = [];
  const { pwm, load } = p.project;
  const span = Math.abs(pwm.high - pwm.low);
  const dMin = Math.min(pwm.driver.high, pwm.driver.low);
  const rMin = p.rValues[0];
  const rMax = p.rValues[p.rValues.length - 1];
  const cMax = p.cValues[p.cValues.length - 1];
  const ohm = (r: number) => formatEng(r, 'Ω');
  let r1Min = rMin;
  if (p.limits.pinCurrent !== undefined) {
    const need = span / p.limits.pinCurrent - dMin;
    if (need > rMax) {
      out.push(
        `pin current ${formatEng(p.limits.pinCurrent, 'A')} needs R1 >= ${ohm(need)} (${formatEng(span, 'V')} / ${formatEng(p.limits.pinCurrent, 'A')} less the ${ohm(dMin)} driver); the largest resistor allowed is ${ohm(rMax)}`,
      );
    }
    r1Min = Math.max(rMin, need);
  }
  let seriesMax = Infinity;
  if (p.limits.droop !== undefined && load.resistance !== undefined && pwm.low >= 0 && pwm.driver.high >= pwm.driver.low) {
    const ideal = Math.max(pwm.low + p.dutyMin * (pwm.high - pwm.low), pwm.low + p.dutyMax * (pwm.high - pwm.low));
    if (ideal > p.limits.droop) {
      seriesMax = (load.resistance * p.limits.droop) / (ideal - p.limits.droop);
      const fewest = Math.min(...stageCounts);
      const smallest = pwm.driver.low + r1Min + (fewest - 1) * rMin;
      if (smallest > seriesMax) {
        out.push(
          `droop ${volts(p.limits.droop)} with the ${ohm(load.resistance)} load allows at most ${ohm(seriesMax)} in series (driver included); the smallest ${fewest}-stage ladder in the range has ${ohm(smallest)}`,
        );
      }
    }
  }
  if (p.limits.gain !== undefined && load.resistance !== undefined && !p.buffered) {
    // The DC divider of series resistance and load (gainFloor.ts), for the smallest ladder allowed.
    const fewest = Math.min(...stageCounts);
    const rs = [r1Min, ...new Array<number>(fewest - 1).fill(rMin)];
    const floor = gainFloor(p.circuit, rs, p.dutyMin, p.dutyMax);
    if (floor > p.searchLimits.gain!) {
      const limit = `gain error ${percentOf(p.limits.gain)}${p.margin > 0 ? ` (less the ${percentOf(p.margin)} margin)` : ''} with the ${ohm(load.resistance)} load`;
      const smallest = Math.min(pwm.driver.high, pwm.driver.low) + rs.reduce((a, b) => a + b, 0);
      const follower = (p.project.search?.buffered ?? []).includes(true) ? '' : '; a follower after the last stage (search.buffered: [false, true]) isolates the load';
      out.push(
        pwm.driver.high === pwm.driver.low
          ? `${limit} allows at most ${ohm((load.resistance * p.searchLimits.gain!) / (1 - p.searchLimits.gain!))} in series (driver included); the smallest ${fewest}-stage ladder in the range has ${ohm(smallest)}${follower}`
          : `${limit}: the smallest ${fewest}-stage ladder in the range (${ohm(smallest)} in series, driver included) loses at least ${percentOf(floor)} of full scale${follower}`,
      );
    }
  }
  if (p.limits.ripple !== undefined) {
    const d = Math.min(p.dutyMax, Math.max(p.dutyMin, 0.5));
    const tauNeed = timeConstantFor(p.limits.ripple, span, d, p.period);
    const rBest = Math.min(rMax, seriesMax - Math.max(pwm.driver.high, pwm.driver.low));
    const rEff = load.resistance === undefined ? rBest + dMin : ((rBest + dMin) * load.resistance) / (rBest + dMin + load.resistance);
    const tauHave = rBest > 0 ? rEff * (cMax + load.capacitance) : 0;
    if (tauNeed > tauHave) {
      out.push(
        `ripple ${volts(p.limits.ripple)} needs a time constant of about ${formatEng(tauNeed, 's')} with one stage at ${formatEng(p.frequency, 'Hz')}; the largest R and C allowed give ${formatEng(tauHave, 's')}`,
      );
    }
  }
  return out;
}

/** The one-stage time constant whose ripple at duty d equals `ripple` (bisection in log tau). */
function timeConstantFor(ripple: number, span: number, d: number, period: number): number {
  if (ripple >= span) return 0;
  let lo = period * 1e-6;
  let hi = period * 1e12;
  for (let i = 0; i < 200 && hi / lo > 1 + 1e-9; i++) {
    const mid = Math.sqrt(lo * hi);
    if (oneStageRipple(span, d, period, mid) > ripple) lo = mid;
    else hi = mid;
  }
  return hi;
}
