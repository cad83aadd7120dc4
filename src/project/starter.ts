import { formatEng, seriesValues } from '../units/index.js';

/** What the starter file is sized for. */
export interface StarterOptions {
  /** 1 or 2 RC stages. */
  stages: 1 | 2;
  /** PWM resolution, bits (whole number, 4 to 16). */
  bits: number;
  /** PWM frequency, Hz. */
  frequency: number;
  /** Add a `search:` block (design space for recommendations, and the pin current limit). */
  search: boolean;
  /** Schema path or URL for the yaml-language-server modeline on the first line. */
  schema: string;
  /** File name shown in the comments (default dacsmith.yaml). */
  name?: string;
}

/** The parts and limits a starter file states, SI base units. */
export interface StarterDesign {
  stages: Array<{ r: number; c: number }>;
  /** Settling-time limit for the full-range step, s. */
  settlingLimit: number;
  /** Estimated settling time that the limit covers with margin, s. */
  settlingEstimate: number;
}

// Invented example circuit, stated in the file's comments so that the user replaces it.
const HIGH = 3.3; // V
const LOW = 0; // V
const DRIVER_HIGH = 40; // ohm, order of magnitude of a 3.3 V push-pull pin (common practice)
const DRIVER_LOW = 25; // ohm
const LOAD_CAPACITANCE = 10e-12; // F
const DUTY_MIN = 0.05;
const DUTY_MAX = 0.95;
/** Smallest first-stage resistor: keeps the pin current well under 1 mA at 3.3 V (common practice). */
const R1_MIN = 10e3;
/** Stage 2 impedance ratio: R2 = 10 R1, C2 = C1 / 10, so stage 2 barely loads stage 1 (common practice). */
const IMPEDANCE_RATIO = 10;
/** Apery's constant zeta(3) = sum 1/n^3 (value from memory: 1.2020569...). */
const ZETA3 = 1.2020569031595942;

/** Smallest E6 value (IEC 60063) at or above x. */
const e6AtLeast = (x: number): number => seriesValues('E6', x, 10.0001 * x)[0];

/** Smallest value of the 1-2-5 sequence at or above x (for round limits). */
function oneTwoFiveAtLeast(x: number): number {
  const decade = 10 ** Math.floor(Math.log10(x));
  return [1, 2, 5, 10].map((m) => m * decade).find((v) => v >= x * (1 - 1e-12)) ?? 10 * decade;
}

/**
 * Size the starter filter so that its own spec (ripple 0.5 LSB, droop 1 LSB, settling within the
 * stated time to 0.5 LSB) holds with margin; the exact engine is the judge (see the tests), these
 * are hand formulas aimed at half of each limit.
 *
 * Method:
 * - R1 >= |Rh - Rl| 2^bits / 2, at least 10 kohm: with unequal driver resistances the charge
 *   balance on C1 gives a DC error of about Vfs D(1-D) |Rh - Rl| / R1, at most 0.5 LSB then.
 * - One stage: worst peak-to-peak ripple of an RC fed by a two-level source is
 *   Vfs tanh(T / (4 tau)) at D = 1/2 (first-order step response over each phase, periodic
 *   steady state); tau is chosen for 0.25 LSB.
 * - Two stages (R2 = 10 R1, C2 = C1/10): H(s) = 1 / (s^2 a + s b + 1) with a = R1C1R2C2 and
 *   b = R1C1 + R2C2 + R1C2 (two-section RC ladder); since b^2 >= 4a, |H(jw)| <= 1/(w^2 a). The
 *   n-th harmonic of the PWM wave has peak-to-peak amplitude (4 Vfs / (n pi)) |sin(n pi D)|
 *   (Fourier series of a pulse train), so the ripple is at most 4 Vfs zeta(3) / (pi w^2 a); a is
 *   chosen for 0.25 LSB.
 * - C is rounded up to E6 (IEC 60063), which only lowers the ripple.
 * - Settling to 0.5 LSB after a step of 0.9 Vfs, leaving 0.25 LSB for the ripple: one stage
 *   tau ln(0.9 Vfs / 0.25 LSB); two stages, with real poles a1 < a2 of s^2 a + s b + 1, the step
 *   error is at most a2/(a2-a1) exp(-a1 t) of the step. The limit is 1.5 x that, rounded up to
 *   1-2-5.
 *
 * Syntax: starterDesign(stages, bits, frequency)
 * Example: starterDesign(1, 10, 20e3).stages[0].r   // 10000
 */
