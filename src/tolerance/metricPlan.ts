import type { Ladder } from '../circuit/ladder.js';
import { settlingSteps, modalAverageOutput as averageOutput, averageOutput as engineAverage, prepare, modalLadder, rippleAt } from '../engine/index.js';
import type { Project } from '../project/types.js';
import { gridPeaks } from './dutySearch.js';

/** What to compute for each ladder of a tolerance study, and the limits to check. */
export interface MetricPlan {
  dutyMin: number;
  dutyMax: number;
  /** Settling band, V. */
  band: number;
  /** Settling steps; the slowest counts (a step that never settles is the slowest). */
  steps: Array<{ from: number; to: number }>;
  /** Compute INL (the spec limits it). */
  inl: boolean;
  /** Compute the endpoint-fit gain error (asked for, and the spec limits it: spec.gain). */
  gain: boolean;
  /** Spec limits in SI (V, s; gain: a fraction of full scale); absent = not checked. */
  limits: { ripple?: number; droop?: number; inl?: number; gain?: number; settling?: number };
  /**
   * Duties of the nominal ladder's local ripple maxima: each sample's worst-ripple search starts
   * from them (empty: search the whole range).
   */
  rippleHints: number[] | null;
  /**
   * Duties of the local maxima of |DC error| and |INL| of the nominal ladder and of the ladder with
   * the driver at its most unequal corners (when the tolerance gives driver ranges): the samples'
   * DC searches start from them.
   */
  droopHints: number[] | null;
  inlHints: number[] | null;
}

export interface MetricPlanOptions {
  /**
   * Also plan the gain check (spec.gain, model.md 1.1) when the project has one (default false:
   * callers that predate it, such as the robust design search, keep their figures).
   */
  gain?: boolean;
}

/**
 * The metric plan of a project for a given nominal ladder: duty range, settling steps and band
 * exactly as `analyze` chooses them (analyze.ts), spec limits, and where the nominal ladder's
 * ripple peaks.
 *
 * Method: settling step = spec.settling.from/to when either is given (a missing end is that end of
 * the used range), else both full-range steps; band = spec.settling.band, else defaultBand (0.5 LSB
 * or 0.1 % of full scale). Peaks (gridPeaks): the engine's 16-cell duty grid, each grid local
 * maximum refined by Brent's method. DC peaks also on the ladder with (driver high, driver low) at
 * (max, min) and (min, max) of their ranges: unequal drivers bend average(D), equal ones leave it
 * affine, so a nominal with equal drivers alone would show no interior DC peak.
 *
 * Syntax: metricPlan(project, ladder[, { gain }])
 * Example: metricPlan(p, ladderFromProject(p)).rippleHints  // [0.5] for a symmetric filter
 */
export function metricPlan(project: Project, ladder: Ladder, options: MetricPlanOptions = {}): MetricPlan {
  const { min: dutyMin, max: dutyMax } = project.pwm.duty;
  const s = project.spec.settling;
  const plan = settlingSteps(project);
  const steps = plan.steps.map(([from, to]) => ({ from, to }));
  const limits: MetricPlan['limits'] = {};
  if (project.spec.ripple !== undefined) limits.ripple = project.spec.ripple;
  if (project.spec.droop !== undefined) limits.droop = project.spec.droop;
  if (project.spec.inl !== undefined) limits.inl = project.spec.inl;
  const gain = options.gain === true && project.spec.gain !== undefined;
  if (gain) limits.gain = project.spec.gain;
  if (s?.time !== undefined) limits.settling = s.time;
  return {
    dutyMin,
    dutyMax,
    band: plan.band,
    steps,
    inl: project.spec.inl !== undefined,
    gain,
    limits,
    ...peaks(project, ladder, dutyMin, dutyMax),
  };
}

function peaks(project: Project, ladder: Ladder, a: number, b: number) {
  const m = modalLadder(ladder);
  if (m === null) return { rippleHints: null, droopHints: null, inlHints: null };
  const probes = [ladder];
  const driver = project.tolerance?.driver;
  if (driver) {
    probes.push({ ...ladder, driverHigh: driver.high.max, driverLow: driver.low.min });
    probes.push({ ...ladder, driverHigh: driver.high.min, driverLow: driver.low.max });
  }
  // Peaks of the nominal ladder first; a probe adds only peaks far (over 4 cells) from those.
  const cell = (b - a) / 16;
  const droopHints: number[] = [];
  const inlHints: number[] = [];
  const addFar = (list: number[], found: number[]) => {
    for (const x of found) if (list.every((y) => Math.abs(x - y) > 4 * cell)) list.push(x);
  };
  for (const probe of probes) {
    // A probe's drivers move the first section's modes: it may lose the modal form the nominal
    // ladder has (a cascade whose sections then share a mode); the engine then gives its averages.
    const pm = modalLadder(probe);
    const prepared = pm ? null : prepare(probe);
    const average = (d: number) => (pm ? averageOutput(pm, d) : engineAverage(probe, prepared!, d));
    const span = probe.high - probe.low;
    addFar(droopHints, gridPeaks((d) => Math.abs(probe.low + d * span - average(d)), a, b));
    if (project.spec.inl !== undefined && b > a) {
      const yA = average(a);
      const slope = (average(b) - yA) / (b - a);
      addFar(inlHints, gridPeaks((d) => Math.abs(average(d) - yA - slope * (d - a)), a, b));
    }
  }
  return {
    rippleHints: gridPeaks((d) => rippleAt(m, d), a, b),
    droopHints: droopHints.sort((x, y) => x - y),
    inlHints: inlHints.sort((x, y) => x - y),
  };
}
