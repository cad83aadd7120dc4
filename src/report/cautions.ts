import type { Analysis } from '../engine/index.js';
import type { Project } from '../project/types.js';
import { formatEng } from '../units/index.js';

/**
 * Upper limit of extra-low voltage for ripple-free DC, V: 60 V (the SELV / ELV band I limit of
 * IEC 61140, and ES1 of IEC 62368-1; common practice, values from memory).
 */
export const SELV_DC_LIMIT = 60;

/**
 * Pin current from which the report cautions, A: 10 mA, half of the 20 mA absolute-maximum
 * current per pin that many microcontroller GPIOs state (common practice, figure from memory;
 * the microcontroller's data sheet rules). Below it a caution would be noise.
 */
export const GPIO_CAUTION_CURRENT = 10e-3;

/** Standard ratings as text: '6.3 V'. */
const volts = (v: number) => formatEng(v, 'V', 3);

/**
 * Cautions an engineer would write beside the figures, each deferring to data sheets, local codes
 * and licensed practice:
 * - capacitor voltage rating: the working voltage (from the analysis) and the next standard rating
 *   with margin (common practice);
 * - class-2 ceramic capacitors (X5R, X7R, ...): capacitance loss under DC bias and wide tolerance,
 *   phrased conditionally (the tool does not know the technology and does not guess it from the value);
 * - polarized capacitors, conditionally, only when a level is negative (reverse bias);
 * - pin peak current, only when it exceeds search.pin_current or approaches a typical GPIO rating;
 * - a level above 60 V DC: outside extra-low voltage.
 *
 * Syntax: cautions(project, analysis)
 * Example: cautions(p, analyzeProject(p))   // ['Capacitor voltage rating: ...', 'If you use class-2 ...']
 */
export function cautions(project: Project, analysis: Analysis): string[] {
  const notes: string[] = [];
  const { high, low } = project.pwm;
  const n = project.filter.stages.length;
  const names = project.network ? 'the filter capacitors see' : n === 1 ? 'C1 sees' : n === 2 ? 'C1 and C2 see' : `C1 to C${n} see`;

  const { working, factor, rating } = analysis.capacitorVoltage;
  const suggestion =
    rating === null
      ? `no standard rating up to 1 kV reaches ${factor} x that: use parts rated for it, per their data sheets.`
      : `a rating of ${volts(rating)} or more, the next standard rating (6.3, 10, 16, 25, 35, 50, 63, 100 V, ...) ` +
        `at or above ${factor} x the working voltage (common practice: derating guides keep a capacitor at or below ` +
        `about 50 % to 70 % of its rating), is a reasonable start; the capacitor data sheet rules.`;
  notes.push(`Capacitor voltage rating: ${names} at most ${volts(working)} (the largest PWM level); ${suggestion}`);

  notes.push(
    'If you use class-2 ceramic capacitors (X5R, X7R, Y5V, ...): they lose capacitance under DC bias, often a large ' +
      'share near their rated voltage, and their tolerance is wide (±10 % to ±20 %, Y5V -20/+80 %). Read the ' +
      "manufacturer's DC-bias curve at the working voltage and enter the effective value (and tolerance.capacitor) " +
      'in the project; class-1 (C0G/NP0) or film parts keep their value.',
  );

  if (analysis.activeStages.length > 0) {
    notes.push(
      'The Sallen-Key stage is computed with an ideal op-amp: input offset and bias current, output swing, ' +
        'bandwidth, slew rate and output impedance are left out. Choose a unity-gain-stable op-amp whose input and ' +
        'output ranges cover the whole output range (rail-to-rail near 0 V when the range starts there) and whose ' +
        'gain-bandwidth is far above f0; its data sheet decides offset and settling.',
    );
  }

  if (Math.min(high, low) < 0) {
    notes.push(
      `The PWM swings below 0 V (low ${volts(low)}): if you use polarized capacitors (electrolytic, tantalum), ` +
        'they would be reverse-biased; use non-polarized parts.',
    );
  }

  const peak = analysis.pinPeakCurrent;
  const limit = project.search?.pinCurrent;
  if (limit !== undefined && peak > limit) {
    notes.push(
      `Pin peak current ${formatEng(peak, 'A', 3)} exceeds search.pin_current (${formatEng(limit, 'A', 3)}): ` +
        'raise R1, and check the pin rating in the microcontroller data sheet.',
    );
  } else if (peak >= GPIO_CAUTION_CURRENT) {
    notes.push(
      `Pin peak current ${formatEng(peak, 'A', 3)} approaches the pin ratings of many microcontrollers ` +
        `(cautioned from ${formatEng(GPIO_CAUTION_CURRENT, 'A', 3)}, half of a common 20 mA absolute maximum; ` +
        'common practice): check the microcontroller data sheet, or raise R1.',
    );
  }

  const highest = Math.max(Math.abs(high), Math.abs(low));
  if (highest > SELV_DC_LIMIT) {
    notes.push(
      `A level of ${volts(highest)} is above ${SELV_DC_LIMIT} V DC, outside extra-low voltage (SELV, IEC 61140; ` +
        'common practice, from memory): shock protection, clearances and insulation apply; follow local ' +
        'electrical codes and licensed practice.',
    );
  }
  return notes;
}
