import { describe, expect, it } from 'vitest';
import type { Ladder } from '../../src/circuit/ladder.js';
import { rememberRecentLadders } from '../../src/engine/recentLadders.js';

// Bookkeeping only (no physics): ladders here are distinct objects, their content is irrelevant.
const ladders = Array.from({ length: 10 }, (_, i) => ({ period: i + 1 }) as unknown as Ladder);

describe('rememberRecentLadders', () => {
  it('computes once per ladder object while it stays among the recent ones', () => {
    const calls: Ladder[] = [];
    const f = rememberRecentLadders((l) => {
      calls.push(l);
      return { of: l };
    }, 3);
    const first = f(ladders[0]);
    expect(f(ladders[0])).toBe(first);
    f(ladders[1]);
    f(ladders[2]);
    expect(f(ladders[0])).toBe(first); // a hit moves ladder 0 to the front
    f(ladders[3]); // evicts the least recently used: ladder 1
    expect(calls).toEqual([ladders[0], ladders[1], ladders[2], ladders[3]]);
    f(ladders[1]);
    expect(calls.at(-1)).toBe(ladders[1]);
    expect(f(ladders[0])).toBe(first);
  });

  it('remembers a null result too, and tells equal-looking ladders apart (identity, not content)', () => {
    let n = 0;
    const f = rememberRecentLadders(() => {
      n++;
      return null;
    });
    const a = { ...ladders[0] };
    const b = { ...ladders[0] };
    expect(f(a)).toBeNull();
    expect(f(a)).toBeNull();
    expect(n).toBe(1);
    f(b);
    expect(n).toBe(2);
  });
});
