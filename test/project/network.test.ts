/**
 * Version 1.1 keys of the project file (model.md, "Version 1.1 additions"): second_pwm and the
 * active (sallen-key) stage. Every refusal names the file, line, column and key path; the
 * normalized `network`, the inherited pin of the second output, and the LSB over the combined
 * code range of a fine channel.
 */
import { describe, expect, it } from 'vitest';
import { parseProject, type Project } from '../../src/project/index.js';
import { projectErrorOf } from './fixtures.js';

/** A project with a 2-stage RC filter and a fine channel, one entry per line (line n = index n - 1). */
const BASE = [
  'pwm:', //                                    1
  '  frequency: 20 kHz', //                     2
  '  bits: 8', //                               3
  '  high: 3.3 V', //                           4
  '  driver: { high: 40 ohm, low: 25 ohm }', // 5
  'filter:', //                                 6
  '  stages:', //                               7
  '    - { r: 10k, c: 100n }', //               8
  '    - { r: 10k, c: 100n }', //               9
  'second_pwm:', //                             10
  '  role: fine', //                            11
  '  bits: 8', //                               12
  '  into: { stage: 1, r: 2.56M }', //          13
];

/** BASE with lines replaced (1-based line -> new text; null removes the line). */
function edited(changes: Record<number, string | null> = {}, extra: string[] = []): string {
  return [...BASE.flatMap((line, i) => (i + 1 in changes ? (changes[i + 1] === null ? [] : [changes[i + 1] as string]) : [line])), ...extra, ''].join('\n');
}

const load = (text: string): Project => parseProject(text, 'p.yaml');
const errorOf = (text: string): string => projectErrorOf(() => load(text)).format();

/** `p.yaml:LINE:COL` of the first `needle` on 1-based line `line` of `text` (where the key or value is written). */
function at(text: string, line: number, needle: string): string {
  const column = text.split('\n')[line - 1].indexOf(needle) + 1;
  if (column === 0) throw new Error(`'${needle}' is not on line ${line}`);
  return `p.yaml:${line}:${column}`;
}

