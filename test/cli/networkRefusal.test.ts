/**
 * Version 1.1 circuits (second_pwm, an active stage) on the command line: every command computes
 * them with the general engine (design: test/cli/networkDesign.test.ts); what is left to refuse is
 * input a command needs, such as a design file without a search section.
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

describe('design on version 1.1 circuits: input it still needs', () => {
  it('design on a version 1.1 file without a search section asks for one (not the old refusal)', () => {
    const r = runBuilt(['design', sallenKey, '--format', 'json']);
    expect(r.code).toBe(2);
    expect(r.stdout).toBe('');
    expect(r.stderr).toContain('search: missing; add a search section');
    expect(r.stderr).not.toContain('does not yet handle');
  });
});

describe('tolerance computes version 1.1 circuits (the general engine)', () => {
  const parts: Array<[string, string[]]> = [
    [complement, ['second output R', 'second output C', 'second output driver high', 'second output driver low']],
    [fine, ['second output R', 'second output driver high', 'second output driver low']],
    [sallenKey, ['stage 2 R1', 'stage 2 R2', 'stage 2 C1', 'stage 2 C2']],
  ];
  for (const [file, labels] of parts) {
    it(`${file}: exit 0 or 1 with the verdict, and the new parts in the report`, () => {
      const r = runBuilt(['tolerance', file, '--samples', '200', '--workers', '1', '--no-charts', '--width', '120']);
      expect(r.stderr).toBe('');
      expect([0, 1]).toContain(r.code);
      expect(r.stdout).toMatch(r.code === 0 ? /^PASS/m : /^FAIL/m);
      for (const label of labels) expect(r.stdout).toContain(label);
      expect(r.stdout).toContain('Worst case over the tolerance box');
      expect(r.stdout).toMatch(/yield: +\d+\.\d\d % \(\d+ of 200/);
    });
  }

  it('JSON: the shape of a ladder study, the new keys in `at`, exit as `pass`', () => {
    const ladder = JSON.parse(runBuilt(['tolerance', 'sample-configs/tolerance-fan-reference.yaml', '--samples', '50', '--workers', '1', '--format', 'json']).stdout);
    for (const [file, partKeys] of [
      [complement, ['second.r', 'second.c', 'second.driver.high', 'r2']],
      [fine, ['second.r', 'second.driver.low', 'c1']],
      [sallenKey, ['s2.r1', 's2.r2', 's2.c1', 's2.c2', 'r1']],
    ] as const) {
      const r = runBuilt(['tolerance', file, '--samples', '50', '--workers', '1', '--format', 'json']);
      const j = JSON.parse(r.stdout);
      // the keys of a ladder study's JSON at every level (which limits and figures appear follows the spec)
      const keys = (x: object) => Object.keys(x).sort();
      expect(keys(j)).toEqual(keys(ladder));
      expect(keys(j.worstCase)).toEqual(keys(ladder.worstCase));
      for (const f of ['worstRipple', 'droop', 'settlingTime']) expect(keys(j.worstCase[f])).toEqual(keys(ladder.worstCase[f]));
      expect(keys(j.worstCase.nominal)).toEqual(keys(ladder.worstCase.nominal));
      expect(keys(j.monteCarlo)).toEqual(keys(ladder.monteCarlo));
      expect(keys(j.monteCarlo.percentiles.worstRipple)).toEqual(keys(ladder.monteCarlo.percentiles.worstRipple));
      expect(keys(j.parameters[0])).toEqual(keys(ladder.parameters[0]));
      for (const key of partKeys) expect(Object.keys(j.worstCase.worstRipple.at)).toContain(key);
      expect(j.parameters.map((q: { key: string }) => q.key)).toEqual(expect.arrayContaining([...partKeys]));
      expect(r.code).toBe(j.pass ? 0 : 1);
    }
  });
});

describe('tolerance of a network in the built worker (dist/tolerance-worker.js)', () => {
  it('two threads give the JSON of one (1200 samples: 600 per thread, above the network threshold of 500)', () => {
    const run = (workers: string) => runBuilt(['tolerance', sallenKey, '--samples', '1200', '--workers', workers, '--format', 'json']);
    const one = run('1');
    const two = run('2');
    expect(two.stderr).toBe('');
    expect(two.stdout).toBe(one.stdout);
    expect(JSON.parse(two.stdout).monteCarlo.samples).toBe(1200);
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
