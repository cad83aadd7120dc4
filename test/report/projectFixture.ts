/** Hand-built projects for report and analysis tests (invented values, SI units). */
import type { Project } from '../../src/project/types.js';

export interface OneStage {
  r?: number;
  c?: number;
  /** Symmetric driver resistance, ohm. */
  driver?: number;
  loadResistance?: number;
  frequency?: number;
  high?: number;
  low?: number;
  bits?: number;
  duty?: { min: number; max: number };
}

/**
 * A one-stage project: 3.3 V, 10 kHz, 1 kohm + 1 uF behind a 25 ohm driver, open output, 10 bits,
 * duty 5 %..95 %, no spec, unless overridden.
 */
export function oneStageProject(o: OneStage = {}): Project {
  const high = o.high ?? 3.3;
  const low = o.low ?? 0;
  const bits = 'bits' in o ? o.bits : 10;
  const driver = o.driver ?? 25;
  return {
    file: 'fixture.yaml',
    pwm: {
      frequency: o.frequency ?? 10e3,
      bits,
      prescaler: 1,
      alignment: 'edge',
      high,
      low,
      driver: { high: driver, low: driver },
      duty: o.duty ?? { min: 0.05, max: 0.95 },
    },
    load: { resistance: o.loadResistance, capacitance: 0 },
    filter: { stages: [{ r: o.r ?? 1e3, c: o.c ?? 1e-6, buffered: false }] },
    spec: {},
    lsb: bits === undefined ? undefined : (high - low) / 2 ** bits,
  };
}
