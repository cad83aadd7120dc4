/**
 * The starter file of `init`: for any options it must be a valid project (JSON Schema, loader)
 * that passes its own spec under the exact engine, and its sizing formulas must hold.
 */
import { readFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { Ajv2020 } from 'ajv/dist/2020.js';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { parse as parseYaml } from 'yaml';
import { analyzeProject } from '../../src/engine/analyze.js';
import { parseProject } from '../../src/project/index.js';
import { starterDesign, starterProject } from '../../src/project/starter.js';

const root = join(dirname(fileURLToPath(import.meta.url)), '..', '..');
const schema = JSON.parse(readFileSync(join(root, 'schemas', 'project.schema.json'), 'utf8'));
// Ajv, a JSON Schema 2020-12 validator, reads the file independently of dacsmith's loader.
const validate = new Ajv2020({ strict: false, allErrors: true }).compile(schema);

const options = fc.record({
  stages: fc.constantFrom(1 as const, 2 as const),
  bits: fc.integer({ min: 4, max: 16 }),
  // Log-uniform from 200 Hz to 2 MHz.
  frequency: fc.double({ min: Math.log(200), max: Math.log(2e6), noNaN: true }).map((x) => Number(Math.exp(x).toPrecision(4))),
  search: fc.boolean(),
});

describe('starterProject', () => {
  it('starts with the yaml-language-server modeline', () => {
    const text = starterProject({ stages: 2, bits: 10, frequency: 20e3, search: false, schema: '../schemas/project.schema.json' });
    expect(text.split('\n')[0]).toBe('# yaml-language-server: $schema=../schemas/project.schema.json');
  });

  it('is accepted by the JSON Schema and passes its own spec under the exact engine, for any options', () => {
    fc.assert(
      fc.property(options, (o) => {
        const text = starterProject({ ...o, schema: 'project.schema.json' });
        expect(validate(parseYaml(text)), JSON.stringify(validate.errors)).toBe(true);
        const analysis = analyzeProject(parseProject(text, 'starter.yaml'));
        const names = analysis.checks.map((c) => c.name);
        expect(names).toEqual(o.search ? ['ripple', 'droop', 'settling', 'pin_current'] : ['ripple', 'droop', 'settling']);
        expect(analysis.checks.filter((c) => !c.pass)).toEqual([]);
      }),
      { numRuns: 30 },
    );
  });

  it('refuses resolutions and frequencies it cannot size for', () => {
    const base = { stages: 1 as const, frequency: 20e3, search: false, schema: 's.json' };
    expect(() => starterProject({ ...base, bits: 3 })).toThrow(RangeError);
    expect(() => starterProject({ ...base, bits: 10.5 })).toThrow(RangeError);
    expect(() => starterProject({ ...base, bits: 10, frequency: 0 })).toThrow(RangeError);
  });
});

describe('starterDesign sizing formulas against the exact engine', () => {
  const analyse = (stages: 1 | 2, bits: number, frequency: number) =>
    analyzeProject(parseProject(starterProject({ stages, bits, frequency, search: false, schema: 's.json' }), 's.yaml'));

  it('one stage: the worst ripple is Vfs tanh(T/(4 tau)) (square wave into an RC, from memory)', () => {
    for (const [bits, f] of [[8, 20e3], [12, 1e3]] as const) {
      const a = analyse(1, bits, f);
      const [{ r, c }] = starterDesign(1, bits, f).stages;
      const tau = (r + 32.5) * (c + 10e-12); // mean driver 32.5 ohm, 10 pF load (the starter's example)
      // Unequal driver resistances (40/25 ohm) shift the worst duty slightly: agree within 1 %.
      expect(a.worstRipple.ripple / (3.3 * Math.tanh(1 / f / (4 * tau)))).toBeCloseTo(1, 2);
    }
  });

  it('two stages: the ripple stays under the Fourier bound 4 Vfs zeta(3) / (pi w^2 R1C1R2C2)', () => {
    // Pulse-train harmonics (2 Vfs/(n pi)) |sin(n pi D)| (Fourier series of a rectangular wave)
    // times |H(j n w)| <= 1/((n w)^2 a) for H = 1/(s^2 a + s b + 1) with b^2 >= 4a; zeta(3) from memory.
    for (const [bits, f] of [[8, 20e3], [10, 100e3], [14, 2e3]] as const) {
      const a = analyse(2, bits, f);
      const [s1, s2] = starterDesign(2, bits, f).stages;
      const w = 2 * Math.PI * f;
      const bound = (4 * 3.3 * 1.2020569) / (Math.PI * w ** 2 * (s1.r + 32.5) * s1.c * s2.r * (s2.c + 10e-12));
      expect(a.worstRipple.ripple).toBeLessThanOrEqual(bound);
      expect(a.worstRipple.ripple).toBeGreaterThan(0.5 * bound); // and the bound is not loose
    }
  });

  it('states a settling limit that covers the exact settling time and is a 1-2-5 value', () => {
    for (const stages of [1, 2] as const) {
      const design = starterDesign(stages, 10, 20e3);
      const a = analyse(stages, 10, 20e3);
      expect(a.settling.time).not.toBeNull();
      expect(a.settling.time!).toBeLessThanOrEqual(design.settlingLimit);
      const mantissa = design.settlingLimit / 10 ** Math.floor(Math.log10(design.settlingLimit) + 1e-12);
      expect([1, 2, 5].some((m) => Math.abs(mantissa - m) < 1e-9)).toBe(true);
    }
  });
});
