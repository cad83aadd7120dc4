import type { Ladder } from '../circuit/ladder.js';
import { settlingSteps } from '../engine/index.js';
import type { Project } from '../project/types.js';
import { doublesOf } from '../numeric/dense.js';
import { seriesValues } from '../units/index.js';
import { DesignInputError } from './designInputError.js';
import { projectAtResolution } from './projectAtResolution.js';
import { designLimits } from './designLimits.js';
import type { DesignLimits } from './types.js';

/** One design problem: the project at one resolution, reduced to the numbers the search needs. */
export interface DesignProblem {
  /** The project at this resolution (pwm.bits, pwm.frequency, lsb and LSB limits adjusted). */
  project: Project;
  bits: number | null;
  lsb: number | null;
  frequency: number;
  period: number;
  dutyMin: number;
  dutyMax: number;
  /** The file's limits at this resolution (what the checks and reports compare with). */
  limits: DesignLimits;
  /**
   * The limits the search prunes and accepts against: each of `limits` scaled by (1 - margin), so
   * that every recommended design keeps search.margin of headroom (model.md 1.1).
   */
  searchLimits: DesignLimits;
  /** search.margin, fraction. */
  margin: number;
  /** This problem's ladders have an ideal follower after the last stage (search.buffered). */
  buffered: boolean;
  /** Settling band, V. */
  band: number;
  /** Settling steps [from, to]; the slowest counts (two for the default full-range step). */
  steps: Array<[number, number]>;
  /** Whether `steps` is the default full-range step (rising and falling). */
  defaultStep: boolean;
  stageCounts: number[];
  series: string;
  resistorSeries: string;
  capacitorSeries: string;
  rValues: number[];
  cValues: number[];
  /**
   * The circuit around the ladder as the ladder itself sees it (PWM source, load): the fast model
   * and the bounds use it. With a follower after the last stage the load hangs on the follower,
   * so the ladder is unloaded here (no load resistance or capacitance), exactly as the engine
   * models it (circuit/stateSpace.ts).
   */
  circuit: Omit<Ladder, 'stages'>;
  /** A ladder of the project's circuit with other stages (the last one buffered when `buffered`). */
  ladderOf(r: ArrayLike<number>, c: ArrayLike<number>): Ladder;
}

/**
 * The design problem of a project, optionally at another resolution `bits` (search over pwm.bits
 * with pwm.clock): the PWM frequency follows from the timer (derivePwmFrequency, common practice),
 * limits the file gave in LSB (project.specInLsb) scale with the new LSB, limits in V stay.
 *
 * Settling step and band as `analyze` uses them (engine/analyze.ts): spec.settling.from/to when
 * given (a missing end takes that end of the used range), else the full used range rising and
 * falling; band from the spec, else 0.5 LSB, else 0.1 % of full scale.
 *
 * Limits: `limits` are the file's (gain as a fraction of full scale), `searchLimits` the same
 * scaled by (1 - search.margin), what the search must meet. With `buffered` every ladder gets an
 * ideal unity-gain follower after its last stage (model.md, Ladder).
 *
 * Syntax: designProblem(project[, bits][, buffered])
 * Example: designProblem(loadProject('board.yaml'), 12).frequency   // clock / 4096 for edge PWM
 */
