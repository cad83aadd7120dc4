import { describe, expect, it } from 'vitest';
import { stateSpace } from '../../src/circuit/stateSpace.js';
import { ladder, stage } from '../engine/ladders.js';

// Reference: nodal analysis by hand (Kirchhoff's current law at each capacitor node), e.g.
// C1 v1' = (Vpin - v1)/(Rd + R1) - (v1 - v2)/R2, C2 v2' = (v1 - v2)/R2 - v2/RL.
describe('stateSpace (nodal equations of the ladder)', () => {
  it('one loaded stage: A = -(1/(Rd+R) + 1/RL)/(C+CL), b = V/((Rd+R)(C+CL))', () => {
    const l = ladder([stage(4.7e3, 100e-9)], {
      driverHigh: 40,
      driverLow: 25,
      loadResistance: 100e3,
      loadCapacitance: 47e-12,
    });
    const s = stateSpace(l);
    const c = 100e-9 + 47e-12;
    expect(s.high.A[0]).toBeCloseTo(-(1 / 4740 + 1 / 100e3) / c, 6);
    expect(s.low.A[0]).toBeCloseTo(-(1 / 4725 + 1 / 100e3) / c, 6);
    expect(s.high.b[0]).toBeCloseTo(3.3 / (4740 * c), 6);
    expect(s.low.b[0]).toBe(0);
    expect(s.mean.A[0]).toBeCloseTo(-(1 / 4732.5 + 1 / 100e3) / c, 6);
  });

  it('two coupled stages with a load', () => {
    const [r1, c1, r2, c2, rl, rd] = [1e3, 1e-6, 10e3, 100e-9, 1e6, 20];
    const s = stateSpace(ladder([stage(r1, c1), stage(r2, c2)], { driverHigh: rd, driverLow: rd, loadResistance: rl }));
    const expected = [
      -(1 / (r1 + rd) + 1 / r2) / c1,
      1 / (r2 * c1),
      1 / (r2 * c2),
      -(1 / r2 + 1 / rl) / c2,
    ];
    expected.forEach((v, i) => expect(s.high.A[i]).toBeCloseTo(v, 8));
    expect(s.sections).toEqual([{ first: 0, last: 1 }]);
  });

  it('a follower after stage 1 removes the loading of node 1; a buffered last stage ignores the load', () => {
    const [r1, c1, r2, c2] = [1e3, 1e-6, 10e3, 100e-9];
    const s = stateSpace(
      ladder([stage(r1, c1, true), stage(r2, c2, true)], { loadResistance: 1e3, loadCapacitance: 1e-6 }),
    );
    const expected = [-1 / (r1 * c1), 0, 1 / (r2 * c2), -1 / (r2 * c2)];
    expected.forEach((v, i) => expect(s.high.A[i]).toBeCloseTo(v, 8));
    expect(Array.from(s.capacitance)).toEqual([c1, c2]);
    expect(s.sections).toEqual([
      { first: 0, last: 0 },
      { first: 1, last: 1 },
    ]);
  });

  it('rejects ladders that are not physical', () => {
    expect(() => stateSpace(ladder([]))).toThrow(RangeError);
    expect(() => stateSpace(ladder([stage(0, 1e-9)]))).toThrow(RangeError);
    expect(() => stateSpace(ladder([stage(1e3, -1e-9)]))).toThrow(RangeError);
    expect(() => stateSpace(ladder([stage(1e3, 1e-9)], { driverLow: -1 }))).toThrow(RangeError);
    expect(() => stateSpace(ladder([stage(1e3, 1e-9)], { loadResistance: 0 }))).toThrow(RangeError);
  });
});
