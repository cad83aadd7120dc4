/**
 * One object of each shape the modal engine builds per call, created once at load with fractional
 * values. Why: V8 stores a number field as a small integer until a fraction arrives, then changes
 * the object layout for good and throws away every optimised function built on the old one; in the
 * design search's short runs (a fraction of a second) that cost more than the computing itself.
 * Creating these first makes every number field a double from the start. Property order must match
 * the literals in periodicState.ts, phaseCurve.ts, smallState.ts, steadySwing.ts, stepError.ts,
 * modalLadderOf.ts (checked by test/engine/modal/doubleFields.test.ts).
 */
const f = 0.5;
const curve = { offset: f, gain: [f], rate: [f], length: f };
/** The shapes, kept so that the objects are not collected before the literals run (harmless either way). */
export const DOUBLE_FIELD_SHAPES: readonly object[] = [
  curve,
  { max: f, tMax: f, min: f, tMin: f },
  { duty: f, t1: f, t2: f, start: [f], yStart: f, meanOffset: f, average: f, high: curve, low: curve },
  { t1: f, t2: f, yStart: f, meanOffset: f, average: f, yEnd: f, aHigh0: f, aHigh1: f, aLow0: f, aLow1: f, rh0: f, rh1: f, rl0: f, rl1: f },
  { ripple: f, average: f, yStart: f, above: f, below: f },
  { high: curve, low: curve, above: f, below: f },
  { n: f, period: f, high: f, low: f, symmetric: true, hi: { rate: [f], out: [f] }, lo: { rate: [f], out: [f] }, mix: [f], delta: [f], outLow: f, outHigh: f, condition: f },
];
