import type { Analysis } from '../engine/index.js';
import type { Project } from '../project/types.js';
import { formatEng } from '../units/index.js';

/**
 * Upper limit of safety extra-low voltage for DC, V: 60 V ripple-free d.c. (the ES1 / SELV limit
 * in IEC 62368-1 and its predecessor IEC 60950-1; value from memory).
 */
export const SELV_DC_LIMIT = 60;

/** Capacitance from which a part is likely electrolytic or tantalum, i.e. polarized (common practice). */
export const LIKELY_POLARIZED = 1e-6;

/** Voltage derating asked of capacitors: rate them at least this multiple of the highest level (common practice). */
export const VOLTAGE_DERATING = 1.5;

/**
 * Short notes on what the analysis cannot check, each deferring to data sheets or codes:
 * pin peak current against `search.pin_current` (or, when unset, a reminder to compare it with the
 * MCU data sheet), capacitor voltage rating, polarity of large (likely polarized) capacitors,
 * and levels above the extra-low-voltage limit.
 *
 * Syntax: cautions(project, analysis)
 * Example: cautions(p, analyzeProject(p))   // ['Pin peak current 0.7 mA: compare it with ...', ...]
 */
export function cautions(project: Project, analysis: Analysis): string[] {
  const notes: string[] = [];
  const { high, low } = project.pwm;
  const peak = formatEng(analysis.pinPeakCurrent, 'A', 3);
  const limit = project.search?.pinCurrent;
  if (limit === undefined) {
    notes.push(`Pin peak current ${peak}: compare it with the pin current rating in the microcontroller data sheet.`);
  } else if (analysis.pinPeakCurrent > limit) {
    notes.push(
      `Pin peak current ${peak} exceeds search.pin_current (${formatEng(limit, 'A', 3)}): raise R1 or check the microcontroller data sheet.`,
    );
  }

  const highest = Math.max(Math.abs(high), Math.abs(low));
  notes.push(
    `Capacitors see up to ${formatEng(highest, 'V', 3)}: choose a voltage rating with margin ` +
      `(at least ${formatEng(VOLTAGE_DERATING * highest, 'V', 3)} is common practice) and follow the capacitor data sheet.`,
  );

  const stages = project.filter.stages;
  const polarized = stages
    .map((s, i) => ({ c: s.c, name: `C${i + 1}` }))
    .filter((s) => s.c >= LIKELY_POLARIZED);
  if (polarized.length > 0) {
    const which = polarized.map((s) => `${s.name} (${formatEng(s.c, 'F', 3)})`).join(', ');
    const reverse = Math.min(high, low) < 0 ? ' The output swings below 0 V, which reverse-biases a polarized part: use a non-polarized type.' : '';
    const verb = polarized.length > 1 ? 'are' : 'is';
    notes.push(`${which} ${verb} likely electrolytic or tantalum: mind the polarity (+ to the filter node, - to ground).${reverse}`);
  }

  if (highest > SELV_DC_LIMIT) {
    notes.push(
      `A level of ${formatEng(highest, 'V', 3)} is above ${SELV_DC_LIMIT} V DC, outside safety extra-low voltage: ` +
        'follow local electrical codes and licensed practice.',
    );
  }
  return notes;
}
