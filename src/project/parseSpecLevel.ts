import { parseQuantity, QuantityError } from '../units/index.js';

const NUMBER = String.raw`[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?`;
const IN_LSB = new RegExp(`^(${NUMBER})\\s*LSBs?$`, 'i');
const IN_PERCENT = new RegExp(`^(${NUMBER})\\s*%$`);
const VOLTAGE_PHRASE = 'expected a voltage (V)';
const LEVEL_PHRASE = 'expected a level in V, mV, LSB or % of full scale';

/** A spec level in volts, and its size in LSB when it was written in LSB. */
export interface SpecLevel {
  volts: number;
  lsb?: number;
}

/**
 * A limit on a voltage level, written in V (with any SI prefix), in LSB (`0.5 LSB`, needs the
 * resolution) or in percent of full scale (`0.1 %` of high - low); a plain number is in V.
 * The limit must be greater than 0.
 *
 * Syntax: parseSpecLevel(input, { fullScale[, lsb] })
 * Example: parseSpecLevel('0.5 LSB', { fullScale: 3.3, lsb: 3.3 / 1024 })   // { volts: 1.61e-3, lsb: 0.5 }
 *          parseSpecLevel('2 mV', { fullScale: 3.3 })                        // { volts: 0.002 }
 *          parseSpecLevel('1 %', { fullScale: 3.3 })                         // { volts: 0.033 }
 */
export function parseSpecLevel(input: string | number, scale: { fullScale: number; lsb?: number }): SpecLevel {
  const text = typeof input === 'string' ? input.trim() : '';
  let level: SpecLevel;
  const lsb = IN_LSB.exec(text);
  const percent = IN_PERCENT.exec(text);
  if (lsb) {
    if (scale.lsb === undefined) {
      throw new QuantityError(
        `'${input}' needs pwm.bits: one LSB is (high - low) / 2^bits; give pwm.bits or write the limit in V or %`,
        input,
        'voltage',
      );
    }
    level = { volts: Number(lsb[1]) * scale.lsb, lsb: Number(lsb[1]) };
  } else if (percent) {
    level = { volts: (Number(percent[1]) / 100) * scale.fullScale };
  } else {
    try {
      level = { volts: parseQuantity(input, 'voltage') };
    } catch (error) {
      if (error instanceof QuantityError && error.message.startsWith(VOLTAGE_PHRASE)) {
        throw new QuantityError(LEVEL_PHRASE + error.message.slice(VOLTAGE_PHRASE.length), input, 'voltage');
      }
      throw error;
    }
  }
  if (!(level.volts > 0) || !Number.isFinite(level.volts)) {
    const shown = typeof input === 'string' ? `'${input}'` : String(input);
    throw new QuantityError(`a limit must be greater than 0, got ${shown}`, input, 'voltage');
  }
  return level;
}
