import type { Ladder } from '../circuit/ladder.js';
import type { Network } from '../circuit/network.js';
import { ladderFromProject } from '../project/ladderFromProject.js';
import { networkFromProject } from '../project/networkFromProject.js';
import type { Project } from '../project/types.js';
import { ladderAt, networkAt, type ToleranceParameter } from './parameters.js';

/**
 * What a tolerance study varies: a passive `Ladder` (computed by the ladder engine and its modal
 * form), or the general `Network` of a version 1.1 file (second PWM output, Sallen-Key stages;
 * computed by the general periodic engine). Both are plain data, so worker threads receive either.
 */
export type ToleranceCircuit = Ladder | Network;

/**
 * Whether a tolerance circuit is a `Network` (it has a `pin`; a `Ladder` keeps its levels itself).
 *
 * Syntax: isNetwork(circuit)
 * Example: isNetwork(networkFromProject(p))  // true
 */
export function isNetwork(circuit: ToleranceCircuit): circuit is Network {
  return 'pin' in circuit;
}

/**
 * The circuit a project's tolerance study varies: its `Network` when the file uses a version 1.1
 * element (project.network), else its `Ladder`.
 *
 * Syntax: toleranceCircuitOf(project)
 * Example: isNetwork(toleranceCircuitOf(loadProject('sample-configs/fine-16bit-setpoint.yaml')))  // true
 */
export function toleranceCircuitOf(project: Project): ToleranceCircuit {
  return project.network ? networkFromProject(project) : ladderFromProject(project);
}

/**
 * The circuit with each parameter at deviate z (ladderAt or networkAt, parameters.ts).
 *
 * Syntax: circuitAt(circuit, parameters, z[, offset])
 * Example: circuitAt(n, params, new Array(params.length).fill(-1))  // every part at its minimum
 */
export function circuitAt(circuit: ToleranceCircuit, parameters: ToleranceParameter[], z: ArrayLike<number>, offset = 0): ToleranceCircuit {
  return isNetwork(circuit) ? networkAt(circuit, parameters, z, offset) : ladderAt(circuit, parameters, z, offset);
}

/**
 * Period, levels and full scale of a circuit (the first output's), for rounding floors.
 *
 * Syntax: circuitScale(circuit)
 * Example: circuitScale(ladder).fullScale  // 3.3
 */
export function circuitScale(circuit: ToleranceCircuit): { period: number; low: number; high: number; fullScale: number } {
  const { high, low } = isNetwork(circuit) ? circuit.pin : circuit;
  return { period: circuit.period, low, high, fullScale: Math.abs(high - low) };
}
