import { describe, expect, it } from 'vitest';
import { pinStateKey } from '../../../src/circuit/networkEquations.js';
import { pinSchedule } from '../../../src/engine/periodic/pinSchedule.js';
import { fine44, fine44Center } from './networks.js';
import { pinSchedule as referenceSchedule } from './odexNetwork.js';

describe('pinSchedule (engine) against the time-stepping reference schedule', () => {
  it('fine outputs, edge and center, on a duty grid with coinciding edges (0, 1, equal duties)', () => {
    // Reference: the independent schedule the ODE reference integrates (odexNetwork.ts), its
    // intervals merged where neighbours share the pin state.
    const grid = [0, 1 / 16, 0.25, 0.3, 0.5, 0.75, 15 / 16, 1];
    for (const net of [fine44, fine44Center]) {
      for (const first of grid) {
        for (const second of grid) {
          const got = pinSchedule(net, { first, second });
          const want: Array<{ key: string; duration: number }> = [];
          for (const i of referenceSchedule(net, { first, second })) {
            const key = pinStateKey(i.firstHigh, i.secondHigh);
            const prev = want[want.length - 1];
            if (prev && prev.key === key) prev.duration += i.t1 - i.t0;
            else want.push({ key, duration: i.t1 - i.t0 });
          }
          expect(got.map((p) => p.key)).toEqual(want.map((p) => p.key));
          got.forEach((p, k) => expect(p.duration).toBeCloseTo(want[k].duration, 18));
          for (let k = 1; k < got.length; k++) expect(got[k].key).not.toBe(got[k - 1].key);
        }
      }
    }
  });
});
