import { create, unitDependencies, type MathJsInstance, type Unit } from 'mathjs';
import { DIMENSIONS, describeDimension, type Dimension } from './dimension.js';
import { QuantityError } from './quantityError.js';
import { SHORTHAND_PREFIX_EXPONENT } from './siPrefixes.js';

export interface ParseQuantityOptions {
  /** `positive`: the value must be > 0; `nonNegative`: >= 0. Default: any sign. */
  sign?: 'positive' | 'nonNegative';
}

/** Decimal number as written: 4, 4.7, .47, 4.7e-3 (no hex, no Infinity, no NaN). */
const NUMBER = String.raw`[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?`;
const PLAIN_NUMBER = new RegExp(`^${NUMBER}$`);
const PERCENT = new RegExp(`^(${NUMBER})\\s*%$`);
/** Anything that looks like a letter-and-digit code, to name its dimension in a message. */
const RESISTANCE_CODE = /^[+-]?\d*[Rr]\d*(?:ohm)?$/;
const VOLTAGE_CODE = /^[+-]?\d*V\d*$/;
/** Spellings of infinity and not-a-number (JavaScript and YAML), refused by name. */
const NOT_FINITE = /^[+-]?(?:\.?inf(?:inity)?|\.?nan)$/i;

// Only the unit machinery of mathjs: a fraction of the full bundle's size and start-up time.
let math: MathJsInstance | undefined;
function mathjs(): MathJsInstance {
  math ??= create({ unitDependencies });
  return math;
}

/**
 * Read a quantity written the ways an engineer writes it and return it in SI base units.
 *
 * Accepted forms, for the expected dimension:
 * - a unit with an SI prefix: `4.7 uF`, `4.7 µF`, `10 kΩ`, `10 kOhm`, `3.3 V`, `20 kHz`,
 *   `1.5 mA`, `20 ms`, and any other unit mathjs knows for the dimension (`2 min`);
 * - a prefix letter without a unit (the dimension is implied): `10k`, `100n`, `2.2u`, `1M`;
 * - an IEC 60062 letter-and-digit code, the letter marking the decimal point: `4k7`, `2R2`,
 *   `R47`, `4u7`, `6n8`, `1M0` (`R`/`r` for ohms, `F` for farads; `V` for volts as in `3V3`,
 *   common practice);
 * - a plain number, taken in SI base units: `470`, `1e-9`;
 * - for a fraction: a percentage (`5 %`, `5%`) or a plain number from 0 to 1.
 *
 * Prefix letters are SI prefixes whatever the dimension: `1M` is 1 Mohm but `1m` is 1 milliohm
 * (SI: m = milli), never mega. `K` is taken as kilo, `u` as micro.
 *
 * Method: regular expressions for plain numbers, percentages, prefix shorthand (with or without
 * the SI unit symbol) and letter-and-digit codes; everything else goes to mathjs `unit()` and is
 * compared with the expected SI unit by `equalBase` (which also names a wrong dimension).
 * Results are rounded to 15 significant digits to drop the noise of multiplying by a prefix, so
 * `4.7 nF` gives the double nearest 4.7e-9.
 *
 * Syntax: parseQuantity(input, expected[, { sign }])
 * Example: parseQuantity('4k7', 'resistance')       // 4700
 *          parseQuantity('4.7 µF', 'capacitance')   // 4.7e-6
 *          parseQuantity('5 %', 'fraction')         // 0.05
 *          parseQuantity('3.3 V', 'capacitance')    // throws QuantityError:
 *            expected a capacitance (F), got '3.3 V' (a voltage)
 */
export function parseQuantity(input: string | number, expected: Dimension, opts: ParseQuantityOptions = {}): number {
  const value = readValue(input, expected);
  if (!Number.isFinite(value)) {
    throw new QuantityError(`expected ${describeDimension(expected)}, got ${quoted(input)}, which is not a finite number`, input, expected);
  }
  if (expected === 'fraction' && (value < 0 || value > 1)) {
    const hint = typeof input === 'number' || PLAIN_NUMBER.test(String(input).trim())
      ? value > 1 && value <= 100 ? `; write '${value} %' if you mean ${value} percent` : ''
      : '';
    throw new QuantityError(`expected a fraction from 0 to 1 or a percentage from 0 % to 100 %, got ${quoted(input)}${hint}`, input, expected);
  }
  if (opts.sign === 'positive' && !(value > 0)) {
    throw new QuantityError(`expected ${describeDimension(expected)} greater than 0, got ${quoted(input)}`, input, expected);
  }
  if (opts.sign === 'nonNegative' && !(value >= 0)) {
    throw new QuantityError(`expected ${describeDimension(expected)} of 0 or more, got ${quoted(input)}`, input, expected);
  }
  return value === 0 ? 0 : value; // no -0
}

function readValue(input: unknown, expected: Dimension): number {
  if (typeof input === 'number') return input;
  if (typeof input !== 'string') {
    throw new QuantityError(`expected ${describeDimension(expected)}, got ${JSON.stringify(input) ?? String(input)}`, String(input), expected);
  }
  const text = normalizeSymbols(input.trim());
  if (text === '') {
    throw new QuantityError(`expected ${describeDimension(expected)}, got an empty value`, input, expected);
  }
  if (PLAIN_NUMBER.test(text)) return Number(text);
  if (NOT_FINITE.test(text)) return NaN;

  const percent = PERCENT.exec(text);
  if (expected === 'fraction') {
    if (percent) return roundNoise(Number(percent[1]) / 100);
    throw wrongOrUnreadable(input, text, expected);
  }
  if (percent) {
    throw new QuantityError(`expected ${describeDimension(expected)}, got '${input}' (a percentage)`, input, expected);
  }

  const coded = readShorthandOrCode(text, expected);
  if (coded !== undefined) return coded;
  return readWithUnit(input, text, expected);
}

