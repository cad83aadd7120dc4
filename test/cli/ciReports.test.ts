/**
 * The CI outputs end to end (node bin/dacsmith.cjs, built by the vitest globalSetup): GitHub
 * workflow annotations from `check --format github` and `compare --format github`, on the line of
 * the limit in the project file, and the JUnit XML report of `check --junit FILE`.
 */
import { mkdtempSync, readFileSync, realpathSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { XMLParser, XMLValidator } from 'fast-xml-parser';
import { describe, expect, it } from 'vitest';
import { runBuilt } from './runBuilt.js';

const work = realpathSync(mkdtempSync(join(tmpdir(), 'dacsmith-ci-')));
const dacsmith = (args: string[]) => runBuilt(args, { cwd: work });
const write = (name: string, text: string) => {
  writeFileSync(join(work, name), text);
  return name;
};

/** Invented one-stage project: 20 kHz, 10 bits, 3.3 V, 30 ohm driver, open output. */
const PROJECT = `# invented test project
pwm:
  frequency: 20 kHz
  bits: 10
  high: 3.3 V
  low: 0 V
  driver: 30 ohm
  duty: { min: 10 %, max: 90 % }
filter:
  stages:
    - { r: 10k, c: 100n }
spec:
  droop: 1 LSB
  ripple: 1 LSB
search:
  resistance: { min: 1k, max: 100k }
  capacitance: { min: 1n, max: 10u }
  pin_current: 0.1 mA
`;

/** 1-based line and column where `text` first appears in the file, found here by plain search. */
function where(source: string, text: string): { line: number; col: number } {
  const lines = source.split('\n');
  const i = lines.findIndex((l) => l.includes(text));
  if (i < 0) throw new Error(`'${text}' not in the file`);
  return { line: i + 1, col: lines[i].indexOf(text) + 1 };
}

/**
 * A workflow-command line read back as GitHub's runner reads it: `::level props::message`, props
 * split at ',' and '=' and then unescaped (%2C, %3A, %0D, %0A, %25; the escaping of actions/toolkit
 * command.ts, from memory).
 */
function readAnnotation(line: string) {
  const m = /^::(error|warning|notice) ([^:]*)::(.*)$/.exec(line);
  if (!m) return undefined;
  const unescape = (s: string) => s.replace(/%0D/g, '\r').replace(/%0A/g, '\n').replace(/%3A/g, ':').replace(/%2C/g, ',').replace(/%25/g, '%');
  const props = Object.fromEntries(m[2].split(',').map((p) => [p.slice(0, p.indexOf('=')), unescape(p.slice(p.indexOf('=') + 1))]));
  return { level: m[1], props, message: unescape(m[3]) };
}

const annotations = (stdout: string) => stdout.split('\n').map(readAnnotation).filter((a) => a !== undefined);

describe('check --format github', () => {
  it('puts one error on the line of each failing limit and a warning on the warned key', () => {
    // ripple fails (10k-100n at 20 kHz), pin current fails (3.3 V / 10 kohm > 0.1 mA), droop holds
    // (open output); a 0.1 pF load capacitance (below 1 pF) is warned about
    const file = write('fails.yaml', PROJECT.replace('filter:', 'load:\n  capacitance: 0.1p\nfilter:'));
    const source = readFileSync(join(work, file), 'utf8');
    const r = dacsmith(['check', file, '--format', 'github']);
    expect(r.code).toBe(1);
    const found = annotations(r.stdout);
    const ripple = found.find((a) => a.props.title?.includes('ripple'));
    expect(ripple).toMatchObject({ level: 'error', props: { file, line: String(where(source, 'ripple: 1 LSB').line), col: String(where(source, 'ripple: 1 LSB').col) } });
    expect(ripple?.message).toMatch(/^ripple .* > .*\(limit spec\.ripple\)$/);
    const pin = found.find((a) => a.props.title?.includes('pin_current'));
    expect(pin?.props.line).toBe(String(where(source, 'pin_current: 0.1 mA').line));
    // The warning: on the load capacitance's line, as a warning
    const warned = found.filter((a) => a.level === 'warning');
    expect(warned).toHaveLength(1);
    expect(warned[0].props.line).toBe(String(where(source, 'capacitance: 0.1p').line));
    expect(warned[0].message).toMatch(/^load\.capacitance: /);
    expect(found.map((a) => a.props.title)).not.toContain('dacsmith: droop fails');
    // The summary line for the log is plain text
    expect(r.stdout.trimEnd().split('\n').at(-1)).toBe('dacsmith check: 1 of 1 file fails its spec');
  });

  it('turns warnings into errors under --strict', () => {
    const file = write('strict.yaml', PROJECT.replace('c: 100n', 'c: 10u').replace('pin_current: 0.1 mA', 'pin_current: 10 mA').replace('filter:', 'load:\n  capacitance: 0.1p\nfilter:'));
    // Every limit holds; a 0.1 pF load capacitance (below 1 pF) is warned about
    const plainRun = dacsmith(['check', file, '--format', 'github']);
    expect(plainRun.code).toBe(0);
    const plain = annotations(plainRun.stdout);
    const strict = dacsmith(['check', file, '--format', 'github', '--strict']);
    expect(plain.some((a) => a.level === 'warning')).toBe(true);
    expect(strict.code).toBe(1);
    expect(annotations(strict.stdout).filter((a) => a.level === 'warning')).toEqual([]);
    expect(annotations(strict.stdout).filter((a) => a.level === 'error').length).toBe(plain.filter((a) => a.level === 'warning').length);
  });

  it('points the default gain check at spec, or at line 1 without a spec', () => {
    // A 2 kohm load behind 10 kohm divides the output to a sixth: the 2 % default gain limit fails
    const divider = PROJECT.replace('filter:', 'load:\n  resistance: 2k\nfilter:').replace(/spec:[\s\S]*$/, '');
    const withSpec = write('gain-spec.yaml', `${divider}spec:\n  ripple: 100 LSB\n`);
    const noSpec = write('gain-none.yaml', divider);
    const a = annotations(dacsmith(['check', withSpec, '--format', 'github']).stdout).find((x) => x.props.title === 'dacsmith: gain fails');
    expect(a?.props.line).toBe(String(where(readFileSync(join(work, withSpec), 'utf8'), 'spec:').line));
    expect(a?.message).toContain('default limit: the file has no spec.gain');
    const b = annotations(dacsmith(['check', noSpec, '--format', 'github']).stdout).find((x) => x.props.title === 'dacsmith: gain fails');
    expect(b?.props).toMatchObject({ line: '1', col: '1' });
  });

  it('annotates an invalid file at its bad value, exit 2', () => {
    const file = write('invalid.yaml', PROJECT.replace('c: 100n', 'c: 3.3 V'));
    const r = dacsmith(['check', file, '--format', 'github']);
    expect(r.code).toBe(2);
    const [a] = annotations(r.stdout);
    expect(a).toMatchObject({ level: 'error', props: { file, line: String(where(readFileSync(join(work, file), 'utf8'), '3.3 V }').line) } });
    expect(a.message).toContain('filter.stages[0].c');
  });

  it('compare annotates the head and says what the base did', () => {
    const base = write('base.yaml', PROJECT.replace('c: 100n', 'c: 10u').replace('pin_current: 0.1 mA', 'pin_current: 10 mA'));
    const head = write('head.yaml', PROJECT.replace('pin_current: 0.1 mA', 'pin_current: 10 mA'));
    const r = dacsmith(['compare', base, head, '--format', 'github']);
    expect(r.code).toBe(1);
    const found = annotations(r.stdout);
    expect(found).toHaveLength(1);
    expect(found[0].props).toMatchObject({ file: head, line: String(where(PROJECT, 'ripple: 1 LSB').line) });
    expect(found[0].message).toMatch(/; passes in base\.yaml$/);
  });
});

describe('check --junit', () => {
  it('writes a JUnit report: a testsuite per file, a testcase per check, failure and error elements', () => {
    const pass = write('j-pass.yaml', PROJECT.replace('c: 100n', 'c: 10u').replace('pin_current: 0.1 mA', 'pin_current: 10 mA'));
    const fail = write('j-fail.yaml', PROJECT);
    const bad = write('j-bad.yaml', PROJECT.replace('r: 10k', 'r: 10 kV'));
    const r = dacsmith(['check', pass, fail, bad, '--junit', 'report.xml']);
    expect(r.code).toBe(2);
    const text = readFileSync(join(work, 'report.xml'), 'utf8');
    // Well-formed XML (fast-xml-parser's validator), then the common JUnit shape
    expect(XMLValidator.validate(text)).toBe(true);
    const doc = new XMLParser({ ignoreAttributes: false, attributeNamePrefix: '', isArray: (name) => ['testsuite', 'testcase'].includes(name) }).parse(text);
    const suites = doc.testsuites.testsuite;
    expect(suites.map((s: { name: string }) => s.name)).toEqual([pass, fail, bad]);
    const [ok, failing, invalid] = suites;
    expect(ok.testcase.map((c: { name: string }) => c.name)).toEqual(['ripple', 'droop', 'pin_current']);
    expect(ok.testcase.every((c: object) => !('failure' in c))).toBe(true);
    expect(ok).toMatchObject({ tests: '3', failures: '0', errors: '0' });
    const failed = failing.testcase.filter((c: object) => 'failure' in c);
    expect(failed.map((c: { name: string }) => c.name)).toEqual(['ripple', 'pin_current']);
    expect(failing.failures).toBe('2');
    expect(failed[0].line).toBe(String(where(PROJECT, 'ripple: 1 LSB').line));
    expect(failed[0].failure.message).toMatch(/^ripple .* > /);
    expect(invalid.testcase[0].error.message).toContain('filter.stages[0].r');
    expect(doc.testsuites).toMatchObject({ tests: '7', failures: '2', errors: '1' });
  });

  it('never writes the report over a project file', () => {
    const file = write('j-self.yaml', PROJECT);
    const r = dacsmith(['check', file, '--junit', file]);
    expect(r.code).toBe(2);
    expect(readFileSync(join(work, file), 'utf8')).toBe(PROJECT);
  });
});
