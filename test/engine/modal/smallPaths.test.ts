import { describe, expect, it } from 'vitest';
import { modalLadderOf } from '../../../src/engine/modal/modalLadderOf.js';
import { periodicState } from '../../../src/engine/modal/periodicState.js';
import { curveValue, type PhaseCurve } from '../../../src/engine/modal/phaseCurve.js';
import { rippleAt } from '../../../src/engine/modal/rippleAt.js';
import { settlingLowerBound } from '../../../src/engine/modal/settlingLowerBound.js';
import { steadySwing } from '../../../src/engine/modal/steadySwing.js';
import { curveLastExit, reusedStepError, steadyError, stepError } from '../../../src/engine/modal/stepError.js';
import { ladder } from '../ladders.js';

/**
 * The allocation-free one- and two-stage paths of the modal engine (results written into earlier
 * objects, scratch kept by a module, the ripple without the time average) against the paths that
 * build new objects. Internal consistency, not physics: the physics of these functions is held to
 * independent references in the other files of this folder.
 */

/** A small deterministic generator (common practice: a linear congruential generator, Numerical Recipes' constants). */
function lcg(seed: number): () => number {
  let x = seed >>> 0;
  return () => {
    x = (Math.imul(x, 1664525) + 1013904223) >>> 0;
    return x / 2 ** 32;
  };
}

const rel = (a: number, b: number) => (a === b ? 0 : Math.abs(a - b) / Math.max(Math.abs(a), Math.abs(b)));

/** Random follower-free ladders of one and two stages (decades of R, C and frequency; unequal drivers, loads). */
function randomModels(count: number, seed: number) {
  const random = lcg(seed);
  const decade = (lo: number, hi: number) => lo * (hi / lo) ** random();
  return Array.from({ length: count }, (_, trial) => {
    const stages = 1 + (trial % 2);
    const circuit = ladder([], {
      driverHigh: trial % 3 === 0 ? decade(5, 80) : 25,
      driverLow: 25,
      loadResistance: trial % 5 !== 0 ? decade(1e3, 1e7) : null,
      period: 1 / decade(100, 1e6),
    });
    const r = Array.from({ length: stages }, () => decade(100, 1e6));
    const c = Array.from({ length: stages }, () => decade(1e-10, 1e-5));
    return { m: modalLadderOf(circuit, r, c), from: random(), to: random() };
  });
}

describe('one- and two-stage paths that write into earlier objects', () => {
  const models = randomModels(120, 7);

  it('rippleAt (no time average) equals the ripple of steadySwing', () => {
    for (const { m, from, to } of models) {
      for (const d of [from, to, 0.5]) expect(rel(rippleAt(m, d), steadySwing(m, d).ripple)).toBeLessThanOrEqual(1e-13);
    }
  });

  it('periodicState and steadySwing written into an earlier result equal new ones', () => {
    let state = periodicState(models[0].m, 0.5);
    let swing = steadySwing(models[0].m, 0.5);
    for (const { m, to } of models) {
      const before = state;
      state = periodicState(m, to, state);
      if (before.start.length === m.n) expect(state).toBe(before); // reused when the order fits
      expect(state).toEqual(periodicState(m, to));
      swing = steadySwing(m, to, undefined, swing);
      expect(swing).toEqual(steadySwing(m, to));
    }
  });

  it('reusedStepError gives the figures and period errors of stepError', () => {
    for (const { m, from, to } of models) {
      const target = periodicState(m, to);
      const source = periodicState(m, from);
      const fresh = stepError(m, target, source, steadyError(target));
      const reused = reusedStepError(m, target, source, steadyError(target, steadyError(source)));
      if (fresh === null) {
        expect(reused).toBeNull();
        continue;
      }
      expect(reused).not.toBeNull();
      expect([...reused!.zeta]).toEqual([...fresh.zeta]);
      expect([...reused!.logMu]).toEqual([...fresh.logMu]);
      expect([...reused!.bound]).toEqual([...fresh.bound]);
      expect([...reused!.lead]).toEqual([...fresh.lead]);
      const band = 0.25 * Math.abs(target.average - source.average) + 1e-6;
      for (const k of [0, 1, 3, 40]) {
        fresh.setPeriod(k);
        reused!.setPeriod(k);
        expect(reused!.leaves(band, 0)).toBe(fresh.leaves(band, 0));
        expect(reused!.lastExit(k, band)).toBe(fresh.lastExit(k, band));
      }
    }
  });

  it('settlingLowerBound is the same called again after other ladders (its scratch is refilled)', () => {
    const band = (m: (typeof models)[number]) => 0.01 * Math.abs(m.m.high - m.m.low) + steadySwing(m.m, m.to).ripple;
    const first = models.map((x) => settlingLowerBound(x.m, x.from, x.to, band(x)));
    const again = [...models].reverse().map((x) => settlingLowerBound(x.m, x.from, x.to, band(x))).reverse();
    expect(again).toEqual(first);
  });
});

describe('curveLastExit of one and two terms', () => {
  // Definition (model.md, settling): after the returned time the curve stays within the band, and
  // the time is a crossing of the band or the phase end; checked on a dense sample.
  const random = lcg(11);
  for (let trial = 0; trial < 60; trial++) {
    const terms = 1 + (trial % 2);
    const rate = Array.from({ length: terms }, (_, i) => -(10 ** (random() * 3)) * (i + 1));
    const gain = Array.from({ length: terms }, () => 2 * random() - 1);
    const curve: PhaseCurve = { offset: 2 * random() - 1, gain, rate, length: 2 * random() + 0.1 };
    const band = 0.05 + 0.5 * random();
    it(`trial ${trial}: ${terms} term(s)`, () => {
      const t = curveLastExit(curve, band, curve.length);
      const samples = 4000;
      const after = (s: number) => Math.abs(curveValue(curve, s)) <= band * (1 + 1e-9);
      for (let i = 0; i <= samples; i++) {
        const s = (curve.length * i) / samples;
        if (s > t + 1e-9 * curve.length) expect(after(s)).toBe(true);
      }
      if (t >= 0) {
        const v = Math.abs(curveValue(curve, t));
        if (t < curve.length) expect(Math.abs(v - band)).toBeLessThan(1e-9);
        else expect(v).toBeGreaterThan(band);
      }
    });
  }
});