/** µ (micro sign), μ (Greek mu) -> u; Ω (Greek omega), Ω (ohm sign), Ohm, ohms -> ohm. */
function normalizeSymbols(text: string): string {
  return text
    .replace(/[\u00b5\u03bc]/g, 'u')
    .replace(/[\u03a9\u2126]/g, 'ohm')
    .replace(/ohms?$/i, 'ohm');
}

interface CodeForms {
  /** Decimal number, prefix letter (or the R / V / F marker), maybe the unit: `10k`, `100nF`. */
  shorthand: RegExp;
  /** Decimal number and the unit without prefix: `40 ohm`, `3 A`. */
  bareUnit: RegExp;
  /** IEC 60062: digits, the letter in place of the decimal point, digits, maybe the unit. */
  code: RegExp;
}
const codeForms = new Map<Dimension, CodeForms>();

function formsFor(expected: Dimension): CodeForms {
  let forms = codeForms.get(expected);
  if (!forms) {
    const markers = Object.keys(SHORTHAND_PREFIX_EXPONENT).filter((m) => m !== '\u00b5' && m !== '\u03bc');
    if (expected === 'resistance') markers.push('R', 'r');
    if (expected === 'voltage') markers.push('V');
    if (expected === 'capacitance') markers.push('F');
    const marker = `[${markers.join('')}]`;
    const unit = DIMENSIONS[expected].codeSuffixes.join('|');
    forms = {
      shorthand: new RegExp(`^(${NUMBER})\\s*(${marker})(?:\\s*(?:${unit}))?$`),
      bareUnit: new RegExp(`^(${NUMBER})\\s*(?:${unit})$`),
      code: new RegExp(`^([+-]?)(\\d*)(${marker})(\\d+)(?:\\s*(?:${unit}))?$`),
    };
    codeForms.set(expected, forms);
  }
  return forms;
}

/**
 * `10k`, `2.2u`, `470R`, `100nF`, `40 ohm`, `4k7`, `R47`, `3V3`, `4k7ohm`; undefined when the
 * form does not apply (then mathjs reads it). The common forms never need mathjs, which keeps
 * start-up quick: its unit parser builds its typed functions on first use.
 */
function readShorthandOrCode(text: string, expected: Dimension): number | undefined {
  const forms = formsFor(expected);
  const shorthand = forms.shorthand.exec(text);
  if (shorthand) return scaled(shorthand[1], markerExponent(shorthand[2]));
  const bare = forms.bareUnit.exec(text);
  if (bare) return roundNoise(Number(bare[1]));
  const code = forms.code.exec(text);
  if (code) return scaled(`${code[1]}${code[2] || '0'}.${code[4]}`, markerExponent(code[3]));
  return undefined;
}

function markerExponent(marker: string): number {
  return marker === 'R' || marker === 'r' || marker === 'V' || marker === 'F' ? 0 : SHORTHAND_PREFIX_EXPONENT[marker];
}

/** decimal text * 10^exponent, as the double nearest the decimal value. */
function scaled(decimal: string, exponent: number): number {
  return roundNoise(Number(decimal) * 10 ** exponent);
}

function roundNoise(value: number): number {
  return Number.isFinite(value) ? Number(value.toPrecision(15)) : value;
}

function readWithUnit(input: string, text: string, expected: Dimension): number {
  let unit: Unit;
  try {
    unit = mathjs().unit(text);
  } catch {
    throw wrongOrUnreadable(input, text, expected);
  }
  const reference = mathjs().unit(DIMENSIONS[expected].mathjsUnit);
  if (unit.value === null || unit.value === undefined) {
    throw new QuantityError(`expected ${describeDimension(expected)}, got '${input}', a unit without a number`, input, expected);
  }
  if (!unit.equalBase(reference)) {
    throw new QuantityError(`expected ${describeDimension(expected)}, got '${input}' (${dimensionOfUnit(unit)})`, input, expected);
  }
  return roundNoise(Number(unit.value));
}

/** Name what a value that is not the expected dimension is, if we can tell. */
function wrongOrUnreadable(input: string, text: string, expected: Dimension): QuantityError {
  let other: string | undefined;
  if (expected !== 'resistance' && RESISTANCE_CODE.test(text)) other = DIMENSIONS.resistance.phrase;
  else if (expected !== 'voltage' && VOLTAGE_CODE.test(text)) other = DIMENSIONS.voltage.phrase;
  else if (expected === 'fraction') {
    try {
      other = dimensionOfUnit(mathjs().unit(text));
    } catch {
      other = undefined;
    }
  }
  if (other) return new QuantityError(`expected ${describeDimension(expected)}, got '${input}' (${other})`, input, expected);
  const comma = /\d,\d/.test(text) ? '; use a point as the decimal marker' : '';
  return new QuantityError(
    `expected ${describeDimension(expected)} such as ${DIMENSIONS[expected].example}, got '${input}'${comma}`,
    input,
    expected,
  );
}

function dimensionOfUnit(unit: Unit): string {
  for (const [name, info] of Object.entries(DIMENSIONS)) {
    if (name !== 'fraction' && unit.equalBase(mathjs().unit(info.mathjsUnit))) return info.phrase;
  }
  const units = unit.formatUnits();
  return units ? `a quantity in ${units}` : 'a plain number';
}

function quoted(input: string | number): string {
  return typeof input === 'string' ? `'${input}'` : String(input);
}