describe('second_pwm: refusals with file, line, column and key path', () => {
  it('second_pwm.bits without pwm.bits', () => {
    // pwm.bits removed: the fine bits (now line 11) have no coarse resolution to sit below
    expect(errorOf(edited({ 3: null }))).toBe(
      'p.yaml:11:3: second_pwm.bits: needs pwm.bits: the code is coarse * 2^bits + fine, so the coarse resolution must be known; give pwm.bits',
    );
  });

  it('bits with role: complement', () => {
    expect(errorOf(edited({ 11: '  role: complement' }))).toBe(
      "p.yaml:12:3: second_pwm.bits: only role fine has bits of its own: a complement output is the inverted copy of pwm; remove bits, or write 'role: fine'",
    );
  });

  it('role: fine without bits (points at the second_pwm mapping that lacks it)', () => {
    expect(errorOf(edited({ 12: null }))).toBe(
      'p.yaml:10:1: second_pwm.bits: missing; role fine needs the resolution of the fine channel (code = coarse * 2^bits + fine), e.g. 8',
    );
  });

  it('into.stage beyond the stages', () => {
    const text = edited({ 13: '  into: { stage: 3, r: 2.56M }' });
    expect(errorOf(text)).toBe(`${at(text, 13, '3,')}: second_pwm.into.stage: the filter has 2 stages, so there is no stage 3; name an RC stage (1, 2)`);
  });

  it('into.stage pointing at an active stage', () => {
    const text = edited({ 9: '    - { active: sallen-key, r1: 10k, r2: 10k, c1: 12n, c2: 10n }', 13: '  into: { stage: 2, r: 2.56M }' });
    expect(errorOf(text)).toBe(
      `${at(text, 13, '2,')}: second_pwm.into.stage: stage 2 is an active (sallen-key) stage; the second output enters the node of an RC stage; name an RC stage (1)`,
    );
  });

  it('into.stage 0 (the schema counts stages from 1)', () => {
    const text = edited({ 13: '  into: { stage: 0, r: 2.56M }' });
    expect(errorOf(text)).toBe(`${at(text, 13, '0,')}: second_pwm.into.stage: must be at least 1, got 0`);
  });

  it('second_pwm in a design-only file (no filter.stages to inject into)', () => {
    const text = edited({ 6: null, 7: null, 8: null, 9: null }, [
      'search:',
      '  resistance: { min: 1k, max: 1M }',
      '  capacitance: { min: 1n, max: 1u }',
    ]);
    expect(errorOf(text)).toBe(`${at(text, 9, '1,')}: second_pwm.into.stage: needs filter.stages: the second output enters the node of an RC stage of the filter`);
  });

  it('zero or negative parts and levels', () => {
    const zeroR = edited({ 13: '  into: { stage: 1, r: 0 }' });
    expect(errorOf(zeroR)).toBe(`${at(zeroR, 13, '0 }')}: second_pwm.into.r: expected a resistance (ohm) greater than 0, got 0`);
    const negativeC = edited({ 13: '  into: { stage: 1, r: 10k, c: -100n }' });
    expect(errorOf(negativeC)).toMatch(new RegExp(`^${at(negativeC, 13, '-100n')}: second_pwm\\.into\\.c: expected a capacitance \\(F\\) greater than 0`));
    const negativeDriver = edited({}, ['  driver: -5 ohm']);
    expect(errorOf(negativeDriver)).toMatch(new RegExp(`^${at(negativeDriver, 14, '-5')}: second_pwm\\.driver: .*resistance`));
    // a second pin whose high level is not above the (inherited) low level
    const flat = edited({}, ['  high: 0 V']);
    expect(errorOf(flat)).toBe(`${at(flat, 14, '0 V')}: second_pwm.high: the high level (0 V) must be above the low level (0 V)`);
  });

  it('unknown keys, with a did-you-mean like the other blocks', () => {
    expect(errorOf(edited({ 11: '  rol: fine' }))).toContain("p.yaml:11:3: second_pwm.rol: unknown key 'rol'; did you mean 'role'?");
    const into = edited({ 13: '  into: { stag: 1, r: 2.56M }' });
    expect(errorOf(into)).toContain(`${at(into, 13, 'stag')}: second_pwm.into.stag: unknown key 'stag'; did you mean 'stage'?`);
    const role = edited({ 11: '  role: fin' });
    expect(errorOf(role)).toBe(`${at(role, 11, 'fin')}: second_pwm.role: expected one of fine, complement, got 'fin'; did you mean 'fine'?`);
    expect(errorOf(edited({ 10: 'second_pwn:' }))).toContain("p.yaml:10:1: second_pwn: unknown key 'second_pwn'; did you mean 'second_pwm'?");
  });

  it('second_pwm.bits above 16', () => {
    expect(errorOf(edited({ 12: '  bits: 17' }))).toBe('p.yaml:12:9: second_pwm.bits: must be at most 16, got 17');
  });
});

