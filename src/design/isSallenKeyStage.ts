import type { AnyCandidateStage, SallenKeyCandidateStage } from './types.js';

/**
 * Whether a proposed stage is a Sallen-Key stage (version 1.1 circuits) rather than an RC stage.
 *
 * Syntax: isSallenKeyStage(stage)
 * Example: isSallenKeyStage({ active: 'sallen-key', r1: 1e4, r2: 1e4, c1: 2.2e-8, c2: 1e-8 })   // true
 */
export function isSallenKeyStage(stage: AnyCandidateStage): stage is SallenKeyCandidateStage {
  return 'active' in stage && stage.active === 'sallen-key';
}
