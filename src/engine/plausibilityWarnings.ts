import type { Project } from '../project/types.js';
import { formatEng } from '../units/index.js';

/** A value that is legal but probably not what was meant: `key` is the project-file key path. */
export interface Warning {
  key: string;
  message: string;
}

/** The analysis figures the plausibility rules need (SI). */
export interface WarningFigures {
  /** Time constants of the filter, s (any order). */
  timeConstants: number[];
  /** average(duty.max) - average(duty.min), V. */
  outputSpan: number;
}

/**
 * Plausibility limits of model.md "Version 1.1 additions" (Warnings): a filter or load resistance
 * outside 1 ohm .. 100 Mohm, a capacitance outside 1 pF .. 10 mF, and an output span below 90 % of
 * the ideal span.
 */
export const PLAUSIBLE = {
  resistance: { min: 1, max: 100e6 },
  capacitance: { min: 1e-12, max: 10e-3 },
  /** Smallest output span, as a fraction of the ideal span (duty.max - duty.min) (high - low). */
  span: 0.9,
} as const;

/** '1M' from 1e6 and 'M': the value written with one SI prefix letter, up to 3 significant digits. */
function written(value: number, prefix: string, scale: number): string {
  return `${Number((value / scale).toPrecision(3))}${prefix}`;
}

/** Why a resistance is implausible and what was probably meant. */
function resistanceMessage(what: string, r: number): string | null {
  const read = formatEng(r, 'Ω', 3);
  if (r < PLAUSIBLE.resistance.min) {
    // 'm' typed for 'M' scales by 1e9; only suggest it when the result is itself plausible
    const mega = r * 1e9;
    const guess =
      r >= 1e-3 && mega <= PLAUSIBLE.resistance.max
        ? `did you mean ${written(mega, 'M', 1e6)} (${formatEng(mega, 'Ω', 3)})? In IEC 60062 and SI, 'm' is milli and 'M' is mega`
        : 'check the unit prefix (k kilo, M mega; a plain number is in ohms)';
    return `${what} read as ${read}, below 1 Ω: ${guess}.`;
  }
  if (r > PLAUSIBLE.resistance.max) {
    return (
      `${what} read as ${read}, above 100 MΩ, where board leakage and capacitor insulation resistance ` +
      `compete with it (common practice): check the unit prefix (k kilo, M mega, G giga).`
    );
  }
  return null;
}

/** Why a capacitance is implausible and what was probably meant. */
function capacitanceMessage(what: string, c: number): string | null {
  const read = formatEng(c, 'F', 3);
  if (c < PLAUSIBLE.capacitance.min) {
    return (
      `${what} read as ${read}, below 1 pF, less than the stray capacitance of a pin and a board ` +
      `(common practice): check the unit prefix (p pico, n nano, u micro).`
    );
  }
  if (c > PLAUSIBLE.capacitance.max) {
    const guess =
      c >= 1
        ? // a bare number is in farads: '100' reads as 100 F
          `did you mean ${written(c * 1e-6, 'u', 1e-6)} (${formatEng(c * 1e-6, 'F', 3)}) or ${written(c * 1e-9, 'n', 1e-9)}? A number without a prefix is in farads`
        : `did you mean ${written(c * 1e-3, 'u', 1e-6)} (${formatEng(c * 1e-3, 'F', 3)})? In SI, 'm' is milli and 'u' is micro`;
    return `${what} read as ${read}, above 10 mF: ${guess}.`;
  }
  return null;
}

/**
 * Warnings on part values alone (no analysis needed, so `design` and `tolerance` can call it):
 * every filter resistor and the load resistance outside 1 ohm .. 100 Mohm, every filter capacitor
 * and the load capacitance outside 1 pF .. 10 mF (a load capacitance of 0 means none and is not
 * warned about). Thresholds: model.md "Version 1.1 additions" (PLAUSIBLE).
 *
 * Syntax: partValueWarnings(project)
 * Example: partValueWarnings(p)   // [{ key: 'load.resistance', message: "load.resistance read as 1 mΩ, ..." }]
 */
