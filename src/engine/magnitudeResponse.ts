import type { Ladder } from '../circuit/ladder.js';
import type { MagnitudeSeries } from './types.js';
import { checkCount } from './checkArguments.js';
import { cutoff as cutoffFrequency } from './cutoff.js';
import { magnitude } from './magnitude.js';

/**
 * The magnitude response relative to DC, in dB, at `points` log-spaced frequencies from a hundredth
 * of the lower to ten times the higher of the cutoff and the PWM frequency, so that both show with
 * the passband before them and the stopband after.
 *
 * Method: |H(j w)| / |H(0)| of the state-space model at each frequency (magnitude.ts); the cutoff
 * from cutoff.ts unless the caller has it (`knownCutoff`).
 *
 * Syntax: magnitudeResponse(ladder, points[, knownCutoff])
 * Example: magnitudeResponse(oneStage, 72).gainDb[0]   // ~0 dB, far below the cutoff
 */
export function magnitudeResponse(ladder: Ladder, points: number, knownCutoff?: number): MagnitudeSeries {
  checkCount(points, 'points', true);
  const cutoff = knownCutoff ?? cutoffFrequency(ladder);
  const pwmFrequency = 1 / ladder.period;
  const fLo = Math.min(cutoff, pwmFrequency) / 100;
  const fHi = Math.max(cutoff, pwmFrequency) * 10;
  const frequency = Array.from({ length: points }, (_, i) => (points === 1 ? fLo : fLo * (fHi / fLo) ** (i / (points - 1))));
  return {
    frequency,
    gainDb: frequency.map((f) => 20 * Math.log10(magnitude(ladder, f))),
    cutoff,
    pwmFrequency,
  };
}
