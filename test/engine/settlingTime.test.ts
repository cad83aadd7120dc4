import { describe, expect, it } from 'vitest';
import { expm as mathjsExpm, lusolve, matrix } from 'mathjs';
import type { Ladder } from '../../src/circuit/ladder.js';
import { settlingTime } from '../../src/engine/settlingTime.js';
import { defaultSettling } from '../../src/engine/defaultSettling.js';
import { steadyState } from '../../src/engine/steadyState.js';
import { ladder, nodalRates, oneStageWithRatio, stage } from './ladders.js';

const T = 50e-6;
const RATIOS = [1e-2, 0.3, 10, 1e3, 1e5, 1e7, 1e9]; // tau / T

describe('settlingTime, exact references', () => {
  it('one stage, duty 0 <-> 1: t_s = tau ln(span / band) within T/1e4, tau/T from 1e-2 to 1e9', () => {
    // Source: first-order step response v = V (1 - e^(-t/tau)) (textbook RC charging); at duty 0
    // or 1 there is no ripple, so the output enters the band for good at tau ln(V / band).
    const band = 1e-3;
    for (const ratio of RATIOS) {
      const tau = ratio * T;
      const expected = tau * Math.log(3.3 / band);
      for (const [from, to] of [
        [0, 1],
        [1, 0],
      ]) {
        const got = settlingTime(oneStageWithRatio(ratio), from, to, band).time as number;
        expect(Math.abs(got - expected)).toBeLessThan(T / 1e4);
      }
    }
  });

  it('two stages, duty 0 <-> 1: matches the two-pole step response within T/1e4 over 11 decades', () => {
    // Source: the two-section ladder has H(s) = 1/(s^2 a + s b + 1) with a = R1C1R2C2,
    // b = R1C1 + R2C2 + R1C2 (network analysis textbooks); with poles -1/tau_1, -1/tau_2 its
    // step response is 1 - (tau_1 e^(-t/tau_1) - tau_2 e^(-t/tau_2)) / (tau_1 - tau_2), monotone,
    // so t_s is where the tail equals band / span; found here by bisection.
    const band = 1e-3;
    for (const ratio of RATIOS) {
      const [r1, c1, r2, c2] = [1e3, (ratio * T) / 1e3, 10e3, (ratio * T) / 30e3];
      const a = r1 * c1 * r2 * c2;
      const b = r1 * c1 + r2 * c2 + r1 * c2;
      const disc = Math.sqrt(b * b - 4 * a);
      const tau1 = (b + disc) / 2; // the time constants are the roots of tau^2 - b tau + a = 0
      const tau2 = a / tau1;
      const tail = (t: number) => (tau1 * Math.exp(-t / tau1) - tau2 * Math.exp(-t / tau2)) / (tau1 - tau2);
      let lo = 0;
      let hi = 60 * tau1;
      for (let i = 0; i < 200; i++) {
        const mid = (lo + hi) / 2;
        if (3.3 * tail(mid) > band) lo = mid;
        else hi = mid;
      }
      const l = ladder([stage(r1, c1), stage(r2, c2)], { period: T });
      for (const [from, to] of [
        [0, 1],
        [1, 0],
      ]) {
        const got = settlingTime(l, from, to, band).time as number;
        expect(Math.abs(got - lo)).toBeLessThan(T / 1e4);
      }
    }
  });

  it('two identical buffered stages (Jordan block): t_s from 1 - e^(-x)(1 + x), x = t/tau', () => {
    // Source: step response of two cascaded isolated first-order sections with equal tau
    // (convolution of two exponentials; textbook): tail e^(-x)(1 + x), solved by bisection.
    const band = 1e-3;
    for (const ratio of [0.2, 30, 1e6]) {
      const tau = ratio * T;
      let lo = 0;
      let hi = 60;
      for (let i = 0; i < 200; i++) {
        const mid = (lo + hi) / 2;
        if (3.3 * Math.exp(-mid) * (1 + mid) > band) lo = mid;
        else hi = mid;
      }
      const l = ladder([stage(1e3, tau / 1e3, true), stage(1e3, tau / 1e3, true)]);
      const got = settlingTime(l, 1, 0, band).time as number;
      expect(Math.abs(got - lo * tau)).toBeLessThan(T / 1e4);
    }
  });

  it('one stage with ripple lies between the envelope bounds', () => {
    // Derivation (one stage, equal drivers, so one time constant tau in both phases): after the
    // step the output is v_to(t) + e0 e^(-t/tau), v_to the periodic steady state at `to` and
    // e0 = v_from(0) - v_to(0) the difference of the rising-edge values (the minima of a one-stage
    // waveform). With S = largest |v_to - average_to|: (i) within every period v_to - average_to
    // takes values of both signs, so the output is outside the band while |e0| e^(-t/tau) > band,
    // up to one period: t_s >= tau ln(|e0| / band) - T; (ii) once |e0| e^(-t/tau) <= band - S it is
    // inside for good: t_s <= tau ln(|e0| / (band - S)). (Brief: "between tau ln(step/band) and
    // tau ln(step/(band - ripple/2))"; S replaces ripple/2 since the waveform is not symmetric.)
    const band = 1e-3;
    for (const ratio of [3e3, 1e5, 1e7]) {
      const tau = ratio * T;
      const l = oneStageWithRatio(ratio);
      for (const [from, to] of [
        [0.1, 0.9],
        [0.8, 0.25],
      ]) {
        const a = steadyState(l, from);
        const b = steadyState(l, to);
        expect(a.tMin).toBe(0);
        const e0 = Math.abs(a.min - b.min);
        const s = Math.max(b.max - b.average, b.average - b.min);
        const got = settlingTime(l, from, to, band).time as number;
        expect(got).toBeGreaterThanOrEqual(tau * Math.log(e0 / band) - T);
        expect(got).toBeLessThanOrEqual(tau * Math.log(e0 / (band - s)));
      }
    }
  });
});

