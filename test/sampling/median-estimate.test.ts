import { describe, expect, it } from 'vitest';
import { MEDIAN_SAMPLE, medianEstimate } from '../../src/sampling/median-estimate.js';
import { createRng } from '../../src/sampling/rng.js';

describe('medianEstimate', () => {
  it('is the exact median when all values are read', () => {
    // definition of the median: middle value, or mean of the two middle values
    expect(medianEstimate(new Float32Array([5, 1, 4, 2, 3]), 5)).toBe(3);
    expect(medianEstimate(new Float32Array([4, 1, 3, 2]), 4)).toBe(2.5);
    expect(medianEstimate(new Float32Array([9, 9, 1]), 2)).toBe(9);
    expect(medianEstimate(new Float32Array(0), 0)).toBe(0);
  });

  it('estimates the median of many values to within a few percent in rank', () => {
    const n = 200_000;
    const rng = createRng(4);
    const v = new Float32Array(n);
    for (let i = 0; i < n; i++) v[i] = rng();
    const copy = v.slice();
    const m = medianEstimate(v, n);
    // U(0,1): the median's rank is its value. A sample median of 4096 values has standard
    // error 0.5/sqrt(4096) = 0.0078; 5 of them (0.039) are exceeded with probability < 1e-6
    expect(MEDIAN_SAMPLE).toBe(4096);
    const MEDIAN_TOL = 0.039;
    expect(Math.abs(m - 0.5)).toBeLessThan(MEDIAN_TOL);
    expect(Array.from(v.subarray(0, 10))).toEqual(Array.from(copy.subarray(0, 10)));
  });
});
