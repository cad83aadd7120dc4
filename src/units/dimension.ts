/**
 * The physical dimensions a project file value can have, with the words an engineer uses for
 * them in messages and the SI unit each is stored in inside the program.
 */

export type Dimension =
  | 'resistance'
  | 'capacitance'
  | 'voltage'
  | 'frequency'
  | 'time'
  | 'current'
  | 'fraction';

export interface DimensionInfo {
  /** "a capacitance", for messages. */
  phrase: string;
  /** SI unit the value is stored in (ASCII, as written in messages). */
  unit: string;
  /** Unit written the mathjs way, the reference its parsed units are compared against. */
  mathjsUnit: string;
  /** Unit symbols that may follow a letter-and-digit code or a prefix shorthand (`4k7ohm`, `100nF`). */
  codeSuffixes: readonly string[];
  /** Short example for messages. */
  example: string;
}

export const DIMENSIONS: Readonly<Record<Dimension, DimensionInfo>> = {
  resistance: { phrase: 'a resistance', unit: 'ohm', mathjsUnit: 'ohm', codeSuffixes: ['ohm'], example: "'10 kohm', '10k' or '4k7'" },
  capacitance: { phrase: 'a capacitance', unit: 'F', mathjsUnit: 'F', codeSuffixes: ['F'], example: "'100 nF', '100n' or '4u7'" },
  voltage: { phrase: 'a voltage', unit: 'V', mathjsUnit: 'V', codeSuffixes: ['V'], example: "'3.3 V', '500 mV' or '3V3'" },
  frequency: { phrase: 'a frequency', unit: 'Hz', mathjsUnit: 'Hz', codeSuffixes: ['Hz'], example: "'20 kHz' or '20k'" },
  time: { phrase: 'a time', unit: 's', mathjsUnit: 's', codeSuffixes: ['s'], example: "'20 ms' or '20m'" },
  current: { phrase: 'a current', unit: 'A', mathjsUnit: 'A', codeSuffixes: ['A'], example: "'10 mA' or '10m'" },
  fraction: { phrase: 'a fraction', unit: '0 to 1, or %', mathjsUnit: '', codeSuffixes: [], example: "'5 %' or 0.05" },
};

/** "a capacitance (F)" */
export function describeDimension(dimension: Dimension): string {
  const info = DIMENSIONS[dimension];
  return `${info.phrase} (${info.unit})`;
}