export function partValueWarnings(project: Project): Warning[] {
  const warnings: Warning[] = [];
  const add = (key: string, message: string | null) => {
    if (message !== null) warnings.push({ key, message });
  };
  project.filter.stages.forEach((s, i) => {
    add(`filter.stages[${i}].r`, resistanceMessage(`R${i + 1}`, s.r));
    add(`filter.stages[${i}].c`, capacitanceMessage(`C${i + 1}`, s.c));
  });
  const { resistance, capacitance } = project.load;
  if (resistance !== undefined) add('load.resistance', resistanceMessage('the load resistance', resistance));
  if (capacitance > 0) add('load.capacitance', capacitanceMessage('the load capacitance', capacitance));
  return warnings;
}

/**
 * Everything in a project that is legal but probably not what was meant, with what was read and
 * what was probably meant (model.md "Version 1.1 additions", Warnings): the part values
 * (partValueWarnings), a slowest time constant shorter than the PWM period (the filter then barely
 * smooths), and an output span average(duty.max) - average(duty.min) below 90 % of the ideal span
 * (duty.max - duty.min)(high - low). A warning never changes a verdict; `check --strict` makes it one.
 *
 * Syntax: plausibilityWarnings(project, { timeConstants, outputSpan })
 * Example: plausibilityWarnings(p, { timeConstants: [1e-3], outputSpan: 1.6 })
 *          // [{ key: 'load.resistance', message: 'the output spans 1.6 V ...' }] when the ideal span is 2.97 V
 */
export function plausibilityWarnings(project: Project, figures: WarningFigures): Warning[] {
  const warnings = partValueWarnings(project);
  const { pwm, load, spec } = project;
  const period = 1 / pwm.frequency;
  const slowest = Math.max(0, ...figures.timeConstants);
  if (slowest < period) {
    const loadNote =
      load.resistance !== undefined ? ` and load.resistance (${formatEng(load.resistance, 'Ω', 3)}; a small load resistance shortens every time constant)` : '';
    warnings.push({
      key: 'filter.stages',
      message:
        `the slowest time constant, ${formatEng(slowest, 's', 3)}, is shorter than the PWM period ` +
        `${formatEng(period, 's', 3)} (pwm.frequency ${formatEng(pwm.frequency, 'Hz', 3)}): the filter barely smooths the PWM; ` +
        `check the R and C values${loadNote}.`,
    });
  }

  const idealSpan = (pwm.duty.max - pwm.duty.min) * (pwm.high - pwm.low);
  if (idealSpan !== 0 && figures.outputSpan / idealSpan < PLAUSIBLE.span) {
    const share = (100 * figures.outputSpan) / idealSpan;
    const cause =
      load.resistance !== undefined
        ? `the load (${formatEng(load.resistance, 'Ω', 3)}) and the series resistance form a divider; a larger load resistance, smaller series resistors or a buffer keep the span`
        : 'check the driver resistances and the filter values';
    // Without droop the gain check is on unless the file turned it off; INL alone (an endpoint
    // fit) cannot see a span loss: say that nothing checks it then. A droop limit does bound it.
    const unchecked =
      spec.gain === undefined && spec.droop === undefined ? ' No check limits the span: spec.gain is none and spec.droop is not set.' : '';
    warnings.push({
      key: load.resistance !== undefined ? 'load.resistance' : 'filter.stages',
      message:
        `the output spans ${formatEng(figures.outputSpan, 'V', 3)} from duty ${(100 * pwm.duty.min).toFixed(1)} % to ${(100 * pwm.duty.max).toFixed(1)} %, ` +
        `${share.toFixed(1)} % of the ideal ${formatEng(idealSpan, 'V', 3)} (below 90 %): ${cause}.${unchecked}`,
    });
  }
  return warnings;
}