describe('active stage: refusals with file, line, column and key path', () => {
  const active = (stage: string): string => edited({ 9: `    - ${stage}` }, []).replace(/second_pwm:[\s\S]*$/, '');

  it('loads { active: sallen-key, r1, r2, c1, c2 } with IEC 60062 codes', () => {
    const p = load(active('{ active: sallen-key, r1: 4k7, r2: 10 kohm, c1: 22n, c2: 1n5 }'));
    expect(p.network?.stages[1]).toEqual({ kind: 'sallen-key', r1: 4700, r2: 10e3, c1: 22e-9, c2: 1.5e-9 });
  });

  it('buffered on an active stage', () => {
    const text = active('{ active: sallen-key, r1: 10k, r2: 10k, c1: 12n, c2: 10n, buffered: true }');
    expect(errorOf(text)).toBe(
      `${at(text, 9, 'buffered')}: filter.stages[1].buffered: not allowed on an active stage: its output is already an op-amp output, which nothing after it loads; remove 'buffered'`,
    );
  });

  it('a missing part, and r or c on an active stage', () => {
    // a missing key points at the mapping that lacks it (locate.ts)
    const missing = active('{ active: sallen-key, r1: 10k, r2: 10k, c1: 12n }');
    expect(errorOf(missing)).toBe(`${at(missing, 9, '{')}: filter.stages[1].c2: missing; capacitor from the op-amp input to ground, e.g. '100n'`);
    const withR = active('{ active: sallen-key, r: 10k, r1: 10k, r2: 10k, c1: 12n, c2: 10n }');
    expect(errorOf(withR)).toBe(`${at(withR, 9, 'r:')}: filter.stages[1].r: 'r' belongs to an RC stage; an active (sallen-key) stage takes r1, r2, c1 and c2`);
  });

  it('r1 on an RC stage, and a missing c on an RC stage', () => {
    const withR1 = active('{ r: 10k, c: 10n, r1: 10k }');
    expect(errorOf(withR1)).toBe(
      `${at(withR1, 9, 'r1')}: filter.stages[1].r1: 'r1' belongs to an active stage; add 'active: sallen-key', or give r and c for an RC stage`,
    );
    const noC = active('{ r: 10k }');
    expect(errorOf(noC)).toBe(`${at(noC, 9, '{')}: filter.stages[1].c: missing; capacitor from the node of the RC stage to ground, e.g. '100n'`);
  });

  it('zero and negative parts', () => {
    const zero = active('{ active: sallen-key, r1: 0, r2: 10k, c1: 12n, c2: 10n }');
    expect(errorOf(zero)).toBe(`${at(zero, 9, '0,')}: filter.stages[1].r1: expected a resistance (ohm) greater than 0, got 0`);
    const negative = active('{ active: sallen-key, r1: 10k, r2: 10k, c1: 12n, c2: -10n }');
    expect(errorOf(negative)).toMatch(new RegExp(`^${at(negative, 9, '-10n')}: filter\\.stages\\[1\\]\\.c2: expected a capacitance \\(F\\) greater than 0`));
  });

  it('unknown keys and kinds, with a did-you-mean', () => {
    const key = active('{ active: sallen-key, r1: 10k, r2: 10k, c1: 12n, c3: 10n }');
    expect(errorOf(key)).toContain(`${at(key, 9, 'c3')}: filter.stages[1].c3: unknown key 'c3'; did you mean 'c1'?`);
    const kind = active('{ active: salen-key, r1: 10k, r2: 10k, c1: 12n, c2: 10n }');
    expect(errorOf(kind)).toBe(`${at(kind, 9, 'salen')}: filter.stages[1].active: expected one of sallen-key, got 'salen-key'; did you mean 'sallen-key'?`);
  });
});

