/**
 * The review workflow end to end, run as a user would (node bin/dacsmith.cjs, built by the vitest
 * globalSetup): `check` exit codes and formats, `compare` of two files and against a git revision,
 * `init` and its starter file.
 */
import { execFileSync } from 'node:child_process';
import { existsSync, mkdirSync, mkdtempSync, readFileSync, realpathSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join, resolve } from 'node:path';
import { Ajv2020 } from 'ajv/dist/2020.js';
import { beforeAll, describe, expect, inject, it } from 'vitest';
import { parse as parseYaml } from 'yaml';
import { root, runBuilt } from './runBuilt.js';

const work = realpathSync(mkdtempSync(join(tmpdir(), 'dacsmith-review-')));

/**
 * Run the built command without a terminal and without colour. Git never looks above `work`
 * (GIT_CEILING_DIRECTORIES), so "outside a repository" holds wherever the temporary folder is.
 */
function dacsmith(args: string[], cwd = work) {
  return runBuilt(args, { cwd, env: { GIT_CEILING_DIRECTORIES: work } });
}

function write(name: string, text: string): string {
  const path = join(work, name);
  mkdirSync(dirname(path), { recursive: true });
  writeFileSync(path, text);
  return path;
}

/** Invented one-stage project: 20 kHz, 10 bits, 3.3 V, symmetric 30 ohm driver, open output. */
const ONE_STAGE = `pwm:
  frequency: 20 kHz
  bits: 10
  high: 3.3 V
  low: 0 V
  driver: 30 ohm
  duty: { min: 10 %, max: 90 % }
filter:
  stages:
    - { r: 10k, c: 4.7u }
spec:
  ripple: 1 LSB
  droop: 1 LSB
`;
const PASSING = ONE_STAGE;
const FAILING = ONE_STAGE.replace('c: 4.7u', 'c: 100n');
const INVALID = ONE_STAGE.replace('r: 10k', 'r: 10 kV');

/**
 * Cells of a GitHub-flavoured Markdown table row. GFM spec 0.29, section 4.10 "Tables
 * (extension)": cells are split at pipes; a backslash escapes the next character, so an escaped
 * pipe stays in the cell (the splitting rule of cmark-gfm, from memory).
 */
function gfmCells(row: string): string[] {
  const body = row.trim().replace(/^\|/, '');
  const cells: string[] = [];
  let cell = '';
  for (let i = 0; i < body.length; i++) {
    if (body[i] === '\\' && i + 1 < body.length) {
      cell += body[i] + body[i + 1];
      i++;
    } else if (body[i] === '|') {
      cells.push(cell.trim());
      cell = '';
    } else cell += body[i];
  }
  if (cell.trim() !== '') cells.push(cell.trim());
  return cells;
}

/**
 * Every GFM table in a Markdown text: a header row, then the delimiter row (cells of dashes with
 * optional colons, GFM spec 4.10), then body rows, each with as many cells as the header.
 */
function gfmTables(markdown: string): Array<{ header: string[]; rows: string[][] }> {
  const lines = markdown.split('\n');
  const tables: Array<{ header: string[]; rows: string[][] }> = [];
  let inFence = false;
  for (let i = 0; i < lines.length; i++) {
    if (lines[i].startsWith('```')) inFence = !inFence;
    if (inFence || !lines[i].startsWith('|')) continue;
    const header = gfmCells(lines[i]);
    const delimiter = gfmCells(lines[i + 1] ?? '');
    expect(delimiter.length, `delimiter row after ${lines[i]}`).toBe(header.length);
    for (const d of delimiter) expect(d).toMatch(/^:?-+:?$/);
    const rows: string[][] = [];
    i += 2;
    while (i < lines.length && lines[i].startsWith('|')) rows.push(gfmCells(lines[i++]));
    for (const r of rows) expect(r.length, `row ${r.join(' | ')}`).toBe(header.length);
    tables.push({ header, rows });
  }
  return tables;
}

beforeAll(() => {
  const error = inject('buildError');
  if (error) throw new Error(`build failed, CLI tests cannot run:\n${error}`);
});

