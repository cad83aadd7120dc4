import { describe, expect, it } from 'vitest';
import { designSearch } from '../../src/design/index.js';
import { ladderFromProject } from '../../src/project/ladderFromProject.js';
import { parseProject } from '../../src/project/index.js';
import { cornerMiss } from '../../src/tolerance/cornerMiss.js';
import { worstCaseCheck } from '../../src/tolerance/robustChecks.js';
import { worstCase } from '../../src/tolerance/worstCase.js';

// Invented scenario: a small two-stage space whose nominally feasible designs straddle the
// worst-case limits (1 %/10 % parts), so both outcomes occur.
const project = parseProject(
  `
pwm: { frequency: 20 kHz, bits: 10, high: 3.3 V, low: 0 V, driver: { high: 40 ohm, low: 25 ohm }, duty: { min: 5 %, max: 95 % } }
load: { resistance: 1 Mohm, capacitance: 100 pF }
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
tolerance: { resistor: 1 %, capacitor: 10 % }
`,
  'corner.yaml',
);

describe('cornerMiss: a corner miss proves the worst-case verdict', () => {
  it('every design it rules out fails the full worst-case search, and the verdict is unchanged', () => {
    // Reference: worstCase.ts (sign scan, line searches, sweep of all corners) on each design.
    const designs = designSearch(project, { top: 60, compare: false, diagnose: false }).candidates;
    expect(designs.length).toBeGreaterThan(30);
    let ruledOut = 0;
    let passed = 0;
    for (const d of designs) {
      const ladder = ladderFromProject(project, d.stages.map((s) => ({ r: s.r, c: s.c, buffered: false })));
      const full = worstCase(project, ladder);
      const miss = cornerMiss(project, ladder);
      if (miss !== null) {
        ruledOut++;
        expect(full.pass, `${JSON.stringify(d.stages)} missed ${miss} at a corner`).toBe(false);
        const figure = miss === 'ripple' ? full.worstRipple : miss === 'droop' ? full.droop : miss === 'inl' ? full.inl! : full.settlingTime;
        expect(figure.pass).toBe(false);
      }
      if (full.pass) passed++;
      expect(worstCaseCheck(project, ladder).pass).toBe(full.pass);
    }
    expect(ruledOut).toBeGreaterThan(0);
    expect(passed).toBeGreaterThan(0);
  });
});
