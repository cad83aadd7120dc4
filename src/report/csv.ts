import type { Analysis } from '../engine/index.js';
import { stepRecord, worstRippleWave } from './waveforms.js';

/**
 * The waveforms of an analysis as CSV (RFC 4180, header line, '\n' line ends): columns
 * `time_s,output_V,waveform,duty`; `waveform` is `steady` (two periods in periodic steady state at
 * the worst-ripple duty, time from a rising edge) or `step` (the settling step, time from the step;
 * duty = the new duty).
 *
 * Syntax: waveformCsv(analysis)
 * Example: waveformCsv(a).split('\n')[0]   // 'time_s,output_V,waveform,duty'
 */
export function waveformCsv(analysis: Analysis): string {
  const lines = ['time_s,output_V,waveform,duty'];
  const steady = worstRippleWave(analysis, 200);
  const dSteady = analysis.worstRipple.duty;
  steady.t.forEach((t, i) => lines.push(`${t},${steady.v[i]},steady,${dSteady}`));
  const step = stepRecord(analysis);
  step.wave.t.forEach((t, i) => lines.push(`${t},${step.wave.v[i]},step,${step.to}`));
  return lines.join('\n') + '\n';
}
