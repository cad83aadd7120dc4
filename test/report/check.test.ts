/** renderCheck: the one-line-per-file text, the Markdown table and the JSON shape. */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import type { Check } from '../../src/engine/checks.js';
import { renderCheck, type CheckedFile } from '../../src/report/check.js';

const ripple = (value: number | null, limit: number): Check => ({ name: 'ripple', value, limit, unit: 'V', pass: value !== null && value <= limit });
const settling = (value: number | null, limit: number): Check => ({ name: 'settling', value, limit, unit: 's', pass: value !== null && value <= limit });
const file = (name: string, checks: Check[]): CheckedFile => ({ file: name, pass: checks.every((c) => c.pass), checks, warnings: [], lsb: 3.3 / 1024 });

describe('renderCheck text', () => {
  it('writes PASS with the number of checks, FAIL with each failing spec, value > limit', () => {
    const out = renderCheck(
      [file('a.yaml', [ripple(1e-3, 3.22e-3)]), file('bb.yaml', [ripple(4.12e-3, 1.61e-3), settling(null, 0.02), settling(0.01, 0.02)])],
      'text',
    );
    expect(out).toBe('PASS  a.yaml   (1 check holds)\nFAIL  bb.yaml  ripple 4.12 mV > 1.61 mV, settling never settles (limit 20 ms)\n');
  });

  it('prints enough digits that a value just over its limit does not read as equal', () => {
    const out = renderCheck([file('a.yaml', [ripple(1.6113e-3, 1.611e-3)])], 'text');
    expect(out).toContain('ripple 1.6113 mV > 1.611 mV');
  });

  it('leaves invalid files to standard error and colours only when asked', () => {
    const bad: CheckedFile = { file: 'bad.yaml', pass: false, checks: [], warnings: [], lsb: null, error: 'bad.yaml:1:1: pwm: required' };
    expect(renderCheck([bad], 'text')).toBe('');
    const good = [file('a.yaml', [ripple(1e-3, 2e-3)])];
    expect(renderCheck(good, 'text', { color: false })).not.toMatch(/\x1b\[/);
    expect(renderCheck(good, 'text', { color: true })).toMatch(/\x1b\[32mPASS/);
  });
});

describe('renderCheck warnings and the gain check', () => {
  const warning = { key: 'load.resistance', message: 'the load resistance read as 1 mΩ' };
  it('lists warnings under their own heading; with strict the details name the warned keys', () => {
    const warned: CheckedFile = { ...file('a.yaml', [ripple(1e-3, 2e-3)]), warnings: [warning] };
    const out = renderCheck([warned], 'text');
    expect(out).toBe('PASS  a.yaml  (1 check holds; 1 warning)\n\nWarnings\n  - a.yaml: load.resistance: the load resistance read as 1 mΩ\n');
    const strict = renderCheck([{ ...warned, pass: false }], 'text', { strict: true });
    expect(strict).toContain('FAIL  a.yaml  1 check holds; 1 warning (strict: fails): load.resistance');
    const md = renderCheck([warned], 'markdown');
    expect(md).toContain('### Warnings\n\n- a.yaml: load.resistance: the load resistance read as 1 mΩ');
    const j = JSON.parse(renderCheck([warned], 'json', { strict: true }));
    expect(j.warnings).toEqual([{ file: 'a.yaml', ...warning }]);
    expect(j.files[0].warnings).toEqual([warning]);
    expect(j.strict).toBe(true);
  });

  it('prints the gain check (a fraction of full scale) in percent, never with the unit "1"', () => {
    const gain: Check = { name: 'gain', value: 0.0912, limit: 0.02, unit: '1', pass: false };
    const out = renderCheck([file('a.yaml', [gain])], 'text');
    expect(out).toBe('FAIL  a.yaml  gain 9.12 % of full scale > 2 % of full scale\n');
  });
});

describe('renderCheck JSON and Markdown', () => {
  it('JSON holds files [{ file, pass, checks, warnings, error? }], warnings, strict and pass', () => {
    const bad: CheckedFile = { file: 'bad.yaml', pass: false, checks: [], warnings: [], lsb: null, error: 'bad.yaml:1:1: pwm: required' };
    const j = JSON.parse(renderCheck([file('a.yaml', [ripple(1e-3, 2e-3)]), bad], 'json'));
    expect(j).toEqual({
      files: [
        { file: 'a.yaml', pass: true, checks: [ripple(1e-3, 2e-3)], warnings: [] },
        { file: 'bad.yaml', pass: false, checks: [], warnings: [], error: 'bad.yaml:1:1: pwm: required' },
      ],
      warnings: [],
      strict: false,
      pass: false,
    });
  });

  it('Markdown keeps one row per file with three cells, whatever the file names hold', () => {
    // GFM spec 0.29, 4.10 Tables: a pipe inside a cell must be escaped; a backslash escapes the
    // next character. Split like cmark-gfm: skip escaped pairs, cut at bare pipes (from memory).
    const split = (row: string) => {
      const cells: string[] = [];
      let cell = '';
      for (let i = 1; i < row.length; i++) {
        if (row[i] === '\\') {
          cell += row[i] + (row[i + 1] ?? '');
          i++;
        } else if (row[i] === '|') {
          cells.push(cell);
          cell = '';
        } else cell += row[i];
      }
      return cells;
    };
    fc.assert(
      fc.property(fc.array(fc.string({ minLength: 1, maxLength: 12 }), { minLength: 1, maxLength: 5 }), (names) => {
        const md = renderCheck(names.map((n) => file(n, [ripple(1e-3, 2e-3)])), 'markdown');
        const rows = md.split('\n').filter((l) => l.startsWith('|'));
        expect(rows).toHaveLength(names.length + 2);
        for (const r of rows) expect(split(r)).toHaveLength(3);
      }),
    );
  });
});

describe('renderCheck github', () => {
  // GitHub's workflow-command escaping, from memory of actions/toolkit command.ts: data escapes
  // % CR LF as %25 %0D %0A; property values also : and , as %3A %2C.
  const unescape = (s: string) => s.replace(/%0D/g, '\r').replace(/%0A/g, '\n').replace(/%3A/g, ':').replace(/%2C/g, ',').replace(/%25/g, '%');

  it('escapes file names and messages so that the runner reads them back unchanged', () => {
    const name = 'boards/a,b:100%.yaml';
    const warned: CheckedFile = {
      ...file(name, [ripple(4.12e-3, 1.61e-3)]),
      warnings: [{ key: 'load.resistance', message: 'spans 50 % of\nthe ideal\r' }],
      positions: new Map([
        ['spec.ripple', { line: 12, column: 3, exact: true }],
        ['load.resistance', { line: 7, column: 3, exact: true }],
      ]),
    };
    const lines = renderCheck([warned], 'github').trimEnd().split('\n');
    expect(lines).toHaveLength(3); // two annotations (no raw line break leaks) and the summary
    const [error, warning] = lines.map((l) => /^::(\w+) ([^:]*)::(.*)$/.exec(l));
    expect(error?.[1]).toBe('error');
    const props = Object.fromEntries((error?.[2] ?? '').split(',').map((p) => [p.slice(0, p.indexOf('=')), unescape(p.slice(p.indexOf('=') + 1))]));
    expect(props).toEqual({ file: name, line: '12', col: '3', title: 'dacsmith: ripple fails' });
    expect(unescape(error?.[3] ?? '')).toBe('ripple 4.12 mV > 1.61 mV (limit spec.ripple)');
    expect(warning?.[1]).toBe('warning');
    expect(unescape(warning?.[3] ?? '')).toBe('load.resistance: spans 50 % of\nthe ideal\r');
  });

  it('leaves out line and column when the position is unknown, and says when the limit is a default', () => {
    const gain: Check = { name: 'gain', value: 0.5, limit: 0.02, unit: '1', pass: false };
    const unknown = renderCheck([file('x.yaml', [gain])], 'github');
    expect(unknown.split('\n')[0]).toBe('::error file=x.yaml,title=dacsmith%3A gain fails::gain 50 %25 of full scale > 2 %25 of full scale (limit spec.gain)');
    const fallback = renderCheck([{ ...file('x.yaml', [gain]), positions: new Map([['spec.gain', { line: 1, column: 1, exact: false }]]) }], 'github');
    expect(fallback.split('\n')[0]).toBe('::error file=x.yaml,line=1,col=1,title=dacsmith%3A gain fails::gain 50 %25 of full scale > 2 %25 of full scale (default limit: the file has no spec.gain)');
  });
});
