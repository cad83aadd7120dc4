import { describe, expect, it } from 'vitest';
import { analyzeProject, dutyGrid } from '../../src/engine/analyze.js';
import type { Project } from '../../src/project/types.js';
import { oneStageProject } from '../report/projectFixture.js';

/**
 * Peak-to-peak ripple of one RC stage driven by a rectangular wave of amplitude `v`, period `t`,
 * duty `d`, time constant `tau`, in periodic steady state:
 *   v (1 - e^(-dT/tau)) (1 - e^(-(1-d)T/tau)) / (1 - e^(-T/tau))
 * (textbook first-order charge/discharge in steady state; common practice).
 */
function rippleOneStage(v: number, t: number, d: number, tau: number): number {
  const a = Math.exp(-t / tau);
  return (v * (1 - a ** d) * (1 - a ** (1 - d))) / (1 - a);
}

/**
 * Thevenin view of a loaded stage (voltage divider and parallel resistance, textbook circuit
 * theory): the pin behind `rs` = driver + R, load `rl` to ground.
 */
function thevenin(rs: number, rl: number | undefined): { k: number; rth: number } {
  return rl === undefined ? { k: 1, rth: rs } : { k: rl / (rl + rs), rth: (rs * rl) / (rs + rl) };
}

const withSpec = (p: Project, spec: Project['spec'], pinCurrent?: number): Project => ({
  ...p,
  spec,
  ...(pinCurrent !== undefined
    ? {
        search: {
          stages: [1],
          series: { resistor: 'E12', capacitor: 'E12' }, margin: 0, buffered: [false],
          resistance: { min: 1e3, max: 1e6 },
          capacitance: { min: 1e-9, max: 1e-5 },
          pinCurrent,
        },
      }
    : {}),
});

describe('analyzeProject against one-stage closed forms', () => {
  const cases = [
    { name: 'open output', p: oneStageProject({ r: 1e3, c: 1e-6, driver: 25 }) },
    { name: '10 kohm load', p: oneStageProject({ r: 2.2e3, c: 470e-9, driver: 40, loadResistance: 10e3 }) },
  ];
  for (const { name, p } of cases) {
    const { k, rth } = thevenin(p.filter.stages[0].r + p.pwm.driver.high, p.load.resistance);
    const tau = rth * p.filter.stages[0].c;
    const T = 1 / p.pwm.frequency;
    const v = p.pwm.high - p.pwm.low;
    const a = analyzeProject(p, { duties: [0.1, 0.3, 0.5, 0.8] });

    it(`${name}: ripple at each duty matches the closed form`, () => {
      for (const pt of a.points) {
        expect(pt.ripple).toBeCloseTo(k * rippleOneStage(v, T, pt.duty, tau), 9);
      }
    });
    it(`${name}: average is the divided ideal output (DC voltage divider)`, () => {
      for (const pt of a.points) expect(pt.average).toBeCloseTo(k * (p.pwm.low + pt.duty * v), 9);
    });
    it(`${name}: worst ripple sits at 50 % duty, where the closed form peaks (it is symmetric in d)`, () => {
      expect(a.worstRipple.duty).toBeCloseTo(0.5, 3);
      expect(a.worstRipple.ripple).toBeCloseTo(k * rippleOneStage(v, T, 0.5, tau), 9);
    });
    it(`${name}: droop is the divider loss at the top of the range`, () => {
      // DC error = ideal - k ideal = (1 - k) D v, largest at duty.max (0 when the output is open).
      expect(Math.abs(a.dc.droop.error)).toBeCloseTo((1 - k) * p.pwm.duty.max * v, 9);
    });
    it(`${name}: cutoff and attenuation follow the single pole 1/(2 pi tau) (textbook RC low-pass)`, () => {
      const fc = 1 / (2 * Math.PI * tau);
      expect(a.cutoff / fc).toBeCloseTo(1, 6);
      // attenuation in positive dB (README "Sign convention"): 10 log10(1 + (f/fc)^2)
      const expected = 10 * Math.log10(1 + (p.pwm.frequency / fc) ** 2);
      expect(a.attenuation).toBeCloseTo(expected, 4);
      expect(a.attenuation).toBeGreaterThan(0);
    });
    it(`${name}: pin peak current is (high - low) / (driver + R1) (design notes definition)`, () => {
      expect(a.pinPeakCurrent).toBeCloseTo(v / (p.pwm.driver.high + p.filter.stages[0].r), 12);
    });
    it(`${name}: one time constant, tau = R_thevenin C`, () => {
      expect(a.timeConstants).toHaveLength(1);
      expect(a.timeConstants[0] / tau).toBeCloseTo(1, 9);
    });
  }

  it('settling lies within the first-order bounds tau ln(step / (band +- ripple/2))', () => {
    // Textbook first-order step: |v - v_final| = step e^(-t/tau); the ripple moves the instant the
    // output stays inside the band by at most half a ripple either way.
    const p = oneStageProject({ r: 1e3, c: 1e-6, driver: 0, frequency: 100e3 });
    const tau = 1e-3;
    const band = 0.05;
    const spec = { settling: { band, time: 10e-3, from: 0.1, to: 0.9 } };
    const a = analyzeProject(withSpec(p, spec));
    const step = 0.8 * 3.3;
    const half = rippleOneStage(3.3, 1e-5, 0.9, tau) / 2;
    expect(a.settling.time).not.toBeNull();
    expect(a.settling.time!).toBeGreaterThan(tau * Math.log(step / (band + half)) - 1e-5);
    expect(a.settling.time!).toBeLessThan(tau * Math.log(step / (band - half)) + 1e-5);
    expect(a.checks).toEqual([{ name: 'settling', value: a.settling.time, limit: 10e-3, unit: 's', pass: true }]);
    expect(a.pass).toBe(true);
  });
});

