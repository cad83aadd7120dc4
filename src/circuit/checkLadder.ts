import type { Ladder } from './ladder.js';

/**
 * Throw a RangeError naming the problem when a ladder is not physical: no stages, a resistance or
 * capacitance that is not finite and > 0, a negative or infinite driver resistance, a load
 * resistance <= 0, a negative load capacitance, a period that is not > 0, non-finite levels.
 *
 * Syntax: checkLadder(ladder)
 * Example: checkLadder({ ...ladder, stages: [] })  // throws RangeError: invalid ladder: at least one stage
 */
export function checkLadder(ladder: Ladder): void {
  const bad = (what: string) => {
    throw new RangeError(`invalid ladder: ${what}`);
  };
  if (!(ladder.period > 0) || !Number.isFinite(ladder.period)) bad('period must be > 0');
  if (!Number.isFinite(ladder.high) || !Number.isFinite(ladder.low)) bad('levels must be finite');
  if (!(ladder.driverHigh >= 0) || !(ladder.driverLow >= 0)) bad('driver resistance must be >= 0');
  if (!Number.isFinite(ladder.driverHigh) || !Number.isFinite(ladder.driverLow)) bad('driver must be finite');
  if (ladder.stages.length === 0) bad('at least one stage');
  for (const s of ladder.stages) {
    if (!(s.r > 0) || !(s.c > 0) || !Number.isFinite(s.r) || !Number.isFinite(s.c)) {
      bad('every stage needs finite r > 0 and c > 0');
    }
  }
  if (ladder.loadResistance !== null && !(ladder.loadResistance > 0)) bad('load resistance must be > 0');
  if (!(ladder.loadCapacitance >= 0) || !Number.isFinite(ladder.loadCapacitance)) {
    bad('load capacitance must be finite and >= 0');
  }
}
