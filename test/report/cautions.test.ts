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

  it('a 3.3 V project with a 100 nF part and the pin current in limits only gets the voltage-rating note', () => {
    const notes = notesFor(quiet);
    expect(notes).toHaveLength(1);
    // Derating to 1.5 x the highest level: common practice.
    expect(notes[0]).toMatch(/^Capacitors see up to 3\.3 V: .*at least 4\.95 V/);
  });

  it('flags a level above 60 V DC as outside safety extra-low voltage (IEC 62368-1 ES1, from memory)', () => {
    const notes = notesFor(withPinLimit(oneStageProject({ high: 100, r: 100e3, c: 100e-9 }), 10e-3));
    expect(notes.some((n) => /100 V is above 60 V DC, outside safety extra-low voltage/.test(n))).toBe(true);
    expect(notesFor(withPinLimit(oneStageProject({ high: 60, r: 100e3, c: 100e-9 }), 10e-3)).join()).not.toMatch(/extra-low/);
  });

  it('flags a 1 uF capacitor as likely polarized, and a negative swing as reverse bias', () => {
    const notes = notesFor(withPinLimit(oneStageProject({ r: 4.7e3, c: 1e-6 }), 10e-3));
    expect(notes.some((n) => /^C1 \(1 µF\) is likely electrolytic or tantalum: mind the polarity/.test(n))).toBe(true);
    const bipolar = notesFor(withPinLimit(oneStageProject({ r: 4.7e3, c: 1e-6, low: -3.3 }), 10e-3));
    expect(bipolar.some((n) => /reverse-biases/.test(n))).toBe(true);
    expect(notesFor(withPinLimit(oneStageProject({ r: 4.7e3, c: 0.99e-6 }), 10e-3)).join()).not.toMatch(/polarity/);
  });

  it('flags a pin peak current over search.pin_current', () => {
    // 3.3 V / (25 ohm + 100 ohm) = 26.4 mA (pin peak current, design notes) > 20 mA.
    const notes = notesFor(withPinLimit(oneStageProject({ r: 100, c: 100e-9 }), 20e-3));
    expect(notes.some((n) => /^Pin peak current 26\.4 mA exceeds search\.pin_current \(20 mA\)/.test(n))).toBe(true);
  });

  it('without a pin current limit, asks to compare with the microcontroller data sheet', () => {
    const notes = notesFor(oneStageProject({ r: 4.7e3, c: 100e-9 }));
    expect(notes.some((n) => /^Pin peak current 698 µA: compare it with the pin current rating in the microcontroller data sheet/.test(n))).toBe(true);
  });
});
