import { describe, expect, it } from 'vitest';
import { stringify } from 'yaml';
import { loadProject, parseProject, type Project } from '../../src/project/index.js';
import { fixture, projectErrorOf } from './fixtures.js';

/** The formatted error of a fixture file. */
const errorText = (name: string): string => {
  const file = fixture(name);
  return projectErrorOf(() => loadProject(file)).format();
};

const MINIMAL = 'pwm:\n  frequency: 20 kHz\n  high: 3.3 V\nfilter:\n  stages:\n    - { r: 4k7, c: 100n }\n';

describe('parseProject: malformed files, each named with file, line, column and key path', () => {
  it('duplicate key', () => {
    expect(errorText('duplicate-key.yaml')).toBe(
      `${fixture('duplicate-key.yaml')}:4:3: pwm.frequency: duplicate key 'frequency'; a key may appear only once in a mapping`,
    );
  });

  it('alias bomb (exponential alias expansion) stops at the first alias', () => {
    const text = errorText('alias-bomb.yaml');
    expect(text).toBe(
      `${fixture('alias-bomb.yaml')}:9:8: b[0]: the aliases in this file expand too far (more than 20 copies, as in an alias bomb); write the values out`,
    );
  });

  it('__proto__ and constructor keys', () => {
    expect(errorText('proto-key.yaml')).toBe(
      `${fixture('proto-key.yaml')}:8:7: filter.stages[0].__proto__: the key '__proto__' is not allowed (a reserved name in JavaScript objects)`,
    );
    expect(errorText('constructor-key.yaml')).toContain(':4:3: pwm.constructor: the key \'constructor\' is not allowed');
    expect(({} as Record<string, unknown>).polluted).toBeUndefined();
  });

  it('.inf and .nan', () => {
    expect(errorText('inf-number.yaml')).toBe(
      `${fixture('inf-number.yaml')}:5:15: load.resistance: '.inf' is not a finite number; write a finite value`,
    );
    expect(errorText('nan-number.yaml')).toBe(
      `${fixture('nan-number.yaml')}:6:20: filter.stages[0].c: '.nan' is not a finite number; write a finite value`,
    );
  });

  it('empty file, comments only', () => {
    for (const name of ['empty.yaml', 'comments-only.yaml']) {
      expect(errorText(name)).toBe(
        `${fixture(name)}:1:1: the file is empty; a project needs at least a pwm section and a filter (or search) section`,
      );
    }
  });

  it('a document that is not a mapping', () => {
    expect(errorText('not-a-mapping.yaml')).toContain(':1:1: a project file is a mapping of sections');
    expect(errorText('not-a-mapping.yaml')).toContain('this one holds a list');
    expect(projectErrorOf(() => parseProject('just text\n', 'p.yaml')).format()).toBe(
      "p.yaml:1:1: a project file is a mapping of sections (pwm, load, filter, spec, search, tolerance), but this one holds the single value 'just text'",
    );
  });

  it('YAML syntax errors, with the line yaml reports', () => {
    // bad-syntax.yaml leaves the flow mapping of stage 0 open on line 6; yaml notices on line 7.
    expect(errorText('bad-syntax.yaml')).toMatch(/bad-syntax\.yaml:7:1: spec: YAML syntax error: Flow map .* end with a \}/);
    expect(projectErrorOf(() => parseProject('pwm:\n\thigh: 3.3 V\n', 'p.yaml')).format()).toBe(
      'p.yaml:2:1: a tab is used for indentation; YAML indents with spaces',
    );
    expect(projectErrorOf(() => parseProject('pwm:\n  high: "3.3 V\n', 'p.yaml')).format()).toMatch(/^p\.yaml:3:1: .*YAML syntax error: Missing closing "quote/);
    expect(projectErrorOf(() => parseProject(`${MINIMAL}---\npwm: {}\n`, 'p.yaml')).format()).toBe(
      "p.yaml:7:1: more than one YAML document (a second '---'); a project file holds one",
    );
    expect(projectErrorOf(() => parseProject(MINIMAL.replace('3.3 V', '!volts 3.3'), 'p.yaml')).format()).toBe(
      'p.yaml:3:9: pwm.high: unknown tag !volts; write plain values without tags',
    );
  });

  it('unknown key, with a suggestion', () => {
    expect(errorText('unknown-key.yaml')).toBe(
      `${fixture('unknown-key.yaml')}:5:3: load.resitance: unknown key 'resitance'; did you mean 'resistance'?`,
    );
    expect(projectErrorOf(() => parseProject(`${MINIMAL}ripple: 1 mV\n`, 'p.yaml')).format()).toBe(
      "p.yaml:7:1: ripple: unknown key 'ripple' here; 'ripple' belongs under spec",
    );
    expect(projectErrorOf(() => parseProject(MINIMAL.replace('high:', 'colour: red\n  high:'), 'p.yaml')).format()).toMatch(
      /^p\.yaml:3:3: pwm\.colour: unknown key 'colour'; expected one of: frequency, clock, bits, prescaler, alignment, high, low, driver, duty$/,
    );
  });

  it('a quantity of the wrong dimension', () => {
    expect(errorText('wrong-dimension.yaml')).toBe(
      `${fixture('wrong-dimension.yaml')}:7:20: filter.stages[1].c: expected a capacitance (F), got '3.3 V' (a voltage)`,
    );
  });

  it('a negative resistance', () => {
    expect(errorText('negative-r.yaml')).toBe(
      `${fixture('negative-r.yaml')}:6:10: filter.stages[0].r: expected a resistance (ohm) greater than 0, got '-4.7k'`,
    );
  });

  it('a spec in LSB without pwm.bits', () => {
    expect(errorText('lsb-without-bits.yaml')).toBe(
      `${fixture('lsb-without-bits.yaml')}:9:11: spec.ripple: '0.5 LSB' needs pwm.bits: one LSB is (high - low) / 2^bits; give pwm.bits or write the limit in V or %`,
    );
  });

  it('clock and frequency that disagree', () => {
    // 16 MHz / (1 * 2^10) = 15625 Hz, edge-aligned; the file says 20 kHz.
    expect(errorText('clock-mismatch.yaml')).toBe(
      `${fixture('clock-mismatch.yaml')}:5:14: pwm.frequency: 20 kHz does not match the timer: clock / (prescaler * 2^bits) = 16 MHz / (1 * 2^10) = 15.625 kHz; correct one of them, or give only one`,
    );
  });

  it('neither frequency nor clock', () => {
    expect(errorText('no-frequency.yaml')).toBe(
      `${fixture('no-frequency.yaml')}:1:1: pwm.frequency: missing; give pwm.frequency (e.g. '19.5 kHz'), or pwm.clock and pwm.bits (and pwm.prescaler)`,
    );
    expect(projectErrorOf(() => parseProject(MINIMAL.replace('frequency: 20 kHz', 'clock: 16 MHz'), 'p.yaml')).format()).toBe(
      'p.yaml:1:1: pwm.frequency: missing; with pwm.clock, give pwm.bits (and pwm.prescaler) so that the frequency follows, or give pwm.frequency',
    );
  });

  it('reports several problems at once, in file order', () => {
    const e = projectErrorOf(() => loadProject(fixture('several-errors.yaml')));
    expect(e.issues.map((i) => `${i.line}:${i.column} ${i.path}`)).toEqual(['5:14 pwm.alignment', '8:29 filter.stages[0].bufered']);
    expect(e.issues[0].message).toBe("expected one of edge, center, got 'centre'; did you mean 'center'?");
    expect(e.issues[1].message).toBe("unknown key 'bufered'; did you mean 'buffered'?");
    expect(e.format().split('\n')).toHaveLength(2);
    // The first issue is also the error's own file/path/line/column/message.
    expect([e.path, e.line, e.column, e.message]).toEqual(['pwm.alignment', 5, 14, e.issues[0].message]);
  });
});

