/**
 * networkMetrics: the searches started from the nominal network's peaks (what Monte Carlo and the
 * worst case evaluate) against the general engine's own full searches (networkWorstRipple's grid
 * and every-code scans, networkDcTransfer's scan of every coarse code: what `analyze` reports), on
 * perturbed circuits of the three version 1.1 samples; and worker threads evaluating networks.
 * The engine itself is held to ODEX and closed forms in test/engine/periodic.
 */
import { describe, expect, it } from 'vitest';
import { loadProject } from '../../src/project/index.js';
import { networkFromProject } from '../../src/project/networkFromProject.js';
import { drawDeviates } from '../../src/tolerance/deviates.js';
import { metricPlan } from '../../src/tolerance/metricPlan.js';
import { monteCarlo } from '../../src/tolerance/monteCarlo.js';
import { networkMetrics } from '../../src/tolerance/networkMetrics.js';
import { monteCarloParallel } from '../../src/tolerance/parallel.js';
import { networkAt, toleranceParameters } from '../../src/tolerance/parameters.js';

const samples = ['complement-ripple-cancel', 'fine-16bit-setpoint', 'sallen-key-reference'];

describe('networkMetrics: searches from the nominal peaks against the engine\'s full searches', () => {
  for (const name of samples) {
    it(`${name}: ripple, droop, INL, gain and settling of perturbed circuits`, () => {
      const p = loadProject(`sample-configs/${name}.yaml`);
      const nominal = networkFromProject(p);
      const plan = metricPlan(p, nominal, { gain: true });
      const params = toleranceParameters(p.tolerance!, nominal);
      // uniform deviates spread the parts over their whole range (the box's far corners included)
      const count = name.startsWith('fine') ? 4 : 8;
      const z = drawDeviates(count, params.length, 5, 'uniform');
      const fs = nominal.pin.high - nominal.pin.low;
      for (let i = 0; i < count; i++) {
        const n = networkAt(nominal, params, z, i * params.length);
        const fast = networkMetrics(n, plan);
        const ref = networkMetrics(n, plan, { engineOnly: true });
        // Brent's tolerance 1e-6 on the duty against the engine's 1e-9: near a smooth maximum the
        // values differ by about f'' (1e-6)^2, far below 1e-9 of the ripple; a fine output's codes
        // are found exactly, so the values are the same numbers.
        expect(Math.abs(fast.worstRipple.ripple - ref.worstRipple.ripple)).toBeLessThan(1e-9 * ref.worstRipple.ripple);
        expect(Math.abs(fast.droop.error - ref.droop.error)).toBeLessThan(1e-9 * Math.abs(ref.droop.error) + 1e-12 * fs);
        if (plan.inl) expect(Math.abs(fast.inl!.error - ref.inl!.error)).toBeLessThan(1e-9 * Math.abs(ref.inl!.error) + 1e-12 * fs);
        if (plan.gain) expect(Math.abs(fast.gain! - ref.gain!)).toBeLessThan(1e-9 * Math.abs(ref.gain!) + 1e-12);
        expect(fast.settlingTime).toBe(ref.settlingTime);
      }
    });
  }
});

describe('Monte Carlo of a network in worker threads', () => {
  it('gives exactly the in-process result (the sallen-key sample)', async () => {
    const p = loadProject('sample-configs/sallen-key-reference.yaml');
    const inProcess = monteCarlo(p, undefined, { samples: 60 });
    // A low threshold so that this small run really uses this thread plus one worker.
    const parallel = await monteCarloParallel(p, undefined, { samples: 60, workers: 2, minSamplesPerThread: 20 });
    expect(parallel.values.worstRipple).toEqual(inProcess.values.worstRipple);
    expect(parallel.values.droop).toEqual(inProcess.values.droop);
    expect(parallel.values.settlingTime).toEqual(inProcess.values.settlingTime);
    expect(parallel.yield).toBe(inProcess.yield);
  });
});
