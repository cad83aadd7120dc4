import { describe, expect, it } from 'vitest';
import { cutoff } from '../../src/engine/cutoff.js';
import { magnitude } from '../../src/engine/magnitude.js';
import { timeConstants } from '../../src/engine/timeConstants.js';
import { pinPeakCurrent } from '../../src/engine/pinPeakCurrent.js';
import { ladder, relative, stage } from './ladders.js';

describe('cutoff and magnitude', () => {
  it('one stage: fc = 1/(2 pi R C), where the gain is 1/sqrt(2) (-3 dB)', () => {
    // Source: first-order RC low-pass, textbook circuit theory; -3 dB = gain 1/sqrt(2) (common
    // practice). The driver counts as series resistance, taken as the mean of high and low.
    for (const [r, c] of [
      [10e3, 100e-9],
      [1e3, 1e-12],
      [1e6, 10e-6],
    ]) {
      const l = ladder([stage(r, c)], { driverHigh: 40, driverLow: 20 });
      const fc = 1 / (2 * Math.PI * (r + 30) * c);
      expect(relative(cutoff(l), fc)).toBeLessThan(1e-12);
      expect(magnitude(l, fc)).toBeCloseTo(Math.SQRT1_2, 13);
    }
  });

  it('one stage rolls off at -20 dB/decade far above fc', () => {
    // Source: first-order low-pass asymptote, 20 dB per decade (common practice).
    const l = ladder([stage(10e3, 100e-9)]);
    const fc = cutoff(l);
    const drop = 20 * Math.log10(magnitude(l, 1e3 * fc) / magnitude(l, 1e4 * fc));
    expect(drop).toBeCloseTo(20, 5);
    expect(magnitude(l, 0)).toBe(1);
  });

  it('loaded stage: fc = 1/(2 pi C (R || R_L))', () => {
    // Source: Thevenin equivalent of source resistance and load (textbook circuit theory).
    const [r, c, rl] = [4.7e3, 220e-9, 10e3];
    const l = ladder([stage(r, c)], { loadResistance: rl });
    expect(relative(cutoff(l), 1 / (2 * Math.PI * c * ((r * rl) / (r + rl))))).toBeLessThan(1e-12);
  });

  it('two-section ladder: |H| = 1/sqrt(2) of H = 1/(s^2 R1C1R2C2 + s(R1C1 + R2C2 + R1C2) + 1)', () => {
    // Source: two-section RC ladder transfer function (network analysis textbooks). With
    // a = R1C1R2C2, b = R1C1 + R2C2 + R1C2, |H(jw)|^2 = 1/((1 - a w^2)^2 + b^2 w^2) = 1/2 gives
    // a^2 x^2 + (b^2 - 2a) x - 1 = 0 in x = w^2, positive root x = 2 / (B + sqrt(B^2 + 4 a^2)).
    for (const [r1, c1, r2, c2, rd] of [
      [1e3, 100e-9, 10e3, 10e-9, 25],
      [4.7e3, 1e-6, 4.7e3, 1e-6, 0],
      [100, 1e-9, 1e6, 1e-6, 50],
    ]) {
      const l = ladder([stage(r1, c1), stage(r2, c2)], { driverHigh: rd, driverLow: rd });
      const a = (r1 + rd) * c1 * r2 * c2;
      const b = (r1 + rd) * c1 + r2 * c2 + (r1 + rd) * c2;
      const B = b * b - 2 * a;
      const w = Math.sqrt(2 / (B + Math.sqrt(B * B + 4 * a * a)));
      expect(relative(cutoff(l), w / (2 * Math.PI))).toBeLessThan(1e-12);
      // and the magnitude itself at some frequency
      const f = 3 * w / (2 * Math.PI);
      const ww = 3 * w;
      const ref = 1 / Math.sqrt((1 - a * ww * ww) ** 2 + b * b * ww * ww);
      expect(relative(magnitude(l, f), ref)).toBeLessThan(1e-12);
    }
  });
});

describe('timeConstants', () => {
  it('one stage (R + driver) C; buffered stages are independent sections', () => {
    // Source: RC time constant (common practice); an ideal follower isolates sections.
    expect(timeConstants(ladder([stage(1e3, 1e-6)], { driverHigh: 10, driverLow: 30 }))[0]).toBeCloseTo(1.02e-3, 15);
    const t = timeConstants(ladder([stage(1e3, 1e-6, true), stage(10e3, 1e-6)], { loadResistance: 10e3 }));
    // slowest first: stage 2 with R2 || R_L = 5 kohm, then stage 1
    expect(relative(t[0], 5e3 * 1e-6)).toBeLessThan(1e-14);
    expect(relative(t[1], 1e3 * 1e-6)).toBeLessThan(1e-14);
  });

  it('two-section ladder: the roots of tau^2 - b tau + a = 0', () => {
    // Source: poles of H = 1/(a s^2 + b s + 1) are s = -1/tau (network analysis textbooks).
    const [r1, c1, r2, c2] = [1e3, 100e-9, 10e3, 10e-9];
    const a = r1 * c1 * r2 * c2;
    const b = r1 * c1 + r2 * c2 + r1 * c2;
    const tau1 = (b + Math.sqrt(b * b - 4 * a)) / 2;
    const t = timeConstants(ladder([stage(r1, c1), stage(r2, c2)]));
    expect(relative(t[0], tau1)).toBeLessThan(1e-13);
    expect(relative(t[1], a / tau1)).toBeLessThan(1e-12);
  });

  it('keeps relative accuracy when time constants span 12 decades', () => {
    // Source: for weakly coupled sections the poles approach the isolated R C products
    // (perturbation, common practice): stage 2 hardly loads stage 1 when R2 >> R1.
    const t = timeConstants(ladder([stage(1, 1e-9), stage(1e9, 1e-3)]));
    expect(relative(t[0], 1e9 * 1e-3 + 1 * 1e-3)).toBeLessThan(1e-8);
    expect(relative(t[1], 1e-9)).toBeLessThan(1e-8);
  });
});

describe('pinPeakCurrent', () => {
  it('(high - low) / (smaller driver + R1)', () => {
    // Source: Ohm's law at an edge with the first capacitor still at the other level (model.md).
    const l = ladder([stage(470, 1e-6), stage(4.7e3, 100e-9)], { driverHigh: 40, driverLow: 25 });
    expect(pinPeakCurrent(l)).toBeCloseTo(3.3 / 495, 15);
  });
});