describe('dacsmith check', () => {
  const pass = write('check/pass.yaml', PASSING);
  const fail = write('check/fail.yaml', FAILING);
  const bad = write('check/bad.yaml', INVALID);

  it('exits 0 when every file passes, one PASS line per file', () => {
    const r = dacsmith(['check', pass, pass]);
    expect(r.code).toBe(0);
    expect(r.stderr).toBe('');
    const lines = r.stdout.trimEnd().split('\n');
    expect(lines).toHaveLength(2);
    for (const l of lines) expect(l).toMatch(/^PASS\s+\S+pass\.yaml\s+\(2 checks hold\)$/);
  });

  it('exits 1 when a spec fails, naming the failing spec with value and limit in engineering units', () => {
    const r = dacsmith(['check', pass, fail]);
    expect(r.code).toBe(1);
    const failLine = r.stdout.split('\n').find((l) => l.includes('fail.yaml'));
    // Ripple limit 1 LSB = 3.3 V / 1024 = 3.22 mV; the 100 nF filter ripples far more.
    expect(failLine).toMatch(/^FAIL\s+\S+fail\.yaml\s+ripple \d+(\.\d+)? mV > 3\.22 mV$/);
  });

  it('exits 2 when any file is invalid (invalid wins over fail) and still checks the others', () => {
    const r = dacsmith(['check', fail, bad, pass]);
    expect(r.code).toBe(2);
    expect(r.stdout).toMatch(/^FAIL\s+\S+fail\.yaml/m);
    expect(r.stdout).toMatch(/^PASS\s+\S+pass\.yaml/m);
    // The message names file, line and key path (ProjectError.format, design notes).
    expect(r.stderr).toContain(`${bad}:10:`);
    expect(r.stderr).toMatch(/filter\.stages/);
    expect(dacsmith(['check', pass, bad]).code).toBe(2);
    expect(dacsmith(['check', pass, join(work, 'check', 'missing.yaml')]).code).toBe(2);
  });

  it('--quiet prints nothing on stdout; the exit code and the errors remain', () => {
    expect(dacsmith(['check', pass, '--quiet'])).toMatchObject({ code: 0, stdout: '', stderr: '' });
    expect(dacsmith(['check', fail, '-q'])).toMatchObject({ code: 1, stdout: '' });
    const r = dacsmith(['check', bad, pass, '--quiet']);
    expect(r).toMatchObject({ code: 2, stdout: '' });
    expect(r.stderr).toContain(bad);
  });

  it('--format json gives one object { files: [{ file, pass, checks, error? }], pass }', () => {
    const r = dacsmith(['check', pass, fail, bad, '--format', 'json']);
    expect(r.code).toBe(2);
    const json = JSON.parse(r.stdout);
    expect(json.pass).toBe(false);
    expect(json.files.map((f: { file: string }) => f.file)).toEqual([pass, fail, bad]);
    expect(json.files.map((f: { pass: boolean }) => f.pass)).toEqual([true, false, false]);
    expect(json.files[0].error).toBeUndefined();
    expect(json.files[2].error).toContain(bad);
    expect(json.files[2].checks).toEqual([]);
    const ripple = json.files[1].checks.find((c: { name: string }) => c.name === 'ripple');
    expect(ripple).toMatchObject({ limit: 3.3 / 1024, pass: false, unit: 'V' });
    expect(ripple.value).toBeGreaterThan(ripple.limit);
  });

  it('--format markdown is a heading, a verdict and a well-formed table with a row per file', () => {
    const odd = write('check/a|b.yaml', PASSING); // a pipe in a name must not split the cell
    const r = dacsmith(['check', pass, fail, bad, odd, '--format', 'markdown']);
    expect(r.code).toBe(2);
    expect(r.stdout.split('\n')[0]).toMatch(/^## /);
    expect(r.stdout).toMatch(/^\*\*FAIL\*\*/m);
    const [table] = gfmTables(r.stdout);
    expect(table.header).toEqual(['File', 'Result', 'Details']);
    expect(table.rows.map((row) => row[1])).toEqual(['PASS', 'FAIL', 'INVALID', 'PASS']);
    expect(table.rows[3][0]).toContain('a\\|b.yaml');
  });

  it('shows an example in --help', () => {
    const r = dacsmith(['check', '--help']);
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/Examples:\n\s+dacsmith check /);
  });
});

