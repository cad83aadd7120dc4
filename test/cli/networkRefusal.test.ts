/**
 * Until the engine for version 1.1 circuits is in, every command that computes a ladder refuses a
 * file with second_pwm or an active stage: exit 2 (bad input, model.md), a message naming the
 * file, the line of the key, the key and the command, and nothing on standard output.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { runBuilt } from './runBuilt.js';

const complement = 'sample-configs/complement-ripple-cancel.yaml';
const fine = 'sample-configs/fine-16bit-setpoint.yaml';
const sallenKey = 'sample-configs/sallen-key-reference.yaml';
const plain = 'sample-configs/greenhouse-heater.yaml';

/** 1-based line and column where `text` first appears in the file. */
function lineOf(file: string, text: string): string {
  const lines = readFileSync(file, 'utf8').split('\n');
  const line = lines.findIndex((l) => l.includes(text));
  return `${line + 1}:${lines[line].indexOf(text) + 1}`;
}

describe('commands refuse version 1.1 circuits for now (exit 2)', () => {
  for (const [command, extra] of [
    ['analyze', []],
    ['design', ['--no-charts']],
    ['tolerance', ['--samples', '100', '--workers', '1']],
  ] as const) {
    it(`${command} on second_pwm`, () => {
      const r = runBuilt([command, complement, ...extra]);
      expect(r.code).toBe(2);
      expect(r.stdout).toBe('');
      expect(r.stderr).toContain(
        `${complement}:${lineOf(complement, 'second_pwm:')}: second_pwm: '${command}' does not yet handle a second PWM output (second_pwm, role complement)`,
      );
    });
  }

  it('analyze and design on an active stage name filter.stages[1].active and its line', () => {
    for (const command of ['analyze', 'design']) {
      const r = runBuilt([command, sallenKey, '--format', 'json']);
      expect(r.code).toBe(2);
      expect(r.stdout).toBe('');
      expect(r.stderr).toContain(`${sallenKey}:${lineOf(sallenKey, 'active:')}: filter.stages[1].active: '${command}' does not yet handle an active stage`);
    }
  });

  it('compare refuses when either file is a version 1.1 circuit', () => {
    for (const files of [[plain, fine], [fine, plain]]) {
      const r = runBuilt(['compare', ...files]);
      expect(r.code).toBe(2);
      expect(r.stderr).toContain(`second_pwm: 'compare' does not yet handle a second PWM output (second_pwm, role fine)`);
    }
  });

  it('check reports the file as bad input and still checks the others', () => {
    const r = runBuilt(['check', plain, sallenKey, '--format', 'json']);
    expect(r.code).toBe(2);
    expect(r.stderr).toContain(`filter.stages[1].active: 'check' does not yet handle an active stage`);
    const rows = JSON.parse(r.stdout);
    const files = (Array.isArray(rows) ? rows : rows.files).map((f: { file: string }) => f.file);
    expect(files).toEqual([plain, sallenKey]);
  });
});
