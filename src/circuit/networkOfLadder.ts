import type { Ladder } from './ladder.js';
import type { Network } from './network.js';

/**
 * The `Network` of a `Ladder`: the same PWM pin, RC stages (each `{ kind: 'rc', r, c, buffered }`)
 * and load, no second PWM output. A ladder has no alignment of its own (its steady-state ripple
 * does not depend on it, model.md "Circuit model"), so it is given, edge by default.
 *
 * Syntax: networkOfLadder(ladder[, alignment])
 * Example: networkOfLadder(ladder).stages[0]   // { kind: 'rc', r: 4700, c: 1e-7, buffered: false }
 */
export function networkOfLadder(ladder: Ladder, alignment: Network['alignment'] = 'edge'): Network {
  return {
    period: ladder.period,
    alignment,
    pin: { high: ladder.high, low: ladder.low, driverHigh: ladder.driverHigh, driverLow: ladder.driverLow },
    stages: ladder.stages.map((s) => ({ kind: 'rc', r: s.r, c: s.c, buffered: s.buffered })),
    second: null,
    loadResistance: ladder.loadResistance,
    loadCapacitance: ladder.loadCapacitance,
  };
}
