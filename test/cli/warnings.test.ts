/**
 * Plausibility warnings, the default gain check and `check --strict`, end to end through the built
 * command (model.md "Version 1.1 additions": Warnings, Full scale).
 */
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { root, runBuilt } from './runBuilt.js';

const fixture = (name: string) => join(root, 'test', 'fixtures', 'projects', name);
const slip = fixture('unit-slip-load.yaml');
const divider = fixture('divider-no-droop.yaml');
const dividerGainOff = fixture('divider-gain-off.yaml');
const json = (args: string[]) => {
  const r = runBuilt(args);
  return { ...r, body: JSON.parse(r.stdout) };
};

describe('a load typed as 1m (1 milliohm, meant 1 Mohm)', () => {
  it('analyze warns on load.resistance, the time constant and the span, and fails the default gain check (exit 1)', () => {
    const r = json(['analyze', slip, '--format', 'json']);
    expect(r.code).toBe(1);
    const keys = r.body.warnings.map((w: { key: string }) => w.key);
    expect(keys).toEqual(['load.resistance', 'filter.stages', 'load.resistance']);
    expect(r.body.warnings[0].message).toContain('did you mean 1M (1 MΩ)?');
    // model.md 1.1: with neither droop nor INL limited, gain is checked at 2 % of full scale
    const gain = r.body.checks.find((c: { name: string }) => c.name === 'gain');
    expect(gain).toMatchObject({ limit: 0.02, unit: '1', pass: false });
    // Ohm's law: 1 mohm against 10 kohm passes 1e-7 of the span, so the gain error is the whole span
    expect(gain.value).toBeGreaterThan(0.999);
    expect(r.body.checks.find((c: { name: string }) => c.name === 'ripple').pass).toBe(true);
  });

  it('text report: the gain check in % of full scale, a Warnings heading before the Cautions', () => {
    const r = runBuilt(['analyze', slip, '--no-charts']);
    expect(r.code).toBe(1);
    expect(r.stdout).toMatch(/\n {2}gain\s+100 % of full scale\s+2 % of full scale\s+-98 % of full scale\s+FAIL/);
    const warnings = r.stdout.indexOf('\nWarnings\n');
    expect(warnings).toBeGreaterThan(0);
    expect(r.stdout.indexOf('\nCautions\n')).toBeGreaterThan(warnings);
    expect(r.stdout).toContain('3 warnings (see Warnings).');
  });

  it('check lists the warnings but keeps the exit code of the checks; compare carries the head warnings', () => {
    const check = json(['check', slip, '--format', 'json']);
    expect(check.code).toBe(1); // the gain check fails on its own
    expect(check.body.warnings).toHaveLength(3);
    expect(check.body.warnings[0]).toMatchObject({ file: slip, key: 'load.resistance' });
    const compare = json(['compare', divider, slip, '--format', 'json']);
    expect(compare.body.warnings.map((w: { key: string }) => w.key)).toEqual(['load.resistance', 'filter.stages', 'load.resistance']);
    const gainRow = compare.body.checks.find((c: { name: string }) => c.name === 'gain');
    // the divider base now has the default gain check too (droop not limited), and fails it
    expect(gainRow.status).toBe('still fails');
    const text = runBuilt(['compare', divider, slip, '--width', '300']).stdout;
    expect(text).toContain('Warnings (head)');
    expect(text).toMatch(/gain\s+2 % of full scale\s+90.9 % of full scale FAIL\s+100 % of full scale FAIL\s+still fails/);
  });
});

