import type { SallenKeyStage } from './network.js';

/**
 * Natural frequency and quality factor of a unity-gain Sallen-Key low-pass stage:
 * f0 = 1 / (2 pi sqrt(r1 r2 c1 c2)), Q = sqrt(r1 r2 c1 c2) / (c2 (r1 + r2)) (model.md 1.1; the
 * standard unity-gain Sallen-Key formulas, e.g. in op-amp filter application notes).
 *
 * Syntax: sallenKeyFigures(stage)
 * Example: sallenKeyFigures({ kind: 'sallen-key', r1: 10e3, r2: 10e3, c1: 20e-9, c2: 10e-9 })  // { f0: 1125.4, q: 0.7071 }
 */
export function sallenKeyFigures(s: Pick<SallenKeyStage, 'r1' | 'r2' | 'c1' | 'c2'>): { f0: number; q: number } {
  const root = Math.sqrt(s.r1 * s.r2 * s.c1 * s.c2);
  return { f0: 1 / (2 * Math.PI * root), q: root / (s.c2 * (s.r1 + s.r2)) };
}
