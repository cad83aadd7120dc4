import { describe, expect, it } from 'vitest';
import { designSearch } from '../../src/design/index.js';
import { wilsonInterval } from '../../src/numeric/statistics.js';
import { ladderFromProject } from '../../src/project/ladderFromProject.js';
import { parseProject } from '../../src/project/index.js';
import { monteCarlo } from '../../src/tolerance/monteCarlo.js';
import { SEQUENTIAL_Z, sequentialYield } from '../../src/tolerance/sequentialYield.js';

// Invented scenario: nominally feasible designs of a small space, some far inside the limits
// (yield near 100 %), some at their edge (yield far below the target).
const project = parseProject(
  `
pwm: { frequency: 20 kHz, bits: 10, high: 3.3 V, low: 0 V, driver: 30 ohm, duty: { min: 5 %, max: 95 % } }
load: { resistance: 1 Mohm }
spec:
  ripple: 1 LSB
  droop: 2 %
  settling: { band: 0.5 LSB, time: 5 ms }
search:
  stages: [1, 2]
  series: E6
  margin: 0 %
  resistance: { min: 1k, max: 100k }
  capacitance: { min: 10n, max: 10u }
tolerance: { resistor: 1 %, capacitor: 10 %, yield: 95 %, seed: 7 }
`,
  'sequential.yaml',
);

describe('sequentialYield: stops once the yield interval clears the target', () => {
  it('agrees with one full Monte Carlo run: the same figures at the cap, the same verdict when it stops early', () => {
    // Reference: monteCarlo.ts with the full sample count and the same seed.
    const cap = 1500;
    const designs = designSearch(project, { top: 40, compare: false, diagnose: false }).candidates;
    let early = 0;
    let atCap = 0;
    for (const d of designs) {
      const ladder = ladderFromProject(project, d.stages.map((s) => ({ r: s.r, c: s.c, buffered: false })));
      const s = sequentialYield(project, ladder, 0.95, cap);
      const full = monteCarlo(project, ladder, { samples: cap });
      expect(s.interval).toEqual(wilsonInterval(Math.round(s.yield * s.samples), s.samples, SEQUENTIAL_Z));
      if (s.early) {
        early++;
        expect(s.samples).toBeLessThan(cap);
        // The interval excludes the target on the side of the verdict (Wilson 1927, z = 3).
        expect(s.pass ? s.interval[0] >= 0.95 : s.interval[1] < 0.95).toBe(true);
        expect(s.pass, `${JSON.stringify(d.stages)}: full yield ${full.yield}`).toBe(full.yield >= 0.95);
      } else {
        atCap++;
        expect(s.samples).toBe(cap);
        expect(s.yield).toBe(full.yield);
        expect(s.pass).toBe(full.yield >= 0.95);
      }
    }
    expect(early).toBeGreaterThan(0);
    expect(early + atCap).toBe(designs.length);
  });
});