describe('parseProject: rules between keys', () => {
  const err = (text: string) => projectErrorOf(() => parseProject(text, 'p.yaml')).format();

  it('high must exceed low', () => {
    expect(err(MINIMAL.replace('high: 3.3 V', 'high: 0 V\n  low: 3.3 V'))).toBe(
      'p.yaml:3:9: pwm.high: the high level (0 V) must be above the low level (3.3 V)',
    );
  });

  it('duty min below max, both within 0..1', () => {
    expect(err(MINIMAL.replace('high: 3.3 V', 'high: 3.3 V\n  duty: { min: 60 %, max: 40 % }'))).toBe(
      'p.yaml:4:16: pwm.duty.min: min (60 %) must be below max (40 %)',
    );
    expect(err(MINIMAL.replace('high: 3.3 V', 'high: 3.3 V\n  duty: { max: 120 % }'))).toContain(
      "p.yaml:4:16: pwm.duty.max: expected a fraction from 0 to 1 or a percentage from 0 % to 100 %, got '120 %'",
    );
  });

  it('settling from and to: both or neither, and different', () => {
    expect(err(`${MINIMAL}spec:\n  settling: { band: 1 mV, from: 10 % }\n`)).toBe(
      "p.yaml:8:27: spec.settling.from: 'from' needs 'to' as well; give both or neither",
    );
    expect(err(`${MINIMAL}spec:\n  settling: { band: 1 mV, from: 10 %, to: 0.1 }\n`)).toBe(
      'p.yaml:8:43: spec.settling.to: from and to are the same duty (10 %); a step needs two different duties',
    );
  });

  it('a missing required key points at the mapping that lacks it', () => {
    expect(err('pwm:\n  frequency: 20 kHz\nfilter:\n  stages:\n    - { r: 4k7, c: 100n }\n')).toBe(
      "p.yaml:1:1: pwm.high: missing; open-circuit pin level during the high phase (the supply of the output stage), e.g. '3.3 V'",
    );
    expect(err('pwm:\n  frequency: 20 kHz\n  high: 3.3 V\n')).toBe(
      'p.yaml:1:1: filter: missing; give filter.stages (1 to 4 RC stages), or a search section to design a filter',
    );
  });

  it('search ranges, search.bits needing a clock, tolerances below 100 %', () => {
    const search = 'search:\n  resistance: { min: 1 Mohm, max: 1 kohm }\n  capacitance: { min: 1n, max: 1u }\n  bits: { min: 8, max: 10 }\n';
    const e = projectErrorOf(() => parseProject(MINIMAL + search, 'p.yaml'));
    expect(e.format().split('\n')).toEqual([
      'p.yaml:8:22: search.resistance.min: min (1 Mohm) must be below max (1 kohm)',
      'p.yaml:10:3: search.bits: needs pwm.clock: the frequency at each resolution follows from the timer clock',
    ]);
    expect(err(`${MINIMAL}tolerance: { resistor: 100 %, capacitor: 10 % }\n`)).toBe(
      "p.yaml:7:24: tolerance.resistor: a tolerance must be below 100 %, got '100 %'",
    );
  });

  it('schema ranges and kinds: bits, stage count, booleans, version', () => {
    expect(err(MINIMAL.replace('high: 3.3 V', 'high: 3.3 V\n  bits: 0'))).toBe('p.yaml:4:9: pwm.bits: must be at least 1, got 0');
    expect(err(MINIMAL.replace('high: 3.3 V', 'high: 3.3 V\n  bits: ten'))).toBe(
      "p.yaml:4:9: pwm.bits: expected a whole number, got 'ten'",
    );
    expect(err(MINIMAL.replace('c: 100n }', 'c: 100n, buffered: yes }'))).toBe(
      "p.yaml:6:36: filter.stages[0].buffered: expected true or false, got 'yes'",
    );
    expect(err(`version: 2\n${MINIMAL}`)).toBe('p.yaml:1:10: version: expected 1, got 2 (this dacsmith reads version 1 project files)');
    const five = '    - { r: 1k, c: 1n }\n'.repeat(5);
    expect(err(MINIMAL.replace('    - { r: 4k7, c: 100n }\n', five))).toBe('p.yaml:6:5: filter.stages: needs at most 4 entries, got 5 entries');
    expect(err(MINIMAL.replace('high: 3.3 V', 'high: [3.3]'))).toBe(
      "p.yaml:3:9: pwm.high: expected a quantity in V such as '3.3 V', got a list",
    );
    expect(err(`${MINIMAL}spec: { ripple: { max: 1 } }\n`)).toBe(
      "p.yaml:7:17: spec.ripple: expected a level in V, mV, LSB or % of full scale such as '0.5 LSB', got a mapping",
    );
  });
});

