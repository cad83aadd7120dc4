/**
 * Version 1.1 circuits (second_pwm, an active stage) on the command line: analyze, check, compare and
 * design compute them with the general engine (design: test/cli/networkDesign.test.ts); tolerance
 * does not handle them yet and refuses the file with exit 2 (bad input, model.md), a message naming
 * the file, the line of the key, the key and the command, and nothing on standard output, rather
 * than compute them as a plain RC ladder.
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

describe('tolerance refuses version 1.1 circuits for now (exit 2); design no longer does', () => {
  it('tolerance on second_pwm', () => {
    const r = runBuilt(['tolerance', complement, '--samples', '100', '--workers', '1']);
    expect(r.code).toBe(2);
    expect(r.stdout).toBe('');
    expect(r.stderr).toContain(
      `${complement}:${lineOf(complement, 'second_pwm:')}: second_pwm: 'tolerance' does not yet handle a second PWM output (second_pwm, role complement)`,
    );
  });

  it('design on a version 1.1 file without a search section asks for one (not the old refusal)', () => {
    const r = runBuilt(['design', sallenKey, '--format', 'json']);
    expect(r.code).toBe(2);
    expect(r.stdout).toBe('');
    expect(r.stderr).toContain('search: missing; add a search section');
    expect(r.stderr).not.toContain('does not yet handle');
  });
});

describe('analyze, check and compare compute version 1.1 circuits', () => {
  it('analyze --format json of each sample: the model.md contract, a settled step and its checks', () => {
    for (const file of [complement, fine, sallenKey]) {
      const r = runBuilt(['analyze', file, '--format', 'json']);
      expect([0, 1]).toContain(r.code);
      const j = JSON.parse(r.stdout);
      expect(j.points.length).toBeGreaterThan(1);
      expect(j.worstRipple.ripple).toBeGreaterThan(0);
      expect(j.settling.time).toBeGreaterThan(0);
      expect(j.cutoff).toBeGreaterThan(0);
      expect(j.pass).toBe(j.checks.every((c: { pass: boolean }) => c.pass));
      expect(r.code).toBe(j.pass ? 0 : 1);
    }
  });

  it('the Sallen-Key report names the stage, its f0 and Q, and the ideal op-amp caution', () => {
    const r = runBuilt(['analyze', sallenKey, '--no-charts']);
    expect(r.stdout).toContain('Sallen-Key: r1 10k, r2 10k');
    expect(r.stdout).toMatch(/f0 1\.45 kHz, Q 0\.548/);
    expect(r.stdout).toContain('ideal op-amp');
  });

  it('check runs every file, plain and version 1.1 alike', () => {
    const r = runBuilt(['check', plain, sallenKey, complement, '--format', 'json']);
    expect([0, 1]).toContain(r.code);
    const rows = JSON.parse(r.stdout);
    const files = (Array.isArray(rows) ? rows : rows.files).map((f: { file: string }) => f.file);
    expect(files).toEqual([plain, sallenKey, complement]);
  });

  it('compare of a plain file and a version 1.1 file runs both engines', () => {
    const r = runBuilt(['compare', plain, fine]);
    expect([0, 1]).toContain(r.code);
    expect(r.stderr).toBe('');
  });
});
