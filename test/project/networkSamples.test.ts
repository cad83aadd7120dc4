/**
 * The three version 1.1 samples (sample-configs/) normalize to the circuits their comments
 * describe: every value below is read off the YAML file by hand, in SI units.
 */
import { describe, expect, it } from 'vitest';
import { loadProject } from '../../src/project/index.js';

const sample = (name: string) => loadProject(`sample-configs/${name}.yaml`);

describe('version 1.1 samples', () => {
  it('complement-ripple-cancel: the complement enters stage 1 through 10 kohm and 1 uF, pin as pwm', () => {
    const p = sample('complement-ripple-cancel');
    expect(p.network).toEqual({
      stages: [
        { kind: 'rc', r: 10e3, c: 100e-9, buffered: false },
        { kind: 'rc', r: 10e3, c: 100e-9, buffered: false },
      ],
      second: { role: 'complement', bits: null, coarseBits: null, pin: { high: 5, low: 0, driverHigh: 35, driverLow: 25 }, stage: 0, r: 10e3, c: 1e-6 },
    });
    expect(p.filter.stages).toHaveLength(2);
    expect(p.pwm.frequency).toBe(10e6 / 256); // clock / 2^bits, edge-aligned
    expect(p.lsb).toBe(5 / 256); // a complement adds no resolution
  });

  it('fine-16bit-setpoint: 8 + 8 bits, weighted in through 256 x the first resistor', () => {
    const p = sample('fine-16bit-setpoint');
    const second = p.network?.second;
    expect(second).toEqual({ role: 'fine', bits: 8, coarseBits: 8, pin: { high: 3.3, low: 0, driverHigh: 40, driverLow: 25 }, stage: 0, r: 2.56e6, c: null });
    expect(second!.r / (p.network!.stages[0] as { r: number }).r).toBeCloseTo(256, 12);
    expect(p.lsb).toBe(3.3 / 65536);
    expect(p.spec.ripple).toBe(3.3 / 65536); // 1 LSB of the 16-bit code
    expect(p.spec.inl).toBe(4 * (3.3 / 65536));
    expect(p.spec.settling?.band).toBe(2 * (3.3 / 65536));
  });

  it('sallen-key-reference: an RC stage, then a Sallen-Key stage with Q near 0.55', () => {
    const p = sample('sallen-key-reference');
    expect(p.network).toEqual({
      stages: [
        { kind: 'rc', r: 4700, c: 100e-9, buffered: false },
        { kind: 'sallen-key', r1: 10e3, r2: 10e3, c1: 12e-9, c2: 10e-9 },
      ],
      second: null,
    });
    expect(p.filter.stages).toEqual([{ r: 4700, c: 100e-9, buffered: false }]);
    const sk = p.network!.stages[1] as { r1: number; r2: number; c1: number; c2: number };
    // Unity-gain Sallen-Key low-pass: Q = sqrt(r1 r2 c1 c2) / (c2 (r1 + r2)), f0 = 1 / (2 pi sqrt(r1 r2 c1 c2))
    // (model.md 1.1, the standard unity-gain result of active-filter texts: common practice)
    const root = Math.sqrt(sk.r1 * sk.r2 * sk.c1 * sk.c2);
    expect(root / (sk.c2 * (sk.r1 + sk.r2))).toBeCloseTo(0.55, 2);
    expect(1 / (2 * Math.PI * root)).toBeCloseTo(1453, 0); // the 1.45 kHz of the sample's comment
  });
});
