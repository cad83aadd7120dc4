/**
 * `dacsmith design` on version 1.1 circuits, run as a user runs it: the three demo samples (invented
 * scenarios: RC + Sallen-Key, complement output through R and C, fine output) give ranked designs
 * in the file's topology with the new parts in JSON and text, `--write` writes a project file that
 * loads as the same circuit with the design's parts (analyze of it gives the design's figures), and
 * `--robust` is refused for these circuits with the key.
 */
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { root, runBuilt } from './runBuilt.js';

const sample = (name: string) => join(root, 'sample-configs', name);
const SK = sample('design-sallen-key.yaml');
const COMPLEMENT = sample('design-complement.yaml');
const FINE = sample('design-fine.yaml');
const dir = mkdtempSync(join(tmpdir(), 'dacsmith-network-design-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

type Json = Record<string, any>;
const designJson = (file: string, extra: string[] = []) => {
  const r = runBuilt(['design', file, '--format', 'json', '--top', '3', ...extra]);
  return { code: r.code, stderr: r.stderr, json: JSON.parse(r.stdout) as Json };
};

describe('design on the version 1.1 demo samples', () => {
  it('RC + Sallen-Key: Sallen-Key stages as { active, r1, r2, c1, c2 }, Q inside search.q, the trade-off curve', () => {
    const { code, json } = designJson(SK);
    expect(code).toBe(0);
    expect(json.pass).toBe(true);
    expect(json.complete).toBe(true);
    expect(json.candidates.length).toBe(3);
    expect(json.basis.network.topology).toBe('RC + Sallen-Key');
    expect(json.basis.network.q).toEqual({ min: 0.5, max: 0.7 });
    for (const c of json.candidates) {
      expect(Object.keys(c.stages[0]).sort()).toEqual(['c', 'r']);
      const s = c.stages[1];
      expect(s.active).toBe('sallen-key');
      // model.md 1.1 (the standard unity-gain Sallen-Key formulas): f0 = 1 / (2 pi sqrt(r1 r2 c1 c2)), Q = sqrt(r1 r2 c1 c2) / (c2 (r1 + r2)).
      const root = Math.sqrt(s.r1 * s.r2 * s.c1 * s.c2);
      expect(c.activeStages).toEqual([{ stage: 1, f0: expect.closeTo(1 / (2 * Math.PI * root), 6), q: expect.closeTo(root / (s.c2 * (s.r1 + s.r2)), 12) }]);
      expect(c.activeStages[0].q).toBeGreaterThanOrEqual(0.5 - 1e-12);
      expect(c.activeStages[0].q).toBeLessThanOrEqual(0.7 + 1e-12);
      expect(c.pass && c.keepsMargin).toBe(true);
      expect(c.codes).toMatch(/^[0-9kMRnpu]+-[0-9kMRnpu]+ \+ SK [0-9kMR]+\/[0-9kMR]+-[0-9nupm]+\/[0-9nupm]+$/);
    }
    expect(json.verified).toBeLessThan(json.space / 100);
    expect(json.tradeoff.length).toBe(1);
    expect(json.tradeoff[0].points.length).toBe(9);
    // The curve's point at the spec's ripple limit is design #1 (the same search without the settling-time limit, which #1 meets).
    expect(json.tradeoff[0].points[4].settlingTime).toBe(json.candidates[0].settlingTime);
    // Design #1 beats the file's own first guess.
    expect(json.candidates[0].settlingTime).toBeLessThan(json.current.settlingTime);
  });

  it('complement: the injection resistor and capacitor as secondPwm { r, c }', () => {
    const { code, json } = designJson(COMPLEMENT, ['--no-charts']);
    expect(code).toBe(0);
    expect(json.basis.network.topology).toBe('RC + RC; complement output into stage 1 through R and C in series');
    for (const c of json.candidates) {
      expect(c.stages.length).toBe(2);
      expect(Object.keys(c.secondPwm).sort()).toEqual(['c', 'r']);
      expect(c.secondPwm.r).toBeGreaterThanOrEqual(680);
      expect(c.secondPwm.r).toBeLessThanOrEqual(2200);
      expect(c.secondPwm.c).toBeGreaterThanOrEqual(33e-9 * (1 - 1e-9));
      expect(c.secondPwm.c).toBeLessThanOrEqual(150e-9 * (1 + 1e-9));
      expect(c.codes).toContain('; 2nd r ');
      expect(c.pinCurrent).toBeLessThanOrEqual(4e-3 * 0.9);
    }
    expect(json.tradeoff).toEqual([]);
  });

  it('fine: the weighting resistor near its ideal weight 2^8 (R1 + driver) - driver', () => {
    const { code, json } = designJson(FINE, ['--no-charts']);
    expect(code).toBe(0);
    for (const c of json.candidates) {
      expect(Object.keys(c.secondPwm)).toEqual(['r']);
      // Superposition: the fine full range weighs one coarse step at r = 2^8 (R1 + 32.5) - 32.5 (mean drivers 40 / 25 ohm).
      const ideal = 256 * (c.stages[0].r + 32.5) - 32.5;
      expect(Math.abs(c.secondPwm.r / ideal - 1)).toBeLessThan(0.25);
      expect(c.checks.find((k: Json) => k.name === 'inl').pass).toBe(true);
    }
  });

  it('text report: the circuit, the Q window, the Sallen-Key column with f0 and Q, the IEC codes', () => {
    const r = runBuilt(['design', SK, '--top', '2', '--no-charts', '--width', '200']);
    expect(r.code).toBe(0);
    expect(r.stdout).toContain("Circuit:     RC + Sallen-Key (the file's; the search chooses every part)");
    expect(r.stdout).toContain('Q from 0.5 to 0.7 (search.q)');
    expect(r.stdout).toContain('stage 2 Sallen-Key: r1, r2 / c1, c2');
    expect(r.stdout).toMatch(/f0 [0-9.]+ kHz, Q 0\.[5-7][0-9]*/);
    expect(r.stdout).toMatch(/ \+ SK [0-9kMR]+\//);
    expect(r.stdout).toContain('Sallen-Key f0, Q');
  });
});

describe('--write on a version 1.1 circuit', () => {
  for (const [file, changed] of [
    [SK, /filter\.stages\[1\]\.(r1|r2|c1|c2) /],
    [FINE, /second_pwm\.into\.r 8\.2 Mohm -> /],
  ] as const) {
    it(`${file.split('/').pop()}: a loadable project with design #1's parts; analyze of it gives #1's figures`, () => {
      const out = join(dir, `written-${file.split('/').pop()}`);
      const r = runBuilt(['design', file, '--top', '1', '--no-charts', '--format', 'json', '--write', out]);
      expect(r.code).toBe(0);
      expect(r.stderr).toMatch(changed);
      const best = JSON.parse(r.stdout).candidates[0];
      const a = runBuilt(['analyze', out, '--format', 'json']);
      expect(a.code).toBe(0);
      const analysis = JSON.parse(a.stdout);
      expect(analysis.settling.time).toBe(best.settlingTime);
      expect(analysis.worstRipple.ripple).toBe(best.worstRipple);
      // Only the parts changed: the comments of the original are still there.
      expect(readFileSync(out, 'utf8')).toContain('(invented scenario)');
    });
  }
});

describe('refusals', () => {
  it('--robust for a version 1.1 circuit: exit 2, naming the key', () => {
    const r = runBuilt(['design', COMPLEMENT, '--robust', 'worst-case', '--no-charts']);
    expect(r.code).toBe(2);
    expect(r.stdout).toBe('');
    expect(r.stderr).toMatch(/design-complement\.yaml:\d+:\d+: second_pwm: --robust worst-case does not yet handle a file with second_pwm or an active stage/);
  });
});
