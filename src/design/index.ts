/** Filter design: standard-value recommendations for a project (`dacsmith design`). */
export { designSearch } from './designSearch.js';
export { designProblem, type DesignProblem } from './designProblem.js';
export { projectAtResolution } from './projectAtResolution.js';
export { exactCandidate } from './exactCandidate.js';
export { rankCandidates, SETTLING_TIE } from './rankCandidates.js';
export { tradeoffCurves, type TradeoffCurve, type TradeoffPoint } from './tradeoffCurves.js';
export { explainInfeasible } from './explainInfeasible.js';
export { DesignInputError } from './designInputError.js';
export type * from './types.js';
export { infeasibilityBounds, type ProvenMiss, type SpaceBounds } from './infeasibilityBounds.js';
export { nearestFixes, type NearestFix, type FixKind } from './nearestFix.js';
export { boundedSearch, type SearchBudget } from './boundedSearch.js';
export { networkDesignSearch } from './network/networkDesignSearch.js';
export { networkTradeoffCurves } from './network/networkTradeoffCurves.js';
