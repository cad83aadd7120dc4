/**
 * Input limits of the project reader (readYamlDocument): what a project file never needs is
 * refused before any work, with a message of bounded length naming the file, line and key path.
 * The limits themselves are our own choice (a real project file has a few dozen keys); the YAML
 * rules used are those of YAML 1.2 (yaml.org/spec/1.2.2): section 5.4 (line breaks: CR LF, CR or
 * LF), sections 7.3-7.4 (flow collections).
 */
import { describe, expect, it } from 'vitest';
import { loadProject, parseProject } from '../../src/project/index.js';
import { MAX_NESTING_DEPTH, MAX_PROJECT_LINES, MAX_PROJECT_NODES, MAX_STRING_LENGTH } from '../../src/project/readYamlDocument.js';
import { openFlowCollections } from '../../src/project/openFlowCollections.js';
import { fixture, projectErrorOf } from './fixtures.js';

const MINIMAL = 'pwm:\n  frequency: 20 kHz\n  high: 3.3 V\nfilter:\n  stages:\n    - { r: 4k7, c: 100n }\n';
const errorOf = (text: string) => projectErrorOf(() => parseProject(text, 'p.yaml'));
const longestLine = (text: string) => Math.max(...text.split('\n').map((l) => l.length));

describe('project reader: input limits before any work', () => {
  it('refuses a file of many lines at the first line past the limit', () => {
    const text = MINIMAL + Array.from({ length: 60000 }, (_, i) => `k${i}: 1\n`).join('');
    const e = errorOf(text);
    expect(e.issues).toHaveLength(1);
    expect(e.issues[0]).toMatchObject({ line: MAX_PROJECT_LINES + 1 });
    expect(e.format()).toMatch(/more than 5000 lines/);
  });

  it('refuses many keys on one line (flow mapping) by counting nodes', () => {
    const text = MINIMAL + `extra: {${Array.from({ length: 20000 }, (_, i) => `k${i}: 1`).join(', ')}}\n`;
    const e = errorOf(text);
    expect(e.issues).toHaveLength(1);
    expect(e.issues[0].message).toBe(`more than ${MAX_PROJECT_NODES} keys and list items; a project file has a few dozen`);
    expect(e.issues[0].line).toBe(7);
  });

  it('refuses flow brackets nested 5000 deep before the parser recurses, at the bracket past the limit', () => {
    const text = MINIMAL + `extra: ${'['.repeat(5000)}${']'.repeat(5000)}\n`;
    const e = errorOf(text);
    expect(e.issues[0]).toMatchObject({ line: 7, column: 8 + MAX_NESTING_DEPTH });
    expect(e.format().length).toBeLessThan(200);
  });

  it('refuses block nesting past the limit in the walk, with a shortened key path', () => {
    let text = MINIMAL + 'extra:\n';
    for (let d = 1; d <= 40; d++) text += `${' '.repeat(2 * d)}level${d}:\n`;
    text += `${' '.repeat(82)}x: 1\n`;
    const e = errorOf(text);
    expect(e.issues[0].message).toMatch(new RegExp(`nested more than ${MAX_NESTING_DEPTH} levels deep`));
    expect(e.issues[0].path.length).toBeLessThanOrEqual(80);
    expect(e.issues[0].path).toMatch(/^extra\.level1\..*\.\.\..*level\d+$/);
  });

  it('refuses a value longer than the string limit', () => {
    const e = errorOf(MINIMAL.replace('3.3 V', `'${'3'.repeat(MAX_STRING_LENGTH + 1)} V'`));
    expect(e.issues[0]).toMatchObject({ path: 'pwm.high', line: 3 });
    expect(e.issues[0].message).toMatch(/a value of 1003 characters/);
  });
});

describe('project reader: messages point where the mistake is', () => {
  it('an unclosed flow sequence is reported at its opening bracket under the key that holds it', () => {
    const e = projectErrorOf(() => loadProject(fixture('flow-unclosed.yaml')));
    expect(e.issues[0]).toMatchObject({ line: 5, column: 11, path: 'pwm.driver' });
    expect(e.issues[0].message).toMatch(/this bracket is not closed/);
  });

  it('a section written twice names the section on its second line', () => {
    const e = projectErrorOf(() => loadProject(fixture('duplicate-section.yaml')));
    expect(e.format()).toBe(`${fixture('duplicate-section.yaml')}:8:1: pwm: duplicate key 'pwm'; a key may appear only once in a mapping`);
  });

  it('a repeated key inside a section names the key on its second line, not the section', () => {
    const e = projectErrorOf(() => loadProject(fixture('duplicate-stages.yaml')));
    expect(e.format()).toBe(`${fixture('duplicate-stages.yaml')}:6:3: filter.stages: duplicate key 'stages'; a key may appear only once in a mapping`);
  });

  it('CR-only line endings are line breaks (YAML 1.2, 5.4): messages have real lines and no raw CR', () => {
    const e = projectErrorOf(() => loadProject(fixture('cr-line-endings.yaml')));
    expect(e.format()).toBe(`${fixture('cr-line-endings.yaml')}:4:3: pwm.high: duplicate key 'high'; a key may appear only once in a mapping`);
    expect(parseProject(MINIMAL.replace(/\n/g, '\r'), 'p.yaml').pwm.frequency).toBe(20000);
  });

  it('control characters in a key are escaped, so a message stays on one line', () => {
    const e = errorOf(MINIMAL + '"a\\tb": 1\n"a\\tb": 2\n');
    expect(e.format()).not.toMatch(/[\t\r\n]/);
    expect(e.format()).toMatch(/duplicate key 'a\\tb'/);
    expect(longestLine(e.format())).toBeLessThan(200);
  });
});

describe('openFlowCollections', () => {
  it('skips brackets inside quoted scalars and comments', () => {
    expect(openFlowCollections("a: ['[', \"{\", x] # [[\nb: {c: 1}\n")).toEqual({ open: [], deepest: 1 });
    expect(openFlowCollections('a: [1, {b: [2').open).toEqual([3, 7, 11]);
    expect(openFlowCollections("a: 'it''s [' \nb: [").open).toEqual([17]);
  });
});
