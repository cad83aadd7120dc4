/**
 * The pruning-only model of version 1.1 circuits (design/network/fastNetwork.ts) and the bounds built
 * on it (networkBounds.ts), held to the exact engine: the periodic state at the period start and the
 * average equal periodicOrbit's; the sampled output lies within its extremes; and on candidates
 * spread over small design spaces of each circuit (unequal drivers), every bound is at most the
 * engine's figure (worst ripple, settling time, droop, INL) and the endpoint-fit gain error is the
 * engine's own. A bound above the engine's figure would let the search drop a design that belongs
 * in the list.
 */
import { describe, expect, it } from 'vitest';
import { fastNetwork, fastOrbit, sampledOutput } from '../../../src/design/network/fastNetwork.js';
import { dcBounds, probeOf, rippleLowerBound, settlingLowerBound } from '../../../src/design/network/networkBounds.js';
import { networkProblem } from '../../../src/design/network/networkProblem.js';
import { networkCandidate } from '../../../src/design/network/networkCandidate.js';
import { periodicOrbit } from '../../../src/engine/periodic/periodicOrbit.js';
import { parseProject } from '../../../src/project/index.js';
import * as nets from '../../engine/periodic/networks.js';

describe('fastOrbit and sampledOutput agree with the engine (periodicOrbit.ts)', () => {
  const cases: Array<[string, (typeof nets)['oneRc'], Array<{ first: number; second: number | null }>]> = [
    ['one RC stage', nets.oneRc, [{ first: 0.3, second: null }]],
    ['one RC stage, center-aligned', nets.oneRcCenter, [{ first: 0.7, second: null }]],
    ['two RC stages, unequal drivers, loaded', nets.twoRcLoaded, [{ first: 0.05, second: null }, { first: 0.5, second: null }]],
    ['RC + Sallen-Key, Q 2 (rings)', nets.rcSallenKeyQ2, [{ first: 0.4, second: null }]],
    ['complement through R and C', nets.complementRC, [{ first: 0.25, second: null }]],
    ['complement through R, center-aligned', nets.complementRCenter, [{ first: 0.6, second: null }]],
    ['fine output', nets.fine44, [{ first: 0.5, second: 0.3125 }, { first: 0.0625, second: 0.9375 }]],
  ];
  for (const [label, network, duties] of cases) {
    it(label, () => {
      const model = fastNetwork(network);
      for (const d of duties) {
        const exact = periodicOrbit(network, d);
        const fast = fastOrbit(model, d);
        const scale = network.pin.high - network.pin.low;
        for (let i = 0; i < exact.start.length; i++) expect(Math.abs(fast.start[i] - exact.start[i])).toBeLessThan(1e-12 * scale);
        expect(Math.abs(fast.average - exact.average)).toBeLessThan(1e-12 * scale);
        const s = sampledOutput(model, fast, 8);
        expect(s.max).toBeLessThanOrEqual(exact.max + 1e-13 * scale);
        expect(s.min).toBeGreaterThanOrEqual(exact.min - 1e-13 * scale);
        // 16 or more samples per period catch most of the peak-to-peak (common practice for a smooth waveform).
        expect(s.max - s.min).toBeGreaterThan(0.9 * exact.ripple);
      }
    });
  }
});

