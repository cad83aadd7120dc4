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
