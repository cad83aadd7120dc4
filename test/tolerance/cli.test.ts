import { spawnSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, inject, it } from 'vitest';
import { describeError } from '../../src/cli/errors.js';
import { runTolerance, type ToleranceArgs } from '../../src/cli/tolerance.js';
import { MIN_SAMPLES_PER_THREAD } from '../../src/tolerance/parallel.js';

// The command's work function, run in-process (the lead registers the command in main.ts).
const sample = 'sample-configs/tolerance-fan-reference.yaml';
const args = (extra: Partial<ToleranceArgs>): ToleranceArgs => ({
  file: sample,
  format: 'text',
  charts: true,
  samples: 2000,
  workers: 1,
  ...extra,
});

describe('dacsmith tolerance', () => {
  it('prints the worst case, the yield and histograms with the limit marked; exit 1 when a worst case fails', async () => {
    const out = await runTolerance(args({}), { color: false });
    expect(out.stdout).toContain('Worst case over the tolerance box');
    expect(out.stdout).toContain('Monte Carlo');
    expect(out.stdout).toMatch(/yield: +\d+\.\d\d % \(\d+ of 2000/);
    expect(out.stdout).toContain('Distributions');
    expect(out.stdout).toMatch(/-+ {2}limit 280 µV/);
    expect(out.stdout).toContain('FAIL: worst case fails: worst ripple');
    expect(out.stdout).not.toMatch(/\x1b\[/);
    expect(out.code).toBe(1);
  });

  it('JSON holds the contract keys, SI numbers, nothing else on stdout, and repeats with the same seed', async () => {
    const a = await runTolerance(args({ format: 'json', seed: 77 }), { color: false });
    const body = JSON.parse(a.stdout);
    expect(body.worstCase.worstRipple.value).toBeGreaterThan(2.8e-4);
    expect(body.worstCase.worstRipple.pass).toBe(false);
    expect(typeof body.worstCase.settlingTime.value).toBe('number');
    expect(typeof body.worstCase.droop.value).toBe('number');
    expect(body.monteCarlo.samples).toBe(2000);
    expect(body.monteCarlo.seed).toBe(77);
    expect(body.monteCarlo.yield).toBeGreaterThan(0.9);
    expect(body.monteCarlo.yield).toBeLessThanOrEqual(1);
    expect(Object.keys(body.worstCase.worstRipple.at)).toContain('driver.high');
    const b = await runTolerance(args({ format: 'json', seed: 77 }), { color: false });
    expect(b.stdout).toBe(a.stdout);
    const c = await runTolerance(args({ format: 'json', seed: 78 }), { color: false });
    expect(JSON.parse(c.stdout).monteCarlo.percentiles).not.toEqual(body.monteCarlo.percentiles);
  });

  it('Markdown: the same sections as GitHub-flavoured Markdown', async () => {
    const out = await runTolerance(args({ format: 'markdown', samples: 500 }), { color: false });
    expect(out.stdout.startsWith('# Tolerance study: ')).toBe(true);
    expect(out.stdout).toContain('## Monte Carlo');
    expect(out.stdout).toMatch(/\| figure \| nominal \| worst case \|/);
    expect(out.stdout).toContain('```text');
  });

  it('exit 0 when every limit holds at the worst case and no yield target is set', async () => {
    const out = await runTolerance(
      { file: 'sample-configs/greenhouse-heater.yaml', format: 'json', charts: false, samples: 300, workers: 1 },
      { color: false },
    );
    expect(JSON.parse(out.stdout).pass).toBe(true);
    expect(out.code).toBe(0);
  });

  it('a project where no sample settles: the settling histogram is one "never settles" row, in every format', async () => {
    // Invented: 1 kHz PWM into 1 kohm / 100 nF (tau = T / 10). A first-order RC's steady ripple at
    // 50 % duty is V tanh(T / (4 tau)) (the standard RC charge/discharge result; from memory):
    // 3.3 V tanh(2.5) = 3.26 V, against a band of 0.5 LSB = 6.4 mV; at the step's 90 % end it is
    // still over 1 V at the corners of a 20 % capacitor tolerance: every sample never settles.
    const dir = mkdtempSync(join(tmpdir(), 'dacsmith-tol-'));
    const file = join(dir, 'never.yaml');
    writeFileSync(
      file,
      [
        'pwm: { frequency: 1 kHz, bits: 8, high: 3.3 V }',
        'filter:',
        '  stages:',
        '    - { r: 1k, c: 100n }',
        'spec:',
        '  settling: { band: 0.5 LSB, time: 50 ms, from: 10 %, to: 90 % }',
        'tolerance: { resistor: 1 %, capacitor: 20 %, samples: 200 }',
        '',
      ].join('\n'),
    );
    const text = await runTolerance({ file, format: 'text', charts: true, workers: 1 }, { color: false });
    expect(text.code).toBe(1);
    expect(text.stdout).toMatch(/Settling time\n\s+-+ {2}limit 50 ms: no sample settles\n\s+never settles \|x+ 200\n/);
    const json = JSON.parse((await runTolerance({ file, format: 'json', charts: true, workers: 1 }, { color: false })).stdout);
    expect(json.monteCarlo.yield).toBe(0);
    const html = await runTolerance({ file, format: 'html', charts: true, workers: 1 }, { color: false });
    expect(html.stdout).not.toContain('NaN');
    const md = await runTolerance({ file, format: 'markdown', charts: true, workers: 1 }, { color: false });
    expect(md.stdout).toContain('never settles |');
  });

  it('bad input is exit 2 with a message naming the file and key', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'dacsmith-tol-'));
    const file = join(dir, 'no-tolerance.yaml');
    writeFileSync(file, 'pwm: { frequency: 20 kHz, high: 3.3 V }\nfilter:\n  stages:\n    - { r: 1k, c: 1u }\n');
    const missing = await runTolerance({ file, format: 'text', charts: false, workers: 1 }, { color: false }).catch((e) => e);
    expect(describeError(missing)).toEqual({ code: 2, message: expect.stringMatching(/no-tolerance\.yaml: tolerance: /) });
    const zero = await runTolerance(args({ samples: 0 }), { color: false }).catch((e) => e);
    expect(describeError(zero).code).toBe(2);
    expect(describeError(zero).message).toContain('--samples');
  });
});

