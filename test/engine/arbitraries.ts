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

/**
 * A number spread uniformly over [0, 1]. (fc.double spreads over the floating-point numbers, so
 * most of its draws sit near 0; an exponent range that contains 0 then mostly gives 10^0 = 1.)
 */
export const unitInterval = fc.integer({ min: 0, max: 2 ** 30 }).map((k) => k / 2 ** 30);
const uniform = (lo: number, hi: number) => unitInterval.map((u) => lo + u * (hi - lo));
const logSpread = (lo: number, hi: number) => uniform(Math.log10(lo), Math.log10(hi)).map((e) => 10 ** e);

/**
 * Ladders of 2 to 4 stages with every stage's own time constant R C spread log-uniformly from
 * tauMin to tauMax periods (by default 1e-2 to 1e9, the range the engine is held to), followers
 * anywhere, drivers 0 .. 1 kohm, open or loaded (1 kohm .. 100 Mohm, 0 or 1 pF .. 1 uF).
 */
export function filterLadders(tauMin = 1e-2, tauMax = 1e9): fc.Arbitrary<Ladder> {
  return fc
    .record({
      period: logSpread(1e-6, 1e-2),
      high: fc.constantFrom(3.3, 5, 1.8),
      low: fc.constantFrom(0, 0, 0.1),
      driverHigh: uniform(0, 1000),
      driverLow: fc.oneof(uniform(0, 1000), fc.constant(-1)),
      stages: fc.array(fc.record({ tau: logSpread(tauMin, tauMax), r: logSpread(10, 1e6), buffered: fc.boolean() }), {
        minLength: 2,
        maxLength: 4,
      }),
      loadResistance: fc.option(logSpread(1e3, 1e8), { nil: null }),
      loadCapacitance: fc.oneof(fc.constant(0), logSpread(1e-12, 1e-6)),
    })
    .map(({ stages, driverLow, ...rest }) => ({
      ...rest,
      // -1 stands for "equal to the high driver", a common case with its own code path
      driverLow: driverLow < 0 ? rest.driverHigh : driverLow,
      stages: stages.map((s) => ({ r: s.r, c: (s.tau * rest.period) / s.r, buffered: s.buffered })),
    }));
}

export const filterLadderArb = filterLadders();
