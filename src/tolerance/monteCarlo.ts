import { InputError } from '../units/index.js';
import type { Project, ToleranceSettings } from '../project/types.js';
import { drawDeviates, type Distribution } from './deviates.js';
import { evaluateSamples, type SampleTable } from './evaluateSamples.js';
import { metricPlan, type MetricPlan } from './metricPlan.js';
import { toleranceParameters, type ToleranceParameter } from './parameters.js';
import { summarizeSamples, type SampleSummary } from './summarizeSamples.js';
import { toleranceCircuitOf, type ToleranceCircuit } from './toleranceCircuit.js';

export interface MonteCarloOptions {
  /** Sample count (default: tolerance.samples). */
  samples?: number;
  /** Seed (default: tolerance.seed); the same seed gives the same result. */
  seed?: number;
  distribution?: Distribution;
  /** Also count the gain check (spec.gain) in the yield (default false; see MetricPlanOptions). */
  gain?: boolean;
  /** Called now and then with (samples done, total). */
  onProgress?: (done: number, total: number) => void;
}

/** A Monte Carlo tolerance run. */
export interface MonteCarloResult extends SampleSummary {
  samples: number;
  seed: number;
  distribution: Distribution;
  parameters: ToleranceParameter[];
  plan: MetricPlan;
  /** The yield the project asks for, or null. */
  target: number | null;
  /** yield >= target (true without a target). */
  pass: boolean;
  /** Every sample's figures. */
  values: SampleTable;
}

/** Everything a run needs, shared by the in-process and the worker-thread runs. */
export interface MonteCarloSetup {
  /** The nominal circuit: a ladder, or a network (second PWM output, Sallen-Key stages). */
  circuit: ToleranceCircuit;
  parameters: ToleranceParameter[];
  plan: MetricPlan;
  deviates: Float64Array;
  samples: number;
  seed: number;
  distribution: Distribution;
  target: number | null;
}

/**
 * Monte Carlo tolerance analysis of a circuit, ladder or network (default: the project's, see
 * toleranceCircuit.ts): draw every part
 * value from its distribution, compute each sample's exact worst ripple, droop, INL (when the spec
 * limits it) and settling time, and count the yield against the spec.
 *
 * Method: deviates from drawDeviates (xoroshiro128+, Box-Muller, truncation by rejection), drawn
 * up front in one stream so the result depends on the seed only, not on how the work is split;
 * figures by circuitMetrics (a ladder: exact modal fast path, engine fallback; a network: the
 * general periodic engine); summary by summarizeSamples.
 * Runs in the calling thread; monteCarloParallel spreads the same work over worker threads.
 *
 * Syntax: monteCarlo(project[, circuit, { samples, seed, distribution, onProgress }])
 * Example: monteCarlo(p, undefined, { samples: 1000, seed: 7 }).yield  // 0.998
 */
export function monteCarlo(project: Project, circuit?: ToleranceCircuit, options: MonteCarloOptions = {}): MonteCarloResult {
  const setup = monteCarloSetup(project, circuit, options);
  const { onProgress } = options;
  const table = evaluateSamples(
    setup.circuit,
    setup.parameters,
    setup.plan,
    setup.deviates,
    0,
    setup.samples,
    onProgress && ((done) => onProgress(done, setup.samples)),
  );
  return monteCarloResult(setup, table);
}

/**
 * The shared set-up of a run: parameters, plan and deviates (from `draw`, drawDeviates unless a
 * caller that sets up many runs alike passes one that reuses its table: sequentialYield.ts).
 *
 * Syntax: monteCarloSetup(project[, circuit, options, draw])
 * Example: monteCarloSetup(p).deviates.length  // samples * parameters
 */
export function monteCarloSetup(
  project: Project,
  circuit?: ToleranceCircuit,
  options: MonteCarloOptions = {},
  draw: typeof drawDeviates = drawDeviates,
): MonteCarloSetup {
  const settings = requireTolerance(project);
  const nominal = circuit ?? toleranceCircuitOf(project);
  const samples = options.samples ?? settings.samples;
  const seed = options.seed ?? settings.seed;
  const distribution = options.distribution ?? settings.distribution;
  if (!Number.isInteger(samples) || samples < 1) throw new ToleranceInputError(`samples must be a whole number >= 1, got ${samples}`);
  if (!Number.isInteger(seed) || seed < 0 || seed > 0xffffffff) {
    throw new ToleranceInputError(`seed must be a whole number from 0 to 4294967295, got ${seed}`);
  }
  const parameters = toleranceParameters(settings, nominal);
  return {
    circuit: nominal,
    parameters,
    plan: metricPlan(project, nominal, { gain: options.gain }),
    deviates: draw(samples, parameters.length, seed, distribution),
    samples,
    seed,
    distribution,
    target: settings.yield ?? null,
  };
}

/**
 * Assemble the result of a run from its set-up and its sample table.
 *
 * Syntax: monteCarloResult(setup, table)
 * Example: monteCarloResult(setup, table).pass
 */
export function monteCarloResult(setup: MonteCarloSetup, table: SampleTable): MonteCarloResult {
  const summary = summarizeSamples(table, setup.plan);
  return {
    ...summary,
    samples: setup.samples,
    seed: setup.seed,
    distribution: setup.distribution,
    parameters: setup.parameters,
    plan: setup.plan,
    target: setup.target,
    pass: setup.target === null || summary.yield >= setup.target,
    values: table,
  };
}

/** The project's tolerance block, or a clear error naming the missing key. */
export function requireTolerance(project: Project): ToleranceSettings {
  if (!project.tolerance) throw new ToleranceInputError(`the project has no tolerance block`, 'tolerance', project.file);
  return project.tolerance;
}

/** Input that makes a tolerance study impossible (exit code 2 in the command line). */
export class ToleranceInputError extends InputError {
  override name = 'ToleranceInputError';
}
