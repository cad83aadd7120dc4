import { describe, expect, it } from 'vitest';
import { monteCarlo } from '../../src/tolerance/monteCarlo.js';
import { monteCarloParallel } from '../../src/tolerance/parallel.js';
import { normalCdf, oneStageRipple, stage } from './reference.js';
import { project } from './projectFixture.js';

const T = 1 / 20e3;
const R0 = 10e3;
const C0 = 100e-9;
const tolR = 0.05;
const tolC = 0.1;
// One stage, equal ideal drivers, no load: the worst ripple over [10 %, 90 %] is at D = 0.5, and
// it falls monotonically as tau = R C grows (closed form, textbook). A limit equal to the ripple
// at tau_min passes exactly the samples with R C >= tau_min.
const tauMin = 0.97 * R0 * C0;
const limit = oneStageRipple(3.3, T, 0.5, tauMin);

/** CDF of a part value under the study's distribution: normal sigma = tol/3 cut at +-tol, or uniform. */
function partCdf(x: number, nominal: number, tol: number, kind: 'normal' | 'uniform'): number {
  const z = (x / nominal - 1) / tol; // in units of the tolerance, -1..1
  if (z <= -1) return 0;
  if (z >= 1) return 1;
  if (kind === 'uniform') return (z + 1) / 2;
  return (normalCdf(3 * z) - normalCdf(-3)) / (normalCdf(3) - normalCdf(-3));
}

/**
 * P(R C >= tau_min) = integral over c of f_C(c) (1 - F_R(tau_min / c)) dc, by composite Simpson's
 * rule on the CDF increments of C (Stieltjes form, 4000 cells): the yield computed directly from
 * the distributions, independently of the sampler.
 */
function exactYield(kind: 'normal' | 'uniform'): number {
  const cells = 4000;
  const lo = C0 * (1 - tolC);
  const hi = C0 * (1 + tolC);
  let y = 0;
  for (let i = 0; i < cells; i++) {
    const a = lo + ((hi - lo) * i) / cells;
    const b = lo + ((hi - lo) * (i + 1)) / cells;
    const m = 0.5 * (a + b);
    const survive = (c: number) => 1 - partCdf(tauMin / c, R0, tolR, kind);
    const mass = partCdf(b, C0, tolC, kind) - partCdf(a, C0, tolC, kind);
    y += (mass * (survive(a) + 4 * survive(m) + survive(b))) / 6;
  }
  return y;
}

function oneStageProject(kind: 'normal' | 'uniform', samples: number, seed: number) {
  return project([stage(R0, C0)], { resistor: tolR, capacitor: tolC, distribution: kind, samples, seed }, { spec: { ripple: limit } });
}

