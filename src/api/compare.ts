import { analyzeProject, compareOverlays } from '../engine/index.js';
import { compareJson } from '../report/compare.js';
import { projectOf, type ProjectInput } from './projectOf.js';

/** Samples per overlay curve in the JSON, as `compare --format json` writes them. */
const JSON_OVERLAY_COLUMNS = 72;

/**
 * What a change to a project does: the object `dacsmith compare BASE HEAD --format json` prints
 * (base, head, inputs, figures, checks, warnings, waveforms, pass; `pass` is the head's).
 *
 * Syntax: compare(base, head)
 * Example: compare('old.yaml', 'new.yaml').figures.find((f) => f.key === 'worstRipple')
 */
export function compare(base: ProjectInput, head: ProjectInput) {
  const [b, h] = [projectOf(base, 'compare'), projectOf(head, 'compare')];
  const [ba, ha] = [analyzeProject(b), analyzeProject(h)];
  const label = (input: ProjectInput, file: string) => (typeof input === 'string' ? input : file);
  return compareJson(
    { label: label(base, b.file), project: b, analysis: ba },
    { label: label(head, h.file), project: h, analysis: ha },
    compareOverlays(ba, ha, JSON_OVERLAY_COLUMNS),
  );
}
