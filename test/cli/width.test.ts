/**
 * Every text report fits the terminal: 80 columns when standard output is not a terminal (as
 * here), else `--width N`. Widths measured with string-width, as a terminal counts them.
 */
import stringWidth from 'string-width';
import { describe, expect, it } from 'vitest';
import { runBuilt } from './runBuilt.js';

const withFilter = ['greenhouse-heater', 'motor-current-ref', 'sensor-bias-trim', 'tolerance-fan-reference', 'design-tight-ripple'].map(
  (n) => `sample-configs/${n}.yaml`,
);
const withTolerance = ['greenhouse-heater', 'tolerance-fan-reference'].map((n) => `sample-configs/${n}.yaml`);

const runs: Array<[string, string[]]> = [
  ...withFilter.map((f): [string, string[]] => [`analyze ${f}`, ['analyze', f]]),
  ['design design-tight-ripple', ['design', 'sample-configs/design-tight-ripple.yaml', '--top', '5']],
  ['design design-open-resolution', ['design', 'sample-configs/design-open-resolution.yaml', '--top', '5']],
  ['design design-wide-e24', ['design', 'sample-configs/design-wide-e24.yaml', '--top', '5', '--no-charts']],
  ...withTolerance.map((f): [string, string[]] => [`tolerance ${f}`, ['tolerance', f, '--samples', '2000']]),
  ['check', ['check', ...withFilter]],
  ['compare', ['compare', 'sample-configs/greenhouse-heater.yaml', 'sample-configs/motor-current-ref.yaml']],
];

const widest = (text: string) => Math.max(...text.split('\n').map((l) => stringWidth(l)));

describe('text reports fit the width', () => {
  it.each(runs)('%s: at most 80 columns by default, at most N with --width N', (_name, args) => {
    const plain = runBuilt(args);
    expect(plain.code === 0 || plain.code === 1).toBe(true);
    expect(plain.stdout.length).toBeGreaterThan(0);
    expect(widest(plain.stdout)).toBeLessThanOrEqual(80);
    for (const n of [50, 60]) {
      const narrow = runBuilt([...args, '--width', String(n)]);
      expect(narrow.code).toBe(plain.code);
      expect(widest(narrow.stdout)).toBeLessThanOrEqual(n);
    }
  });

  it('uses a wider width when asked (the analysis tables then need no wrapping)', () => {
    const wide = runBuilt(['analyze', 'sample-configs/greenhouse-heater.yaml', '--width', '140']);
    expect(widest(wide.stdout)).toBeLessThanOrEqual(140);
    expect(widest(wide.stdout)).toBeGreaterThan(80);
    expect(wide.stdout).toMatch(/duty \(%\) +average \(V\) +ideal \(V\)/);
  });

  it('refuses a width below 50 columns (exit 2)', () => {
    const r = runBuilt(['analyze', 'sample-configs/greenhouse-heater.yaml', '--width', '49']);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/--width must be a whole number of at least 50/);
  });
});
