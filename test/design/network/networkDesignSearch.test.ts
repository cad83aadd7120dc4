/**
 * The search over version 1.1 circuits (design/network) against exhaustive search: on small spaces
 * of each circuit (a Sallen-Key stage alone, RC + Sallen-Key, two RC stages with a complement output
 * through R and C, edge- and center-aligned, two RC stages with a fine output), unequal drivers throughout, every candidate
 * gets the exact engine's settling time and the full engine evaluation in settling order
 * (bruteForceNetwork.ts, which builds the space itself from model.md's Q formula and the explicit
 * ranges); the top designs must be the same designs with the same figures. Invented scenarios.
 */
import { describe, expect, it } from 'vitest';
import { networkDesignSearch } from '../../../src/design/network/networkDesignSearch.js';
import { parseProject } from '../../../src/project/index.js';
import { bruteForceNetwork, networkKey } from './bruteForceNetwork.js';

const SCENARIOS: Array<[string, string]> = [
  [
    'one Sallen-Key stage, default step (both directions), E6, Q 0.5 to 0.75',
    `
pwm: { frequency: 19.5 kHz, bits: 8, high: 3.3 V, low: 0 V, driver: { high: 40 ohm, low: 25 ohm }, duty: { min: 5 %, max: 95 % } }
load: { resistance: 47k }
filter:
  stages:
    - { active: sallen-key, r1: 10k, r2: 10k, c1: 22n, c2: 10n }
spec:
  ripple: 0.5 LSB
  droop: 1 LSB
search:
  series: E6
  resistance: { min: 2k2, max: 47k }
  capacitance: { min: 4n7, max: 220n }
  q: { min: 0.5, max: 0.75 }
`,
  ],
  [
    'RC + Sallen-Key, step 10 % to 90 % with a settling limit, E3',
    `
pwm: { frequency: 19.5 kHz, bits: 10, high: 3.3 V, low: 0 V, driver: { high: 40 ohm, low: 25 ohm }, duty: { min: 5 %, max: 95 % } }
load: { resistance: 47k }
filter:
  stages:
    - { r: 4k7, c: 100n }
    - { active: sallen-key, r1: 10k, r2: 10k, c1: 22n, c2: 10n }
spec:
  ripple: 0.5 LSB
  droop: 1 LSB
  settling: { band: 0.5 LSB, from: 10 %, to: 90 % }
search:
  series: E3
  resistance: { min: 2k2, max: 22k }
  capacitance: { min: 4n7, max: 100n }
`,
  ],
  [
    'two RC stages, complement output through R and C, E3',
    `
pwm: { frequency: 39 kHz, bits: 8, high: 5 V, low: 0 V, driver: { high: 35 ohm, low: 25 ohm }, duty: { min: 5 %, max: 95 % } }
second_pwm: { role: complement, into: { stage: 1, r: 10k, c: 1u } }
filter:
  stages:
    - { r: 10k, c: 100n }
    - { r: 10k, c: 100n }
spec:
  ripple: 0.003 LSB
  settling: { band: 0.5 LSB, from: 10 %, to: 90 % }
search:
  series: E3
  resistance: { min: 4k7, max: 22k }
  capacitance: { min: 10n, max: 220n }
  second_pwm: { r: { min: 4k7, max: 10k }, c: { min: 100n, max: 220n } }
`,
  ],
  [
    'two RC stages, fine output (6 + 4 bits), INL limit, E12 resistors, E3 capacitors',
    `
pwm: { frequency: 62.5 kHz, bits: 6, high: 3.3 V, low: 0 V, driver: { high: 40 ohm, low: 25 ohm }, duty: { min: 2 %, max: 98 % } }
second_pwm: { role: fine, bits: 4, into: { stage: 1, r: 680k } }
filter:
  stages:
    - { r: 10k, c: 1u }
    - { r: 10k, c: 1u }
spec:
  ripple: 0.01 LSB
  inl: 1 LSB
  settling: { band: 1 LSB, from: 10 %, to: 90 % }
search:
  series: { resistor: E12, capacitor: E3 }
  resistance: { min: 10k, max: 18k }
  capacitance: { min: 22n, max: 1u }
  second_pwm: { r: { min: 560k, max: 1M } }
`,
  ],
  [
    'complement through R and C, center-aligned, default step (both directions)',
    `
pwm: { frequency: 39 kHz, alignment: center, bits: 8, high: 5 V, low: 0 V, driver: { high: 35 ohm, low: 25 ohm }, duty: { min: 5 %, max: 95 % } }
second_pwm: { role: complement, into: { stage: 1, r: 10k, c: 1u } }
filter:
  stages:
    - { r: 10k, c: 100n }
    - { r: 10k, c: 100n }
spec:
  ripple: 0.003 LSB
  settling: { band: 0.5 LSB }
search:
  series: E3
  resistance: { min: 4k7, max: 22k }
  capacitance: { min: 10n, max: 100n }
  second_pwm: { r: { min: 4k7, max: 10k }, c: { min: 100n, max: 220n } }
`,
  ],

];

describe('networkDesignSearch finds the exhaustive optimum', () => {
  for (const [label, yaml] of SCENARIOS) {
    it(label, () => {
      const p = parseProject(yaml, 'invented.yaml');
      const found = networkDesignSearch(p, { top: 3, compare: false });
      const brute = bruteForceNetwork(p, 3);
      // The same space: the search's own count equals the one built here.
      expect(found.stats.space).toBe(brute.count);
      expect(brute.ranked.length).toBe(3);
      expect(found.feasible).toBe(true);
      expect(found.candidates.map(networkKey)).toEqual(brute.ranked.map(networkKey));
      expect(found.candidates.map((c) => c.settlingTime)).toEqual(brute.ranked.map((c) => c.settlingTime));
      expect(found.candidates.map((c) => c.worstRipple)).toEqual(brute.ranked.map((c) => c.worstRipple));
      // The bounds pruned: far fewer exact evaluations than candidates.
      expect(found.stats.verified).toBeLessThan(brute.count / 20);
    });
  }
});
