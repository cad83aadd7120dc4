import { describe, expect, it } from 'vitest';
import type { Ladder, Stage } from '../../src/circuit/ladder.js';
import { cutoff, steadyState } from '../../src/engine/index.js';
import { ladder, stage } from '../engine/ladders.js';

// The engine remembers its work per ladder object (engine/recentLadders.ts), so Ladder is deeply
// readonly. The @ts-expect-error lines below are the check: `npm run typecheck` (tsc covers test/)
// fails with "Unused '@ts-expect-error' directive" as soon as one of these writes compiles again.

/** Never called: only the compiler reads it. */
function writesTheCompilerRefuses(l: Ladder, s: Stage): void {
  // @ts-expect-error a stage value cannot be changed in place
  l.stages[1].c = 1e-8;
  // @ts-expect-error nor can a stage be added
  l.stages.push(s);
  // @ts-expect-error nor the stage list replaced
  l.stages = [];
  // @ts-expect-error nor the PWM period
  l.period = 1e-4;
  // @ts-expect-error nor a field of a stage on its own
  s.buffered = true;
}

describe('Ladder is immutable', () => {
  it('a changed circuit is a new object, and the engine answers for it', () => {
    expect(typeof writesTheCompilerRefuses).toBe('function');
    const l = ladder([stage(1e3, 1e-7), stage(1e4, 1e-8)]);
    const ripple = steadyState(l, 0.5).ripple;
    const fc = cutoff(l);
    const changed: Ladder = { ...l, stages: l.stages.map((s, i) => (i === 1 ? { ...s, c: 1e-9 } : s)) };
    // a smaller second capacitor: more ripple and a higher cutoff (first-order RC intuition,
    // f = 1/(2 pi R C); common practice)
    expect(steadyState(changed, 0.5).ripple).toBeGreaterThan(ripple);
    expect(cutoff(changed)).toBeGreaterThan(fc);
  });

  it('why: an in-place write (possible only past the compiler) is answered from the cache', () => {
    const l = ladder([stage(1e3, 1e-7), stage(1e4, 1e-8)]);
    const ripple = steadyState(l, 0.5).ripple;
    const fc = cutoff(l);
    (l.stages[1] as { c: number }).c = 1e-9;
    // the old circuit's numbers: the hazard the readonly types close
    expect(steadyState(l, 0.5).ripple).toBe(ripple);
    expect(cutoff(l)).toBe(fc);
  });
});