describe('parseProject: a complete valid file, normalized to SI', () => {
  it('reads every key of valid-full.yaml', () => {
    const file = fixture('valid-full.yaml');
    const project = loadProject(file);
    const lsb = 3.4 / 4096; // (3.3 V - (-0.1 V)) / 2^12
    // Hand-derived from the file: units per the SI Brochure, codes per IEC 60062, frequency per
    // the center-aligned timer rule 48 MHz / (2 * 2 * 2^12) = 2929.6875 Hz.
    const expected: Project = {
      file,
      pwm: {
        frequency: 2929.6875,
        clock: 48e6,
        bits: 12,
        prescaler: 2,
        alignment: 'center',
        high: 3.3,
        low: -0.1,
        driver: { high: 40, low: 25 },
        duty: { min: 0.025, max: 0.975 },
      },
      load: { resistance: 1e6, capacitance: 100e-12 },
      filter: {
        stages: [
          { r: 4700, c: 1e-6, buffered: false },
          { r: 47e3, c: 6.8e-9, buffered: true },
          { r: 10e3, c: 1e-9, buffered: false },
        ],
      },
      spec: {
        ripple: 0.5 * lsb,
        droop: 2e-3,
        inl: 0.0005 * 3.4,
        settling: { band: 1 * lsb, time: 0.2, from: 0.1, to: 0.9 },
      },
      search: {
        stages: [2, 3],
        series: { resistor: 'E96', capacitor: 'E96' }, margin: 0.1, buffered: [false],
        resistance: { min: 1e3, max: 470e3 },
        capacitance: { min: 1e-9, max: 4.7e-6 },
        pinCurrent: 5e-3,
        bits: { min: 10, max: 12 },
      },
      tolerance: {
        resistor: 0.001,
        capacitor: 0.05,
        stages: [{ capacitor: 0.1 }, undefined, { resistor: 0.01, capacitor: 0.02 }],
        driver: { high: { min: 20, max: 60 }, low: { min: 25, max: 25 } },
        supply: 0.02,
        load: 0.2,
        distribution: 'uniform',
        samples: 2000,
        seed: 42,
        yield: 0.99,
      },
      lsb,
      specInLsb: { ripple: 0.5, band: 1 },
    };
    expect(project).toEqual(expected);
  });

  it('round-trips: the normalized project written back as plain SI numbers loads to the same project', () => {
    const original = loadProject(fixture('valid-full.yaml'));
    const reloaded = parseProject(stringify(asSiYaml(original)), 'again.yaml');
    // Limits come back in volts, so the record of which were written in LSB is gone by design.
    const { file: _a, specInLsb: _b, ...before } = original;
    const { file: _c, specInLsb: after, ...rest } = reloaded;
    expect(rest).toEqual(before);
    expect(after).toBeUndefined();
  });

  it('fills in the defaults of model.md for a minimal file', () => {
    const project = parseProject(MINIMAL, 'min.yaml');
    expect(project).toEqual({
      file: 'min.yaml',
      pwm: {
        frequency: 20e3,
        prescaler: 1,
        alignment: 'edge',
        high: 3.3,
        low: 0,
        driver: { high: 0, low: 0 },
        duty: { min: 0, max: 1 },
      },
      load: { capacitance: 0 },
      filter: { stages: [{ r: 4700, c: 100e-9, buffered: false }] },
      spec: { gain: 0.02 }, // model.md 1.1: the default full-scale limit
    });
  });

  it('takes one driver value for both phases, % of full scale and mV for specs', () => {
    const p = parseProject(MINIMAL.replace('high: 3.3 V', 'high: 5 V\n  driver: 30 ohm') + 'spec: { droop: 1 %, ripple: 2 mV }\n', 'p.yaml');
    expect(p.pwm.driver).toEqual({ high: 30, low: 30 });
    expect(p.spec).toEqual({ droop: 0.05, ripple: 2e-3 });
    expect(p.specInLsb).toBeUndefined();
  });

  it('accepts anchors and aliases used with restraint', () => {
    const p = loadProject(fixture('aliases-ok.yaml'));
    expect(p.filter.stages).toEqual([
      { r: 10e3, c: 100e-9, buffered: false },
      { r: 10e3, c: 100e-9, buffered: false },
    ]);
  });

  it('accepts a design-only file (search, no filter) with no stages', () => {
    const p = parseProject(
      'pwm: { frequency: 20 kHz, high: 3.3 V }\nsearch: { resistance: { min: 1k, max: 100k }, capacitance: { min: 1n, max: 1u } }\n',
      'p.yaml',
    );
    expect(p.filter.stages).toEqual([]);
    expect(p.search).toEqual({
      stages: [1, 2],
      series: { resistor: 'E24', capacitor: 'E24' },
      margin: 0.1,
      buffered: [false],
      resistance: { min: 1e3, max: 100e3 },
      capacitance: { min: 1e-9, max: 1e-6 },
    });
  });
});

