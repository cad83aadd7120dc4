import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeAll, describe, expect, inject, it } from 'vitest';
import { root, runBuilt } from './runBuilt.js';

const sample = (name: string) => join(root, 'sample-configs', name);
const work = mkdtempSync(join(tmpdir(), 'dacsmith-cli-'));

/** Run the built command like a user would, without a terminal and without colour. */
function dacsmith(...args: string[]) {
  return dacsmithIn(root, ...args);
}

function dacsmithIn(cwd: string, ...args: string[]) {
  return runBuilt(args, { cwd });
}

function project(name: string, yaml: string): string {
  const path = join(work, name);
  writeFileSync(path, yaml);
  return path;
}

const GOOD = `pwm:
  frequency: 20 kHz
  bits: 10
  high: 3.3 V
  low: 0 V
  driver: 25 ohm
  duty: { min: 10 %, max: 90 % }
filter:
  stages:
    - { r: 10k, c: 2.2u }
spec:
  ripple: 1 LSB
`;

const noStackTrace = (s: string) => expect(s).not.toMatch(/^\s+at .+\(.*:\d+:\d+\)$|^\s+at .+:\d+:\d+$/m);

beforeAll(() => {
  const error = inject('buildError');
  if (error) throw new Error(`build failed, CLI tests cannot run:\n${error}`);
});

describe('dacsmith analyze', () => {
  it('exits 0 with a text report when every spec holds (greenhouse sample, the npm start showcase)', () => {
    const r = dacsmith('analyze', sample('greenhouse-heater.yaml'));
    expect(r.stderr).toBe('');
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/PASS: all \d spec checks hold\./);
    expect(r.stdout).not.toMatch(/\x1b\[/);
  });

  it('runs every sample configuration', () => {
    for (const name of ['greenhouse-heater.yaml', 'sensor-bias-trim.yaml', 'motor-current-ref.yaml']) {
      const r = dacsmith('analyze', sample(name), '--format', 'json');
      expect(r.stderr, name).toBe('');
      expect(r.code, name).toBe(0);
      expect(JSON.parse(r.stdout).pass, name).toBe(true);
    }
  });

  it('exits 1 when a spec fails, and says which', () => {
    const path = project('tight.yaml', GOOD.replace('ripple: 1 LSB', 'ripple: 0.001 LSB'));
    const r = dacsmith('analyze', path, '--no-charts');
    expect(r.code).toBe(1);
    expect(r.stdout).toMatch(/FAIL: ripple/);
  });

  it('prints exactly one JSON object with the contract keys (design notes) and nothing else', () => {
    const r = dacsmith('analyze', project('good.yaml', GOOD), '--format', 'json', '--duty', '25%', '--duty', '0.5');
    expect(r.code).toBe(0);
    const json = JSON.parse(r.stdout);
    expect(json.points.map((p: { duty: number }) => p.duty)).toEqual([0.25, 0.5]);
    for (const p of json.points) expect(Object.keys(p)).toEqual(expect.arrayContaining(['duty', 'average', 'min', 'max', 'ripple']));
    expect(Object.keys(json.worstRipple).sort()).toEqual(['duty', 'ripple']);
    expect(Object.keys(json.settling).sort()).toEqual(['band', 'from', 'time', 'to']);
    expect(typeof json.cutoff).toBe('number');
    expect(json.checks[0]).toMatchObject({ name: 'ripple', limit: 3.3 / 1024 });
    expect(json.pass).toBe(true);
  });

  it('accepts fractions, percent and comma lists for --duty', () => {
    const r = dacsmith('analyze', project('good.yaml', GOOD), '--format', 'json', '--duty', '0.1,35 %', '--duty', '100%');
    expect(JSON.parse(r.stdout).points.map((p: { duty: number }) => p.duty)).toEqual([0.1, 0.35, 1]);
  });

  it('exits 2 for an out-of-range or malformed --duty, without a stack trace', () => {
    for (const bad of ['1.5', '101%', '-0.1', 'half', '50']) {
      const r = dacsmith('analyze', project('good.yaml', GOOD), '--duty', bad);
      expect(r.code, bad).toBe(2);
      expect(r.stdout, bad).toBe('');
      expect(r.stderr, bad).toMatch(/--duty/);
      noStackTrace(r.stderr);
    }
  });

  it('exits 2 naming file, line and key path for a bad value in the project file', () => {
    const path = project('bad.yaml', GOOD.replace('r: 10k', 'r: banana'));
    const r = dacsmith('analyze', path);
    expect(r.code).toBe(2);
    expect(r.stdout).toBe('');
    // ProjectError.format(): FILE:LINE:COL: key.path: message; the bad value is on line 10.
    expect(r.stderr).toContain(`${path}:10:`);
    expect(r.stderr).toMatch(/filter\.stages.*\.r/);
    noStackTrace(r.stderr);
  });

  it('exits 2 for a missing file, an unknown option, or no command', () => {
    const missing = dacsmith('analyze', join(work, 'nope.yaml'));
    expect(missing.code).toBe(2);
    expect(missing.stderr).toContain('nope.yaml');
    noStackTrace(missing.stderr);
    const unknown = dacsmith('analyze', project('good.yaml', GOOD), '--colour');
    expect(unknown.code).toBe(2);
    expect(unknown.stderr).toMatch(/Unknown argument/i);
    expect(dacsmith().code).toBe(2);
  });

  it('is self-contained: runs from another directory with a relative path', () => {
    project('here.yaml', GOOD);
    const r = dacsmithIn(work, 'analyze', 'here.yaml', '--format', 'json');
    expect(r.stderr).toBe('');
    expect(r.code).toBe(0);
    expect(JSON.parse(r.stdout).inputs.file).toBe('here.yaml');
  });

  it('shows an example in --help', () => {
    const r = dacsmith('analyze', '--help');
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/Examples:\n\s+dacsmith analyze /);
  });

  it('writes the waveforms as CSV with a header', () => {
    const csv = join(work, 'waves.csv');
    const r = dacsmith('analyze', project('good.yaml', GOOD), '--format', 'json', '--csv', csv);
    expect(r.code).toBe(0);
    JSON.parse(r.stdout);
    const lines = readFileSync(csv, 'utf8').trimEnd().split('\n');
    expect(lines[0]).toBe('time_s,output_V,waveform,duty');
    const rows = lines.slice(1).map((l) => l.split(','));
    expect(rows.every((c) => c.length === 4 && Number.isFinite(Number(c[0])) && Number.isFinite(Number(c[1])))).toBe(true);
    expect(new Set(rows.map((c) => c[2]))).toEqual(new Set(['steady', 'step']));
    // Steady state at the worst-ripple duty: its spread is the reported worst ripple (sampled, so at most).
    const steady = rows.filter((c) => c[2] === 'steady').map((c) => Number(c[1]));
    const json = JSON.parse(r.stdout);
    const spread = Math.max(...steady) - Math.min(...steady);
    expect(spread).toBeLessThanOrEqual(json.worstRipple.ripple * (1 + 1e-9));
    expect(spread).toBeGreaterThan(0.95 * json.worstRipple.ripple);
  });

  it('exits 2 when the CSV file cannot be written', () => {
    const r = dacsmith('analyze', project('good.yaml', GOOD), '--csv', join(work, 'no-such-dir', 'w.csv'));
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/no-such-dir.*no such folder; nothing written/);
  });
});