describe('monteCarlo', () => {
  for (const kind of ['normal', 'uniform'] as const) {
    it(`one-stage yield agrees with the yield integrated from the ${kind} distributions of R and C`, () => {
      const N = 20_000;
      const mc = monteCarlo(oneStageProject(kind, N, 11));
      const y = exactYield(kind);
      expect(y).toBeGreaterThan(0.5);
      expect(y).toBeLessThan(0.95);
      // |yhat - y| <= 4 sqrt(y (1 - y) / N): binomial standard error, normal approximation; the
      // chance of a false alarm is about 6e-5 (two-sided 4 sigma)
      expect(Math.abs(mc.yield - y)).toBeLessThanOrEqual(4 * Math.sqrt((y * (1 - y)) / N));
      expect(mc.yieldBySpec.ripple).toBe(mc.yield);
      expect(mc.values.engineSamples).toBe(0);
    });
  }

  it('same seed, same result; another seed, another result', () => {
    const a = monteCarlo(oneStageProject('normal', 500, 3));
    const b = monteCarlo(oneStageProject('normal', 500, 3));
    const c = monteCarlo(oneStageProject('normal', 500, 4));
    expect(b.values.worstRipple).toEqual(a.values.worstRipple);
    expect(b.values.settlingTime).toEqual(a.values.settlingTime);
    expect(b.yield).toBe(a.yield);
    expect(c.values.worstRipple).not.toEqual(a.values.worstRipple);
  });

  it('uniform parts spread the ripple wider than normal ones, by about the ratio of their deviations', () => {
    // To first order the ripple is linear in the part deviations, so its spread scales with theirs:
    // uniform variance tol^2 / 3 against (tol/3)^2 (1 - 6 phi(3) / (2 Phi(3) - 1)) for the normal
    // cut at 3 sigma, a ratio of standard deviations of about 1.75. Checked loosely (1.5 to 2.0):
    // the ripple is not exactly linear over +-10 %.
    const std = (v: Float64Array) => {
      const m = v.reduce((a, x) => a + x, 0) / v.length;
      return Math.sqrt(v.reduce((a, x) => a + (x - m) ** 2, 0) / (v.length - 1));
    };
    const u = monteCarlo(oneStageProject('uniform', 5000, 5));
    const n = monteCarlo(oneStageProject('normal', 5000, 5));
    const ratio = std(u.values.worstRipple) / std(n.values.worstRipple);
    expect(ratio).toBeGreaterThan(1.5);
    expect(ratio).toBeLessThan(2.0);
    expect(u.yield).toBeLessThan(n.yield);
  });

  it('worker threads give exactly the in-process result', async () => {
    const p = project(
      [stage(2.2e3, 470e-9), stage(10e3, 47e-9)],
      { samples: 1200, seed: 9, driver: { high: { min: 20, max: 60 }, low: { min: 15, max: 40 } }, supply: 0.05 },
      { spec: { ripple: 1e-3, settling: { band: 1.6e-3, time: 0.02 } } },
    );
    const inProcess = monteCarlo(p);
    // A low threshold so that this small run really uses this thread plus one and two workers.
    for (const workers of [2, 3]) {
      const parallel = await monteCarloParallel(p, undefined, { workers, minSamplesPerThread: 300 });
      expect(parallel.values.worstRipple).toEqual(inProcess.values.worstRipple);
      expect(parallel.values.droop).toEqual(inProcess.values.droop);
      expect(parallel.values.settlingTime).toEqual(inProcess.values.settlingTime);
      expect(parallel.yield).toBe(inProcess.yield);
    }
  });

  it('with work alongside: runs it once on this thread, the same result; an error there stops the run', async () => {
    const p = project(
      [stage(2.2e3, 470e-9), stage(10e3, 47e-9)],
      { samples: 1500, seed: 4, driver: { high: { min: 20, max: 60 }, low: { min: 15, max: 40 } } },
      { spec: { ripple: 1e-3, settling: { band: 1.6e-3, time: 0.02 } } },
    );
    const inProcess = monteCarlo(p);
    let runs = 0;
    let seen = 0;
    const parallel = await monteCarloParallel(p, undefined, {
      workers: 2,
      minSamplesPerThread: 300,
      alongside: () => runs++,
      onProgress: (done) => (seen = Math.max(seen, done)),
    });
    expect(runs).toBe(1);
    expect(seen).toBe(1500);
    expect(parallel.values.worstRipple).toEqual(inProcess.values.worstRipple);
    expect(parallel.values.settlingTime).toEqual(inProcess.values.settlingTime);
    await expect(
      monteCarloParallel(p, undefined, {
        workers: 2,
        minSamplesPerThread: 300,
        alongside: () => {
          throw new Error('alongside failed');
        },
      }),
    ).rejects.toThrow('alongside failed');
    // A worker that fails at once, while this thread is still busy: its error comes out of the run,
    // and no unhandled rejection escapes meanwhile (vitest fails a run that has one).
    await expect(
      monteCarloParallel(p, undefined, {
        workers: 2,
        minSamplesPerThread: 300,
        workerUrl: new URL('data:text/javascript,throw new Error("worker failed at start")'),
        alongside: () => {
          const until = Date.now() + 400;
          while (Date.now() < until);
        },
      }),
    ).rejects.toThrow('worker failed at start');
  });
});
