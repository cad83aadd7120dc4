import { derivePwmFrequency } from '../project/derivePwmFrequency.js';
import type { Project } from '../project/types.js';
import { formatEng } from '../units/index.js';
import { boundedSearch, type SearchBudget } from './boundedSearch.js';
import { designLabel } from './designLabel.js';
import type { DesignProblem } from './designProblem.js';
import type { Candidate, FixKind, NearestFix } from './types.js';

export type { FixKind, NearestFix } from './types.js';


/** Resolutions below the lowest searched, and frequency factors, tried at most. */
const FEWER_BITS = 4;
const FASTER = [2, 4, 8];
/** Range widening factor for R and C. */
const WIDER = 10;

/**
 * The nearest changes of a project whose search finds nothing that make it feasible, one per kind,
 * each verified by the design search itself on the changed project (boundedSearch.ts: proven
 * bounds, then the walk within the shared budget), so every suggestion is true: its design meets
 * every limit of the changed project by the exact engine. Kinds, each the smallest step tried that
 * works: fewer PWM bits (higher frequency from the same timer clock; LSB limits scale with the
 * LSB), a faster PWM at the same resolution (timer clock x2, x4, x8, or pwm.frequency without a
 * clock), one more stage (up to three), an ideal follower between the last stage and the load
 * (searched as the unloaded ladder, which is what the model makes of it), a resistor or capacitor
 * range ten times wider. A kind
 * whose search ran out of budget is left out (nothing claimed).
 *
 * Syntax: nearestFixes(project, problems, stageCounts, budgetOf)   // budgetOf: a fresh budget per kind
 * Example: nearestFixes(p, problems, [2], () => ({ left: 4e4, perProblem: 4e4 }))[0].line
 *          // 'at 7 bits (125 kHz) the best 2-stage design settles in 1.2 ms against 20 ms: feasible (...)'
 */
export function nearestFixes(project: Project, problems: DesignProblem[], stageCounts: number[], budgetOf: () => SearchBudget): NearestFix[] {
  const { pwm } = project;
  const bitsRange = project.search?.bits;
  const searchBits = bitsRange !== undefined && pwm.clock !== undefined;
  const bitsList: Array<number | undefined> = searchBits ? problems.map((p) => p.bits ?? undefined) : [undefined];
  const limit = problems[0].limits.settlingTime;
  const fixes: NearestFix[] = [];
  // "the best" only when the search ran to the end; a search cut at its budget found "a" design.
  let complete = true;
  const search = (p: Project, counts: number[], bits: Array<number | undefined>, budget: SearchBudget) => {
    const result = boundedSearch(p, counts, bits, 1, budget);
    complete = result.complete;
    return result.designs[0];
  };
  const describe = (best: Candidate) => {
    const n = best.stages.length;
    const settles = best.settlingTime === null ? 'never settles' : `settles in ${formatEng(best.settlingTime, 's')}`;
    return `${complete ? 'the best' : 'a'} ${n}-stage design ${settles}${limit !== undefined ? ` against ${formatEng(limit, 's')}` : ''}: feasible (${designLabel(best)})`;
  };

  // Fewer bits: the same timer clock gives a higher PWM frequency.
  const lowest = searchBits ? bitsRange.min : pwm.bits;
  if (pwm.clock !== undefined && lowest !== undefined) {
    const budget = budgetOf();
    for (let b = lowest - 1; b >= Math.max(1, lowest - FEWER_BITS); b--) {
      const found = search(project, stageCounts, [b], budget);
      if (found) {
        const change = `${b} bits (${formatEng(found.frequency, 'Hz')})`;
        fixes.push({ kind: 'resolution', change, best: found, line: `fewer bits: at ${change} ${describe(found)}; LSB limits count in ${b}-bit LSB` });
        break;
      }
    }
  }

  // A faster PWM at the same resolution(s).
  const fasterBudget = budgetOf();
  for (const k of FASTER) {
    const faster: Project =
      pwm.clock !== undefined
        ? { ...project, pwm: { ...pwm, clock: pwm.clock * k, frequency: fasterFrequency(project, k) } }
        : { ...project, pwm: { ...pwm, frequency: pwm.frequency * k } };
    const found = search(faster, stageCounts, bitsList, fasterBudget);
    if (found) {
      const change = pwm.clock !== undefined ? `a ${formatEng(pwm.clock * k, 'Hz')} timer clock (${formatEng(found.frequency, 'Hz')} at ${found.bits} bits)` : `${formatEng(found.frequency, 'Hz')} PWM`;
      fixes.push({ kind: 'frequency', change, best: found, line: `higher PWM frequency: with ${change} ${describe(found)}` });
      break;
    }
  }

  // One more stage.
  const most = Math.max(...stageCounts);
  if (most < 3) {
    const found = search(project, [most + 1], bitsList, budgetOf());
    if (found) fixes.push({ kind: 'stages', change: `${most + 1} stages`, best: found, line: `one more stage: ${describe(found)}${found.bits !== null && searchBits ? ` at ${found.bits} bits` : ''}` });
  }

  // A follower after the last stage: by the model (an ideal unity-gain follower does not load the
  // node before it) the ladder then sees an open output, so the unloaded search is that design.
  if (project.load.resistance !== undefined || project.load.capacitance > 0) {
    const buffered: Project = { ...project, load: { capacitance: 0 } };
    const found = search(buffered, stageCounts, bitsList, budgetOf());
    if (found) {
      const best = { ...found, stages: found.stages.map((s, k) => (k === found.stages.length - 1 ? { ...s, buffered: true } : s)) };
      fixes.push({
        kind: 'follower',
        change: 'a follower after the last stage',
        best,
        line: `a follower (op-amp buffer) between the last stage and the load: ${describe(best)}${found.bits !== null && searchBits ? ` at ${found.bits} bits` : ''}`,
      });
    }
  }

  // Wider component ranges.
  const settings = project.search;
  if (settings) {
    const ranges: Array<[FixKind, Project, string]> = [
      [
        'resistance',
        { ...project, search: { ...settings, resistance: { min: settings.resistance.min / WIDER, max: settings.resistance.max * WIDER } } },
        `resistors from ${formatEng(settings.resistance.min / WIDER, 'Ω')} to ${formatEng(settings.resistance.max * WIDER, 'Ω')}`,
      ],
      [
        'capacitance',
        { ...project, search: { ...settings, capacitance: { min: settings.capacitance.min / WIDER, max: settings.capacitance.max * WIDER } } },
        `capacitors from ${formatEng(settings.capacitance.min / WIDER, 'F')} to ${formatEng(settings.capacitance.max * WIDER, 'F')}`,
      ],
    ];
    for (const [kind, wider, change] of ranges) {
      const found = search(wider, stageCounts, bitsList, budgetOf());
      if (found) fixes.push({ kind, change, best: found, line: `wider range: with ${change} ${describe(found)}${found.bits !== null && searchBits ? ` at ${found.bits} bits` : ''}` });
    }
  }
  return fixes;
}

/** The project's PWM frequency with the timer clock k times faster (same bits, prescaler, alignment). */
function fasterFrequency(project: Project, k: number): number {
  const { pwm } = project;
  if (pwm.clock === undefined || pwm.bits === undefined) return pwm.frequency * k;
  return derivePwmFrequency({ clock: pwm.clock * k, bits: pwm.bits, prescaler: pwm.prescaler, alignment: pwm.alignment });
}
