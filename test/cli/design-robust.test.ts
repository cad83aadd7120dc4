import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeAll, describe, expect, inject, it } from 'vitest';
import { runBuilt } from './runBuilt.js';

const work = mkdtempSync(join(tmpdir(), 'dacsmith-robust-'));

/** Run the built command like a user would, without a terminal and without colour. */
function dacsmith(...args: string[]) {
  return runBuilt(args);
}

function file(name: string, yaml: string): string {
  const path = join(work, name);
  writeFileSync(path, yaml);
  return path;
}

// Invented scenario: a small E3 space (quick to search).
const BASE = `pwm: { frequency: 20 kHz, bits: 10, high: 3.3 V, low: 0 V, driver: 30 ohm, duty: { min: 5 %, max: 95 % } }
spec:
  ripple: 0.5 LSB
  settling: { band: 1 LSB, time: 50 ms }
search:
  stages: [1, 2]
  series: E3
  margin: 0 %   # the tolerance check alone decides here
  resistance: { min: 1k, max: 100k }
  capacitance: { min: 10n, max: 1u }
`;
const key = (c: { stages: Array<{ r: number; c: number }> }) => c.stages.map((s) => `${s.r}/${s.c}`).join('+');

beforeAll(() => {
  const error = inject('buildError');
  if (error) throw new Error(`build failed: ${error}`);
});

describe('dacsmith design --robust (built bin)', () => {
  it('worst-case: lists a subset of the nominal ranking in order, with worst-case figures (exit 0)', () => {
    const f = file('wc.yaml', BASE + 'tolerance: { resistor: 1 %, capacitor: 20 % }\n');
    const robust = dacsmith('design', f, '--robust', 'worst-case', '--top', '3', '--no-charts', '--format', 'json');
    expect(robust.code).toBe(0);
    const r = JSON.parse(robust.stdout);
    expect(r.pass).toBe(true);
    expect(r.robust.mode).toBe('worst-case');
    expect(r.robust.candidates).toHaveLength(3);
    // The nominal list was screened by the box's corners first (robust.screened): the robust designs
    // keep their order in the full nominal ranking, and the ranks count the designs past the screen.
    expect(r.robust.screened).toBe(true);
    const nominal = JSON.parse(dacsmith('design', f, '--top', '2000', '--no-charts', '--format', 'json').stdout);
    const order = nominal.candidates.map(key);
    const places = r.candidates.map((c: { stages: Array<{ r: number; c: number }> }) => order.indexOf(key(c)));
    const ranks = r.robust.candidates.map((x: { nominalRank: number }) => x.nominalRank);
    for (let i = 0; i < places.length; i++) {
      expect(places[i]).toBeGreaterThanOrEqual(ranks[i] - 1);
      if (i > 0) {
        expect(places[i]).toBeGreaterThan(places[i - 1]);
        expect(ranks[i]).toBeGreaterThan(ranks[i - 1]);
      }
    }
    // Worst case is never better than nominal (the nominal point is inside the box; common practice).
    r.robust.candidates.forEach((x: { worstCase: { worstRipple: number; settlingTime: number } }, i: number) => {
      expect(x.worstCase.worstRipple).toBeGreaterThanOrEqual(r.candidates[i].worstRipple * (1 - 1e-9));
      expect(x.worstCase.worstRipple).toBeLessThanOrEqual((0.5 * 3.3) / 1024);
      expect(x.worstCase.settlingTime).toBeGreaterThanOrEqual(r.candidates[i].settlingTime * (1 - 1e-9));
    });
    const text = dacsmith('design', f, '--robust', 'worst-case', '--top', '3', '--no-charts');
    expect(text.stdout).toMatch(/Under tolerance: worst case/);
    expect(text.stdout).toMatch(/PASS: 3 designs meet every limit at the worst case/);
  });

  it('exits 1 when no design survives the tolerance box', () => {
    // The settling limit lets only the nominal leader through (4.49 ms); 20 % more capacitance slows it past the limit.
    const f = file('none.yaml', BASE.replace('time: 50 ms', 'time: 4.6 ms') + 'tolerance: { resistor: 1 %, capacitor: 20 % }\n');
    const r = dacsmith('design', f, '--robust', 'worst-case', '--no-charts', '--format', 'json');
    expect(r.code).toBe(1);
    const j = JSON.parse(r.stdout);
    expect(j.pass).toBe(false);
    expect(j.robust.candidates).toEqual([]);
    expect(j.robust.exhausted).toBe(true);
    // The one nominal design fails at a corner already: the screen leaves nothing to scan, and the
    // verdict says so rather than claiming that no design works with nominal parts.
    expect(j.robust.screened).toBe(true);
    expect(j.robust.scanned).toBe(0);
    const text = dacsmith('design', f, '--robust', 'worst-case', '--no-charts');
    expect(text.code).toBe(1);
    expect(text.stdout.replace(/\s+/g, " ")).toMatch(/every nominally feasible design misses a limit at a corner of the tolerance box/);
  });

  it('exits 2 with a clear message without a tolerance block, or without a yield target for yield', () => {
    const f = file('plain.yaml', BASE);
    const r = dacsmith('design', f, '--robust', 'worst-case');
    expect(r.code).toBe(2);
    expect(r.stdout).toBe('');
    expect(r.stderr).toMatch(/plain\.yaml(:\d+:\d+)?: tolerance: --robust worst-case needs a tolerance block/);
    const g = file('noyield.yaml', BASE + 'tolerance: { resistor: 1 %, capacitor: 10 % }\n');
    const y = dacsmith('design', g, '--robust', 'yield');
    expect(y.code).toBe(2);
    expect(y.stderr).toMatch(/tolerance\.yield/);
    expect(dacsmith('design', g, '--robust', 'typical').code).toBe(2);
  });
});
