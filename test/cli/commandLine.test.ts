/**
 * The command line keeps its word: one reading of every option, no silent overwrite, no gate that
 * passes on nothing, exit 2 (never 70) for the environment. Run as a user would, through the built
 * command. The boards are invented.
 */
import { spawnSync } from 'node:child_process';
import { copyFileSync, mkdtempSync, readFileSync, writeFileSync, existsSync, readdirSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { bin, root, runBuilt } from './runBuilt.js';
import { DEFAULT_MAX_TIME, searchDeadline } from '../../src/cli/design.js';

const sample = join(root, 'sample-configs', 'greenhouse-heater.yaml');
const scratch = () => mkdtempSync(join(tmpdir(), 'dacsmith-cli-'));

describe('options are read as written, or refused with exit 2 naming the option', () => {
  const refused: Array<[string[], RegExp]> = [
    [['analyze', sample, '--format', 'json', '--format', 'json'], /--format is given more than once/],
    [['analyze', sample, '--format'], /--format needs a value/],
    [['analyze', sample, '--quiet=maybe'], /--quiet is a switch/],
    [['analyze', sample, '--charts=maybe'], /--charts is a switch/],
    [['tolerance', sample, '--seed', ''], /--seed must be a whole number written in decimal digits, got ''/],
    [['tolerance', sample, '--samples', '0x10'], /--samples must be a whole number .* got '0x10'/],
    [['tolerance', sample, '--samples=1e3'], /--samples must be a whole number .* got '1e3'/],
    [['tolerance', sample, '--samples', '1000001'], /--samples 1000001: at most 1000000/],
    [['analyze', sample, '-q', '--quiet'], /-q is given more than once|--quiet is given more than once/],
    // the report said "uniform" while the normal distribution was sampled
    [['tolerance', sample, '--distribution', 'normal', '--distribution', 'uniform'], /--distribution is given more than once/],
    [['analyze', sample, '--csv', 'a.csv', '--csv', 'b.csv'], /--csv is given more than once/],
  ];
  for (const [args, message] of refused) {
    it(args.slice(2).join(' '), () => {
      const r = runBuilt(args);
      expect(r.code).toBe(2);
      expect(r.stderr).toMatch(message);
      expect(r.stdout).toBe('');
    });
  }

  it('accepts repeated --duty, --no-charts and --charts=false', () => {
    expect(runBuilt(['analyze', sample, '-q', '--duty', '0.3', '--duty', '50%', '--no-charts']).code).toBe(0);
    expect(runBuilt(['analyze', sample, '-q', '--charts=false']).code).toBe(0);
  });

  it('honours -- so that a file named -x.yaml can be given', () => {
    const dir = scratch();
    copyFileSync(sample, join(dir, '-x.yaml'));
    const r = runBuilt(['analyze', '--format', 'json', '--', '-x.yaml'], { cwd: dir });
    expect(r.code).toBe(0);
    expect(JSON.parse(r.stdout).pass).toBe(true);
  });
});

describe('check never passes on nothing', () => {
  it("refuses '-' (text and JSON) with exit 2", () => {
    for (const extra of [[], ['--format', 'json']]) {
      const r = runBuilt(['check', '-', ...extra]);
      expect(r.code).toBe(2);
      expect(r.stdout).toBe('');
      expect(r.stderr).toMatch(/name at least one file/);
    }
  });

  it('a glob that matched nothing reaches the command as its pattern: no such file, exit 2', () => {
    const r = runBuilt(['check', 'boards/*.yaml']);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/no such file/);
  });
});

