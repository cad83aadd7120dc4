import type { Ladder } from './ladder.js';

/**
 * DC node voltages per volt of pin source with the given driver resistance (capacitors open).
 *
 * Method: Ohm's law on the resistive chain. In a follower-free section fed from v_in (the pin, or
 * the previous section's last node through its follower) no current flows unless the section ends
 * at the load, so every node sits at v_in; with the load R_L at the section's end the chain is a
 * plain divider, v_k = v_in (R_L + sum of R after node k) / (R_L + sum of all R of the section,
 * driver included). Sums of positive terms only: the result keeps full relative precision even
 * when the resistances differ by many decades (an LU solve of A g = -b loses digits there, since
 * the diagonal of A sums conductances of very different size).
 *
 * Syntax: dcGain(ladder, driver)
 * Example: dcGain({ ...ladder, loadResistance: 9e3, stages: [{ r: 1e3, c: 1e-6, buffered: false }] }, 0)  // [0.9]
 */
export function dcGain(ladder: Ladder, driver: number): number[] {
  const { stages } = ladder;
  const n = stages.length;
  const gain: number[] = new Array<number>(n).fill(1);
  let vIn = 1;
  let first = 0;
  for (let k = 0; k < n; k++) {
    if (!(stages[k].buffered || k === n - 1)) continue;
    const last = k;
    const loaded = last === n - 1 && !stages[last].buffered && ladder.loadResistance !== null;
    if (loaded) {
      dividerGain(stages.map((s) => s.r), first, last, ladder.loadResistance as number, first === 0 ? driver : 0, vIn, gain);
    } else {
      for (let j = first; j <= last; j++) gain[j] = vIn;
    }
    vIn = gain[last];
    first = last + 1;
  }
  return gain;
}

/**
 * DC node voltages of a follower-free chain of resistors r[first..last] (each into a capacitor
 * node) fed from vIn through a further series resistance `source` (the driver, or 0) into a load
 * R_L at node `last`, written into gain[first..last]: the plain divider
 * v_k = vIn (R_L + sum of r after node k) / (R_L + source + sum of r[first..last]), from sums of
 * positive terms only (see dcGain). Shared by dcGain and the engine's modal form of plain arrays
 * (engine/modal/modalLadderOf.ts), so both give the same digits.
 *
 * Syntax: dividerGain(r, first, last, loadResistance, source, vIn, gain)
 * Example: dividerGain([1e3], 0, 0, 9e3, 0, 1, g)  // g[0] = 0.9
 */
export function dividerGain(
  r: ArrayLike<number>,
  first: number,
  last: number,
  loadResistance: number,
  source: number,
  vIn: number,
  gain: number[],
): void {
  let total = loadResistance + source;
  for (let j = first; j <= last; j++) total += r[j];
  let after = loadResistance;
  for (let j = last; j >= first; j--) {
    gain[j] = (vIn * after) / total;
    after += r[j];
  }
}
