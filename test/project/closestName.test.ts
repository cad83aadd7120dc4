import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { closestName } from '../../src/project/closestName.js';
import { editDistance } from '../../src/project/editDistance.js';

/** Plain Levenshtein distance, the textbook Wagner-Fischer recurrence without transpositions. */
function levenshtein(a: string, b: string): number {
  let previous = Array.from({ length: b.length + 1 }, (_, j) => j);
  for (let i = 1; i <= a.length; i++) {
    const current = [i];
    for (let j = 1; j <= b.length; j++) {
      current[j] = Math.min(previous[j] + 1, current[j - 1] + 1, previous[j - 1] + (a[i - 1] === b[j - 1] ? 0 : 1));
    }
    previous = current;
  }
  return previous[b.length];
}

describe('editDistance (optimal string alignment)', () => {
  it('matches the textbook examples', () => {
    // kitten -> sitting: 3 edits (the classic Levenshtein example, e.g. Wikipedia "Levenshtein distance").
    expect(editDistance('kitten', 'sitting')).toBe(3);
    // CA -> ABC: 3 under optimal string alignment (2 under unrestricted Damerau-Levenshtein),
    // the example that tells the two apart (Wikipedia "Damerau-Levenshtein distance").
    expect(editDistance('CA', 'ABC')).toBe(3);
    expect(editDistance('ab', 'ba')).toBe(1); // one transposition
    expect(editDistance('', 'abc')).toBe(3);
    expect(editDistance('resitance', 'resistance')).toBe(1);
  });

  it('is symmetric, zero only on equal words, and between |len a - len b| and Levenshtein', () => {
    fc.assert(
      fc.property(fc.string({ maxLength: 12 }), fc.string({ maxLength: 12 }), (a, b) => {
        const d = editDistance(a, b);
        expect(d).toBe(editDistance(b, a));
        expect(d === 0).toBe(a === b);
        expect(d).toBeGreaterThanOrEqual(Math.abs(a.length - b.length));
        expect(d).toBeLessThanOrEqual(levenshtein(a, b));
      }),
      { numRuns: 500 },
    );
  });
});

describe('closestName', () => {
  const pwmKeys = ['frequency', 'clock', 'bits', 'prescaler', 'alignment', 'high', 'low', 'driver', 'duty'];
  it('suggests the key meant by a typo, a swap, a case slip or a prefix', () => {
    expect(closestName('frequncy', pwmKeys)).toBe('frequency');
    expect(closestName('freqeuncy', pwmKeys)).toBe('frequency');
    expect(closestName('Frequency', pwmKeys)).toBe('frequency');
    expect(closestName('freq', pwmKeys)).toBe('frequency');
    expect(closestName('prescalar', pwmKeys)).toBe('prescaler');
    expect(closestName('pin-current', ['pin_current', 'bits'])).toBe('pin_current');
  });

  it('stays silent when nothing is close', () => {
    expect(closestName('colour', pwmKeys)).toBeUndefined();
    expect(closestName('x', ['r', 'c'])).toBeUndefined();
    expect(closestName('voltage', pwmKeys)).toBeUndefined();
  });
});
