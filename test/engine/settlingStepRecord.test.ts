import { describe, expect, it } from 'vitest';
import { analyzeProject } from '../../src/engine/analyze.js';
import { steadyState, steadyWaveform, stepWaveform } from '../../src/engine/index.js';
import { loadProject } from '../../src/project/index.js';
import { envelope } from '../../src/report/charts.js';
import { settlingStepRecord as stepRecord } from '../../src/engine/settlingStepRecord.js';
import { stepRecordDuration as stepDuration } from '../../src/engine/stepRecordDuration.js';
import { oneStageProject } from '../report/projectFixture.js';

describe('stepRecord', () => {
  const analysis = analyzeProject(loadProject('sample-configs/greenhouse-heater.yaml'));
  const record = stepRecord(analysis);
  const { t, v } = record.wave;
  const T = analysis.ladder!.period;

  it('runs from the step to the end of the record on a 16-per-period grid, plus the exact end', () => {
    // Source: the record's contract (stepRecordDuration.ts rule, per-period grid).
    expect(t[0]).toBe(0);
    expect(t.at(-1)).toBe(stepDuration(analysis));
    expect(t.length).toBeGreaterThanOrEqual(600);
    expect(t.length).toBeLessThanOrEqual(20_000);
    for (let i = 0; i + 1 < t.length; i++) {
      expect(t[i + 1]).toBeGreaterThan(t[i]);
      if (i + 2 < t.length) expect(t[i]).toBeCloseTo((i * T) / 16, 15);
    }
  });

  it('is exact at its instants: the engine step response one instant at a time', () => {
    // Source: stepWaveform (uniform instants; checked in test/engine against mathjs and closed forms).
    const ladder = analysis.ladder!;
    for (const i of [1, 7, 16, 500, 1234, t.length - 2, t.length - 1]) {
      const single = stepWaveform(ladder, record.from, record.to, t[i], 2).v[1];
      expect(Math.abs(single - v[i])).toBeLessThan(1e-12 * (ladder.high - ladder.low));
    }
    // before the step: periodic steady state at `from`, rising edge (model.md)
    expect(Math.abs(v[0] - steadyWaveform(ladder, record.from, 1, 1).v[0])).toBeLessThan(1e-12);
  });

  it('stays within the band from the settling time on (definition of settling time, model.md)', () => {
    expect(record.time).not.toBeNull();
    const after = v.filter((_, i) => t[i] >= (record.time as number));
    expect(after.length).toBeGreaterThan(100);
    for (const x of after) expect(Math.abs(x - record.final)).toBeLessThanOrEqual(record.band * (1 + 1e-9));
  });

  it('a record of nearly a million periods keeps 20 000 samples in whole periods spread over its length', () => {
    // Invented slow filter: 100 kohm + 10 uF (tau = 1 s) behind a 100 kHz PWM: ~9 s of record.
    const slow = analyzeProject(oneStageProject({ r: 100e3, c: 10e-6, frequency: 100e3 }));
    const s = stepRecord(slow);
    const Ts = slow.ladder!.period;
    const { t: ts, v: vs } = s.wave;
    expect(stepDuration(slow) / Ts).toBeGreaterThan(1e5);
    expect(ts.length).toBeLessThanOrEqual(20_000);
    expect(ts[0]).toBe(0);
    expect(ts.at(-1)).toBe(stepDuration(slow));
    // every sampled period has its 16 samples T/16 apart (the last only up to the end of the record)
    const byPeriod = new Map<number, number[]>();
    ts.slice(0, -1).forEach((x) => {
      const k = Math.floor(x / Ts + 1e-6);
      byPeriod.set(k, [...(byPeriod.get(k) ?? []), x / Ts - k]);
    });
    const ks = [...byPeriod.keys()];
    expect(ks.length).toBeGreaterThan(1000);
    ks.forEach((k, i) => {
      const phases = byPeriod.get(k)!;
      if (i + 1 < ks.length) expect(phases.length).toBe(16);
      phases.forEach((f, j) => expect(f).toBeCloseTo(j / 16, 6));
    });
    const gaps = ks.slice(1).map((k, i) => k - ks[i]);
    expect(Math.max(...gaps) - Math.min(...gaps)).toBeLessThanOrEqual(1);
    expect(envelope(s.wave, 72).lower.every(Number.isFinite)).toBe(true);
  });

  it('a strided record that never settles draws the true steady ripple at its end', () => {
    // Invented: 10 kohm + 1 uF behind 25 ohm (tau ~ 1000 T at 100 kHz), a small step 50 % -> 52 %
    // and a band below the ripple, so the output never settles and the record is 8 tau long
    // (stepRecordDuration), sampled in an evenly spread subset of periods. The last column of the envelope
    // must span the exact steady-state ripple at 52 % (steadyState), less what a T/16 grid misses at
    // the corner at 0.52 T (the nearest sample is 0.32 of a step before it, on a rise of 8.32 steps
    // that is nearly straight as tau = 1000 T: 3.85 %), plus at most the drift left in the column
    // (the step's remaining deviation, e^-8 of 66 mV, times ~1/18 tau).
    const project = { ...oneStageProject({ r: 10e3, c: 1e-6, frequency: 100e3 }), spec: { settling: { band: 25e-6, from: 0.5, to: 0.52 } } };
    const a = analyzeProject(project);
    expect(a.settling.time).toBeNull();
    const s = stepRecord(a);
    expect(stepDuration(a) / a.ladder!.period).toBeGreaterThan(20_000 / 16);
    expect(s.wave.t.length).toBeLessThanOrEqual(20_000);
    const { lower, upper } = envelope(s.wave, 72);
    const ripple = steadyState(a.ladder!, 0.52).ripple;
    const spread = upper[71] - lower[71];
    expect(spread).toBeGreaterThan(0.955 * ripple);
    expect(spread).toBeLessThan(ripple + 0.066 * Math.exp(-8) / 10);
  });
});