describe('dacsmith compare', () => {
  it('compares two files: changed inputs, figures, a check that now fails; exit code of the head', () => {
    const base = write('cmp/base.yaml', PASSING);
    const head = write('cmp/head.yaml', FAILING);
    const r = dacsmith(['compare', base, head, '--format', 'json']);
    expect(r.code).toBe(1);
    const json = JSON.parse(r.stdout);
    expect(json.inputs).toEqual([{ key: 'filter.stages[0].c', label: 'C1', unit: 'F', base: 4.7e-6, head: 100e-9 }]);
    expect(json.checks.find((c: { name: string }) => c.name === 'ripple').status).toBe('now FAILS');
    expect(json.pass).toBe(false);
    // The other way round the head passes: exit 0, and the ripple check "now passes".
    const back = dacsmith(['compare', head, base]);
    expect(back.code).toBe(0);
    expect(back.stdout).toMatch(/ripple .*now passes/);
  });

  it('compares a file with its version at a git revision (git show REF:path from the repository top)', () => {
    const repo = join(work, 'repo');
    mkdirSync(join(repo, 'boards'), { recursive: true });
    const git = (...args: string[]) =>
      execFileSync('git', ['-c', 'user.name=Test', '-c', 'user.email=test@example.invalid', ...args], {
        cwd: repo,
        env: { ...process.env, GIT_CEILING_DIRECTORIES: work },
      });
    git('init', '-q');
    const init = dacsmith(['init', 'boards/dac.yaml', '--stages', '1'], repo);
    expect(init.code).toBe(0);
    const committed = readFileSync(join(repo, 'boards', 'dac.yaml'), 'utf8');
    git('add', '.');
    git('commit', '-q', '-m', 'starter');
    const c1 = /- \{ r: ([^,]+), c: ([^}]+) \}/.exec(committed);
    expect(c1).not.toBeNull();
    writeFileSync(join(repo, 'boards', 'dac.yaml'), committed.replace(`c: ${c1![2].trim()}`, 'c: 470 nF'));

    // Run from a subdirectory: the path must be taken relative to the repository top.
    const r = dacsmith(['compare', 'dac.yaml', '--git', 'HEAD', '--format', 'json'], join(repo, 'boards'));
    expect(r.stderr).toBe('');
    expect([0, 1]).toContain(r.code);
    const json = JSON.parse(r.stdout);
    expect(json.base.label).toBe('HEAD:boards/dac.yaml');
    expect(json.inputs.map((i: { key: string }) => i.key)).toEqual(['filter.stages[0].c']);
    expect(json.inputs[0].head).toBeCloseTo(470e-9, 18);

    // Cutoff of a single RC low-pass: fc = 1 / (2 pi R C) (any circuits handbook), here with the
    // driver (mean of 40 and 25 ohm, design notes) in series and the 10 pF load across C.
    const r1 = 10e3 + 32.5;
    const cutoff = json.figures.find((f: { key: string }) => f.key === 'cutoff');
    const baseC = json.inputs[0].base;
    expect(cutoff.base).toBeCloseTo(1 / (2 * Math.PI * r1 * (baseC + 10e-12)), 6);
    expect(cutoff.head).toBeCloseTo(1 / (2 * Math.PI * r1 * (470e-9 + 10e-12)), 6);
    expect(cutoff.deltaPercent).toBeCloseTo((100 * (cutoff.head - cutoff.base)) / cutoff.base, 9);
    expect(r.code).toBe(json.pass ? 0 : 1);

    const md = dacsmith(['compare', 'boards/dac.yaml', '--git', 'HEAD', '--format', 'markdown'], repo);
    expect(md.stdout.split('\n')[0]).toMatch(/^## .*HEAD:boards\/dac\.yaml/);
    expect(md.stdout).toMatch(/^\*\*(PASS|FAIL): /m);
    const tables = gfmTables(md.stdout);
    expect(tables.map((t) => t.header[0])).toEqual(['input', 'figure', 'check']);
    expect(tables[0].rows).toEqual([['C1', expect.stringMatching(/F$/), '470 nF', expect.stringMatching(/%\)$/)]]);
    expect(md.stdout.match(/^```text$/gm)).toHaveLength(2);
  });

  it('holds a git base revision to the byte rules of a file on disk (Latin-1, NUL, UTF-16 refused, exit 2)', () => {
    const repo = join(work, 'repo-bytes');
    mkdirSync(repo, { recursive: true });
    const git = (...args: string[]) =>
      execFileSync('git', ['-c', 'user.name=Test', '-c', 'user.email=test@example.invalid', ...args], {
        cwd: repo,
        env: { ...process.env, GIT_CEILING_DIRECTORIES: work },
      });
    git('init', '-q');
    const good = 'pwm: { frequency: 20 kHz, high: 3.3 V }\nfilter: { stages: [{ r: 4k7, c: 1u }] }\n';
    const bad: Array<[string, Buffer, RegExp]> = [
      ['latin1', Buffer.from(good.replace('4k7', '4k7 \u00b5'), 'latin1'), /HEAD:latin1\.yaml:2:.*not UTF-8 text: byte 0xB5/],
      ['nul', Buffer.from(`${good}\u0000`), /HEAD:nul\.yaml:3:1: .*NUL byte/],
      ['utf16', Buffer.concat([Buffer.from([0xff, 0xfe]), Buffer.from(good, 'utf16le')]), /HEAD:utf16\.yaml:1:1: .*UTF-16/],
    ];
    for (const [name, bytes] of bad) writeFileSync(join(repo, `${name}.yaml`), bytes);
    git('add', '.');
    git('commit', '-q', '-m', 'bytes');
    for (const [name, , message] of bad) {
      writeFileSync(join(repo, `${name}.yaml`), good);
      const r = dacsmith(['compare', `${name}.yaml`, '--git', 'HEAD'], repo);
      expect(r.code).toBe(2);
      expect(r.stderr).toMatch(message);
      expect(r.stderr.length).toBeLessThan(400); // no echo of the whole file
      expect(r.stdout).toBe('');
    }
  });

  it('exits 2 with a clear message outside a repository or when the file is not at that revision', () => {
    const outside = write('outside/dac.yaml', PASSING);
    const r = dacsmith(['compare', outside, '--git', 'HEAD']);
    expect(r.code).toBe(2);
    expect(r.stdout).toBe('');
    expect(r.stderr).toMatch(/not inside a git repository/);

    const repo = join(work, 'repo');
    const fresh = join(repo, 'boards', 'new.yaml');
    writeFileSync(fresh, PASSING);
    const missing = dacsmith(['compare', fresh, '--git', 'HEAD']);
    expect(missing.code).toBe(2);
    expect(missing.stderr).toMatch(/boards\/new\.yaml.*HEAD/);
    expect(dacsmith(['compare', fresh, '--git', 'no-such-branch']).code).toBe(2);
  });

  it('exits 2 for an invalid file or a wrong combination of arguments', () => {
    const base = write('cmp/base.yaml', PASSING);
    const bad = write('cmp/bad.yaml', INVALID);
    expect(dacsmith(['compare', base, bad]).code).toBe(2);
    expect(dacsmith(['compare', base]).code).toBe(2);
    expect(dacsmith(['compare', base, base, '--git', 'HEAD']).code).toBe(2);
  });

  it('shows an example in --help', () => {
    expect(dacsmith(['compare', '--help']).stdout).toMatch(/Examples:\n\s+dacsmith compare /);
  });
});

describe('dacsmith init', () => {
  it('writes dacsmith.yaml with a schema modeline, refuses to overwrite it, and --force does', () => {
    const dir = join(work, 'init-default');
    mkdirSync(dir);
    const first = dacsmith(['init'], dir);
    expect(first.code).toBe(0);
    const file = join(dir, 'dacsmith.yaml');
    const text = readFileSync(file, 'utf8');
    const modeline = /^# yaml-language-server: \$schema=(\S+)\n/.exec(text);
    expect(modeline).not.toBeNull();
    // The relative path leads from the file to this package's schema.
    expect(resolve(dir, modeline![1])).toBe(join(root, 'schemas', 'project.schema.json'));

    writeFileSync(file, 'mine\n');
    const again = dacsmith(['init'], dir);
    expect(again.code).toBe(2);
    expect(again.stderr).toMatch(/already exists/);
    expect(readFileSync(file, 'utf8')).toBe('mine\n');
    expect(dacsmith(['init', '--force'], dir).code).toBe(0);
    expect(readFileSync(file, 'utf8')).toBe(text);
  });

  it('writes to standard output with -', () => {
    const r = dacsmith(['init', '-', '--stages', '1']);
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/^# yaml-language-server: \$schema=/);
    expect(existsSync(join(work, '-'))).toBe(false);
  });

  it('writes files that check accepts and passes, and that the JSON Schema accepts', () => {
    const schema = JSON.parse(readFileSync(join(root, 'schemas', 'project.schema.json'), 'utf8'));
    // Ajv (JSON Schema 2020-12 validator) and the yaml package read the file independently of dacsmith.
    const validate = new Ajv2020({ strict: false, allErrors: true }).compile(schema);
    // A few option sets here; test/project/starter.test.ts sweeps many more in process.
    const variants = [[], ['--stages', '1', '--bits', '8', '--frequency', '62.5kHz', '--search'], ['--bits', '12', '--frequency', '1 kHz']];
    const files = variants.map((options, i) => {
      const file = join(work, 'init-variants', `v${i}.yaml`);
      mkdirSync(dirname(file), { recursive: true });
      expect(dacsmith(['init', file, ...options]).code, options.join(' ')).toBe(0);
      const doc = parseYaml(readFileSync(file, 'utf8'));
      expect(validate(doc), `${options.join(' ')}: ${JSON.stringify(validate.errors)}`).toBe(true);
      return file;
    });
    const r = dacsmith(['check', ...files, '--format', 'json']);
    expect(r.stderr).toBe('');
    expect(r.code).toBe(0);
    const json = JSON.parse(r.stdout);
    for (const f of json.files) expect(f.checks.map((c: { name: string }) => c.name)).toEqual(expect.arrayContaining(['ripple', 'droop', 'settling']));
    expect(json.files[1].checks.map((c: { name: string }) => c.name)).toContain('pin_current');
  });

  it('exits 2 for options out of range', () => {
    expect(dacsmith(['init', '-', '--bits', '3']).code).toBe(2);
    expect(dacsmith(['init', '-', '--stages', '3']).code).toBe(2);
    expect(dacsmith(['init', '-', '--frequency', '3 V']).code).toBe(2);
  });

  it('shows an example in --help', () => {
    expect(dacsmith(['init', '--help']).stdout).toMatch(/Examples:\n\s+dacsmith init/);
  });
});
