import { isMap, parseDocument, YAMLMap, YAMLSeq } from 'yaml';
import type { Candidate } from '../design/types.js';
import { formatEng, formatIec60062 } from '../units/index.js';

/**
 * The project file's text with `filter.stages` replaced by a chosen design, everything else
 * (comments, order, other keys) kept; with a design at another resolution also `pwm.bits` (and
 * `pwm.frequency`, when the file states it, to the timer's new frequency). Stages are written as
 * flow maps of IEC 60062 codes, `{ r: 4k7, c: 100n }` (with `buffered: true` where the design
 * needs a follower), which the project reader accepts.
 *
 * Method: the yaml package's Document API (parseDocument, setIn), so the rest of the file
 * round-trips unchanged.
 *
 * Syntax: withDesign(text, candidate[, note])
 * Example: withDesign('filter:\n  stages: []\n', best)   // 'filter:\n  stages:\n    - { r: 1k0, c: 560n }\n...'
 */
export function withDesign(text: string, candidate: Pick<Candidate, 'stages' | 'bits' | 'frequency'>, note?: string): string {
  const doc = parseDocument(text, { version: '1.2' });
  if (doc.errors.length > 0) throw new Error(`cannot rewrite the project file: ${doc.errors[0].message}`);
  const stages = new YAMLSeq();
  for (const s of candidate.stages) {
    const m = new YAMLMap();
    m.flow = true;
    m.set('r', formatIec60062(s.r, 'resistance'));
    m.set('c', formatIec60062(s.c, 'capacitance'));
    if (s.buffered) m.set('buffered', true); // an op-amp follower after this stage
    stages.items.push(m);
  }
  const follower = candidate.stages.some((s) => s.buffered) ? ' needs an op-amp follower where buffered: true (an ideal unity-gain one assumed)' : '';
  if (note || follower) stages.commentBefore = [note ? ` ${note}` : '', follower].filter((x) => x !== '').join('\n');
  if (!isMap(doc.get('filter'))) doc.set('filter', new YAMLMap());
  doc.setIn(['filter', 'stages'], stages);
  if (candidate.bits !== null && doc.hasIn(['pwm', 'bits']) && doc.getIn(['pwm', 'bits']) !== candidate.bits) {
    doc.setIn(['pwm', 'bits'], candidate.bits);
    if (doc.hasIn(['pwm', 'frequency'])) doc.setIn(['pwm', 'frequency'], formatEng(candidate.frequency, 'Hz', 8));
  } else if (candidate.bits !== null && !doc.hasIn(['pwm', 'bits']) && doc.hasIn(['pwm'])) {
    doc.setIn(['pwm', 'bits'], candidate.bits);
  }
  return doc.toString();
}