/**
 * Brute force: sample the output every T/400 period after period, with one-sample maps from
 * mathjs expm (x -> x_p + e^{A_p h}(x - x_p), x_p = -A_p^{-1} b_p by mathjs lusolve, A and b read
 * off the independent nodal equations of ladders.ts). The start is the periodic steady state at
 * `from` (fixed point of the sampled one-period map); the settling time is bracketed by the last
 * sample outside the band and the sample after it.
 */
function bruteForce(l: Ladder, from: number, to: number, band: number) {
  const n = l.stages.length;
  const m = 400;
  const h = l.period / m;
  const phase = (pin: number, driver: number) => {
    const f = nodalRates(l, pin, driver);
    const b = f(new Array(n).fill(0));
    const cols = Array.from({ length: n }, (_, j) => f(Array.from({ length: n }, (_, i) => (i === j ? 1 : 0))).map((v, i) => v - b[i]));
    const a = Array.from({ length: n }, (_, i) => Array.from({ length: n }, (_, j) => cols[j][i]));
    const e = (mathjsExpm(matrix(a.map((row) => row.map((v) => v * h)))).toArray() as number[][]);
    const xp = (lusolve(a, b.map((v) => -v)) as number[][]).map((r) => r[0]);
    return (x: number[]) => x.map((_, i) => xp[i] + e[i].reduce((s, eij, j) => s + eij * (x[j] - xp[j]), 0));
  };
  const high = phase(l.high, l.driverHigh);
  const low = phase(l.low, l.driverLow);
  const period = (x: number[], d: number, visit?: (k: number, v: number) => void) => {
    const highSteps = Math.round(d * m);
    for (let k = 0; k < m; k++) {
      visit?.(k, x[n - 1]);
      x = k < highSteps ? high(x) : low(x);
    }
    return x;
  };
  // Periodic steady state: fixed point of the affine one-period map x -> M x + g, with M and g
  // measured by running the sampled period from 0 and from each unit vector (mathjs lusolve).
  const settle = (d: number) => {
    const g = period(new Array(n).fill(0), d);
    const cols = Array.from({ length: n }, (_, j) =>
      period(Array.from({ length: n }, (_, i) => (i === j ? 1 : 0)), d).map((v, i) => v - g[i]),
    );
    const iMinusM = Array.from({ length: n }, (_, i) => Array.from({ length: n }, (_, j) => (i === j ? 1 : 0) - cols[j][i]));
    return (lusolve(iMinusM, g) as number[][]).map((r) => r[0]);
  };
  const xTo = settle(to);
  // Trapezoid rule over one period: for a periodic signal it is the plain mean of the m samples.
  let sum = 0;
  period(xTo, to, (_k, v) => (sum += v));
  const average = sum / m;
  let x = settle(from);
  let lastOutside = -1;
  let sample = 0;
  for (let p = 0; p < 200000; p++) {
    x = period(x, to, (_k, v) => {
      if (Math.abs(v - average) > band) lastOutside = sample;
      sample++;
    });
    if (sample - lastOutside > 40 * m && p > 10) break;
  }
  return { after: lastOutside * h, before: (lastOutside + 1) * h };
}