export function designProblem(project: Project, bits?: number, buffered = false): DesignProblem {
  const search = project.search;
  if (!search) throw new DesignInputError(`missing; add a search section (stages, series, resistance, capacitance) to design a filter`, 'search', project.file);
  const at = bits === undefined ? project : projectAtResolution(project, bits);
  const { pwm, spec } = at;
  // (stored as doubles: every tuple of the search is built from them; see doublesOf)
  const rValues = doublesOf(seriesValues(search.series.resistor, search.resistance.min, search.resistance.max));
  const cValues = doublesOf(seriesValues(search.series.capacitor, search.capacitance.min, search.capacitance.max));
  if (rValues.length === 0) throw new DesignInputError(`no ${search.series.resistor} value lies in the range`, 'search.resistance', project.file);
  if (cValues.length === 0) throw new DesignInputError(`no ${search.series.capacitor} value lies in the range`, 'search.capacitance', project.file);
  for (const n of search.stages) {
    if (!Number.isInteger(n) || n < 1 || n > 3) throw new DesignInputError(`${n} is not 1, 2 or 3`, 'search.stages', project.file);
  }
  const { min: dutyMin, max: dutyMax } = pwm.duty;
  const settling = spec.settling;
  const plan = settlingSteps(at);
  const steps = plan.steps.map(([from, to]): [number, number] => [from, to]);
  const limits = designLimits({
    ripple: spec.ripple,
    droop: spec.droop,
    inl: spec.inl,
    gain: spec.gain,
    settlingTime: settling?.time,
    pinCurrent: search.pinCurrent,
  });
  const margin = search.margin;
  const less = (v: number | undefined) => (v === undefined ? undefined : v * (1 - margin));
  const searchLimits = designLimits({
    ripple: less(limits.ripple),
    droop: less(limits.droop),
    inl: less(limits.inl),
    gain: less(limits.gain),
    settlingTime: less(limits.settlingTime),
    pinCurrent: less(limits.pinCurrent),
  });
  const base = {
    period: 1 / pwm.frequency,
    high: pwm.high,
    low: pwm.low,
    driverHigh: pwm.driver.high,
    driverLow: pwm.driver.low,
    loadResistance: at.load.resistance ?? null,
    loadCapacitance: at.load.capacitance,
  };
  const seen = buffered ? { ...base, loadResistance: null, loadCapacitance: 0 } : base;
  const last = (k: number, n: number) => buffered && k === n - 1;
  return {
    project: at,
    bits: pwm.bits ?? null,
    lsb: at.lsb ?? null,
    frequency: pwm.frequency,
    period: 1 / pwm.frequency,
    dutyMin,
    dutyMax,
    limits,
    searchLimits,
    margin,
    buffered,
    band: plan.band,
    steps,
    defaultStep: plan.defaultStep,
    stageCounts: [...search.stages].sort((a, b) => a - b),
    series: search.series.resistor === search.series.capacitor ? search.series.resistor : `${search.series.resistor} resistors, ${search.series.capacitor} capacitors`,
    resistorSeries: search.series.resistor,
    capacitorSeries: search.series.capacitor,
    rValues,
    cValues,
    circuit: seen,
    ladderOf: (r, c) => {
      const stages = [];
      for (let k = 0; k < r.length; k++) stages.push({ r: r[k], c: c[k], buffered: last(k, r.length) });
      return { ...base, stages };
    },
  };
}

/**
 * The follower options a search of the problem tries (search.buffered: without an ideal follower
 * after the last stage, with one, or both), without first.
 *
 * Syntax: followerOptions(problem)
 * Example: followerOptions(designProblem(loadProject('sample-configs/design-follower-10k.yaml')))   // [false, true]
 *
 * See also: withFollower
 */
export function followerOptions(problem: DesignProblem): boolean[] {
  return [...new Set(problem.project.search?.buffered ?? [problem.buffered])].sort((a, b) => Number(a) - Number(b));
}

/**
 * The problem with (`buffered` true) or without an ideal follower after the last stage: itself
 * when it already is so, else the same project at the same resolution. Every bound and proof of
 * the search is per variant: a follower removes the load the ladder sees.
 *
 * Syntax: withFollower(problem, buffered)
 * Example: withFollower(designProblem(p), true).circuit.loadResistance   // null
 *
 * See also: followerOptions
 */
export function withFollower(problem: DesignProblem, buffered: boolean): DesignProblem {
  return buffered === problem.buffered ? problem : designProblem(problem.project, undefined, buffered);
}
