/**
 * A packed array of n zeros. Plain arrays rather than Float64Array: V8 allocates small typed
 * arrays off the managed heap, which is slow when millions of tiny vectors are made.
 *
 * Syntax: zeros(n)
 * Example: zeros(3)  // [0, 0, 0]
 */
export function zeros(n: number): number[] {
  const v: number[] = [];
  for (let i = 0; i < n; i++) v.push(0);
  return v;
}
