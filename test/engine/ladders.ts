/** Invented demo circuits for the engine tests and the bench (not taken from any product or data sheet). */
import type { Ladder, Stage } from '../../src/circuit/ladder.js';

export const stage = (r: number, c: number, buffered = false): Stage => ({ r, c, buffered });

/** A ladder with 3.3 V / 0 V levels, ideal drivers and an open output unless overridden. */
export function ladder(stages: Stage[], extra: Partial<Ladder> = {}): Ladder {
  return {
    period: 50e-6,
    high: 3.3,
    low: 0,
    driverHigh: 0,
    driverLow: 0,
    stages,
    loadResistance: null,
    loadCapacitance: 0,
    ...extra,
  };
}

/** One stage with time constant tau = ratio * period (R = 10 kohm, driver 0). */
export function oneStageWithRatio(ratio: number, extra: Partial<Ladder> = {}): Ladder {
  const period = extra.period ?? 50e-6;
  return ladder([stage(10e3, (ratio * period) / 10e3)], { period, ...extra });
}

/** Relative difference |a - b| / |b|. */
export const relative = (a: number, b: number): number => Math.abs(a - b) / Math.abs(b);

/**
 * Node-voltage rates dx/dt (V/s) of a ladder with the pin at `pin` behind `driver`, written from
 * Kirchhoff's current law at each capacitor node, independently of src/circuit/stateSpace.ts.
 */
export function nodalRates(l: Ladder, pin: number, driver: number) {
  const n = l.stages.length;
  const last = l.stages[n - 1];
  return (x: readonly number[]): number[] => {
    const dx = new Array<number>(n).fill(0);
    for (let k = 0; k < n; k++) {
      const source = k === 0 ? pin : x[k - 1];
      const rIn = l.stages[k].r + (k === 0 ? driver : 0);
      let current = (source - x[k]) / rIn;
      if (k < n - 1 && !l.stages[k].buffered) current -= (x[k] - x[k + 1]) / l.stages[k + 1].r;
      let cap = l.stages[k].c;
      if (k === n - 1 && !last.buffered) {
        if (l.loadResistance !== null) current -= x[k] / l.loadResistance;
        cap += l.loadCapacitance;
      }
      dx[k] = current / cap;
    }
    return dx;
  };
}
