/** Invented demo projects for the tolerance tests (normalized form, SI units). */
import type { Project, ToleranceSettings } from '../../src/project/types.js';
import type { Stage } from '../../src/circuit/ladder.js';

export function project(stages: readonly Stage[], tolerance: Partial<ToleranceSettings>, extra: Partial<Project> = {}): Project {
  return {
    file: 'demo.yaml',
    pwm: {
      frequency: 20e3,
      prescaler: 1,
      alignment: 'edge',
      high: 3.3,
      low: 0,
      driver: { high: 0, low: 0 },
      duty: { min: 0.1, max: 0.9 },
    },
    load: { capacitance: 0 },
    filter: { stages: [...stages] },
    spec: {},
    tolerance: { resistor: 0.01, capacitor: 0.1, distribution: 'normal', samples: 1000, seed: 1, ...tolerance },
    ...extra,
  };
}
