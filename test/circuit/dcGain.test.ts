import { describe, expect, it } from 'vitest';
import { dcGain } from '../../src/circuit/dcGain.js';
import { ladder, relative, stage } from '../engine/ladders.js';

describe('dcGain (DC node voltages per volt of source)', () => {
  it('open output: every node at the source voltage', () => {
    // Source: no DC current flows through an open RC ladder (Ohm's law, common practice).
    expect(dcGain(ladder([stage(1, 1e-9), stage(1e7, 1e-3), stage(47e3, 1e-6)]), 250)).toEqual([1, 1, 1]);
  });

  it('loaded ladder: series divider R_L / (R_L + sum R) at each node', () => {
    // Source: Ohm's law; one current flows through driver, R1, R2 and R_L.
    const [rd, r1, r2, rl] = [25, 1e3, 10e3, 100e3];
    const g = dcGain(ladder([stage(r1, 1e-6), stage(r2, 1e-8)], { loadResistance: rl }), rd);
    const total = rd + r1 + r2 + rl;
    expect(relative(g[0], (r2 + rl) / total)).toBeLessThan(1e-15);
    expect(relative(g[1], rl / total)).toBeLessThan(1e-15);
  });

  it('a follower isolates the load from the sections before it; a buffered last stage ignores it', () => {
    // Source: an ideal unity-gain follower draws no input current (model.md).
    const g = dcGain(ladder([stage(1e3, 1e-6, true), stage(1e3, 1e-6)], { loadResistance: 1e3 }), 0);
    expect(g[0]).toBe(1);
    expect(g[1]).toBe(0.5);
    expect(dcGain(ladder([stage(1e3, 1e-6), stage(1e3, 1e-6, true)], { loadResistance: 1e3 }), 0)).toEqual([1, 1]);
  });
});