export function starterDesign(stages: 1 | 2, bits: number, frequency: number): StarterDesign {
  const period = 1 / frequency;
  const omega = 2 * Math.PI * frequency;
  const fullScale = HIGH - LOW;
  const lsbFraction = 2 ** -bits;
  const rippleTarget = lsbFraction / 4; // fraction of full scale
  const driverMean = (DRIVER_HIGH + DRIVER_LOW) / 2;
  const r1 = e6AtLeast(Math.max(R1_MIN, (Math.abs(DRIVER_HIGH - DRIVER_LOW) * 2 ** bits) / 2));
  const stepOverBand = ((DUTY_MAX - DUTY_MIN) * fullScale) / (0.25 * lsbFraction * fullScale);

  if (stages === 1) {
    const tau = period / (4 * Math.atanh(rippleTarget));
    const c1 = e6AtLeast(tau / (r1 + driverMean) - LOAD_CAPACITANCE);
    const tauActual = (r1 + driverMean) * (c1 + LOAD_CAPACITANCE);
    const estimate = tauActual * Math.log(stepOverBand);
    return { stages: [{ r: r1, c: c1 }], settlingEstimate: estimate, settlingLimit: oneTwoFiveAtLeast(1.5 * estimate) };
  }

  const product = (4 * ZETA3) / (Math.PI * omega ** 2 * rippleTarget); // a = tau1 tau2 needed, s^2
  const c1 = e6AtLeast(Math.sqrt(product) / r1);
  const r2 = IMPEDANCE_RATIO * r1;
  const c2 = c1 / IMPEDANCE_RATIO;
  const ra = r1 + driverMean;
  const cb = c2 + LOAD_CAPACITANCE;
  const a = ra * c1 * r2 * cb;
  const b = ra * c1 + r2 * cb + ra * cb;
  const root = Math.sqrt(b * b - 4 * a);
  const slow = (b - root) / (2 * a); // 1/s
  const fast = (b + root) / (2 * a);
  const estimate = Math.log((fast / (fast - slow)) * stepOverBand) / slow;
  return {
    stages: [
      { r: r1, c: c1 },
      { r: r2, c: Number(c2.toPrecision(12)) },
    ],
    settlingEstimate: estimate,
    settlingLimit: oneTwoFiveAtLeast(1.5 * estimate),
  };
}

/** Column where the comments after keys start. */
const COMMENT_COLUMN = 30;

/** A line of YAML with its comment aligned (at least two spaces after the code). */
const c = (code: string, comment: string) => `${code.padEnd(Math.max(COMMENT_COLUMN, code.length + 2))}# ${comment}`;

/** A quantity as written in the file: ASCII engineering notation ('4.7 uF', '10 kohm'). */
const q = (value: number, unit: string, digits = 4) => formatEng(value, unit, digits).replace('\u00b5', 'u');

/**
 * The text of a commented starter project file: a modeline for editors on the first line, then
 * an invented example circuit (3.3 V pin, 5 % to 95 % duty, open output) sized by
 * `starterDesign` so that `dacsmith check` passes it, each key explained in a comment.
 *
 * Syntax: starterProject({ stages, bits, frequency, search, schema[, name] })
 * Example: starterProject({ stages: 2, bits: 10, frequency: 20e3, search: false,
 *            schema: 'node_modules/dacsmith/schemas/project.schema.json' }).split('\n')[0]
 *          // '# yaml-language-server: $schema=node_modules/dacsmith/schemas/project.schema.json'
 */
