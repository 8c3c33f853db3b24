import { describe, expect, it } from 'vitest';
import { uniformInBox } from '../../src/sampling/uniform-in-box.js';
import { createRng } from '../../src/sampling/rng.js';

describe('uniformInBox', () => {
  it('draws n points inside the box with the mean of a uniform distribution on every axis', () => {
    const box = Object.freeze([Object.freeze([-2, 6] as const), Object.freeze([10, 10.5] as const), Object.freeze([0, 1] as const)]);
    const n = 50_000;
    const x = uniformInBox(box, n, createRng(5));
    expect(x.length).toBe(n * 3);
    for (let j = 0; j < 3; j++) {
      const [lo, hi] = box[j]!;
      let sum = 0;
      let outside = 0;
      for (let i = 0; i < n; i++) {
        const v = x[i * 3 + j]!;
        if (v < lo || v > hi) outside++;
        sum += v;
      }
      expect(outside).toBe(0);
      // the mean of U(lo, hi) is (lo + hi)/2 with standard error (hi − lo)/sqrt(12 n); 5 standard
      // errors are exceeded by chance with probability < 1e-6
      const tolerance = (5 * (hi - lo)) / Math.sqrt(12 * n);
      expect(Math.abs(sum / n - (lo + hi) / 2)).toBeLessThan(tolerance);
    }
  });

  it('puts every point at min on a zero-width axis', () => {
    const x = uniformInBox([[0, 1], [3, 3]], 10, createRng(1));
    for (let i = 0; i < 10; i++) expect(x[2 * i + 1]).toBe(3);
  });

  it('is reproducible for a seed', () => {
    const a = uniformInBox([[0, 1], [0, 2]], 100, createRng(9));
    const b = uniformInBox([[0, 1], [0, 2]], 100, createRng(9));
    expect(Array.from(a)).toEqual(Array.from(b));
  });

  it('refuses inverted or infinite boxes and bad counts', () => {
    expect(() => uniformInBox([[0, 1], [2, 1]], 3, createRng(1))).toThrowErrorMatchingInlineSnapshot(
      `[ToolError: uniformInBox: box[1]: expected finite min <= max, found [2, 1]]`,
    );
    expect(() => uniformInBox([[0, Infinity]], 3, createRng(1))).toThrow('found [0, Infinity]');
    expect(() => uniformInBox([[0, 1]], 2.5, createRng(1))).toThrowErrorMatchingInlineSnapshot(
      `[ToolError: uniformInBox: expected a whole number of points >= 0, found 2.5]`,
    );
  });
});