describe('dacsmith tolerance, the built command (bin/dacsmith.cjs, worker threads from dist/)', () => {
  const root = join(dirname(fileURLToPath(import.meta.url)), '..', '..');
  const run = (...a: string[]) => {
    const r = spawnSync(process.execPath, [join(root, 'bin', 'dacsmith.cjs'), 'tolerance', ...a], {
      cwd: root,
      encoding: 'utf8',
      env: { ...process.env, NO_COLOR: '1' },
    });
    return { code: r.status, stdout: r.stdout, stderr: r.stderr };
  };

  it('runs the sample with two workers: the same JSON as one worker, exit 1, nothing on stderr', () => {
    expect(inject('buildError')).toBeNull();
    // Enough samples for two threads (this one and a worker, MIN_SAMPLES_PER_THREAD each).
    const n = String(2 * MIN_SAMPLES_PER_THREAD);
    const two = run(sample, '--samples', n, '--workers', '2', '--format', 'json');
    const one = run(sample, '--samples', n, '--workers', '1', '--format', 'json');
    expect(two.code).toBe(1);
    expect(two.stderr).toBe('');
    expect(two.stdout).toBe(one.stdout);
    expect(JSON.parse(two.stdout).monteCarlo.samples).toBe(2 * MIN_SAMPLES_PER_THREAD);
  });

  it('a bad option value is exit 2 with a message and no stack trace', () => {
    const r = run(sample, '--samples', '-5');
    expect(r.code).toBe(2);
    expect(r.stderr).toContain('--samples');
    expect(r.stderr).not.toMatch(/\n\s+at /);
  });
});
