import { existsSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { runDesign, type DesignArgs } from '../../src/cli/design.js';
import { UsageError } from '../../src/cli/errors.js';
import { InputError } from '../../src/units/index.js';
import { parseProject } from '../../src/project/index.js';

const yaml = `# invented scenario
pwm: { frequency: 20 kHz, bits: 10, high: 3.3 V, low: 0 V, driver: 30 ohm, duty: { min: 5 %, max: 95 % } }
spec:
  ripple: 0.5 LSB
search:
  stages: [1, 2]
  series: E3
  resistance: { min: 1k, max: 10k }
  capacitance: { min: 10n, max: 1u }
`;
const dir = mkdtempSync(join(tmpdir(), 'dacsmith-design-'));
const file = join(dir, 'board.yaml');
writeFileSync(file, yaml);
const args = (more: Partial<DesignArgs>): DesignArgs => ({ file, format: 'json', top: 3, force: false, charts: false, ...more });

describe('dacsmith design (runDesign)', () => {
  it('exits 0 with a feasible design and writes it as a project file', async () => {
    const out = join(dir, 'designed.yaml');
    const r = await runDesign(args({ write: out }), { color: false });
    expect(r.code).toBe(0);
    const best = JSON.parse(r.stdout).candidates[0];
    const written = parseProject(readFileSync(out, 'utf8'), out);
    expect(written.filter.stages.map((s) => ({ r: s.r, c: s.c }))).toEqual(best.stages);
    expect(readFileSync(out, 'utf8')).toContain('# invented scenario');
    // Each change on standard error, one line each; the file had no filter, so every stage is added.
    const added = best.stages.map((_: unknown, i: number) => `filter.stages[${i}] added: { r: ${best.codes.split(' + ')[i].split('-')[0]}, c: ${best.codes.split(' + ')[i].split('-')[1]} }`);
    expect(r.stderr.split('\n').slice(1, -1).map((l: string) => l.trim())).toEqual(added);
    // The JSON carries the same list: { path, from, to } with from null for an added stage.
    expect(JSON.parse(r.stdout).changes.map((c: { path: string; from: null; to: string }) => `${c.path} added: ${c.to}`)).toEqual(added);
  });

  it('refuses to write over an existing file without --force (exit 2), and overwrites with it', async () => {
    const out = join(dir, 'taken.yaml');
    writeFileSync(out, 'keep me\n');
    const refused = await runDesign(args({ write: out }), { color: false });
    expect(refused.code).toBe(2);
    expect(refused.stderr).toMatch(/exists; use --force/);
    expect(readFileSync(out, 'utf8')).toBe('keep me\n');
    const forced = await runDesign(args({ write: out, force: true }), { color: false });
    expect(forced.code).toBe(0);
    expect(readFileSync(out, 'utf8')).toContain('filter:');
  });

  it('exits 1 when nothing is feasible and writes nothing', async () => {
    const tight = join(dir, 'tight.yaml');
    writeFileSync(tight, yaml.replace('ripple: 0.5 LSB', 'ripple: 0.5 LSB\n  settling: { band: 0.5 LSB, time: 10 us }'));
    const out = join(dir, 'never.yaml');
    const r = await runDesign(args({ file: tight, write: out }), { color: false });
    expect(r.code).toBe(1);
    expect(existsSync(out)).toBe(false);
    expect(JSON.parse(r.stdout).pass).toBe(false);
  });

  it('rejects --top 0 as bad input', async () => {
    await expect(runDesign(args({ top: 0 }), { color: false })).rejects.toBeInstanceOf(UsageError);
  });

  it('a project without a search section is bad input', async () => {
    const bare = join(dir, 'bare.yaml');
    writeFileSync(bare, 'pwm: { frequency: 20 kHz, high: 3.3 V, low: 0 V }\nfilter:\n  stages:\n    - { r: 1k, c: 1u }\n');
    // an input error (exit 2) that names the file and the key; the shell adds the line
    await expect(runDesign(args({ file: bare }), { color: false })).rejects.toMatchObject({ key: 'search', file: bare });
    await expect(runDesign(args({ file: bare }), { color: false })).rejects.toBeInstanceOf(InputError);
  });
});
