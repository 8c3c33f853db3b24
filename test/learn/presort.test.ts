import { describe, expect, it } from 'vitest';
import { presort } from '../../src/learn/presort.js';
import { mulberry32 } from './helpers.js';

/** Reference: the built-in comparator sort by (value, row). */
function reference(col: Float64Array): number[] {
  return Array.from(col, (_, i) => i).sort((a, b) => col[a]! - col[b]! || a - b);
}

describe('presort', () => {
  it('orders every column like a comparator sort, equal values by row', () => {
    const rnd = mulberry32(3);
    const n = 2000;
    // mixed signs, magnitudes from 1e-300 to 1e300, repeated values, both zeros
    const special = [0, -0, 1e-300, -1e-300, 1e300, -1e300, 5e-324, Number.MAX_VALUE, -Number.MAX_VALUE];
    const cols = new Float64Array(3 * n);
    for (let i = 0; i < n; i++) {
      cols[i] = (rnd() - 0.5) * 10 ** Math.floor(rnd() * 20 - 10);
      cols[n + i] = Math.round(rnd() * 10) - 5;
      cols[2 * n + i] = special[Math.floor(rnd() * special.length)]!;
    }
    const order = presort(cols, n, 3);
    for (let f = 0; f < 3; f++) {
      const col = cols.subarray(f * n, (f + 1) * n);
      expect(Array.from(order.subarray(f * n, (f + 1) * n))).toEqual(reference(col));
    }
  });

  it('does not change its input', () => {
    const cols = Float64Array.of(3, 1, 2, 1);
    presort(cols, 4, 1);
    expect(Array.from(cols)).toEqual([3, 1, 2, 1]);
  });
});
