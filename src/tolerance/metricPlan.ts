import type { Ladder } from '../circuit/ladder.js';
import type { Network } from '../circuit/network.js';
import {
  settlingSteps,
  modalAverageOutput as averageOutput,
  averageOutput as engineAverage,
  prepare,
  modalLadder,
  rippleAt,
  networkAverage,
  networkDcTransfer,
  networkRipple,
  networkWorstRipple,
} from '../engine/index.js';
import type { Project } from '../project/types.js';
import { gridPeaks } from './dutySearch.js';
import { isNetwork, type ToleranceCircuit } from './toleranceCircuit.js';

/** What to compute for each circuit of a tolerance study, and the limits to check. */
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
   * Duties of the nominal circuit's local ripple maxima (with a fine output: its worst code, as a
   * fraction of the code range): each sample's worst-ripple search starts from them (null: search
   * the whole range).
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
 * The metric plan of a project for a given nominal circuit (ladder or network): duty range,
 * settling steps and band exactly as `analyze` chooses them (analyze.ts), spec limits, and where
 * the nominal circuit's ripple and DC errors peak.
 *
 * Method: settling step = spec.settling.from/to when either is given (a missing end is that end of
 * the used range), else both full-range steps; band = spec.settling.band, else defaultBand (0.5 LSB
 * or 0.1 % of full scale). Peaks (gridPeaks): the engine's 16-cell duty grid, each grid local
 * maximum refined by Brent's method. DC peaks also on the ladder with (driver high, driver low) at
 * (max, min) and (min, max) of their ranges: unequal drivers bend average(D), equal ones leave it
 * affine, so a nominal with equal drivers alone would show no interior DC peak. A network takes
 * the same peaks from the general engine (networkRipple, networkAverage); with a fine output, whose
 * codes are discrete, the hints are the worst codes of the engine's own searches
 * (networkWorstRipple, networkDcTransfer) on the nominal and on the two driver probes.
 *
 * Syntax: metricPlan(project, ladder[, { gain }])
 * Example: metricPlan(p, ladderFromProject(p)).rippleHints  // [0.5] for a symmetric filter
 */
export function metricPlan(project: Project, circuit: ToleranceCircuit, options: MetricPlanOptions = {}): MetricPlan {
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
    ...(isNetwork(circuit) ? networkPeaks(project, circuit, dutyMin, dutyMax) : peaks(project, circuit, dutyMin, dutyMax)),
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

function networkPeaks(project: Project, network: Network, a: number, b: number) {
  const probes = [network];
  const driver = project.tolerance?.driver;
  if (driver) {
    // Both outputs' drivers at the two most unequal corners (parameters.ts varies the second's too).
    const at = (high: number, low: number): Network => ({
      ...network,
      pin: { ...network.pin, driverHigh: high, driverLow: low },
      second: network.second ? { ...network.second, pin: { ...network.second.pin, driverHigh: high, driverLow: low } } : null,
    });
    probes.push(at(driver.high.max, driver.low.min), at(driver.high.min, driver.low.max));
  }
  const cell = (b - a) / 16;
  const droopHints: number[] = [];
  const inlHints: number[] = [];
  const addFar = (list: number[], found: number[]) => {
    for (const x of found) if (list.every((y) => Math.abs(x - y) > 4 * cell)) list.push(x);
  };
  if (network.second?.role === 'fine') {
    for (const probe of probes) {
      const dc = networkDcTransfer(probe, a, b);
      addFar(droopHints, [dc.droop.duty]);
      if (project.spec.inl !== undefined) addFar(inlHints, [dc.inl.duty]);
    }
    return { rippleHints: [networkWorstRipple(network, a, b).duty], droopHints, inlHints };
  }
  for (const probe of probes) {
    const average = (d: number) => networkAverage(probe, d);
    const span = probe.pin.high - probe.pin.low;
    addFar(droopHints, gridPeaks((d) => Math.abs(probe.pin.low + d * span - average(d)), a, b));
    if (project.spec.inl !== undefined && b > a) {
      const yA = average(a);
      const slope = (average(b) - yA) / (b - a);
      addFar(inlHints, gridPeaks((d) => Math.abs(average(d) - yA - slope * (d - a)), a, b));
    }
  }
  return {
    rippleHints: gridPeaks((d) => networkRipple(network, d), a, b),
    droopHints: droopHints.sort((x, y) => x - y),
    inlHints: inlHints.sort((x, y) => x - y),
  };
}
