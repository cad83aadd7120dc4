import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { basename, join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { parseDocument } from 'yaml';
import { runDesign } from '../../src/cli/design.js';
import { designProgressLine } from '../../src/report/designProgress.js';
import { root, runBuilt } from './runBuilt.js';

// Invented scenarios (test/fixtures/projects): nothing in the search space meets every limit.
const inlFixture = join(root, 'test', 'fixtures', 'projects', 'infeasible-inl-bits.yaml');
const threeStage = join(root, 'test', 'fixtures', 'projects', 'infeasible-ripple-three-stage.yaml');
const gainFixture = join(root, 'test', 'fixtures', 'projects', 'infeasible-gain-load.yaml');
const dir = mkdtempSync(join(tmpdir(), 'dacsmith-infeasible-'));

interface Fix {
  kind: string;
  change: string;
  design: { stages: Array<{ r: number; c: number; buffered?: boolean }>; bits: number | null; frequency: number; pass: boolean };
}

/** The fixture with its filter replaced by a suggested design (and the PWM changed as the fix says). */
function withFix(file: string, fix: Fix, pwm: Record<string, unknown> = {}): string {
  const doc = parseDocument(readFileSync(file, 'utf8'));
  doc.setIn(['filter'], { stages: fix.design.stages.map((s) => ({ r: s.r, c: s.c, ...(s.buffered && { buffered: true }) })) });
  doc.deleteIn(['search', 'bits']);
  for (const [k, v] of Object.entries(pwm)) doc.setIn(['pwm', k], v);
  const out = join(dir, `${basename(file, '.yaml')}-${fix.kind}.yaml`);
  writeFileSync(out, doc.toString());
  return out;
}

describe('dacsmith design on an infeasible INL-bound space (two stages, E12, bits 8..12)', () => {
  const r = runBuilt(['design', inlFixture, '--format', 'json', '--no-charts']);
  const json = JSON.parse(r.stdout);

  it('exits 1, names INL as the binding limit with the figure reached, nothing on stderr (not a terminal)', () => {
    expect(r.code).toBe(1);
    expect(r.stderr).toBe('');
    expect(json.pass).toBe(false);
    const inl = (json.diagnosis as string[]).find((l) => l.startsWith('INL binds'));
    expect(inl).toBeDefined();
    expect(inl).toMatch(/has an INL of [\d.]+ mV \([\d.]+ LSB @ \d+ bit\) against 6\.45 mV/);
  });

  it('suggests a follower and fewer bits, each a design the exact engine passes', () => {
    const kinds = (json.fixes as Fix[]).map((f) => f.kind);
    expect(kinds).toContain('follower');
    expect(kinds).toContain('resolution');
    for (const f of json.fixes as Fix[]) expect(f.design.pass).toBe(true);
  });

  it('the suggested changes hold when `analyze` checks them (exact engine, another command)', () => {
    const fixes = json.fixes as Fix[];
    const follower = fixes.find((f) => f.kind === 'follower')!;
    expect(follower.design.stages.at(-1)?.buffered).toBe(true);
    const a = runBuilt(['analyze', withFix(inlFixture, follower, { bits: follower.design.bits })]);
    expect(a.code).toBe(0);
    const fewer = fixes.find((f) => f.kind === 'resolution')!;
    expect(fewer.design.bits).toBeLessThan(8);
    const b = runBuilt(['analyze', withFix(inlFixture, fewer, { bits: fewer.design.bits })]);
    expect(b.code).toBe(0);
  });
});

describe('dacsmith design on an infeasible three-stage space (E12, bits 8..12)', () => {
  const r = runBuilt(['design', threeStage, '--format', 'json', '--no-charts']);
  const json = JSON.parse(r.stdout);

  it('proves one and two stages out of reach before searching (settling floor of the ripple limit)', () => {
    expect(r.code).toBe(1);
    const proven = json.proven as Array<{ stages: number; limit: string; reach: number; limitValue: number }>;
    expect(proven.map((p) => p.stages).sort()).toEqual([1, 2]);
    for (const p of proven) {
      expect(p.limit).toBe('settling');
      expect(p.reach).toBeGreaterThan(p.limitValue);
    }
  });

  it('suggests fewer bits, and analyze agrees the suggested design meets every limit there', () => {
    const fewer = (json.fixes as Fix[]).find((f) => f.kind === 'resolution');
    expect(fewer).toBeDefined();
    expect(fewer!.change).toMatch(/^7 bits \(62\.5 kHz\)$/); // 8 MHz / 2^7 = 62.5 kHz (edge-aligned timer)
    expect(runBuilt(['analyze', withFix(threeStage, fewer!, { bits: 7 })]).code).toBe(0);
  });
});

describe('dacsmith design when the load divides full scale (default 2 % gain limit, 1 to 3 stages)', () => {
  const r = runBuilt(['design', gainFixture, '--format', 'json', '--no-charts']);
  const json = JSON.parse(r.stdout);

  it('proves every stage count out of reach by the divider alone', () => {
    expect(r.code).toBe(1);
    const proven = json.proven as Array<{ stages: number; limit: string; reach: number }>;
    expect(proven.map((p) => p.stages)).toEqual([1, 2, 3]);
    for (const p of proven) {
      expect(p.limit).toBe('gain');
      // Voltage divider (Ohm's law): 1 - R_L / (R_L + driver + n * 1 kohm), R_L = 10 kohm, driver 30 ohm
      expect(p.reach).toBeCloseTo(1 - 10e3 / (10e3 + 30 + p.stages * 1e3), 9);
    }
  });

  it('suggests a follower, and analyze agrees the buffered design meets every limit with the load', () => {
    const follower = (json.fixes as Fix[]).find((f) => f.kind === 'follower');
    expect(follower).toBeDefined();
    expect(runBuilt(['analyze', withFix(gainFixture, follower!, { bits: follower!.design.bits })]).code).toBe(0);
  });
});

describe('progress', () => {
  it('never with --quiet, even on a terminal stream', async () => {
    const writes: string[] = [];
    const stream = { write: (s: string) => writes.push(s), columns: 80, isTTY: true } as unknown as NodeJS.WriteStream;
    const out = await runDesign({ file: inlFixture, format: 'text', top: 3, force: false, charts: false, quiet: true }, { color: false, progress: stream });
    expect(out.code).toBe(1);
    expect(out.stdout).toBe('');
    expect(writes).toEqual([]);
  });

  it('one line with stages, resolution, share done and best so far, cut to the width', () => {
    const line = designProgressLine(0.42, { phase: 'search', stages: 2, bits: 9, frequency: 31250, best: 1.2e-3 }, 100);
    expect(line).toContain('42 %');
    expect(line).toContain('2 stages');
    expect(line).toContain('9 bits (31.3 kHz)');
    expect(line).toContain('best 1.2 ms');
    expect(designProgressLine(0.42, { phase: 'search', stages: 2, bits: 9, frequency: 31250, best: null }, 40).length).toBeLessThan(40);
  });
});
