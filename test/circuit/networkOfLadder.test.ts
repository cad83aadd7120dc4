import { describe, expect, it } from 'vitest';
import type { Ladder } from '../../src/circuit/ladder.js';
import { networkOfLadder } from '../../src/circuit/networkOfLadder.js';

const ladder: Ladder = {
  period: 50e-6,
  high: 3.3,
  low: 0.2,
  driverHigh: 40,
  driverLow: 25,
  stages: [
    { r: 4700, c: 100e-9, buffered: true },
    { r: 47e3, c: 10e-9, buffered: false },
  ],
  loadResistance: null,
  loadCapacitance: 47e-12,
};

describe('networkOfLadder', () => {
  it('keeps every number of the ladder, RC stages in order, no second output', () => {
    expect(networkOfLadder(ladder)).toEqual({
      period: 50e-6,
      alignment: 'edge',
      pin: { high: 3.3, low: 0.2, driverHigh: 40, driverLow: 25 },
      stages: [
        { kind: 'rc', r: 4700, c: 100e-9, buffered: true },
        { kind: 'rc', r: 47e3, c: 10e-9, buffered: false },
      ],
      second: null,
      loadResistance: null,
      loadCapacitance: 47e-12,
    });
  });

  it('takes the alignment it is given', () => {
    expect(networkOfLadder({ ...ladder, loadResistance: 1e5 }, 'center')).toMatchObject({ alignment: 'center', loadResistance: 1e5 });
  });
});
