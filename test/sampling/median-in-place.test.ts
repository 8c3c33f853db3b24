import { median } from 'simple-statistics';
import { describe, expect, it } from 'vitest';
import { medianInPlace } from '../../src/sampling/median-in-place.js';
import { createRng } from '../../src/sampling/rng.js';

describe('medianInPlace', () => {
  it('is the middle value, or the mean of the two middle values, of the first m', () => {
    // definition of the median
    expect(medianInPlace(new Float32Array([5, 1, 4, 2, 3]), 5)).toBe(3);
    expect(medianInPlace(new Float32Array([4, 1, 3, 2]), 4)).toBe(2.5);
    expect(medianInPlace(new Float32Array([9, 9, 1]), 2)).toBe(9);
    expect(medianInPlace(new Float32Array([7]), 1)).toBe(7);
    expect(medianInPlace(new Float32Array(0), 0)).toBe(0);
  });

  it('agrees exactly with simple-statistics on random, tied and sorted inputs of many sizes', () => {
    // reference: simple-statistics `median` (sorts a copy); float32 values are exact in float64,
    // and both take the mean of the two middle values the same way, so equality is exact
    const rng = createRng(11);
    for (let m = 1; m <= 300; m += 7) {
      const cases = [
        Float32Array.from({ length: m }, () => rng()),
        Float32Array.from({ length: m }, () => Math.floor(rng() * 4)),
        Float32Array.from({ length: m }, (_, i) => i),
        Float32Array.from({ length: m }, (_, i) => m - i),
      ];
      for (const values of cases) {
        const expected = median(Array.from(values));
        expect(medianInPlace(values.slice(), m)).toBe(expected);
      }
    }
  });

  it('reads only the first m values and keeps them as a permutation', () => {
    const values = new Float32Array([3, 1, 2, 100, -100]);
    expect(medianInPlace(values, 3)).toBe(2);
    expect(Array.from(values.subarray(0, 3)).sort()).toEqual([1, 2, 3]);
    expect(Array.from(values.subarray(3))).toEqual([100, -100]);
  });
});