describe('files written whole or not at all', () => {
  it('--csv refuses to overwrite the project file itself, even with --force, leaving it byte for byte', () => {
    const dir = scratch();
    const file = join(dir, 'board.yaml');
    copyFileSync(sample, file);
    const before = readFileSync(file);
    for (const extra of [[], ['--force']]) {
      const r = runBuilt(['analyze', file, '-q', '--csv', file, ...extra]);
      expect(r.code).toBe(2);
      expect(r.stderr).toMatch(/which this command reads/);
    }
    expect(readFileSync(file).equals(before)).toBe(true);
  });

  it('--csv keeps an existing file without --force and replaces it with --force', () => {
    const dir = scratch();
    const csv = join(dir, 'w.csv');
    writeFileSync(csv, 'keep me\n');
    expect(runBuilt(['analyze', sample, '-q', '--csv', csv]).code).toBe(2);
    expect(readFileSync(csv, 'utf8')).toBe('keep me\n');
    expect(runBuilt(['analyze', sample, '-q', '--csv', csv, '--force']).code).toBe(0);
    expect(readFileSync(csv, 'utf8')).toMatch(/^time_s,output_V,waveform,duty\n/);
    expect(readdirSync(dir)).toEqual(['w.csv']); // no temporary file left behind
  });

  it('a full device or a missing folder is exit 2 with the reason, not an internal error', () => {
    if (existsSync('/dev/full')) {
      const r = runBuilt(['analyze', sample, '-q', '--csv', '/dev/full']);
      expect(r.code).toBe(2);
      expect(r.stderr).toMatch(/--csv \/dev\/full: no space left on the device; nothing written/);
    }
    const r = runBuilt(['analyze', sample, '-q', '--csv', join(scratch(), 'missing', 'w.csv')]);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/no such folder; nothing written/);
  });

  it('init refuses an existing file without --force', () => {
    const dir = scratch();
    const file = join(dir, 'dacsmith.yaml');
    writeFileSync(file, '# mine\n');
    const r = runBuilt(['init', file]);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/already exists/);
    expect(readFileSync(file, 'utf8')).toBe('# mine\n');
  });
});

describe('a closed pipe is not a failing spec', () => {
  it('analyze --format json | head -c 10 ends with the command exit code and no stack', () => {
    // 4000 duties make about 0.6 MB of JSON, far more than a pipe buffers (64 KiB on Linux, pipe(7)).
    const duties = Array.from({ length: 4000 }, (_, i) => `--duty ${(0.05 + (0.9 * i) / 3999).toFixed(6)}`).join(' ');
    const r = spawnSync('bash', ['-c', `"${process.execPath}" "${bin}" analyze "${sample}" --format json ${duties} | head -c 10 >/dev/null; echo "\${PIPESTATUS[0]}"`], {
      encoding: 'utf8',
      env: { ...process.env, NO_COLOR: '1' },
    });
    expect(r.stdout.trim()).toBe('0');
    expect(r.stderr).not.toMatch(/EPIPE|at /);
  });
});

describe('check with design-only files among projects (the README CI recipe: check boards/*.yaml)', () => {
  const designOnly = join(root, 'sample-configs', 'design-wide-e24.yaml');

  it('lists a design-only file as SKIP and lets the others decide the exit code', () => {
    const r = runBuilt(['check', sample, designOnly]);
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/^SKIP\s+.*design-wide-e24\.yaml\s+\(design-only/m);
    const json = JSON.parse(runBuilt(['check', sample, designOnly, '--format', 'json']).stdout);
    expect(json.files[1]).toMatchObject({ skipped: expect.stringMatching(/^design-only/) });
    expect(json.pass).toBe(true);
  });

  it('refuses a run where every file is design-only: nothing was checked', () => {
    const r = runBuilt(['check', designOnly]);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/nothing to check/);
  });
});

describe('tolerance.stages longer than the filter', () => {
  it('names the override that has no stage, with its line', () => {
    const file = join(root, 'test', 'fixtures', 'projects', 'tolerance-stage-overrides-too-many.yaml');
    const r = runBuilt(['tolerance', file]);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/tolerance-stage-overrides-too-many\.yaml:8:7: tolerance\.stages\[1\]: the filter has 1 stage/);
  });
});

