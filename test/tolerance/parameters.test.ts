/**
 * The uncertain parameters of ladders and of version 1.1 networks (second PWM output, Sallen-Key
 * stages; model.md 1.1), and the circuits set from deviates (ladderAt, networkAt). Circuits are
 * invented.
 */
import { describe, expect, it } from 'vitest';
import type { ToleranceSettings } from '../../src/project/types.js';
import { networkOfLadder } from '../../src/circuit/networkOfLadder.js';
import { ladderAt, networkAt, toleranceParameters } from '../../src/tolerance/parameters.js';
import { network, pin, rc, sallenKey, secondPwm } from '../engine/periodic/networks.js';
import { ladder, stage } from './reference.js';

const settings = (extra: Partial<ToleranceSettings> = {}): ToleranceSettings => ({
  resistor: 0.01,
  capacitor: 0.1,
  distribution: 'normal',
  samples: 100,
  seed: 1,
  ...extra,
});
const driver = { high: { min: 25, max: 60 }, low: { min: 15, max: 40 } };

/** An RC stage, a Sallen-Key stage, a fine output into stage 1 through r and c, a load. */
const net = network([rc(4.7e3, 100e-9), sallenKey(10e3, 12e3, 22e-9, 10e-9)], {
  pin: pin(40, 25),
  second: secondPwm('fine', 0, 1.2e6, 1e-6, 8, pin(40, 25), 8),
  loadResistance: 47e3,
});

describe('toleranceParameters', () => {
  it('a ladder keeps its keys and labels; its network gives the same parameters', () => {
    const l = ladder([stage(4.7e3, 220e-9), stage(47e3, 22e-9)], { driverHigh: 40, driverLow: 25, loadResistance: 10e6 });
    const s = settings({ driver, supply: 0.05, load: 0.1 });
    const params = toleranceParameters(s, l);
    expect(params.map((p) => p.key)).toEqual(['r1', 'c1', 'r2', 'c2', 'driver.high', 'driver.low', 'supply', 'load']);
    expect(params.map((p) => p.label)).toEqual(['R1', 'C1', 'R2', 'C2', 'driver high', 'driver low', 'supply (high level)', 'load R']);
    expect(toleranceParameters(s, networkOfLadder(l))).toEqual(params);
  });

  it('a network: Sallen-Key r1..c2 (stage override), the second output r, c and drivers, in file order', () => {
    const s = settings({ driver, supply: 0.05, load: 0.1, stages: [undefined, { resistor: 0.001 }] });
    const params = toleranceParameters(s, net);
    expect(params.map((p) => p.key)).toEqual([
      'r1',
      'c1',
      's2.r1',
      's2.r2',
      's2.c1',
      's2.c2',
      'second.r',
      'second.c',
      'driver.high',
      'driver.low',
      'second.driver.high',
      'second.driver.low',
      'supply',
      'load',
    ]);
    const at = Object.fromEntries(params.map((p) => [p.key, p]));
    // the override of stage 2 applies to both of its resistors; its capacitors keep the common 10 %
    expect(at['s2.r1']).toMatchObject({ label: 'stage 2 R1', unit: 'ohm', nominal: 10e3, min: 10e3 * 0.999, max: 10e3 * 1.001 });
    expect(at['s2.r2']).toMatchObject({ nominal: 12e3, min: 12e3 * 0.999, max: 12e3 * 1.001 });
    expect(at['s2.c1']).toMatchObject({ label: 'stage 2 C1', unit: 'F', nominal: 22e-9, min: 22e-9 * 0.9, max: 22e-9 * 1.1 });
    expect(at['s2.c2']).toMatchObject({ nominal: 10e-9, min: 10e-9 * 0.9, max: 10e-9 * 1.1 });
    expect(at['second.r']).toMatchObject({ label: 'second output R', unit: 'ohm', nominal: 1.2e6, min: 1.2e6 * 0.99, max: 1.2e6 * 1.01 });
    expect(at['second.c']).toMatchObject({ label: 'second output C', unit: 'F', nominal: 1e-6, min: 1e-6 * 0.9, max: 1e-6 * 1.1 });
    // the second output's pin draws from the same data-sheet ranges, as its own parameters
    expect(at['second.driver.high']).toMatchObject({ nominal: 40, min: 25, max: 60 });
    expect(at['second.driver.low']).toMatchObject({ nominal: 25, min: 15, max: 40 });
  });

  it('the second output without c has no capacitor; with drivers of its own, no driver parameters', () => {
    const apart = { ...net, second: secondPwm('complement', 0, 10e3, null, null, pin(10, 10)) };
    const keys = toleranceParameters(settings({ driver }), apart).map((p) => p.key);
    expect(keys).toContain('second.r');
    expect(keys).not.toContain('second.c');
    expect(keys).not.toContain('second.driver.high');
    expect(keys).toContain('driver.high');
  });
});

describe('networkAt', () => {
  const s = settings({ driver, supply: 0.05, load: 0.1 });
  const params = toleranceParameters(s, net);
  const index = (key: string) => params.findIndex((p) => p.key === key);

  it('sets each part to centre + z half-width, leaving the nominal network untouched', () => {
    const z = params.map((_, i) => (i % 3) - 1); // -1, 0, 1, -1, ...
    const v = networkAt(net, params, z);
    const value = (key: string) => {
      const p = params[index(key)];
      return 0.5 * (p.min + p.max) + z[index(key)] * 0.5 * (p.max - p.min);
    };
    const sk = v.stages[1];
    expect(sk.kind).toBe('sallen-key');
    if (sk.kind !== 'sallen-key') return;
    expect([sk.r1, sk.r2, sk.c1, sk.c2]).toEqual([value('s2.r1'), value('s2.r2'), value('s2.c1'), value('s2.c2')]);
    expect(v.stages[0]).toMatchObject({ kind: 'rc', r: value('r1'), c: value('c1') });
    expect(v.second).toMatchObject({ r: value('second.r'), c: value('second.c') });
    expect(v.second!.pin).toMatchObject({ driverHigh: value('second.driver.high'), driverLow: value('second.driver.low') });
    expect(v.pin).toMatchObject({ driverHigh: value('driver.high'), driverLow: value('driver.low'), high: value('supply') });
    expect(v.loadResistance).toBe(value('load'));
    // a fresh object: the nominal network keeps its values
    expect(net.stages[1]).toEqual(sallenKey(10e3, 12e3, 22e-9, 10e-9));
    expect(net.second!.pin.driverHigh).toBe(40);
  });

  it('the supply moves both outputs\' high levels by the same factor (one rail)', () => {
    const z = params.map((p) => (p.key === 'supply' ? 1 : 0));
    const v = networkAt({ ...net, second: { ...net.second!, pin: pin(40, 25, 3.0) } }, params, z);
    expect(v.pin.high).toBeCloseTo(3.3 * 1.05, 14);
    expect(v.second!.pin.high).toBeCloseTo(3.0 * 1.05, 14);
  });

  it('ladderAt refuses a network part', () => {
    const l = ladder([stage(4.7e3, 220e-9)]);
    expect(() => ladderAt(l, params, new Array(params.length).fill(0))).toThrow(/network parameter/);
  });
});
