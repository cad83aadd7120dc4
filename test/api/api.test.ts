/**
 * The library API from source: the three kinds of input give the same result, invalid input
 * throws the loader's error with its position, and the JSON builders return plain data.
 * (test/package/install.test.ts holds the installed package to the command's JSON.)
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { analyze, compare, loadProject, ProjectError } from '../../src/api/index.js';
import { jsonValue } from '../../src/report/jsonValue.js';

const sample = 'sample-configs/greenhouse-heater.yaml';

describe('library API', () => {
  it('gives one answer for a path, the YAML text and a loaded project', () => {
    const byPath = analyze(sample);
    expect(analyze({ text: readFileSync(sample, 'utf8'), label: sample })).toEqual(byPath);
    expect(analyze(loadProject(sample))).toEqual(byPath);
  });

  it('follows an edited project (a heavier load droops more)', () => {
    const base = loadProject(sample);
    const light = analyze(base);
    const heavy = analyze({ ...base, load: { ...base.load, resistance: 100e3 } });
    // a resistive load only pulls the output down (README, sign convention): droop grows
    expect(heavy.dc.droop.error).toBeGreaterThan(light.dc.droop.error);
  });

  it('throws ProjectError with the line of the bad value', () => {
    const text = readFileSync(sample, 'utf8').replace('{ r: 1k, c: 1u }', '{ r: 1k, c: 3.3 V }');
    const line = text.split('\n').findIndex((l) => l.includes('3.3 V }')) + 1;
    let error: unknown;
    try {
      analyze({ text, label: 'edited.yaml' });
    } catch (e) {
      error = e;
    }
    expect(error).toBeInstanceOf(ProjectError);
    expect((error as ProjectError).line).toBe(line);
    expect((error as ProjectError).path).toBe('filter.stages[0].c');
  });

  it('compares a project with itself: no input changed, the same pass', () => {
    const c = compare(sample, sample);
    expect(c.inputs).toEqual([]);
    expect(c.pass).toBe(analyze(sample).pass);
  });
});

describe('jsonValue', () => {
  it('is what JSON.parse gives back: null for non-finite numbers, no undefined members, no shared objects', () => {
    const inner = { t: 1 };
    const value = jsonValue({ a: Infinity, b: NaN, c: undefined, d: [inner], e: -0.5 });
    expect(value).toEqual({ a: null, b: null, d: [{ t: 1 }], e: -0.5 });
    expect('c' in value).toBe(false);
    expect(value.d[0]).not.toBe(inner);
  });
});
