/**
 * `--format html` and `--html FILE` as a user runs them: the page on stdout or beside the text
 * report, written atomically (writeOutputFile.ts), never over an existing file without --force and
 * never over a file the command reads, even with --force.
 */
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { formatEng } from '../../src/units/index.js';
import { root, runBuilt } from './runBuilt.js';

const work = mkdtempSync(join(tmpdir(), 'dacsmith-html-cli-'));

// invented project: one 10 kohm / 2.2 uF stage at 20 kHz
const GOOD = `pwm: { frequency: 20 kHz, bits: 10, high: 3.3 V, low: 0 V, driver: 25 ohm, duty: { min: 10 %, max: 90 % } }
filter:
  stages:
    - { r: 10k, c: 2.2u }
spec:
  ripple: 1 LSB
`;

function project(name: string, text = GOOD): string {
  const path = join(work, name);
  writeFileSync(path, text);
  return path;
}

describe('analyze --format html / --html', () => {
  it('--format html prints one page with the five plots; the exit code is the spec status', () => {
    const r = runBuilt(['analyze', project('a.yaml'), '--format', 'html']);
    expect(r.code).toBe(0);
    expect(r.stdout.startsWith('<!DOCTYPE html>')).toBe(true);
    expect(r.stdout.match(/data-plot="/g)).toHaveLength(5);
  });

  it('--no-charts leaves the plots out of the page', () => {
    const r = runBuilt(['analyze', project('a.yaml'), '--format', 'html', '--no-charts']);
    expect(r.stdout).not.toContain('data-plot="');
    expect(r.stdout).toContain('<h2>Spec</h2>');
  });

  it('--html writes the page beside the text report and says so on stderr', () => {
    const out = join(work, 'report.html');
    const r = runBuilt(['analyze', project('a.yaml'), '--html', out]);
    expect(r.code).toBe(0);
    expect(r.stdout).toContain('Output at each duty');
    expect(r.stderr).toBe(`HTML report written to ${out}\n`);
    expect(readFileSync(out, 'utf8')).toContain('data-plot="magnitude"');
  });

  it('an existing file stays unless --force; the project file itself never', () => {
    const out = join(work, 'keep.html');
    writeFileSync(out, 'mine');
    const refused = runBuilt(['analyze', project('a.yaml'), '--html', out]);
    expect(refused.code).toBe(2);
    expect(refused.stderr).toContain('--html');
    expect(readFileSync(out, 'utf8')).toBe('mine');
    const forced = runBuilt(['analyze', project('a.yaml'), '--html', out, '--force']);
    expect(forced.code).toBe(0);
    expect(readFileSync(out, 'utf8')).toContain('<!DOCTYPE html>');
    const input = project('self.yaml');
    const self = runBuilt(['analyze', input, '--html', input, '--force']);
    expect(self.code).toBe(2);
    expect(self.stderr).toContain('which this command reads');
    expect(readFileSync(input, 'utf8')).toBe(GOOD);
  });
});

describe('compare and tolerance --html', () => {
  it('compare never writes over either input', () => {
    const base = project('base.yaml');
    const head = project('head.yaml', GOOD.replace('10k', '22k'));
    const r = runBuilt(['compare', base, head, '--html', head, '--force']);
    expect(r.code).toBe(2);
    expect(readFileSync(head, 'utf8')).toContain('22k');
    const out = join(work, 'compare.html');
    const ok = runBuilt(['compare', base, head, '--html', out]);
    expect(ok.code).toBe(0);
    expect(readFileSync(out, 'utf8').match(/data-plot="compare-/g)).toHaveLength(2);
  });

  it('tolerance --format html draws the three histograms', () => {
    const text = `${GOOD}tolerance: { resistor: 1 %, capacitor: 10 % }\n`;
    const r = runBuilt(['tolerance', project('t.yaml', text), '--samples', '300', '--workers', '1', '--format', 'html']);
    expect([0, 1]).toContain(r.code);
    expect(r.stdout.match(/data-plot="mc-/g)).toHaveLength(3);
  });
});

describe('design --format html', () => {
  it('marks the spec ripple at the resolution the curves are drawn at (a limit in LSB scales with it)', () => {
    // sample-configs/design-open-resolution.yaml states spec.ripple: 0.5 LSB and lets the search choose the bits
    const r = runBuilt(['design', join(root, 'sample-configs', 'design-open-resolution.yaml'), '--top', '1', '--format', 'html']);
    expect(r.code).toBe(0);
    const json = JSON.parse(r.stdout.match(/<script type="application\/json" id="report-data">([\s\S]*?)<\/script>/)![1]) as {
      resolutions: Array<{ bits: number; lsb: number }>;
      tradeoff: Array<{ points: Array<{ best: { bits: number } | null }> }>;
      basis: { limits: { ripple: number } };
    };
    const bits = json.tradeoff.flatMap((c) => c.points).find((p) => p.best !== null)!.best!.bits;
    const lsb = json.resolutions.find((x) => x.bits === bits)!.lsb;
    expect(lsb).not.toBe(json.basis.limits.ripple / 0.5); // the curves are at another resolution than the file's
    expect(r.stdout).toContain(`data-mark="spec ripple ${formatEng(0.5 * lsb, 'V', 3)}"`);
  });
});
