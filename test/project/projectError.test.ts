import { describe, expect, it } from 'vitest';
import { formatIssue, lsbOf, ProjectError } from '../../src/project/index.js';
import { formatKeyPath } from '../../src/project/keyPath.js';

describe('ProjectError and its format', () => {
  it('writes FILE:LINE:COL: key.path: message, leaving out what is unknown', () => {
    expect(formatIssue({ file: 'p.yaml', path: 'filter.stages[1].c', line: 12, column: 10, message: 'm' })).toBe(
      'p.yaml:12:10: filter.stages[1].c: m',
    );
    expect(formatIssue({ file: 'p.yaml', path: '', line: 1, column: 1, message: 'm' })).toBe('p.yaml:1:1: m');
    expect(formatIssue({ file: 'p.yaml', path: '', message: 'no such file' })).toBe('p.yaml: no such file');
  });

  it('sorts issues by position and exposes the first', () => {
    const e = new ProjectError([
      { file: 'p.yaml', path: 'b', line: 9, column: 1, message: 'second' },
      { file: 'p.yaml', path: 'a', line: 2, column: 5, message: 'first' },
    ]);
    expect(e.name).toBe('ProjectError');
    expect(e).toBeInstanceOf(Error);
    expect([e.file, e.path, e.line, e.column, e.message]).toEqual(['p.yaml', 'a', 2, 5, 'first']);
    expect(e.format()).toBe('p.yaml:2:5: a: first\np.yaml:9:1: b: second');
    expect(() => new ProjectError([])).toThrow(RangeError);
  });

  it('formats key paths with dots and list indexes', () => {
    expect(formatKeyPath(['filter', 'stages', 1, 'c'])).toBe('filter.stages[1].c');
    expect(formatKeyPath([])).toBe('');
    expect(formatKeyPath(['tolerance', 'driver', 'high', 'min'])).toBe('tolerance.driver.high.min');
  });
});

describe('lsbOf', () => {
  it('is (high - low) / 2^bits, undefined without bits (model.md, definitions)', () => {
    const pwm = { frequency: 1e4, prescaler: 1, alignment: 'edge' as const, high: 3.3, low: 0, driver: { high: 0, low: 0 }, duty: { min: 0, max: 1 } };
    expect(lsbOf({ pwm: { ...pwm, bits: 10 } })).toBe(3.3 / 1024);
    expect(lsbOf({ pwm: { ...pwm, bits: 8, low: -5, high: 5 } })).toBe(10 / 256);
    expect(lsbOf({ pwm })).toBeUndefined();
  });
});