/** A project as a project file in plain SI numbers (keys as model.md spells them). */
function asSiYaml(p: Project): Record<string, unknown> {
  const { pinCurrent, ...search } = p.search ?? ({} as NonNullable<Project['search']>);
  return {
    pwm: p.pwm,
    load: p.load,
    filter: p.filter,
    spec: p.spec,
    ...(p.search && { search: { ...search, pin_current: pinCurrent } }),
    ...(p.tolerance && { tolerance: { ...p.tolerance, stages: p.tolerance.stages?.map((s) => s ?? null) } }),
  };
}

describe('parseProject: the default full-scale (gain) limit, model.md 1.1', () => {
  const pwm = 'pwm: { frequency: 20 kHz, bits: 10, high: 3.3 V, low: 0 V }\nfilter: { stages: [{ r: 4.7k, c: 1u }] }\n';
  it('applies when no droop is limited, also beside an INL limit (INL is blind to a divided-down output)', () => {
    expect(parseProject(pwm + 'spec: { ripple: 1 LSB }\n', 'a.yaml').spec.gain).toBe(0.02);
    expect(parseProject(pwm + 'spec: { ripple: 1 LSB, inl: 1 LSB }\n', 'b.yaml').spec.gain).toBe(0.02);
  });
  it('stays off when droop is limited or when gain: none, and takes the file value otherwise', () => {
    expect(parseProject(pwm + 'spec: { ripple: 1 LSB, droop: 2 LSB }\n', 'c.yaml').spec.gain).toBeUndefined();
    expect(parseProject(pwm + 'spec: { ripple: 1 LSB, gain: none }\n', 'd.yaml').spec.gain).toBeUndefined();
    expect(parseProject(pwm + 'spec: { ripple: 1 LSB, gain: 5 % }\n', 'e.yaml').spec.gain).toBeCloseTo(0.05, 15);
  });
});
