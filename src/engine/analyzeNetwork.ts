import type { Network } from '../circuit/network.js';
import { sallenKeyFigures } from '../circuit/sallenKeyFigures.js';
import type { Project } from '../project/types.js';
import type { Analysis } from './analysisTypes.js';
import { specChecks } from './checks.js';
import { plausibilityWarnings } from './plausibilityWarnings.js';
import { settlingSteps } from './settlingSteps.js';
import { CAPACITOR_DERATING, suggestedCapacitorRating } from './suggestedCapacitorRating.js';
import { checkNetworkDomain } from './periodic/networkDomain.js';
import {
  networkDcTransfer,
  networkDefaultSettling,
  networkPinPeakCurrent,
  networkPoint,
  networkSettling,
  networkWorstRipple,
} from './periodic/networkFigures.js';
import { networkCutoff, networkMagnitude } from './periodic/networkResponse.js';
import { networkTimeConstants } from './periodic/networkTimeConstants.js';
import { periodicOrbit } from './periodic/periodicOrbit.js';
import { networkDuties } from './periodic/networkCodes.js';

/**
 * `analyzeProject` for a circuit beyond the passive ladder (a second PWM output, Sallen-Key stages):
 * the same figures and checks, from the general piecewise-linear engine (src/engine/periodic).
 * Duties are fractions of the code range (model.md 1.1: with a fine output, code N = fraction
 * 2^(bits + fine bits)).
 *
 * Syntax: analyzeNetwork(project, network, fractions)
 * Example: analyzeNetwork(p, networkFromProject(p), [0.25, 0.5]).worstRipple.ripple
 */
export function analyzeNetwork(project: Project, network: Network, duties: readonly number[]): Analysis {
  checkNetworkDomain(network, project.file);
  const { min: dMin, max: dMax } = project.pwm.duty;
  const { band, steps, defaultStep } = settlingSteps(project);
  const settling = defaultStep ? networkDefaultSettling(network, dMin, dMax, band) : networkSettling(network, steps[0][0], steps[0][1], band);
  const worstRipple = networkWorstRipple(network, dMin, dMax);
  const dc = networkDcTransfer(network, dMin, dMax);
  const peak = networkPinPeakCurrent(network);
  const checks = specChecks(project, { worstRipple, dc, settling, pinPeakCurrent: peak });
  const timeConstants = networkTimeConstants(network);
  const average = (f: number) => periodicOrbit(network, networkDuties(network, f), false).average;
  const levels = [network.pin.high, network.pin.low, network.second?.pin.high ?? 0, network.second?.pin.low ?? 0];
  const working = Math.max(...levels.map(Math.abs));
  return {
    ladder: null,
    network,
    points: duties.map((d) => networkPoint(network, d)),
    worstRipple,
    dc,
    settling,
    cutoff: networkCutoff(network),
    attenuation: -20 * Math.log10(networkMagnitude(network, 1 / network.period) / networkMagnitude(network, 0)),
    pinPeakCurrent: peak,
    capacitorVoltage: { working, factor: CAPACITOR_DERATING, rating: suggestedCapacitorRating(working) },
    timeConstants,
    lsb: project.lsb ?? null,
    checks,
    pass: checks.every((c) => c.pass),
    warnings: plausibilityWarnings(project, { timeConstants, outputSpan: average(dMax) - average(dMin) }),
    activeStages: network.stages.flatMap((s, stage) => (s.kind === 'sallen-key' ? [{ stage, ...sallenKeyFigures(s) }] : [])),
  };
}
