import type { Ladder } from '../circuit/ladder.js';
import type { Network } from '../circuit/network.js';
import { sallenKeyFigures } from '../circuit/sallenKeyFigures.js';
import { ladderFromProject } from '../project/ladderFromProject.js';
import { networkFromProject } from '../project/networkFromProject.js';
import type { Project } from '../project/types.js';
import { capacitorWorkingVoltage } from './capacitorWorkingVoltage.js';
import { cutoff } from './cutoff.js';
import { dcTransfer } from './dcTransfer.js';
import { defaultSettling, slowerSettling } from './defaultSettling.js';
import { magnitude } from './magnitude.js';
import { checkNumericalDomain } from './numericalDomain.js';
import { pinPeakCurrent } from './pinPeakCurrent.js';
import type { WarningFigures } from './plausibilityWarnings.js';
import { settlingTime } from './settlingTime.js';
import { steadyState } from './steadyState.js';
import type { DcTransfer, OperatingPoint, Settling, WorstRipple } from './types.js';
import { warningFigures } from './warningFigures.js';
import { worstRipple } from './worstRipple.js';
import { networkDuties } from './periodic/networkCodes.js';
import { checkNetworkDomain } from './periodic/networkDomain.js';
import {
  networkDcTransfer,
  networkPinPeakCurrent,
  networkPoint,
  networkSettling,
  networkWorstRipple,
} from './periodic/networkFigures.js';
import { networkCutoff, networkMagnitude } from './periodic/networkResponse.js';
import { networkTimeConstants } from './periodic/networkTimeConstants.js';
import { periodicOrbit } from './periodic/periodicOrbit.js';

/**
 * The figures `analyzeProject` asks of a circuit, from whichever engine computes it: the
 * passive-ladder engine for one PWM output and RC stages, the general piecewise-linear engine
 * (src/engine/periodic) for a second output or an active stage. Duties are fractions of the used
 * code range (model.md 1.1).
 */
export interface CircuitEngine {
  readonly ladder: Ladder | null;
  readonly network: Network | null;
  point(duty: number): OperatingPoint;
  worstRipple(min: number, max: number): WorstRipple;
  dcTransfer(min: number, max: number): DcTransfer;
  settling(from: number, to: number, band: number): Settling;
  /** The slower of the full-range rising and falling steps. */
  defaultSettling(min: number, max: number, band: number): Settling;
  pinPeakCurrent(): number;
  cutoff(): number;
  /** Attenuation at the PWM frequency relative to DC, dB (positive). */
  attenuation(): number;
  /** Largest voltage a filter capacitor can see, V (an upper bound). */
  workingVoltage(): number;
  warningFigures(min: number, max: number): WarningFigures;
  activeStages(): Array<{ stage: number; f0: number; q: number }>;
}

/**
 * The engine for a project's circuit, after refusing circuits outside the numerical domain
 * (numericalDomain.ts, periodic/networkDomain.ts) with exit 2.
 *
 * Syntax: circuitEngineOf(project)
 * Example: circuitEngineOf(p).worstRipple(0.05, 0.95).ripple
 */
export function circuitEngineOf(project: Project): CircuitEngine {
  return project.network ? networkEngine(networkFromProject(project), project.file) : ladderEngine(ladderFromProject(project), project.file);
}

/**
 * The engine for a circuit given as such (a tolerance study's nominal `Ladder` or `Network`), with
 * the same domain checks as circuitEngineOf.
 *
 * Syntax: engineOfCircuit(circuit[, file])
 * Example: engineOfCircuit(networkFromProject(p), p.file).warningFigures(0.05, 0.95)
 */
export function engineOfCircuit(circuit: Ladder | Network, file?: string): CircuitEngine {
  return 'pin' in circuit ? networkEngine(circuit, file) : ladderEngine(circuit, file);
}

function ladderEngine(ladder: Ladder, file: string | undefined): CircuitEngine {
  checkNumericalDomain(ladder, file);
  return {
    ladder,
    network: null,
    point: (d) => steadyState(ladder, d),
    worstRipple: (min, max) => worstRipple(ladder, min, max),
    dcTransfer: (min, max) => dcTransfer(ladder, min, max),
    settling: (from, to, band) => settlingTime(ladder, from, to, band),
    defaultSettling: (min, max, band) => defaultSettling(ladder, min, max, band),
    pinPeakCurrent: () => pinPeakCurrent(ladder),
    cutoff: () => cutoff(ladder),
    attenuation: () => -20 * Math.log10(magnitude(ladder, 1 / ladder.period)),
    workingVoltage: () => capacitorWorkingVoltage(ladder),
    warningFigures: (min, max) => warningFigures(ladder, min, max),
    activeStages: () => [],
  };
}

/**
 * The engine for one network (src/engine/periodic), after refusing it outside the numerical domain
 * (periodic/networkDomain.ts): what circuitEngineOf gives a project with a second output or an
 * active stage, and what the design search evaluates its candidates with.
 *
 * Syntax: networkCircuitEngine(network[, file])
 * Example: networkCircuitEngine(networkFromProject(p), p.file).settling(0.1, 0.9, 1e-3).time
 */
export function networkCircuitEngine(network: Network, file?: string): CircuitEngine {
  return networkEngine(network, file);
}

function networkEngine(network: Network, file: string | undefined): CircuitEngine {
  checkNetworkDomain(network, file);
  const average = (f: number) => periodicOrbit(network, networkDuties(network, f), false).average;
  return {
    ladder: null,
    network,
    point: (d) => networkPoint(network, d),
    worstRipple: (min, max) => networkWorstRipple(network, min, max),
    dcTransfer: (min, max) => networkDcTransfer(network, min, max),
    settling: (from, to, band) => networkSettling(network, from, to, band),
    defaultSettling: (min, max, band) => slowerSettling(networkSettling(network, min, max, band), networkSettling(network, max, min, band)),
    pinPeakCurrent: () => networkPinPeakCurrent(network),
    cutoff: () => networkCutoff(network),
    attenuation: () => -20 * Math.log10(networkMagnitude(network, 1 / network.period) / networkMagnitude(network, 0)),
    workingVoltage: () => Math.max(capacitorWorkingVoltage(network.pin), network.second ? capacitorWorkingVoltage(network.second.pin) : 0),
    warningFigures: (min, max) => ({ timeConstants: networkTimeConstants(network), outputSpan: average(max) - average(min) }),
    activeStages: () => network.stages.flatMap((s, stage) => (s.kind === 'sallen-key' ? [{ stage, ...sallenKeyFigures(s) }] : [])),
  };
}
