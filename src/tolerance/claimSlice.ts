/** One slice of the samples: its index and its range [first, last). */
export interface SampleSlice {
  readonly index: number;
  readonly first: number;
  readonly last: number;
}

/**
 * The next unclaimed slice of `count` samples cut in slices of `slice`, or null when none is left:
 * `claims[0]` (on a SharedArrayBuffer) is the next slice index, raised with Atomics.add, so every
 * thread that calls this gets slices no other thread gets (monteCarloParallel and its workers).
 *
 * Syntax: claimSlice(claims, slice, count)
 * Example: claimSlice(new Int32Array(new SharedArrayBuffer(4)), 64, 100)  // { index: 0, first: 0, last: 64 }
 */
export function claimSlice(claims: Int32Array, slice: number, count: number): SampleSlice | null {
  const index = Atomics.add(claims, 0, 1);
  const first = index * slice;
  return first < count ? { index, first, last: Math.min(count, first + slice) } : null;
}
