import type { Ladder } from '../circuit/ladder.js';
import { rememberRecentLadders } from './recentLadders.js';
import { stateSpace } from '../circuit/stateSpace.js';
import { dcGain } from '../circuit/dcGain.js';
import type { Prepared } from './planTypes.js';

export { PLAN_CACHE_SIZE, type Prepared } from './planTypes.js';

/**
 * The duty-independent data of a ladder (state equations, DC states), cached for the few most
 * recently used ladder objects (recentLadders.ts: a ladder changed in place after its first use
 * keeps its old cache while it stays among the recent ones).
 *
 * Method: DC gain per volt g_p of the resistive chain (dcGain.ts); x_p = V_p g_p, the state where
 * A_p x + b_p = 0.
 * Delta = (V_h - V_l) g when both drivers are equal (no subtraction of nearly equal states),
 * else V_h g_h - V_l g_l.
 *
 * Syntax: prepare(ladder)
 * Example: prepare(ladder).xHigh  // node voltages if the pin stayed high forever
 */
export const prepare: (ladder: Ladder) => Prepared = rememberRecentLadders(prepareLadder);

function prepareLadder(ladder: Ladder): Prepared {
  const system = stateSpace(ladder);
  const { n } = system;
  const gHigh = dcGain(ladder, ladder.driverHigh);
  const gLow = ladder.driverHigh === ladder.driverLow ? gHigh : dcGain(ladder, ladder.driverLow);
  const span = ladder.high - ladder.low;
  const delta =
    ladder.driverHigh === ladder.driverLow
      ? gHigh.map((g) => g * span)
      : gHigh.map((g, i) => g * ladder.high - gLow[i] * ladder.low);
  const prepared: Prepared = {
    n,
    period: ladder.period,
    system,
    xHigh: gHigh.map((g) => g * ladder.high),
    xLow: gLow.map((g) => g * ladder.low),
    delta,
    balance: system.capacitance.map(Math.sqrt),
    cells: n === 1 ? 1 : n === 2 ? 8 : 32,
    plans: new Map(),
  };
  return prepared;
}
