import type { Analysis, ChartSeries } from '../engine/index.js';
import { formatEng } from '../units/index.js';
import { percent, tidy } from './quantities.js';
import { svgPlot } from './svgPlot.js';

/** Points per line of the page's plots (a page has room for more than a terminal's columns). */
export const HTML_PLOT_POINTS = 200;

/**
 * The analysis plots as SVG figures, from the engine's chart series: the steady state over
 * two periods at the worst-ripple duty (output minus its average), the settling step with its band
 * and settling instant (whole, and near the final value so that the band shows), the magnitude response on a log frequency axis with the cutoff and the
 * PWM frequency marked, and the DC error across the used duty range (in LSB when the LSB is known).
 *
 * Syntax: analysisPlots(analysis, series)
 * Example: analysisPlots(a, chartSeries(a, p.pwm.duty)).length   // 5
 */
export function analysisPlots(analysis: Analysis, series: ChartSeries): string[] {
  const { lsb } = analysis;
  const levels = analysis.ladder ?? analysis.network!.pin;
  const fullScale = levels.high - levels.low;
  const { steady, step, magnitude, dcError } = series;
  const plots: string[] = [];
  plots.push(
    svgPlot({
      id: 'steady',
      title: `Steady state at duty ${percent(steady.duty)} (worst ripple): output minus its average ${formatEng(tidy(steady.average, fullScale), 'V', 5)}, two PWM periods`,
      x: { label: 'time', unit: 's' },
      y: { label: 'output − average', unit: 'V', minSpan: 1e-6 },
      series: [{ name: `output − average at duty ${percent(steady.duty)}`, x: steady.t, y: steady.deviation }],
    }),
  );
  const band = `settling band ±${formatEng(step.band, 'V', 3)} around ${formatEng(step.final, 'V', 5)}`;
  const tEnd = step.wave.t[step.wave.t.length - 1];
  plots.push(
    svgPlot({
      id: 'step',
      title: `Step response ${percent(step.from)} → ${percent(step.to)}: ${step.time === null ? 'never settles (the ripple leaves the band)' : `settles in ${formatEng(step.time, 's', 3)}`}`,
      x: { label: 'time after the step', unit: 's' },
      y: { label: 'output', unit: 'V' },
      series: [{ name: 'output', x: step.wave.t, y: step.wave.v }],
      yBand: { lo: step.final - step.band, hi: step.final + step.band, label: band },
      xMarks: [step.time === null ? { at: tEnd, label: 'never settles' } : { at: step.time, label: `settled ${formatEng(step.time, 's', 3)}` }],
    }),
  );
  // Near the final value, so that the band and the ripple inside it can be seen: ±3 bands, clipped.
  const zoom = 3 * step.band;
  plots.push(
    svgPlot({
      id: 'step-zoom',
      title: `Step response near the final value (±${formatEng(zoom, 'V', 3)}, clipped)`,
      x: { label: 'time after the step', unit: 's' },
      y: { label: 'output', unit: 'V', range: [step.final - zoom, step.final + zoom] },
      series: [{ name: 'output', x: step.wave.t, y: step.wave.v }],
      yBand: { lo: step.final - step.band, hi: step.final + step.band, label: band },
      xMarks: [step.time === null ? { at: tEnd, label: 'never settles' } : { at: step.time, label: `settled ${formatEng(step.time, 's', 3)}` }],
    }),
  );
  plots.push(
    svgPlot({
      id: 'magnitude',
      title: 'Magnitude response relative to DC',
      x: { label: 'frequency', unit: 'Hz', log: true },
      y: { label: 'gain', unit: 'dB', plain: true },
      series: [{ name: '|H(f)| / |H(0)|', x: magnitude.frequency, y: magnitude.gainDb }],
      xMarks: [
        { at: magnitude.cutoff, label: `cutoff ${formatEng(magnitude.cutoff, 'Hz', 3)}` },
        { at: magnitude.pwmFrequency, label: `PWM ${formatEng(magnitude.pwmFrequency, 'Hz', 3)}: ${(-analysis.attenuation).toFixed(1)} dB` },
      ],
    }),
  );
  const inLsb = lsb !== null;
  const droop = analysis.dc.droop;
  plots.push(
    svgPlot({
      id: 'dc-error',
      title: `DC error (ideal − average) across the used duty range, ${inLsb ? 'LSB' : 'V'}`,
      x: { label: 'duty', unit: '%', plain: true },
      // below 0.01 LSB (or 10 µV) the error is numerical noise: drawn flat
      y: inLsb ? { label: 'DC error (LSB)', unit: 'LSB', plain: true, minSpan: 0.02 } : { label: 'DC error', unit: 'V', minSpan: 20e-6 },
      series: [{ name: 'ideal − average', x: dcError.duty.map((d) => 100 * d), y: inLsb ? dcError.error.map((e) => e / lsb) : dcError.error }],
      xMarks: tidy(droop.error, fullScale) === 0 ? [] : [{ at: 100 * droop.duty, label: `droop at ${percent(droop.duty)}` }],
    }),
  );
  return plots;
}
