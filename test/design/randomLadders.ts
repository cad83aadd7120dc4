import fc from 'fast-check';
import { designProblem, type DesignProblem } from '../../src/design/designProblem.js';
import { parseProject } from '../../src/project/index.js';
import type { Project } from '../../src/project/types.js';

/** Ranges of a random ladder (log10 of ohms and farads; driver resistances in ohms). */
export interface LadderRanges {
  logR: [number, number];
  logC: [number, number];
  /** Largest low-side driver resistance, ohm (the high side takes 5..150 ohm). */
  lowMax: number;
}

/**
 * The fields of a random invented ladder for fc.record: 1 to 3 stages, resistors and capacitors
 * log-uniform in `ranges`, unequal driver resistances, a 0 V or -3.3 V low level, a PWM frequency
 * of 1 to 300 kHz, a resistive load or none, a load capacitance or none. Shared by the property
 * tests of the search's floors (droop, INL, ripple), which hold each floor to the engine.
 */
export function ladderFields(ranges: LadderRanges) {
  return {
    n: fc.integer({ min: 1, max: 3 }),
    logR: fc.array(fc.double({ min: ranges.logR[0], max: ranges.logR[1], noNaN: true }), { minLength: 3, maxLength: 3 }),
    logC: fc.array(fc.double({ min: ranges.logC[0], max: ranges.logC[1], noNaN: true }), { minLength: 3, maxLength: 3 }),
    high: fc.double({ min: 5, max: 150, noNaN: true }),
    low: fc.double({ min: 0, max: ranges.lowMax, noNaN: true }),
    negative: fc.boolean(),
    logF: fc.double({ min: 3, max: 5.5, noNaN: true }),
    load: fc.option(fc.double({ min: 2.5, max: 6, noNaN: true })),
    logCL: fc.option(fc.double({ min: -11, max: -8, noNaN: true })),
  };
}

/** One drawn ladder (ladderFields); `equal` (when drawn) makes both driver resistances the high one. */
export interface DrawnLadder {
  n: number;
  logR: number[];
  logC: number[];
  high: number;
  low: number;
  negative: boolean;
  logF: number;
  load: number | null;
  logCL: number | null;
  equal?: boolean;
}

/** The YAML pieces of a drawn ladder for a test's project template: PWM frequency, drivers, low level, load. */
export function ladderYaml(x: DrawnLadder): { f: string; driver: string; low: string; load: string } {
  const loadC = x.logCL === null ? 0 : 10 ** x.logCL;
  return {
    f: `${10 ** x.logF} Hz`,
    driver: `{ high: ${x.high} ohm, low: ${x.equal ? x.high : x.low} ohm }`,
    low: x.negative ? '-3.3 V' : '0 V',
    load: x.load === null ? `{ capacitance: ${loadC} F }` : `{ resistance: ${10 ** x.load} ohm, capacitance: ${loadC} F }`,
  };
}

/** The drawn ladder's resistors and capacitors, ohm and F, pin side first. */
export function ladderParts(x: DrawnLadder): { r: number[]; c: number[] } {
  return { r: x.logR.slice(0, x.n).map((v) => 10 ** v), c: x.logC.slice(0, x.n).map((v) => 10 ** v) };
}

/**
 * The invented project the floor tests draw their ladders into: a PWM pin (20 kHz unless told,
 * 10 bits, 3.3 V) into a load, a 2 LSB ripple limit, E12 search space of 1 to 3 stages; `o`
 * overrides pieces of the YAML (ladderYaml gives a drawn ladder's), `settling` adds a settling spec.
 */
export function floorProject(o: { driver?: string; low?: string; load?: string; f?: string; settling?: string }): Project {
  return parseProject(
    `
pwm: { frequency: ${o.f ?? '20 kHz'}, bits: 10, high: 3.3 V, low: ${o.low ?? '0 V'}, driver: ${o.driver ?? '{ high: 120 ohm, low: 20 ohm }'}, duty: { min: 5 %, max: 95 % } }
load: ${o.load ?? '{ resistance: 100k }'}
spec:
  ripple: 2 LSB${o.settling ? `\n  settling: ${o.settling}` : ''}
search:
  stages: [1, 2, 3]
  series: E12
  resistance: { min: 100, max: 100k }
  capacitance: { min: 1n, max: 10u }
`,
    'invented.yaml',
  );
}

/**
 * A drawn ladder in a test's project template (default floorProject): its design problem and its
 * resistors and capacitors (ladderYaml, ladderParts).
 */
export function drawnProblem(
  x: DrawnLadder,
  template: (o: ReturnType<typeof ladderYaml>) => Project = floorProject,
): { p: DesignProblem; r: number[]; c: number[] } {
  return { p: designProblem(template(ladderYaml(x))), ...ladderParts(x) };
}
