import type { WaveformRecords } from '../engine/index.js';

/**
 * The waveforms of an analysis as CSV (RFC 4180, header line, '\n' line ends): columns
 * `time_s,output_V,waveform,duty`; `waveform` is `steady` (two periods in periodic steady state at
 * the worst-ripple duty, time from a rising edge) or `step` (the settling step, time from the step;
 * duty = the new duty). Formats only: the records come from the engine (waveformRecords.ts).
 *
 * Syntax: waveformCsv(records)
 * Example: waveformCsv(waveformRecords(a)).split('\n')[0]   // 'time_s,output_V,waveform,duty'
 */
export function waveformCsv(records: WaveformRecords): string {
  const lines = ['time_s,output_V,waveform,duty'];
  const { steady, step } = records;
  steady.wave.t.forEach((t, i) => lines.push(`${t},${steady.wave.v[i]},steady,${steady.duty}`));
  step.wave.t.forEach((t, i) => lines.push(`${t},${step.wave.v[i]},step,${step.to}`));
  return lines.join('\n') + '\n';
}
