import type { Ladder } from '../circuit/ladder.js';

/**
 * A function of a ladder, remembered for the few most recently used ladder objects (by identity,
 * most recent first). Ladders are treated as immutable: a ladder changed in place after its first
 * use keeps its old result while it stays among the recent ones.
 *
 * A small strong list rather than a WeakMap: an evaluation loop that makes a fresh ladder per call
 * (tolerance samples, design candidates) spent ~90 % of its time in V8's ephemeron garbage
 * collection with a WeakMap (measured: 2-stage steadyState 20-40 us without, 260-330 us with).
 *
 * Syntax: rememberRecentLadders(compute[, size])
 * Example: const cachedPrepare = rememberRecentLadders(preparePlain); cachedPrepare(l) === cachedPrepare(l)  // true
 */
export function rememberRecentLadders<V>(compute: (ladder: Ladder) => V, size = 8): (ladder: Ladder) => V {
  const recent: Array<[Ladder, V]> = [];
  return (ladder) => {
    for (let i = 0; i < recent.length; i++) {
      if (recent[i][0] === ladder) {
        const entry = recent[i];
        if (i > 0) {
          recent.splice(i, 1);
          recent.unshift(entry);
        }
        return entry[1];
      }
    }
    const value = compute(ladder);
    recent.unshift([ladder, value]);
    if (recent.length > size) recent.pop();
    return value;
  };
}
