/**
 * The design-space keys for version 1.1 circuits (search.q, search.second_pwm) and the search keys a
 * version 1.1 file must keep to its own topology (search.stages, search.buffered): read into SI,
 * and refused at load with file, line, column and key path when they contradict the circuit.
 */
import { describe, expect, it } from 'vitest';
import { parseProject } from '../../src/project/index.js';
import { projectErrorOf } from './fixtures.js';

/** A file with an RC stage, a Sallen-Key stage and a complement output; `search` is the search section's lines. */
function fileWith(search: string[], second = '  into: { stage: 1, r: 10k, c: 1u }'): string {
  return [
    'pwm: { frequency: 20 kHz, bits: 10, high: 3.3 V }', // 1
    'filter:', //                                           2
    '  stages:', //                                         3
    '    - { r: 10k, c: 100n }', //                         4
    '    - { active: sallen-key, r1: 10k, r2: 10k, c1: 22n, c2: 10n }', // 5
    'second_pwm:', //                                       6
    '  role: complement', //                                7
    second, //                                              8
    'search:', //                                           9
    '  resistance: { min: 1k, max: 100k }', //             10
    '  capacitance: { min: 1n, max: 1u }', //              11
    ...search, //                                          12...
    '',
  ].join('\n');
}

const errorOf = (text: string) => projectErrorOf(() => parseProject(text, 'p.yaml')).format();

describe('search keys of version 1.1 circuits', () => {
  it('reads search.q and search.second_pwm into SI; the stages default to the file\'s count', () => {
    const p = parseProject(fileWith(['  q: { min: 0.55, max: 0.7 }', '  second_pwm: { r: { min: 4k7, max: 22k }, c: { min: 470n, max: 2u2 } }']), 'p.yaml');
    expect(p.search?.q).toEqual({ min: 0.55, max: 0.7 });
    expect(p.search?.secondPwm).toEqual({ r: { min: 4700, max: 22e3 }, c: { min: 470e-9, max: 2.2e-6 } });
    expect(p.search?.stages).toEqual([2]);
  });

  it('search.stages must repeat the file\'s stage count', () => {
    expect(errorOf(fileWith(['  stages: [1, 2]']))).toBe(
      "p.yaml:12:11: search.stages: a file with second_pwm or an active stage keeps its own 2 stages (filter.stages) and the search chooses their parts; give [2] or leave search.stages out",
    );
    expect(parseProject(fileWith(['  stages: [2]']), 'p.yaml').search?.stages).toEqual([2]);
  });

  it('search.buffered may not add a follower', () => {
    expect(errorOf(fileWith(['  buffered: [false, true]']))).toContain('p.yaml:12:13: search.buffered: a file with second_pwm or an active stage keeps its own followers');
  });

  it('search.q needs a Sallen-Key stage; its min may not exceed its max', () => {
    const plain = 'pwm: { frequency: 20 kHz, high: 3.3 V }\nfilter:\n  stages:\n    - { r: 10k, c: 100n }\nsearch:\n  resistance: { min: 1k, max: 100k }\n  capacitance: { min: 1n, max: 1u }\n  q: { min: 0.5, max: 0.7 }\n';
    expect(errorOf(plain)).toBe("p.yaml:8:3: search.q: applies to Sallen-Key stages (active: sallen-key), and filter.stages has none; remove search.q");
    expect(errorOf(fileWith(['  q: { min: 0.8, max: 0.6 }']))).toBe('p.yaml:12:13: search.q.min: min (0.8) must be at most max (0.6)');
    expect(errorOf(fileWith(['  q: { min: 0, max: 0.6 }']))).toContain('p.yaml:12:13: search.q.min');
  });

  it('search.second_pwm needs second_pwm, and its c a series capacitor in the file', () => {
    const noSecond = fileWith(['  second_pwm: { r: { min: 1k, max: 10k } }']).replace('second_pwm:\n  role: complement\n  into: { stage: 1, r: 10k, c: 1u }\n', '');
    expect(errorOf(noSecond)).toBe('p.yaml:9:3: search.second_pwm: chooses the parts of the second PWM output, and the file has no second_pwm; remove it');
    const noC = fileWith(['  second_pwm: { c: { min: 1n, max: 10n } }'], '  into: { stage: 1, r: 10k }');
    expect(errorOf(noC)).toBe('p.yaml:12:17: search.second_pwm.c: second_pwm.into has no series capacitor c to choose; give into.c in the file, or remove this range');
  });

  it('search.second_pwm ranges are checked like the others (unit, order)', () => {
    expect(errorOf(fileWith(['  second_pwm: { r: { min: 22k, max: 4k7 } }']))).toBe('p.yaml:12:27: search.second_pwm.r.min: min (22 kohm) must be at most max (4.7 kohm)');
    expect(errorOf(fileWith(['  second_pwm: { r: { min: 1 uF, max: 4k7 } }']))).toMatch(/^p\.yaml:12:27: search\.second_pwm\.r\.min: /);
  });
});
