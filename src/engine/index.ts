/** The exact engine: periodic steady state, settling, DC transfer and small-signal figures. */
export { steadyState } from './steadyState.js';
export { worstRipple } from './worstRipple.js';
export { dcTransfer } from './dcTransfer.js';
export { settlingTime } from './settlingTime.js';
export { defaultSettling } from './defaultSettling.js';
export { cutoff } from './cutoff.js';
export { magnitude } from './magnitude.js';
export { pinPeakCurrent } from './pinPeakCurrent.js';
export { timeConstants } from './timeConstants.js';
export { checkNumericalDomain, NUMERICAL_DOMAIN, OutsideDomainError } from './numericalDomain.js';
export { steadyWaveform } from './steadyWaveform.js';
export { stepWaveform } from './stepWaveform.js';
export { stepWaveformOnGrid } from './stepWaveformOnGrid.js';
export type { OperatingPoint, WorstRipple, DcTransfer, Settling, Waveform } from './types.js';
export { plausibilityWarnings, partValueWarnings, PLAUSIBLE, type Warning, type WarningFigures } from './plausibilityWarnings.js';
export { warningFigures } from './warningFigures.js';
export { chartSeries, CHART_COLUMNS } from './chartSeries.js';
export { compareOverlays } from './compareOverlays.js';
export { waveformRecords } from './waveformRecords.js';
export { settlingStepRecord } from './settlingStepRecord.js';
export { stepRecordDuration } from './stepRecordDuration.js';
export { steadyRecord } from './steadyRecord.js';
export { magnitudeResponse } from './magnitudeResponse.js';
export { dcErrorAcrossDuty } from './dcErrorAcrossDuty.js';
export type { ChartSeries, CompareOverlays, Overlay, StepRecord, SteadyRecord, MagnitudeSeries, DcErrorSeries, WaveformRecords } from './types.js';
export type { RobustCheck, RobustChecks, RobustVerdict, WorstCaseFigures, YieldFigures } from './robustVerdict.js';
export { analyzeProject, defaultBand, type Analysis, type AnalyzeOptions } from './analyze.js';
export { settlingSteps, type SettlingPlan } from './settlingSteps.js';
export { specChecks, type Check, type CheckInputs, type CheckName } from './checks.js';
// For the tolerance studies and the design search, which evaluate many ladders through the modal form directly.
export { averageOutput } from './averageOutput.js';
export { prepare, type Prepared } from './prepare.js';
export { modalLadder, type ModalLadder } from './modal/modalLadder.js';
export { modalLadderOf } from './modal/modalLadderOf.js';
export { averageOutput as modalAverageOutput } from './modal/averageOutput.js';
export { rippleAt } from './modal/rippleAt.js';
export { steadySwing, type SteadySwing } from './modal/steadySwing.js';
export { periodicState, type PeriodicState } from './modal/periodicState.js';
export { curveValue } from './modal/phaseCurve.js';
export { modalSettling } from './modal/settling.js';
export { settlingLowerBound } from './modal/settlingLowerBound.js';
export { MAX_MODAL_CONDITION } from './modalRoute.js';
// For the design search over version 1.1 circuits (design/network), which evaluates many
// networks, and for their tolerance studies: the general engine's parts and figures of one
// network, its code arithmetic and its domain check.
export { flow, type Flow } from './flow.js';
export { periodPowers, type PeriodPowers } from './periodPowers.js';
export { pinSchedule, type ScheduledPhase } from './periodic/pinSchedule.js';
export { periodStart, type PeriodPhase } from './periodic/periodStart.js';
export {
  networkPoint,
  networkRipple,
  networkAverage,
  networkWorstRipple,
  networkDcTransfer,
  networkSettling,
  networkPinPeakCurrent,
} from './periodic/networkFigures.js';
export type { ExtremumSearch } from './endpointFit.js';
export { codeParts, networkDuties, networkIdeal, quantizedFraction } from './periodic/networkCodes.js';
export { checkNetworkDomain } from './periodic/networkDomain.js';
export { circuitEngineOf, engineOfCircuit, networkCircuitEngine, type CircuitEngine } from './circuitEngine.js';
