/**
 * The circuits and projects `npm run bench` times. All are invented demo scenarios; the projects
 * are the bundled samples (sample-configs/), the ladders are made up here on the demo pin of the
 * engine tests (test/engine/ladders.ts).
 */
import { join } from 'node:path';
import type { Ladder } from '../src/circuit/ladder.js';
import { timeConstants } from '../src/engine/index.js';
import type { Project, SearchSettings, SeriesName } from '../src/project/types.js';
// The demo pin (20 kHz, 3.3 V, open output unless overridden), shared with the engine tests.
import { ladder, stage } from '../test/engine/ladders.js';

/** A deep copy, so that caches keyed on the ladder object cannot answer for it. */
export const freshLadder = (l: Ladder): Ladder => ({ ...l, stages: l.stages.map((s) => ({ ...s })) });

/** Ripple cases for the ODE comparison: slowest time constant a few tens of periods. */
export const odeCases: Array<{ name: string; ladder: Ladder; duty: number }> = [
  // 10 kohm, 150 nF: tau = 1.5 ms = 30 periods of 50 us.
  { name: '1 stage', ladder: ladder([stage(10e3, 150e-9)]), duty: 0.3 },
  // 3.3 kohm / 330 nF then 33 kohm / 33 nF, 25 ohm driver, 1 Mohm load: slowest tau about 29 periods.
  {
    name: '2 stages',
    ladder: ladder([stage(3.3e3, 330e-9), stage(33e3, 33e-9)], { driverHigh: 25, driverLow: 25, loadResistance: 1e6 }),
    duty: 0.3,
  },
];

/**
 * A ladder whose slowest time constant is `periods` PWM periods: one stage (10 kohm), or two
 * stages with R2 = 10 R1 and C2 = C1 / 10 and a 100 kohm load; capacitors scaled to fit (every
 * time constant scales with a common factor on all capacitors).
 *
 * Syntax: ladderWithSlowestTau(stages, periods)
 * Example: timeConstants(ladderWithSlowestTau(2, 1e3))[0] / 50e-6   // 1000
 */
export function ladderWithSlowestTau(stages: 1 | 2, periods: number): Ladder {
  const shape =
    stages === 1
      ? ladder([stage(10e3, 1e-9)], { driverHigh: 30, driverLow: 30 })
      : ladder([stage(1e3, 10e-9), stage(10e3, 1e-9)], { driverHigh: 30, driverLow: 30, loadResistance: 100e3 });
  const scale = (periods * shape.period) / timeConstants(shape)[0];
  return { ...shape, stages: shape.stages.map((s) => ({ ...s, c: s.c * scale })) };
}

/** Sample projects: a one-stage and a two-stage filter. */
export const sampleProjects = {
  oneStage: join('sample-configs', 'sensor-bias-trim.yaml'),
  twoStage: join('sample-configs', 'greenhouse-heater.yaml'),
} as const;

/** Wide design space of the search bench: 100 ohm..1 Mohm, 100 pF..100 uF. */
export function wideSearch(project: Project, stages: 1 | 2, name: SeriesName): Project {
  const series = { resistor: name, capacitor: name };
  const base: SearchSettings = project.search ?? { stages: [stages], series, margin: 0, buffered: [false], resistance: { min: 0, max: 0 }, capacitance: { min: 0, max: 0 } };
  return {
    ...project,
    search: { ...base, stages: [stages], series, resistance: { min: 100, max: 1e6 }, capacitance: { min: 100e-12, max: 100e-6 }, bits: undefined },
  };
}