describe('normalized project', () => {
  it('a plain file has no network', () => {
    const p = load(edited({ 10: null, 11: null, 12: null, 13: null }));
    expect(p.network).toBeUndefined();
    expect(p.lsb).toBe(3.3 / 2 ** 8);
  });

  it('the second pin inherits high, low and driver from pwm', () => {
    const p = load(edited({ 4: '  high: 5 V\n  low: 0.5 V' }));
    expect(p.network?.second?.pin).toEqual({ high: 5, low: 0.5, driverHigh: 40, driverLow: 25 });
  });

  it('the second pin keeps what it states, and takes the rest from pwm', () => {
    const p = load(edited({}, ['  high: 1.8 V', '  driver: 60 ohm']));
    expect(p.network?.second?.pin).toEqual({ high: 1.8, low: 0, driverHigh: 60, driverLow: 60 });
    const q = load(edited({}, ['  driver: { high: 70 ohm, low: 50 ohm }']));
    expect(q.network?.second?.pin).toEqual({ high: 3.3, low: 0, driverHigh: 70, driverLow: 50 });
  });

  it('an ideal pwm driver (none given) is inherited as 0 ohm', () => {
    expect(load(edited({ 5: null })).network?.second?.pin).toEqual({ high: 3.3, low: 0, driverHigh: 0, driverLow: 0 });
  });

  it('fine: LSB is full scale over 2^(pwm.bits + bits), and LSB limits use it', () => {
    // model.md 1.1: "LSB is full scale over 2^(pwm.bits + b)"
    const p = load(edited({}, ['spec:', '  ripple: 0.5 LSB', '  droop: 2 mV', '  settling: { band: 1 LSB }']));
    expect(p.lsb).toBe(3.3 / 2 ** 16);
    expect(p.spec.ripple).toBe(0.5 * (3.3 / 2 ** 16));
    expect(p.spec.droop).toBe(2e-3); // a limit in volts is not rescaled
    expect(p.spec.settling?.band).toBe(3.3 / 2 ** 16);
    expect(p.specInLsb).toEqual({ ripple: 0.5, band: 1 });
    expect(p.network?.second).toMatchObject({ role: 'fine', bits: 8, coarseBits: 8, stage: 0, r: 2.56e6, c: null });
    // duty.min/max keep meaning fractions of the code range: read as written
    expect(load(edited({}, [])).pwm.duty).toEqual({ min: 0, max: 1 });
  });

  it('complement: LSB of pwm.bits alone; bits null; c in series', () => {
    const p = load(edited({ 11: '  role: complement', 12: null, 13: '  into: { stage: 2, r: 10k, c: 1u }' }, ['spec:', '  ripple: 0.5 LSB']));
    expect(p.lsb).toBe(3.3 / 2 ** 8);
    expect(p.spec.ripple).toBe(0.5 * (3.3 / 2 ** 8));
    expect(p.network?.second).toEqual({
      role: 'complement',
      bits: null,
      coarseBits: null,
      pin: { high: 3.3, low: 0, driverHigh: 40, driverLow: 25 },
      stage: 1,
      r: 10e3,
      c: 1e-6,
    });
  });

  it('an active stage: network lists every stage in file order, filter.stages the RC stages only', () => {
    const text = edited({ 8: '    - { active: sallen-key, r1: 10k, r2: 22k, c1: 22n, c2: 10n }', 9: '    - { r: 4k7, c: 1u, buffered: true }' })
      .replace(/second_pwm:[\s\S]*$/, '');
    const p = load(text);
    expect(p.network).toEqual({
      stages: [
        { kind: 'sallen-key', r1: 10e3, r2: 22e3, c1: 22e-9, c2: 10e-9 },
        { kind: 'rc', r: 4700, c: 1e-6, buffered: true },
      ],
      second: null,
    });
    expect(p.filter.stages).toEqual([{ r: 4700, c: 1e-6, buffered: true }]);
  });

  it('second.stage is 0-based into network.stages (an active stage before it counts)', () => {
    const text = edited({ 8: '    - { active: sallen-key, r1: 10k, r2: 10k, c1: 12n, c2: 10n }', 13: '  into: { stage: 2, r: 2.56M }' });
    const p = load(text);
    expect(p.network?.second?.stage).toBe(1);
    expect(p.network?.stages[1]).toEqual({ kind: 'rc', r: 10e3, c: 100e-9, buffered: false });
  });

  it('a tolerance override per stage counts active stages too', () => {
    // two stages, one of them active: counting RC stages alone would call the second override stray
    const plain = edited({ 8: '    - { active: sallen-key, r1: 10k, r2: 10k, c1: 12n, c2: 10n }' }).replace(/second_pwm:[\s\S]*$/, '');
    const text = `${plain}tolerance:\n  resistor: 1 %\n  capacitor: 5 %\n  stages: [{}, { capacitor: 1 % }]\n`;
    expect(load(text).tolerance?.stages).toEqual([{}, { capacitor: 0.01 }]);
  });
});