describe('analyzeProject checks', () => {
  const base = oneStageProject({ r: 1e3, c: 1e-6, driver: 25, loadResistance: 100e3 });
  const plain = analyzeProject(base);
  const ripple = plain.worstRipple.ripple;
  const droop = Math.abs(plain.dc.droop.error);

  it('passes when every value is within its limit', () => {
    const a = analyzeProject(withSpec(base, { ripple: 1.01 * ripple, droop: 1.01 * droop, inl: 1e-6 }, 10e-3));
    expect(a.checks.map((c) => [c.name, c.pass])).toEqual([
      ['ripple', true],
      ['droop', true],
      ['inl', true],
      ['pin_current', true],
    ]);
    expect(a.pass).toBe(true);
  });

  it('fails the ripple, droop and pin current checks when their limits are just below the values', () => {
    const a = analyzeProject(withSpec(base, { ripple: 0.99 * ripple, droop: 0.99 * droop }, 1e-3));
    expect(a.checks.find((c) => c.name === 'ripple')).toMatchObject({ pass: false, value: ripple, limit: 0.99 * ripple, unit: 'V' });
    expect(a.checks.find((c) => c.name === 'droop')).toMatchObject({ pass: false, value: droop });
    // 3.3 V / (25 + 1000) ohm = 3.22 mA > 1 mA
    expect(a.checks.find((c) => c.name === 'pin_current')).toMatchObject({ pass: false, unit: 'A' });
    expect(a.pass).toBe(false);
  });

  it('fails settling with value null when the ripple exceeds the band (never settles)', () => {
    // Ripple at 90 % duty is about 30 mV here; a 1 mV band cannot hold it.
    const a = analyzeProject(withSpec(base, { settling: { band: 1e-3, time: 1, from: 0.1, to: 0.9 } }));
    expect(a.settling.time).toBeNull();
    expect(a.checks).toEqual([{ name: 'settling', value: null, limit: 1, unit: 's', pass: false }]);
    expect(a.pass).toBe(false);
  });

  it('has no checks and passes when the spec is empty', () => {
    expect(plain.checks).toEqual([]);
    expect(plain.pass).toBe(true);
  });
});

describe('analyzeProject defaults', () => {
  it('evaluates 11 duties over the used range unless told otherwise', () => {
    const p = oneStageProject({ duty: { min: 0.1, max: 0.6 } });
    expect(analyzeProject(p).points.map((x) => x.duty)).toEqual(dutyGrid(0.1, 0.6, 11));
    expect(dutyGrid(0.1, 0.6, 11)[0]).toBe(0.1);
    expect(dutyGrid(0.1, 0.6, 11)[10]).toBe(0.6);
    expect(dutyGrid(0.1, 0.6, 11)[5]).toBeCloseTo(0.35, 15);
    expect(analyzeProject(p, { grid: 3 }).points.map((x) => x.duty)).toEqual([0.1, 0.35, 0.6]);
    expect(analyzeProject(p, { duties: [0.7, 0.2] }).points.map((x) => x.duty)).toEqual([0.7, 0.2]);
  });

  it('refuses duties outside 0..1', () => {
    expect(() => analyzeProject(oneStageProject(), { duties: [1.2] })).toThrow(RangeError);
    expect(() => analyzeProject(oneStageProject(), { duties: [Number.NaN] })).toThrow(RangeError);
  });

  it('uses a band of 0.5 LSB when bits are known, else 0.1 % of full scale', () => {
    expect(analyzeProject(oneStageProject({ bits: 10 })).settling.band).toBeCloseTo(0.5 * (3.3 / 1024), 15);
    const noBits = analyzeProject(oneStageProject({ bits: undefined }));
    expect(noBits.settling.band).toBeCloseTo(3.3e-3, 15);
    expect(noBits.lsb).toBeNull();
  });

  it('steps over the full used range by default, and fills a missing end of a given step from it', () => {
    const p = oneStageProject({ duty: { min: 0.2, max: 0.7 } });
    const full = analyzeProject(p).settling;
    expect([full.from, full.to].sort()).toEqual([0.2, 0.7]);
    const onlyTo = analyzeProject({ ...p, spec: { settling: { band: 0.01, to: 0.5 } } }).settling;
    expect([onlyTo.from, onlyTo.to]).toEqual([0.2, 0.5]);
  });
});
