/**
 * `design --format json` is deterministic: two identical runs of the built command print identical
 * JSON (no wall time in it; the Monte Carlo of --robust yield is seeded). The search time stays in
 * the text report.
 */
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { runBuilt } from './runBuilt.js';

const dir = mkdtempSync(join(tmpdir(), 'dacsmith-design-json-'));
const file = join(dir, 'board.yaml');
writeFileSync(
  file,
  `# invented scenario
pwm: { frequency: 20 kHz, bits: 10, high: 3.3 V, low: 0 V, driver: 30 ohm, duty: { min: 5 %, max: 95 % } }
spec:
  ripple: 0.5 LSB
search:
  stages: [1, 2]
  series: E3
  resistance: { min: 1k, max: 10k }
  capacitance: { min: 10n, max: 1u }
tolerance:
  resistor: 1 %
  capacitor: 10 %
  yield: 90 %
`,
);

describe('design --format json', () => {
  it.each([[[]], [['--robust', 'yield']]])('prints the same JSON twice (%j)', (more: string[]) => {
    const first = runBuilt(['design', file, '--format', 'json', ...more]);
    const second = runBuilt(['design', file, '--format', 'json', ...more]);
    expect(first.code).toBe(0);
    expect(first.stderr).toBe('');
    expect(JSON.parse(first.stdout)).not.toHaveProperty('elapsed');
    expect(second.stdout).toBe(first.stdout);
  }, 60_000);

  it('the text report still states the search time', () => {
    const text = runBuilt(['design', file, '--no-charts', '--top', '1', '--width', '300']);
    expect(text.stdout).toMatch(/evaluated by the fast model, \d+ by the exact engine, [\d.]+ m?s/);
  }, 60_000);
});