describe('settlingTime against brute-force sampling', () => {
  const cases: Array<[string, Ladder, number, number, number]> = [
    ['two stages', ladder([stage(2.2e3, 47e-9), stage(22e3, 10e-9)]), 0.25, 0.75, 1e-2],
    [
      'asymmetric drivers, loaded',
      ladder([stage(1e3, 220e-9), stage(4.7e3, 47e-9)], { driverHigh: 60, driverLow: 20, loadResistance: 22e3 }),
      0.3,
      0.9,
      5e-3,
    ],
    ['one stage', oneStageWithRatio(8), 0.5, 0.125, 0.1],
  ];
  for (const [name, l, a, b, band] of cases) {
    it(`${name}: rising and falling within T/100`, () => {
      for (const [from, to] of [
        [a, b],
        [b, a],
      ]) {
        const got = settlingTime(l, from, to, band).time;
        expect(got).not.toBeNull();
        const ref = bruteForce(l, from, to, band);
        expect(Math.abs((got as number) - ref.before)).toBeLessThan(l.period / 100);
        expect(got as number).toBeGreaterThan(ref.after - 1e-12 * l.period);
      }
    });
  }
});

describe('settlingTime, special cases', () => {
  it('is null when the ripple at `to` alone leaves the band', () => {
    // Source: model.md definition (the output never stays within the band).
    const l = oneStageWithRatio(2);
    const ripple = steadyState(l, 0.5).ripple;
    expect(settlingTime(l, 0.1, 0.5, ripple / 4).time).toBeNull();
  });

  it('is 0 without a step, or when the step stays inside the band', () => {
    // Source: model.md definition (the output never leaves the band).
    const l = oneStageWithRatio(1e4);
    expect(settlingTime(l, 0.5, 0.5, 1e-3).time).toBe(0);
    expect(settlingTime(l, 0.5, 0.5001, 1e-3).time).toBe(0);
  });

  it('defaultSettling takes the slower of the rising and falling full-range steps', () => {
    // Source: model.md "default step". Unequal drivers make the two directions differ.
    const l = ladder([stage(1e3, 22e-6)], { driverHigh: 300, driverLow: 20 });
    const up = settlingTime(l, 0.05, 0.95, 1e-3).time as number;
    const down = settlingTime(l, 0.95, 0.05, 1e-3).time as number;
    expect(up).not.toBeCloseTo(down, 6);
    expect(defaultSettling(l, 0.05, 0.95, 1e-3).time).toBe(Math.max(up, down));
  });
});