describe('commands that need a filter, on a design-only file', () => {
  // A file with search: and no filter: is valid for `design`; the other commands refuse it as bad input.
  for (const command of ['analyze', 'tolerance']) {
    it(`${command} exits 2 naming the filter key`, () => {
      const r = dacsmith(command, sample('design-wide-e24.yaml'));
      expect(r.code).toBe(2);
      expect(r.stderr).toContain('design-wide-e24.yaml: filter: missing');
      expect(r.stderr).not.toMatch(/at .*\.js:\d+/);
    });
  }
  it('check exits 2 saying that a run of only design-only files checked nothing (test/cli/commandLine.test.ts has the mixed case)', () => {
    const r = dacsmith('check', sample('design-wide-e24.yaml'));
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/design-only .*nothing to check/);
  });
});

describe('--quiet on the commands that print reports', () => {
  // Conventions of the review workflow: --quiet prints nothing on stdout, the exit code tells.
  for (const command of ['analyze', 'design', 'tolerance']) {
    it(`${command} --quiet prints nothing and keeps the exit code`, () => {
      const extra = command === 'tolerance' ? ['--samples', '200'] : [];
      const loud = dacsmith(command, sample('greenhouse-heater.yaml'), '--no-charts', ...extra);
      const quiet = dacsmith(command, sample('greenhouse-heater.yaml'), '--no-charts', '--quiet', ...extra);
      expect(loud.stdout.length).toBeGreaterThan(0);
      expect(quiet.stdout).toBe('');
      expect(quiet.code).toBe(loud.code);
    });
  }
});

describe('a misspelt command', () => {
  it('is named as unknown, with the suggestion, exit 2', () => {
    const r = dacsmith('analyse', sample('greenhouse-heater.yaml'));
    expect(r.code).toBe(2);
    expect(r.stderr).toContain("unknown command 'analyse'");
    expect(r.stderr).toContain('Did you mean analyze?');
  });
});
