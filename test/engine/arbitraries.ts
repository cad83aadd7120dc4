/** fast-check generators of valid ladders over many decades (invented, random circuits). */
import fc from 'fast-check';
import type { Ladder } from '../../src/circuit/ladder.js';

const logUniform = (lo: number, hi: number) =>
  fc.double({ min: Math.log10(lo), max: Math.log10(hi), noNaN: true }).map((e) => 10 ** e);

export const stageArb = fc.record({
  r: logUniform(1, 1e7),
  c: logUniform(1e-12, 1e-3),
  buffered: fc.boolean(),
});

export const ladderArb: fc.Arbitrary<Ladder> = fc.record({
  period: logUniform(1e-6, 1e-2),
  high: fc.constantFrom(3.3, 5, 1.8),
  low: fc.constantFrom(0, 0, 0.1),
  driverHigh: fc.double({ min: 0, max: 1000, noNaN: true }),
  driverLow: fc.double({ min: 0, max: 1000, noNaN: true }),
  stages: fc.array(stageArb, { minLength: 1, maxLength: 4 }),
  loadResistance: fc.option(logUniform(100, 1e8), { nil: null }),
  loadCapacitance: fc.oneof(fc.constant(0), logUniform(1e-12, 1e-6)),
});
