import type { Ladder } from '../circuit/ladder.js';
import { pinPeakCurrent, type RobustCheck, type RobustChecks, type RobustVerdict } from '../engine/index.js';
import type { Project } from '../project/types.js';
import { requireTolerance, ToleranceInputError } from './monteCarlo.js';
import { sequentialYield } from './sequentialYield.js';
import { ladderAt, toleranceParameters } from './parameters.js';
import { worstCase } from './worstCase.js';
import { boxCorners, cornerMiss } from './cornerMiss.js';

/**
 * The robust checks the design search applies to each nominal design (design/robustDesigns.ts
 * takes them as `checks`): worst case over the tolerance box, or Monte Carlo yield.
 *
 * Syntax: robustDesigns(project, mode, { checks: robustChecks })
 * Example: robustChecks.yield(2000)(p, ladder).pass
 */
export const robustChecks: RobustChecks = {
  worstCase: (project, ladder) => worstCaseCheck(project, ladder),
  yield: (samples) => yieldCheck(samples),
  corners: boxCorners,
};

/**
 * Worst-case check of one design: worst ripple, droop, INL (when limited) and settling time at
 * their worst points of the tolerance box (worstCase.ts), and the pin peak current with
 * R1 and both driver resistances at their minimum and the supply at the end that raises it (the
 * current |high - low| / (driver + R1) falls with R1 and the driver, rises with the swing; Ohm's
 * law). Passes when every limited figure is within its limit. A design that two corners already
 * prove failing (cornerMiss.ts) gets the same verdict without the full search.
 *
 * Syntax: worstCaseCheck(project, ladder)
 * Example: worstCaseCheck(p, ladder).worstCase.settlingTime   // s at the slowest corner
 */
export function worstCaseCheck(project: Project, ladder: Ladder): RobustVerdict {
  const pinCurrent = worstPinCurrent(project, ladder);
  const pinLimit = project.search?.pinCurrent;
  // Two corners often prove the miss already (cornerMiss.ts): same verdict, no full search.
  const miss = cornerMiss(project, ladder);
  if (miss !== null) {
    return { pass: false, worstCase: { settlingTime: Number.NaN, worstRipple: Number.NaN, droop: Number.NaN, inl: null, pinCurrent, missedAtCorner: miss } };
  }
  const w = worstCase(project, ladder);
  const pass = w.pass && (pinLimit === undefined || pinCurrent <= pinLimit);
  return {
    pass,
    worstCase: {
      settlingTime: w.settlingTime.value,
      worstRipple: w.worstRipple.value ?? Infinity,
      droop: Math.abs(w.droop.value ?? Infinity),
      inl: w.inl ? Math.abs(w.inl.value ?? Infinity) : null,
      pinCurrent,
    },
  };
}

/**
 * Yield check of one design with a given sample cap: Monte Carlo yield (the project's seed and
 * distribution) against tolerance.yield, sampled until its confidence interval clears the target
 * or the cap is reached (sequentialYield.ts), and the pin peak current at its
 * worst corner against search.pin_current. The pin limit protects the part, so it holds for every
 * unit, not for a share of them: absolute maximum ratings are checked at the worst case (common
 * practice; the data sheet's absolute maximum ratings table).
 *
 * Syntax: yieldCheck(samples)(project, ladder)
 * Example: yieldCheck(2000)(p, ladder).yield.yield   // 0.9985
 */
export function yieldCheck(samples: number): RobustCheck {
  return (project, ladder) => {
    const target = requireTolerance(project).yield;
    if (target === undefined) throw new ToleranceInputError(`${project.file}: tolerance.yield: a yield check needs a yield target (e.g. yield: 99 %)`);
    const pinCurrent = worstPinCurrent(project, ladder);
    const pinLimit = project.search?.pinCurrent;
    const pinOk = pinLimit === undefined || pinCurrent <= pinLimit;
    // A design over the pin limit fails whatever its yield: skip the Monte Carlo run.
    if (!pinOk) return { pass: false, yield: { yield: Number.NaN, samples: 0, target, pinCurrent } };
    const m = sequentialYield(project, ladder, target, samples);
    return { pass: m.pass, yield: { yield: m.yield, samples: m.samples, target, pinCurrent, interval: m.interval } };
  };
}

/** Pin peak current at its worst corner of the tolerance box, A. */
function worstPinCurrent(project: Project, ladder: Ladder): number {
  const parameters = toleranceParameters(project.tolerance!, ladder);
  let worst = pinPeakCurrent(ladder);
  for (const supply of [-1, 1]) {
    const z = parameters.map((q) => {
      const t = q.target;
      if ((t.kind === 'resistor' && t.stage === 0) || t.kind === 'driverHigh' || t.kind === 'driverLow') return -1;
      return t.kind === 'supply' ? supply : 0;
    });
    worst = Math.max(worst, pinPeakCurrent(ladderAt(ladder, parameters, z)));
  }
  return worst;
}