export function starterProject(options: StarterOptions): string {
  const { stages, bits, frequency, search, schema } = options;
  if (!Number.isInteger(bits) || bits < 4 || bits > 16) throw new RangeError(`bits must be a whole number from 4 to 16, got ${bits}`);
  if (!(frequency > 0 && Number.isFinite(frequency))) throw new RangeError(`frequency must be above 0 Hz, got ${frequency}`);
  const name = options.name ?? 'dacsmith.yaml';
  const design = starterDesign(stages, bits, frequency);
  const lsb = (HIGH - LOW) / 2 ** bits;
  const stageLines = design.stages.map((s) => `    - { r: ${q(s.r, 'ohm')}, c: ${q(s.c, 'F')} }`);
  const rMax = Math.max(1e6, ...design.stages.map((s) => 10 * s.r));
  const cMax = Math.max(10e-6, ...design.stages.map((s) => 10 * s.c));

  const lines = [
    `# yaml-language-server: $schema=${schema}`,
    '#',
    '# dacsmith project: a PWM output smoothed by an RC filter into a DC voltage.',
    `# Check it against its spec with:   dacsmith check ${name}`,
    `# Full report with charts:          dacsmith analyze ${name}`,
    '#',
    '# The circuit below is an invented example sized for its spec: replace the levels, driver',
    '# resistances and load with those of your board (microcontroller data sheet).',
    '# Quantities take units and SI prefixes (4.7 uF, 10 kohm, 20 kHz), IEC 60062 codes (4k7, 100n),',
    '# plain numbers in SI base units (V, s, Hz, ohm, F, A), or percent where a fraction is meant.',
    '',
    'pwm:',
    c(`  frequency: ${q(frequency, 'Hz', 6)}`, `PWM frequency; or give clock (timer clock) with bits`),
    c(`  bits: ${bits}`, `resolution: LSB = (high - low) / 2^bits = ${q(lsb, 'V')}`),
    c('  alignment: edge', 'edge | center (same ripple, shifted in time)'),
    c(`  high: ${q(HIGH, 'V')}`, `pin level when high (the I/O supply)`),
    c(`  low: ${q(LOW, 'V')}`, `pin level when low`),
    c(`  driver: { high: ${q(DRIVER_HIGH, 'ohm')}, low: ${q(DRIVER_LOW, 'ohm')} }`, `pin output resistance per level`),
    c(`  duty: { min: ${100 * DUTY_MIN} %, max: ${100 * DUTY_MAX} % }`, `duty range the firmware uses`),
    '',
    'load:',
    c('  # resistance: 100 kohm', 'resistance from the output to ground; leave out for an open output'),
    c('  #', 'a resistive load divides the output down: mind the droop spec'),
    c(`  capacitance: ${q(LOAD_CAPACITANCE, 'F')}`, `capacitance at the output (input, cable)`),
    '',
    'filter:',
    c('  stages:', 'pin side first: series r, then c to ground'),
    ...(stages === 2 ? ['    # (buffered: true on a stage puts a unity-gain follower after it)'] : []),
    ...stageLines,
    '',
    c('spec:', 'limits in V, mV, LSB or % of full scale'),
    c('  ripple: 0.5 LSB', 'worst peak-to-peak ripple over the duty range'),
    c('  droop: 1 LSB', 'largest DC error (ideal minus average) over the duty range'),
    c('  settling:', 'step over the full duty range, rising and falling (or give from:, to:)'),
    c('    band: 0.5 LSB', 'settled when the output stays within this of its final average'),
    c(`    time: ${q(design.settlingLimit, 's')}`, `settling time allowed`),
  ];
  if (search) {
    lines.push(
      '',
      c('search:', 'design space for recommendations (dacsmith design)'),
      c('  stages: [1, 2]', 'stage counts to try'),
      c('  series: { resistor: E24, capacitor: E12 }', 'E3 E6 E12 E24 E48 E96 E192 (IEC 60063), or one for both'),
      c('  margin: 10 %', 'headroom every recommended design keeps below each limit'),
      c('  buffered: [false]', '[false, true]: also try an op-amp follower after the last stage'),
      `  resistance: { min: 1 kohm, max: ${q(oneTwoFiveAtLeast(rMax), 'ohm')} }`,
      `  capacitance: { min: 100 pF, max: ${q(oneTwoFiveAtLeast(cMax), 'F')} }`,
      c('  pin_current: 10 mA', 'largest pin peak current allowed (see the data sheet)'),
    );
  }
  return lines.join('\n') + '\n';
}
