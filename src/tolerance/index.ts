/** Tolerance studies: worst case over the tolerance box and Monte Carlo yield, exact per circuit. */
export { worstCase, type WorstCaseResult, type WorstCaseFigure, type WorstCaseOptions, type Effect, type Figure } from './worstCase.js';
export {
  monteCarlo,
  monteCarloSetup,
  monteCarloResult,
  requireTolerance,
  ToleranceInputError,
  type MonteCarloOptions,
  type MonteCarloResult,
  type MonteCarloSetup,
} from './monteCarlo.js';
export { monteCarloParallel, type ParallelOptions } from './parallel.js';
export { toleranceStudy, type ToleranceStudyResult } from './study.js';
export { ladderMetrics, type LadderMetrics, type LadderMetricsOptions } from './ladderMetrics.js';
export { metricPlan, type MetricPlan } from './metricPlan.js';
export { toleranceParameters, ladderAt, type ToleranceParameter, type ParameterTarget } from './parameters.js';
export { drawDeviates, type Distribution } from './deviates.js';
export { evaluateSamples, type SampleTable } from './evaluateSamples.js';
export { summarizeSamples, type SampleSummary, type SpecName } from './summarizeSamples.js';
export { percentiles, quantileSorted, wilsonInterval, histogram, type Percentiles, type Histogram } from '../numeric/statistics.js';
export { robustChecks, worstCaseCheck, yieldCheck } from './robustChecks.js';
