import { describe, expect, it } from 'vitest';
import { analyzeProject } from '../../src/engine/analyze.js';
import type { Project } from '../../src/project/types.js';
import { cautions } from '../../src/report/cautions.js';
import { oneStageProject } from './projectFixture.js';

const withPinLimit = (p: Project, pinCurrent: number): Project => ({
  ...p,
  search: { stages: [1], series: { resistor: 'E12', capacitor: 'E12' }, margin: 0, buffered: [false], resistance: { min: 1e3, max: 1e6 }, capacitance: { min: 1e-9, max: 1e-5 }, pinCurrent },
});
const notesFor = (p: Project) => cautions(p, analyzeProject(p, { duties: [0.5] }));

describe('cautions', () => {
  const quiet = withPinLimit(oneStageProject({ r: 4.7e3, c: 100e-9 }), 10e-3);

  it('a 3.3 V project gets the voltage-rating note (6.3 V: next standard rating above 1.5 x 3.3 V, common practice) and the class-2 ceramic note only', () => {
    const notes = notesFor(quiet);
    expect(notes).toHaveLength(2);
    expect(notes[0]).toMatch(/^Capacitor voltage rating: C1 sees at most 3\.3 V .*a rating of 6\.3 V or more/);
    expect(notes[0]).toMatch(/common practice/);
    expect(notes[1]).toMatch(/^If you use class-2 ceramic capacitors \(X5R, X7R/);
    expect(notes[1]).toMatch(/DC bias/);
    expect(notes[1]).toMatch(/DC-bias curve/);
  });

  it('scales the suggested rating with the level: 12 V -> 25 V, 24 V -> 50 V (1.5 x, common practice)', () => {
    expect(notesFor(withPinLimit(oneStageProject({ high: 12, r: 10e3, c: 100e-9 }), 20e-3))[0]).toMatch(/at most 12 V .*a rating of 25 V or more/);
    expect(notesFor(withPinLimit(oneStageProject({ high: 24, r: 10e3, c: 100e-9 }), 20e-3))[0]).toMatch(/at most 24 V .*a rating of 50 V or more/);
  });

  it('never guesses the capacitor technology from the value', () => {
    for (const c of [100e-9, 1e-6, 100e-6]) {
      const text = notesFor(withPinLimit(oneStageProject({ r: 4.7e3, c }), 10e-3)).join(' ');
      expect(text).not.toMatch(/likely|probably/);
      expect(text).not.toMatch(/polari/);
    }
  });

  it('adds a conditional polarity note only when a level is negative', () => {
    const bipolar = notesFor(withPinLimit(oneStageProject({ r: 4.7e3, c: 1e-6, low: -3.3 }), 10e-3));
    expect(bipolar.some((n) => /if you use polarized capacitors .*reverse-biased/.test(n))).toBe(true);
  });

  it('flags a level above 60 V DC as outside extra-low voltage (IEC 61140 SELV, common practice, from memory), and 60 V itself not', () => {
    const notes = notesFor(withPinLimit(oneStageProject({ high: 100, r: 100e3, c: 100e-9 }), 10e-3));
    expect(notes.some((n) => /100 V is above 60 V DC, outside extra-low voltage .*local electrical codes and licensed practice/.test(n))).toBe(true);
    expect(notesFor(withPinLimit(oneStageProject({ high: 60, r: 100e3, c: 100e-9 }), 10e-3)).join()).not.toMatch(/extra-low/);
  });

  it('flags a pin peak current over search.pin_current', () => {
    // 3.3 V / (25 ohm + 100 ohm) = 26.4 mA (pin peak current, design notes) > 20 mA.
    const notes = notesFor(withPinLimit(oneStageProject({ r: 100, c: 100e-9 }), 20e-3));
    expect(notes.some((n) => /^Pin peak current 26\.4 mA exceeds search\.pin_current \(20 mA\)/.test(n))).toBe(true);
  });

  it('says nothing of a small pin current (33 µA is noise), cautions from 10 mA without a limit (half of a common 20 mA GPIO rating)', () => {
    // 3.3 V / (25 ohm + 100 kohm) = 33 µA.
    expect(notesFor(oneStageProject({ r: 100e3, c: 100e-9 })).join()).not.toMatch(/Pin peak current/);
    // 3.3 V / (25 ohm + 300 ohm) = 10.15 mA.
    const notes = notesFor(oneStageProject({ r: 300, c: 100e-9 }));
    expect(notes.some((n) => /^Pin peak current 10\.2 mA approaches .*microcontroller data sheet/.test(n))).toBe(true);
    // 3.3 V / (25 ohm + 350 ohm) = 8.8 mA: below the threshold.
    expect(notesFor(oneStageProject({ r: 350, c: 100e-9 })).join()).not.toMatch(/Pin peak current/);
  });
});
