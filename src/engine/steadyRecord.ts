import type { Ladder } from '../circuit/ladder.js';
import type { SteadyRecord } from './types.js';
import { steadyState } from './steadyState.js';
import { steadyWaveform } from './steadyWaveform.js';

/**
 * The periodic steady state at one duty as a record: the output sampled at t = i T / samplesPerPeriod
 * over `periods` periods from a rising edge (steadyWaveform.ts), with its exact time average
 * (steadyState.ts).
 *
 * Method: both from the exact engine; nothing is interpolated or time-stepped.
 *
 * Syntax: steadyRecord(ladder, duty, periods, samplesPerPeriod)
 * Example: steadyRecord(ladder, 0.5, 2, 36).wave.v.length   // 73
 */
export function steadyRecord(ladder: Ladder, duty: number, periods: number, samplesPerPeriod: number): SteadyRecord {
  return {
    duty,
    average: steadyState(ladder, duty).average,
    wave: steadyWaveform(ladder, duty, periods, samplesPerPeriod),
  };
}