const SPACES: Record<string, string> = {
  "one Sallen-Key stage": "\npwm: { frequency: 19.5 kHz, bits: 8, high: 3.3 V, low: 0 V, driver: { high: 40 ohm, low: 25 ohm }, duty: { min: 5 %, max: 95 % } }\nload: { resistance: 47k }\nfilter:\n  stages:\n    - { active: sallen-key, r1: 10k, r2: 10k, c1: 22n, c2: 10n }\nspec:\n  ripple: 0.5 LSB\n  droop: 1 LSB\nsearch:\n  series: E6\n  resistance: { min: 2k2, max: 47k }\n  capacitance: { min: 4n7, max: 220n }\n  q: { min: 0.5, max: 0.75 }\n",
  "RC + Sallen-Key": "\npwm: { frequency: 19.5 kHz, bits: 10, high: 3.3 V, low: 0 V, driver: { high: 40 ohm, low: 25 ohm }, duty: { min: 5 %, max: 95 % } }\nload: { resistance: 47k }\nfilter:\n  stages:\n    - { r: 4k7, c: 100n }\n    - { active: sallen-key, r1: 10k, r2: 10k, c1: 22n, c2: 10n }\nspec:\n  ripple: 0.5 LSB\n  droop: 1 LSB\n  settling: { band: 0.5 LSB, from: 10 %, to: 90 % }\nsearch:\n  series: E3\n  resistance: { min: 2k2, max: 22k }\n  capacitance: { min: 4n7, max: 100n }\n",
  "complement through R and C": "\npwm: { frequency: 39 kHz, bits: 8, high: 5 V, low: 0 V, driver: { high: 35 ohm, low: 25 ohm }, duty: { min: 5 %, max: 95 % } }\nsecond_pwm: { role: complement, into: { stage: 1, r: 10k, c: 1u } }\nfilter:\n  stages:\n    - { r: 10k, c: 100n }\n    - { r: 10k, c: 100n }\nspec:\n  ripple: 0.003 LSB\n  settling: { band: 0.5 LSB, from: 10 %, to: 90 % }\nsearch:\n  series: E3\n  resistance: { min: 4k7, max: 22k }\n  capacitance: { min: 10n, max: 220n }\n  second_pwm: { r: { min: 4k7, max: 10k }, c: { min: 100n, max: 220n } }\n",
  "fine output": "\npwm: { frequency: 62.5 kHz, bits: 6, high: 3.3 V, low: 0 V, driver: { high: 40 ohm, low: 25 ohm }, duty: { min: 2 %, max: 98 % } }\nsecond_pwm: { role: fine, bits: 4, into: { stage: 1, r: 680k } }\nfilter:\n  stages:\n    - { r: 10k, c: 1u }\n    - { r: 10k, c: 1u }\nspec:\n  ripple: 0.01 LSB\n  inl: 1 LSB\n  settling: { band: 1 LSB, from: 10 %, to: 90 % }\nsearch:\n  series: { resistor: E12, capacitor: E3 }\n  resistance: { min: 10k, max: 18k }\n  capacitance: { min: 22n, max: 1u }\n  second_pwm: { r: { min: 560k, max: 1M } }\n"
};

describe('the bounds never exceed the exact engine (candidates spread over each space)', () => {
  for (const [label, yaml] of Object.entries(SPACES)) {
    it(label, () => {
      const problem = networkProblem(parseProject(yaml, 'invented.yaml'));
      const every = Math.max(1, Math.floor(problem.space / 40));
      let i = 0;
      let checked = 0;
      let settled = 0;
      let close = 0;
      problem.enumerate((stages, second) => {
        if (i++ % every !== 0) return;
        const network = problem.networkOf(stages, second);
        const probe = probeOf(fastNetwork(network));
        const exact = networkCandidate(problem, network);
        expect(rippleLowerBound(problem, probe, 3)).toBeLessThanOrEqual(exact.worstRipple * (1 + 1e-9));
        const coarse = settlingLowerBound(problem, probe);
        const refined = settlingLowerBound(problem, probe, true);
        expect(refined).toBeGreaterThanOrEqual(coarse);
        if (exact.settlingTime !== null) {
          expect(refined).toBeLessThanOrEqual(exact.settlingTime * (1 + 1e-9));
          settled++;
          if (refined >= 0.9 * exact.settlingTime) close++;
        }
        const dc = dcBounds(problem, probe);
        expect(dc.droop).toBeLessThanOrEqual(exact.droop * (1 + 1e-9) + 1e-15);
        expect(dc.inl).toBeLessThanOrEqual(exact.inl * (1 + 1e-9) + 1e-15);
        expect(Math.abs(dc.gainError - exact.gainError)).toBeLessThan(1e-9 * (network.pin.high - network.pin.low));
        checked++;
      });
      expect(checked).toBeGreaterThanOrEqual(30);
      // The settling bound is also close (it is what keeps the exact evaluations few): most within 10 %.
      expect(settled).toBeGreaterThanOrEqual(5);
      expect(close).toBeGreaterThan(0.7 * settled);
    });
  }
});
