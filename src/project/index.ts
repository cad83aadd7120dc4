/** The project file: loading, validation and normalization to SI (model.md, version 1). */
export { loadProject } from './loadProject.js';
export { parseProject } from './parseProject.js';
export { ProjectError, formatIssue, type ProjectIssue } from './projectError.js';
export { derivePwmFrequency } from './derivePwmFrequency.js';
export { lsbOf } from './lsbOf.js';
export { requireFilter } from './requireFilter.js';
export { requireLadder } from './requireLadder.js';
export { networkFromProject } from './networkFromProject.js';
export { parseSpecLevel, type SpecLevel } from './parseSpecLevel.js';
export type * from './types.js';
export { positionOfKey } from './positionOfKey.js';
export { SPEC_LIMITS, specLimit, type CheckName } from './specLimits.js';
export { keyPositions, type KeyPosition } from './keyPositions.js';
