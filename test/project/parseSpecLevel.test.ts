import { describe, expect, it } from 'vitest';
import { parseSpecLevel } from '../../src/project/index.js';

// model.md, definitions: LSB = (high - low) / 2^bits; % is of full scale (high - low).
const tenBits = { fullScale: 3.3, lsb: 3.3 / 1024 };

describe('parseSpecLevel', () => {
  it('reads LSB, % of full scale, V with prefixes and plain numbers', () => {
    expect(parseSpecLevel('0.5 LSB', tenBits)).toEqual({ volts: 0.5 * (3.3 / 1024), lsb: 0.5 });
    expect(parseSpecLevel('2 lsb', tenBits)).toEqual({ volts: 2 * (3.3 / 1024), lsb: 2 });
    expect(parseSpecLevel('1 %', tenBits)).toEqual({ volts: 0.033 });
    expect(parseSpecLevel('2 mV', tenBits)).toEqual({ volts: 2e-3 });
    expect(parseSpecLevel('500 uV', tenBits)).toEqual({ volts: 500e-6 });
    expect(parseSpecLevel(0.01, tenBits)).toEqual({ volts: 0.01 });
  });

  it('needs the resolution for LSB', () => {
    expect(() => parseSpecLevel('0.5 LSB', { fullScale: 3.3 })).toThrow(/needs pwm\.bits/);
  });

  it('refuses limits of 0 or below and other dimensions', () => {
    expect(() => parseSpecLevel('0 mV', tenBits)).toThrow("a limit must be greater than 0, got '0 mV'");
    expect(() => parseSpecLevel(-1, tenBits)).toThrow('a limit must be greater than 0, got -1');
    expect(() => parseSpecLevel('5 kHz', tenBits)).toThrow(
      "expected a level in V, mV, LSB or % of full scale, got '5 kHz' (a frequency)",
    );
    expect(() => parseSpecLevel('half', tenBits)).toThrow(/expected a level in V, mV, LSB or % of full scale such as/);
  });
});
