import type { TradeoffCurve } from '../design/tradeoffCurves.js';
import type { AnyCandidateStage } from '../design/types.js';
import { formatEng } from '../units/index.js';
import { svgPlot } from './svgPlot.js';

/**
 * The design trade-off as an SVG figure: best exact settling time against the allowed ripple
 * (log-log, in V and s as in the JSON `tradeoff`), one line with a dot per computed point for each
 * stage count, gaps where no design is feasible, and the spec's ripple limit marked.
 *
 * Syntax: tradeoffPlot(curves[, rippleLimit])
 * Example: tradeoffPlot(tradeoffCurves(p, [1, 2], p.spec.ripple), p.spec.ripple)
 */
export function tradeoffPlot(curves: TradeoffCurve<AnyCandidateStage>[], rippleLimit?: number): string {
  return svgPlot({
    id: 'tradeoff',
    title: 'Trade-off: best settling time against the allowed ripple, one line per stage count',
    x: { label: 'ripple limit (peak-to-peak)', unit: 'V', log: true },
    y: { label: 'best settling time', unit: 's', log: true },
    series: curves.map((c) => ({
      name: `${c.stages} stage${c.stages > 1 ? 's' : ''}`,
      x: c.points.map((p) => p.ripple),
      y: c.points.map((p) => p.settlingTime),
      dots: true,
    })),
    xMarks: rippleLimit !== undefined ? [{ at: rippleLimit, label: `spec ripple ${formatEng(rippleLimit, 'V', 3)}` }] : [],
  });
}
