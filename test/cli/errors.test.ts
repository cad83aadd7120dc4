import { describe, expect, it } from 'vitest';
import { describeError, UsageError } from '../../src/cli/errors.js';
import { parseDuties } from '../../src/cli/duty.js';
import { ProjectError } from '../../src/project/index.js';

describe('describeError (exit codes of the design notes: 2 bad input; 70 internal, BSD sysexits EX_SOFTWARE)', () => {
  it('gives exit 2 and the loader message FILE:LINE:COL: key.path: message for a project error', () => {
    const e = new ProjectError([{ file: 'p.yaml', path: 'pwm.high', line: 4, column: 9, message: 'expected a voltage' }]);
    expect(describeError(e)).toEqual({ code: 2, message: 'p.yaml:4:9: pwm.high: expected a voltage' });
  });

  it('gives exit 2 for command-line mistakes and unreadable files, without a stack', () => {
    expect(describeError(new UsageError('--duty x'))).toEqual({ code: 2, message: 'dacsmith: --duty x' });
    const enoent = Object.assign(new Error('ENOENT: no such file'), { code: 'ENOENT', path: 'w/x.csv' });
    expect(describeError(enoent)).toEqual({ code: 2, message: 'w/x.csv: no such file' });
  });

  it('gives exit 70 for anything else, with the stack only when DACSMITH_DEBUG is set', () => {
    const bug = new TypeError('x is undefined');
    const quiet = describeError(bug, {});
    expect(quiet.code).toBe(70);
    expect(quiet.message).toMatch(/^dacsmith: internal error: x is undefined\n/);
    expect(quiet.message).not.toContain(' at ');
    expect(describeError(bug, { DACSMITH_DEBUG: '1' }).message).toContain('TypeError: x is undefined\n    at ');
  });
});

describe('parseDuties', () => {
  it('reads fractions and percentages, repeated or comma-separated', () => {
    expect(parseDuties(undefined)).toBeUndefined();
    expect(parseDuties('0.25')).toEqual([0.25]);
    expect(parseDuties(['25%', '50 %,0.75', '0', '1', '.5', '100%'])).toEqual([0.25, 0.5, 0.75, 0, 1, 0.5, 1]);
  });

  it('refuses out-of-range values, bare numbers above 1 and non-numbers', () => {
    for (const bad of ['1.01', '-0.1', '101%', '-1%', '25', 'x', '', '0.5V', '1e400']) {
      expect(() => parseDuties(bad), bad).toThrow(UsageError);
    }
    expect(() => parseDuties('25')).toThrow(/write 25%/);
  });
});