describe('design --max-time stops a long search cleanly', () => {
  it('marks the result incomplete (JSON complete: false) and says so, without an explanation it had no time for', () => {
    // Three stages of E96 at three resolutions, with and without a follower: many minutes without
    // a time limit. The time runs out while the 17 million three-stage resistor tuples are still
    // being listed, which must stop too (the listing took about 30 s of its own before it checked
    // the clock).
    const file = join(root, 'test', 'fixtures', 'projects', 'long-search.yaml');
    const r = runBuilt(['design', file, '--max-time', '1', '--format', 'json', '--no-charts']);
    expect(r.code).toBe(1);
    const out = JSON.parse(r.stdout);
    expect(out.complete).toBe(false);
    expect(out.diagnosis).toEqual([]);
    const text = runBuilt(['design', file, '--max-time', '1', '--no-charts', '--width', '300']).stdout;
    expect(text).toMatch(/Incomplete: stopped at the time limit \(--max-time\)/);
    // The verdict agrees: nothing found in time is not "no design in the search space".
    expect(text).toMatch(/FAIL: no design found before the time limit/);
    expect(text).not.toMatch(/no design in the search space/);
    expect(text).not.toMatch(/No design meets every limit/);
  });

  it('without --max-time the search still stops, after DEFAULT_MAX_TIME seconds', () => {
    // (a three-stage space with nothing feasible and no settling limit would otherwise run for hours)
    expect(DEFAULT_MAX_TIME).toBe(60);
    expect(searchDeadline({ maxTime: undefined }, 1000)).toBe(1000 + 60_000);
    expect(searchDeadline({ maxTime: 5 }, 1000)).toBe(6000);
    expect(runBuilt(['design', '--help']).stdout).toMatch(/default 60/);
  });

  it('--robust takes the time limit too: a search cut by it says so', () => {
    const file = join(root, 'test', 'fixtures', 'projects', 'long-search.yaml');
    const withTolerance = join(mkdtempSync(join(tmpdir(), 'dacsmith-')), 'long-robust.yaml');
    writeFileSync(withTolerance, readFileSync(file, 'utf8') + 'tolerance: { resistor: 1 %, capacitor: 10 % }\n');
    const r = runBuilt(['design', withTolerance, '--robust', 'worst-case', '--max-time', '1', '--format', 'json', '--no-charts']);
    expect(r.code).toBe(1);
    expect(JSON.parse(r.stdout).complete).toBe(false);
  });

  it('a search that ends in time is complete, and bad values are refused', () => {
    const out = JSON.parse(runBuilt(['design', join(root, 'sample-configs', 'design-tight-ripple.yaml'), '--max-time', '60', '--format', 'json', '--no-charts']).stdout);
    expect(out.complete).toBe(true);
    expect(runBuilt(['design', sample, '--max-time', '0']).stderr).toMatch(/--max-time 0: give whole seconds/);
    expect(runBuilt(['design', sample, '--max-time', '1.5']).code).toBe(2);
  });
});

describe('design --curve-effort', () => {
  it('passes the limit on (a low one leaves the two-stage curve out and says so) and refuses bad values', () => {
    // The wide E24 bench project: its two-stage curve takes about 46 000 fast evaluations.
    const file = join(root, 'scripts', 'bench-projects', 'wide-e24.yaml');
    const r = runBuilt(['design', file, '--curve-effort', '10000', '--format', 'json', '--top', '1']);
    const out = JSON.parse(r.stdout);
    expect(out.tradeoffNotDrawn).toEqual([2]);
    expect(out.tradeoff.map((c: { stages: number }) => c.stages)).toEqual([1]);
    expect(runBuilt(['design', file, '--curve-effort', '0']).stderr).toMatch(/--curve-effort 0: give a whole number of evaluations/);
    expect(runBuilt(['design', file, '--curve-effort', '2.5']).code).toBe(2);
  });
});
