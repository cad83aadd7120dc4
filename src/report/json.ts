import type { Analysis } from '../engine/index.js';
import type { Project } from '../project/types.js';
import { cautions } from './cautions.js';
import { jsonValue } from './jsonValue.js';

/**
 * The analysis as one JSON object (the machine-readable contract of `analyze --format json` in
 * the design notes), numbers in SI base units: `points` {duty, average, min, max, ripple, tMin, tMax},
 * `worstRipple` {duty, ripple}, `settling` {from, to, band, time|null}, `cutoff`, `checks`
 * [{name, value, limit, pass, unit}], `pass`; and more: `dc`, `attenuation` (dB), `pinPeakCurrent`,
 * `timeConstants`, `lsb` (null when unknown), `warnings` [{key, message}] (empty when none),
 * `cautions` and the normalized `inputs`. `dc` errors are signed ideal minus actual and
 * `attenuation` is positive dB (README "Sign convention").
 * Non-finite numbers become null (JSON has none).
 *
 * Syntax: jsonReport(project, analysis)
 * Example: JSON.parse(jsonReport(p, a)).worstRipple.ripple
 */
export function jsonReport(project: Project, analysis: Analysis): string {
  return JSON.stringify(analysisJson(project, analysis), null, 2) + '\n';
}

/**
 * The object `analyze --format json` prints (see jsonReport), as plain JSON data: what the library
 * API's analyze() returns, so the command line and the library cannot disagree.
 *
 * Syntax: analysisJson(project, analysis)
 * Example: analysisJson(p, a).worstRipple.ripple
 */
export function analysisJson(project: Project, analysis: Analysis) {
  const { ladder: _ladder, ...figures } = analysis;
  const { file, pwm, load, filter, spec, lsb } = project;
  const body = {
    ...figures,
    cautions: cautions(project, analysis),
    inputs: { file, pwm, load, stages: filter.stages, spec, lsb: lsb ?? null },
  };
  return jsonValue(body);
}
