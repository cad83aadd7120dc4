import { describe, expect, it } from 'vitest';
import { claimSlice } from '../../src/tolerance/claimSlice.js';

describe('claimSlice', () => {
  it('hands out every sample once, in slices, the last one short, then nothing (also to late callers)', () => {
    const claims = new Int32Array(new SharedArrayBuffer(4));
    const seen: number[] = [];
    const slices = [];
    for (let s = claimSlice(claims, 64, 200); s !== null; s = claimSlice(claims, 64, 200)) {
      slices.push(s);
      for (let i = s.first; i < s.last; i++) seen.push(i);
    }
    expect(slices.map((s) => [s.index, s.first, s.last])).toEqual([
      [0, 0, 64],
      [1, 64, 128],
      [2, 128, 192],
      [3, 192, 200],
    ]);
    expect(seen).toEqual(Array.from({ length: 200 }, (_, i) => i));
    expect(claimSlice(claims, 64, 200)).toBeNull();
  });
});
