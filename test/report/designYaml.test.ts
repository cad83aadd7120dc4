import { describe, expect, it } from 'vitest';
import { parse } from 'yaml';
import { designSearch } from '../../src/design/index.js';
import { analyzeProject } from '../../src/engine/analyze.js';
import { parseProject } from '../../src/project/index.js';
import { changeLine, withDesign } from '../../src/report/designYaml.js';

// Invented scenario: a file with aligned comments, a flow list and a design at another resolution.
const source = `# heater setpoint (invented scenario)
pwm:
  clock: 16 MHz
  bits: 8            # what the firmware uses today
  high: 3.3 V
  low: 0 V
  driver: 30 ohm
  duty: { min: 5 %, max: 95 % }
load:
  resistance: 1 Mohm
filter:                       # the first guess on the schematic
  stages:
    - { r: 10k, c: 1u }       # R1 from the stock drawer
spec:
  ripple: 0.5 LSB             # peak-to-peak
  droop: 10 %                 # of full scale
  settling: { band: 0.5 LSB, time: 50 ms }
search:
  stages: [1, 2]
  series: E12
  resistance: { min: 1k, max: 100k }
  capacitance: { min: 1n, max: 10u }
  bits: { min: 6, max: 10 }
`;

describe('withDesign', () => {
  it('changes only the values that differ and lists each change (pwm.bits, stage values, a stage added)', () => {
    const out = withDesign(source, { stages: [{ r: 10e3, c: 4.7e-6 }, { r: 8.2e3, c: 1e-9 }], bits: 6, frequency: 250e3 });
    expect(out.method).toBe('edited');
    expect(out.changes.map(changeLine)).toEqual([
      'filter.stages[0].c 1u -> 4u7',
      'filter.stages[1] added: { r: 8k2, c: 1n0 }',
      'pwm.bits 8 -> 6',
    ]);
    // Every other line, comments and their alignment included, is the same byte for byte.
    const expected = source
      .replace('bits: 8            #', 'bits: 6            #')
      .replace('- { r: 10k, c: 1u }       # R1 from the stock drawer\n', '- { r: 10k, c: 4u7 }       # R1 from the stock drawer\n    - { r: 8k2, c: 1n0 }\n');
    expect(out.text).toBe(expected);
  });

  it('removes surplus stages and sets a stated pwm.frequency with the bits', () => {
    const two = 'pwm:\n  frequency: 62.5 kHz  # 16 MHz / 256\n  clock: 16 MHz\n  bits: 8\nfilter:\n  stages:\n    - { r: 1k, c: 1u }\n    - { r: 10k, c: 100n }  # second\n# tail comment\nspec: {}\n';
    const out = withDesign(two, { stages: [{ r: 1e3, c: 1e-6 }], bits: 6, frequency: 250e3 });
    expect(out.changes.map(changeLine)).toEqual([
      'filter.stages[1] removed (was { r: 10k, c: 100n })',
      'pwm.bits 8 -> 6',
      'pwm.frequency 62.5 kHz -> 250 kHz',
    ]);
    expect(out.text).toBe('pwm:\n  frequency: 250 kHz  # 16 MHz / 256\n  clock: 16 MHz\n  bits: 6\nfilter:\n  stages:\n    - { r: 1k, c: 1u }\n# tail comment\nspec: {}\n');
  });

  it('keeps a value that already reads as the design (10 kohm is not rewritten as 10k) and reports no change', () => {
    const text = 'pwm: { frequency: 20 kHz, high: 3.3 V, low: 0 V, driver: 25 ohm }\nfilter:\n  stages:\n    - r: 10 kohm   # block map\n      c: 100 nF\n';
    const out = withDesign(text, { stages: [{ r: 10e3, c: 100e-9 }], bits: null, frequency: 20e3 });
    expect(out).toEqual({ text, changes: [], method: 'edited' });
  });

  it('writes a filter into a design-only file before spec:, and fills an empty list', () => {
    const noFilter = 'pwm: { frequency: 20 kHz, high: 3.3 V, low: 0 V, driver: 25 ohm }\n# limits\nspec:\n  ripple: 1 mV\n';
    const out = withDesign(noFilter, { stages: [{ r: 4.7e3, c: 100e-9 }], bits: null, frequency: 20e3 });
    expect(out.text).toBe('pwm: { frequency: 20 kHz, high: 3.3 V, low: 0 V, driver: 25 ohm }\n# limits\nfilter:\n  stages:\n    - { r: 4k7, c: 100n }\nspec:\n  ripple: 1 mV\n');
    const empty = withDesign('filter:\n  stages: []   # none yet\n', { stages: [{ r: 4.7e3, c: 100e-9 }], bits: null, frequency: 20e3 });
    expect(empty.text).toBe('filter:\n  stages:\n    - { r: 4k7, c: 100n }   # none yet\n');
    expect(parse(empty.text).filter.stages).toEqual([{ r: '4k7', c: '100n' }]);
  });

  it('turns a follower off, and replaces a stage of another kind (an active stage) whole', () => {
    const text = 'filter:\n  stages:\n    - { r: 4.7k, c: 100n, buffered: true }\n    - { active: sallen-key, r1: 10k, r2: 10k, c1: 22n, c2: 10n }\n';
    const out = withDesign(text, { stages: [{ r: 4.7e3, c: 100e-9 }, { r: 10e3, c: 10e-9 }], bits: null, frequency: 1e3 });
    expect(out.changes.map(changeLine)).toEqual([
      'filter.stages[0].buffered true -> false',
      'filter.stages[1] { active: sallen-key, r1: 10k, r2: 10k, c1: 22n, c2: 10n } -> { r: 10k, c: 10n }',
    ]);
    expect(out.text).toBe('filter:\n  stages:\n    - { r: 4.7k, c: 100n, buffered: false }\n    - { r: 10k, c: 10n }\n');
  });

  it('keeps CRLF line endings when it adds a stage', () => {
    const text = 'filter:\r\n  stages:\r\n    - { r: 1k, c: 1u }\r\nspec: {}\r\n';
    const out = withDesign(text, { stages: [{ r: 1e3, c: 1e-6 }, { r: 10e3, c: 1e-9 }], bits: null, frequency: 1e3 });
    expect(out.text).toBe('filter:\r\n  stages:\r\n    - { r: 1k, c: 1u }\r\n    - { r: 10k, c: 1n0 }\r\nspec: {}\r\n');
  });

  it('replaces an aliased stage by its values, the anchor left alone', () => {
    const aliased = 'base: &s { r: 1k, c: 1u }\nfilter:\n  stages:\n    - *s   # shared\n';
    const out = withDesign(aliased, { stages: [{ r: 2.2e3, c: 1e-6 }], bits: null, frequency: 1e3 });
    expect(out.text).toBe('base: &s { r: 1k, c: 1u }\nfilter:\n  stages:\n    - { r: 2k2, c: 1u0 }   # shared\n');
    expect(out.changes.map(changeLine)).toEqual(['filter.stages[0] *s -> { r: 2k2, c: 1u0 }']);
  });

  it('falls back to the Document API for a flow-style top level, with the change list from the old values', () => {
    const flow = '{ pwm: { bits: 8 }, filter: { stages: [ { r: 1k, c: 1u } ] } }  # one line\n';
    const out = withDesign(flow, { stages: [{ r: 2.2e3, c: 1e-6 }], bits: 6, frequency: 1e3 });
    expect(out.method).toBe('rewritten');
    expect(out.text).toContain('# one line');
    expect(out.changes.map(changeLine)).toEqual(['filter.stages[0] { r: 1k0, c: 1u0 } -> { r: 2k2, c: 1u0 }', 'pwm.bits 8 -> 6']);
    expect(parse(out.text)).toEqual({ pwm: { bits: 6 }, filter: { stages: [{ r: '2k2', c: '1u0' }] } });
  });

  it('the written file loads and analyzes to the chosen design figures (design search at another resolution)', () => {
    const project = parseProject(source, 'setpoint.yaml');
    const best = designSearch(project, { top: 1 }).candidates[0];
    expect(best.bits).not.toBe(8); // the scenario is meant to move the resolution
    const out = withDesign(source, best);
    expect(out.changes.map(changeLine)).toContain(`pwm.bits 8 -> ${best.bits}`);
    const again = parseProject(out.text, 'written.yaml');
    expect(again.pwm.bits).toBe(best.bits);
    expect(again.pwm.frequency).toBeCloseTo(best.frequency, 6);
    const a = analyzeProject(again);
    // The engine's figures of the written file are the design's (same circuit, same resolution).
    expect(a.worstRipple.ripple).toBeCloseTo(best.worstRipple, 12);
    expect(Math.abs(a.dc.droop.error)).toBeCloseTo(best.droop, 12);
    expect(a.pinPeakCurrent).toBeCloseTo(best.pinCurrent, 12);
    expect(a.pass).toBe(true);
  });
});
