import { formatEng } from '../units/index.js';
import type { Candidate } from './types.js';

/**
 * A design in a few words for explanations: its stages as R / C, pin side first.
 *
 * Syntax: designLabel(candidate)
 * Example: designLabel({ stages: [{ r: 330, c: 2.2e-7 }, { r: 820, c: 6.8e-8 }] })   // '330 Ω / 220 nF + 820 Ω / 68 nF'
 */
export function designLabel(candidate: Pick<Candidate, 'stages'>): string {
  return candidate.stages.map((s) => `${formatEng(s.r, 'Ω')} / ${formatEng(s.c, 'F')}${s.buffered ? ' (follower)' : ''}`).join(' + ');
}
