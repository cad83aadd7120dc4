/**
 * The README's side-by-side table ("What each circuit buys"), recomputed: every row meets the
 * ripple limit at its edge, the orderings the README states hold, and the README prints the
 * settling times this computation gives.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { TOPOLOGIES, circuitRow } from '../../scripts/circuit-table.js';

const LSB = 3.3 / 4096;

describe('circuit table', () => {
  const rows = TOPOLOGIES.map(circuitRow);
  const byName = (prefix: string) => rows.find((r) => r.name.startsWith(prefix))!;
  const bestPassive = Math.min(byName('passive, 1').settling!, byName('passive, 2').settling!);

  it('each circuit is scaled to the edge of the 0.5 LSB ripple limit', () => {
    for (const r of rows) {
      expect(r.worstRipple, r.name).toBeLessThanOrEqual(0.5 * LSB);
      expect(r.worstRipple, r.name).toBeGreaterThan(0.499 * LSB);
    }
  });

  it('the active stage settles more than 4x faster than the best passive design, the fine output more than 30x', () => {
    expect(bestPassive / byName('RC + Sallen-Key').settling!).toBeGreaterThan(4);
    expect(bestPassive / byName('fine').settling!).toBeGreaterThan(30);
  });

  it('the README shows the figures computed here', () => {
    const readme = readFileSync('README.md', 'utf8');
    for (const r of rows) {
      const ms = r.settling! * 1e3;
      const shown = ms >= 1000 ? `${(ms / 1000).toPrecision(3)} s` : `${ms.toPrecision(3)} ms`;
      const line = readme.split('\n').find((l) => l.startsWith(`| ${r.name} |`));
      if (!line) continue; // rows the README leaves out (one complement variant)
      expect(line, r.name).toContain(shown);
    }
  });
});
