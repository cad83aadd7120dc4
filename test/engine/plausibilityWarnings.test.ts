/**
 * plausibilityWarnings and partValueWarnings: each rule at its threshold. The thresholds are
 * model.md "Version 1.1 additions" (Warnings): resistance 1 ohm .. 100 Mohm, capacitance
 * 1 pF .. 10 mF, slowest time constant >= PWM period, output span >= 90 % of the ideal span.
 */
import { describe, expect, it } from 'vitest';
import { analyzeProject } from '../../src/engine/analyze.js';
import { PLAUSIBLE, partValueWarnings, plausibilityWarnings } from '../../src/engine/plausibilityWarnings.js';
import type { Project } from '../../src/project/types.js';
import { oneStageProject } from '../report/projectFixture.js';

const keys = (ws: { key: string }[]) => ws.map((w) => w.key);
const withStage = (p: Project, r: number, c: number): Project => ({ ...p, filter: { stages: [{ r, c, buffered: false }] } });
/** Figures that trip no analysis rule for the fixture (10 kHz, ideal span 0.9 x 3.3 V). */
const calm = { timeConstants: [1e-3], outputSpan: 0.9 * 3.3 };

describe('part value rules (model.md 1.1: 1 ohm .. 100 Mohm, 1 pF .. 10 mF)', () => {
  it('keeps the thresholds of model.md 1.1', () => {
    // model.md "Version 1.1 additions", Warnings
    expect(PLAUSIBLE).toEqual({ resistance: { min: 1, max: 100e6 }, capacitance: { min: 1e-12, max: 10e-3 }, span: 0.9 });
  });

  it('warns on a filter resistance just outside 1 ohm .. 100 Mohm, not on the limits themselves', () => {
    const p = oneStageProject();
    expect(partValueWarnings(withStage(p, 1, 1e-6))).toEqual([]);
    expect(partValueWarnings(withStage(p, 100e6, 1e-6))).toEqual([]);
    expect(keys(partValueWarnings(withStage(p, 0.99, 1e-6)))).toEqual(['filter.stages[0].r']);
    expect(keys(partValueWarnings(withStage(p, 101e6, 1e-6)))).toEqual(['filter.stages[0].r']);
  });

  it('warns on a capacitance just outside 1 pF .. 10 mF, not on the limits themselves', () => {
    const p = oneStageProject();
    expect(partValueWarnings(withStage(p, 1e3, 1e-12))).toEqual([]);
    expect(partValueWarnings(withStage(p, 1e3, 10e-3))).toEqual([]);
    expect(keys(partValueWarnings(withStage(p, 1e3, 0.99e-12)))).toEqual(['filter.stages[0].c']);
    expect(keys(partValueWarnings(withStage(p, 1e3, 11e-3)))).toEqual(['filter.stages[0].c']);
  });

  it("reads a 1m load as 1 milliohm and suggests 1M: in IEC 60062 and SI 'm' is milli", () => {
    // SI Brochure (9th ed.), table 7: m = 1e-3, M = 1e6; IEC 60062 uses the same letters in codes.
    const [w] = partValueWarnings(oneStageProject({ loadResistance: 1e-3 }));
    expect(w.key).toBe('load.resistance');
    expect(w.message).toContain('read as 1 mΩ');
    expect(w.message).toContain('did you mean 1M (1 MΩ)?');
    expect(w.message).toContain("'m' is milli");
  });

  it('suggests micro for a bare number of farads, and for milli', () => {
    const bare = partValueWarnings(withStage(oneStageProject(), 1e3, 100));
    expect(bare[0].message).toContain('did you mean 100u (100 µF)');
    expect(bare[0].message).toContain('without a prefix is in farads');
    const milli = partValueWarnings(withStage(oneStageProject(), 1e3, 0.1));
    expect(milli[0].message).toContain('did you mean 100u (100 µF)');
  });

  it('treats a load capacitance of 0 as absent and checks a given one', () => {
    const p = oneStageProject();
    expect(partValueWarnings({ ...p, load: { capacitance: 0 } })).toEqual([]);
    expect(keys(partValueWarnings({ ...p, load: { capacitance: 0.5e-12 } }))).toEqual(['load.capacitance']);
    expect(keys(partValueWarnings({ ...p, load: { resistance: 200e6, capacitance: 0 } }))).toEqual(['load.resistance']);
  });
});

describe('analysis rules', () => {
  const p = oneStageProject(); // 10 kHz: period 100 us

  it('warns when the slowest time constant is shorter than the PWM period (model.md 1.1)', () => {
    expect(plausibilityWarnings(p, { ...calm, timeConstants: [1e-4, 1e-6] })).toEqual([]);
    const w = plausibilityWarnings(p, { ...calm, timeConstants: [0.99e-4, 1e-6] });
    expect(keys(w)).toEqual(['filter.stages']);
    expect(w[0].message).toContain('shorter than the PWM period 100 µs');
  });

  it('warns when the output span is below 90 % of (duty.max - duty.min)(high - low) (model.md 1.1)', () => {
    const ideal = 0.9 * 3.3;
    expect(plausibilityWarnings(p, { ...calm, outputSpan: 0.9 * ideal })).toEqual([]);
    const w = plausibilityWarnings(p, { ...calm, outputSpan: 0.89 * ideal });
    expect(keys(w)).toEqual(['filter.stages']); // open output: no load to blame
    expect(w[0].message).toContain('89.0 % of the ideal 2.97 V');
  });

  it('says when no gain check covers the span (INL given and spec.gain: none, so nothing bounds the full scale)', () => {
    const loaded = { ...oneStageProject({ loadResistance: 10e3 }), spec: { inl: 1e-3 } };
    const [w] = plausibilityWarnings(loaded, { ...calm, outputSpan: 0.5 * 0.9 * 3.3 });
    expect(w.key).toBe('load.resistance');
    expect(w.message).toContain('No check limits the span: spec.gain is none and spec.droop is not set.');
    const checked = plausibilityWarnings({ ...loaded, spec: { gain: 0.02 } }, { ...calm, outputSpan: 0.5 * 0.9 * 3.3 });
    expect(checked[0].message).not.toContain('No check limits');
    // a droop limit bounds the DC error, so the span loss is checked after all
    const droop = plausibilityWarnings({ ...loaded, spec: { inl: 1e-3, droop: 1e-3 } }, { ...calm, outputSpan: 0.5 * 0.9 * 3.3 });
    expect(droop[0].message).not.toContain('No check limits');
  });

  it('finds the span loss of a resistive divider in a full analysis, and nothing in a sound design', () => {
    // Ohm's law: with the capacitor open at DC the output is the divider k = RL / (RL + R + Rd);
    // R = RL gives k just under 1/2, far below 90 %.
    const divided = analyzeProject(oneStageProject({ r: 10e3, c: 1e-6, loadResistance: 10e3 }));
    const span = divided.warnings.find((w) => w.key === 'load.resistance');
    expect(span?.message).toMatch(/49\.\d % of the ideal/);
    expect(analyzeProject(oneStageProject()).warnings).toEqual([]);
  });
});
