import { describe, expect, it } from 'vitest';
import { doubles, doublesOf, emptyDoubles, zeros } from '../../src/numeric/dense.js';

// Storage helpers: the values are what matter to callers; how V8 stores them is a speed concern
// (measured in the bench), not checked here.
describe('dense storage helpers', () => {
  it('zeros and doubles give n zeros', () => {
    expect(zeros(3)).toEqual([0, 0, 0]);
    expect(doubles(3)).toEqual([0, 0, 0]);
    expect(doubles(0)).toEqual([]);
    const grown = emptyDoubles();
    expect(grown).toEqual([]);
    grown.push(470, 4.7e-7);
    expect(grown).toEqual([470, 4.7e-7]);
  });

  it('doublesOf copies the values, whole numbers and fractions alike', () => {
    const source = [470, 16000, 4.7e-7];
    const copy = doublesOf(source);
    expect(copy).toEqual(source);
    copy[0] = 1;
    expect(source[0]).toBe(470);
    expect(doublesOf(new Float64Array([1, 2.5]))).toEqual([1, 2.5]);
  });
});