describe('a 100k / 10u stage into 10 kohm, INL limited and droop not', () => {
  it('fails the default gain check (droop not limited) and warns on the span: exit 1', () => {
    const r = json(['analyze', divider, '--format', 'json']);
    expect(r.code).toBe(1);
    expect(r.body.checks.map((c: { name: string }) => c.name)).toEqual(['ripple', 'inl', 'gain', 'settling']);
    expect(r.body.checks.find((c: { name: string }) => c.name === 'gain')).toMatchObject({ limit: 0.02, pass: false });
    expect(r.body.warnings).toHaveLength(1);
    const [w] = r.body.warnings;
    expect(w.key).toBe('load.resistance');
    // Ohm's law: k = 10k / (10k + 100k + 30) = 0.0909 of the ideal span
    expect(w.message).toContain('9.1 % of the ideal 2.97 V');
    expect(w.message).not.toContain('No check limits the span');
    const off = json(['analyze', dividerGainOff, '--format', 'json']);
    expect(off.code).toBe(0);
    expect(off.body.warnings[0].message).toContain('No check limits the span: spec.gain is none and spec.droop is not set.');
    // signs (README "Sign convention"): the output is short of ideal, so DC and gain errors are positive
    expect(r.body.dc.droop.error).toBeGreaterThan(0);
    expect(r.body.dc.gainError).toBeCloseTo(3.3 * (1 - 10e3 / (10e3 + 100e3 + 30)), 6);
    expect(r.body.attenuation).toBeGreaterThan(0);
  });

  it('check passes without --strict and fails with it (exit 1), naming the warned key (gain check off)', () => {
    const divider = dividerGainOff;
    const plain = runBuilt(['check', divider, '--width', '300']);
    expect(plain.code).toBe(0);
    expect(plain.stdout).toMatch(/^PASS .*\(3 checks hold; 1 warning\)/);
    const strict = runBuilt(['check', divider, '--strict', '--width', '300']);
    expect(strict.code).toBe(1);
    expect(strict.stdout).toMatch(/^FAIL .*1 warning \(strict: fails\): load\.resistance/);
    const strictJson = json(['check', divider, '--strict', '--format', 'json']);
    expect(strictJson.body).toMatchObject({ strict: true, pass: false });
    const md = runBuilt(['check', divider, '--format', 'markdown']).stdout;
    expect(md).toContain('### Warnings');
  });

  it('documents --strict in check --help', () => {
    const help = runBuilt(['check', '--help']).stdout;
    expect(help).toContain('--strict');
    expect(help).toMatch(/Treat plausibility warnings[\s\S]*as failures/);
  });
});

describe('warnings is always present in the JSON', () => {
  it('is an empty array for a sound sample in analyze and tolerance', () => {
    const sample = join(root, 'sample-configs', 'tolerance-fan-reference.yaml');
    expect(json(['analyze', sample, '--format', 'json']).body.warnings).toEqual([]);
    const t = json(['tolerance', sample, '--format', 'json', '--samples', '200', '--workers', '1']);
    expect(t.body.warnings).toEqual([]);
  });
});

describe('tolerance covers the gain check', () => {
  it('finds the worst gain error and its yield when spec.gain limits it', () => {
    // the fan sample with its droop limit swapped for a gain limit of 0.5 % of full scale
    const text = readFileSync(join(root, 'sample-configs', 'tolerance-fan-reference.yaml'), 'utf8');
    expect(text).toMatch(/^ {2}droop: 1 %$/m);
    const path = join(mkdtempSync(join(tmpdir(), 'dacsmith-gain-')), 'fan-gain.yaml');
    writeFileSync(path, text.replace(/^ {2}droop: 1 %$/m, '  gain: 0.5 %'));
    const nominal = json(['analyze', path, '--format', 'json']).body.checks.find((c: { name: string }) => c.name === 'gain');
    const t = json(['tolerance', path, '--format', 'json', '--samples', '300', '--workers', '1']);
    expect(t.code).toBe(1);
    const gain = t.body.worstCase.gain;
    expect(gain.limit).toBe(0.005);
    // the worst case is at least the nominal circuit's gain error (analyze's check value)
    expect(Math.abs(gain.value)).toBeGreaterThanOrEqual(nominal.value * (1 - 1e-9));
    expect(t.body.worstCase.nominal.gain).toBeCloseTo(nominal.value, 9);
    expect(t.body.monteCarlo.yieldBySpec.gain).toBeGreaterThanOrEqual(0);
    expect(t.body.monteCarlo.percentiles.gain.p50).toBeGreaterThan(0);
    const report = runBuilt(['tolerance', path, '--no-charts', '--samples', '300', '--workers', '1', '--width', '300']).stdout;
    expect(report).toMatch(/gain error\s+[\d.]+ % of full scale\s+[\d.]+ % of full scale\s+0\.5 % of full scale\s+FAIL/);
  });
});

describe('design carries the warnings too (model.md 1.1: every command)', () => {
  it('lists the unit slip of the load in JSON and under a Warnings heading', () => {
    const text = readFileSync(slip, 'utf8') + 'search:\n  stages: [1]\n  series: E6\n  resistance: { min: 1k, max: 10k }\n  capacitance: { min: 10n, max: 100n }\n';
    const path = join(mkdtempSync(join(tmpdir(), 'dacsmith-design-warn-')), 'slip-search.yaml');
    writeFileSync(path, text);
    const r = json(['design', path, '--format', 'json', '--no-charts']);
    expect(r.body.warnings[0]).toMatchObject({ key: 'load.resistance' });
    expect(r.body.warnings[0].message).toMatch(/did you mean 1M/);
    const report = runBuilt(['design', path, '--no-charts', '--width', '300']).stdout;
    expect(report).toMatch(/\nWarnings\n/);
  });
});
