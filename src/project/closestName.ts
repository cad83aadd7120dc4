import { editDistance } from './editDistance.js';

/**
 * The allowed name a mistyped one most likely meant, or undefined when none is close.
 *
 * A name is close when, ignoring case, its edit distance (with swaps, see `editDistance`) is at
 * most a third of the typed name's length (at least 1) and smaller than both names' lengths, or
 * when the typed name is a prefix of at least 3 letters (`freq` -> `frequency`). The nearest wins;
 * ties go to the first allowed name. Separators `-`, `_` and space count as the same.
 *
 * Syntax: closestName(typed, allowed)
 * Example: closestName('resitance', ['resistance', 'capacitance'])   // 'resistance'
 *          closestName('colour', ['r', 'c'])                          // undefined
 */
export function closestName(typed: string, allowed: readonly string[]): string | undefined {
  const fold = (s: string) => s.toLowerCase().replace(/[-\s]/g, '_');
  const word = fold(typed);
  const limit = Math.max(1, Math.floor(word.length / 3));
  let best: string | undefined;
  let bestDistance = Infinity;
  for (const name of allowed) {
    const candidate = fold(name);
    let distance = editDistance(word, candidate);
    if (word.length >= 3 && candidate.startsWith(word)) distance = Math.min(distance, 1);
    const close = distance <= limit && distance < Math.min(word.length, candidate.length);
    if (close && distance < bestDistance) {
      best = name;
      bestDistance = distance;
    }
  }
  return best;
}
