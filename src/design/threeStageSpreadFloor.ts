import { threeStageSpread } from './threeStageSpread.js';

/** Floors already computed, by their inputs (the explanation asks the same question many times). */
const memo = new Map<string, number>();
const MEMO_MAX = 256;

/**
 * The smallest pole-spread factor kappa_3 (threeStageSpread.ts) of any three-stage resistor choice
 * from `rValues` (ascending) with R1 >= r1Min and driver + R1 + R2 + R3 <= seriesMax: a floor that
 * holds for every admissible design of the space, for the proven bounds (infeasibilityBounds.ts).
 * Infinity when no choice is admissible.
 *
 * Method: every admissible triple is visited (ascending values, each loop cut where the series
 * resistance passes seriesMax, so the cost follows the admissible count), with a relative allowance
 * of 1e-6 on seriesMax so that no triple the search admits (it allows 1e-6 on every limit) is
 * missed. Results are remembered per input.
 *
 * Syntax: threeStageSpreadFloor(rValues, r1Min, driver, loadResistance, seriesMax)
 * Example: threeStageSpreadFloor([100, 220, 470], 100, 0, null, 1000)   // smallest over admissible triples
 */
export function threeStageSpreadFloor(rValues: readonly number[], r1Min: number, driver: number, loadResistance: number | null, seriesMax: number): number {
  const key = `${rValues.join(',')}|${r1Min}|${driver}|${loadResistance}|${seriesMax}`;
  const known = memo.get(key);
  if (known !== undefined) return known;
  const cap = seriesMax * (1 + 1e-6);
  const n = rValues.length;
  const r = [0, 0, 0];
  let floor = Infinity;
  for (let i = 0; i < n; i++) {
    if (rValues[i] < r1Min) continue;
    if (driver + rValues[i] + 2 * rValues[0] > cap) break;
    r[0] = rValues[i];
    for (let j = 0; j < n && driver + rValues[i] + rValues[j] + rValues[0] <= cap; j++) {
      r[1] = rValues[j];
      for (let k = 0; k < n && driver + rValues[i] + rValues[j] + rValues[k] <= cap; k++) {
        r[2] = rValues[k];
        const kappa = threeStageSpread(r, driver, loadResistance);
        if (kappa < floor) floor = kappa;
      }
    }
  }
  if (memo.size >= MEMO_MAX) memo.clear();
  memo.set(key, floor);
  return floor;
}
