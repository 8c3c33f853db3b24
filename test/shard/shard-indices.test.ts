import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { shardIndices } from '../../src/shard/index.js';

describe('shardIndices', () => {
  it('deals item i to shard (i mod N) + 1', () => {
    expect(shardIndices(10, { k: 1, n: 4 })).toEqual([0, 4, 8]);
    expect(shardIndices(10, { k: 4, n: 4 })).toEqual([3, 7]);
    expect(shardIndices(2, { k: 3, n: 4 })).toEqual([]);
  });

  it('splits any item count into disjoint shards that together hold every item once, sizes within one', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 300 }), fc.integer({ min: 1, max: 40 }), (count, n) => {
        const seen = new Array<number>(count).fill(0);
        const sizes: number[] = [];
        for (let k = 1; k <= n; k++) {
          const idx = shardIndices(count, { k, n });
          sizes.push(idx.length);
          for (let j = 1; j < idx.length; j++) expect(idx[j]!).toBeGreaterThan(idx[j - 1]!);
          for (const i of idx) seen[i]!++;
        }
        expect(seen.every((c) => c === 1)).toBe(true);
        expect(Math.max(...sizes) - Math.min(...sizes)).toBeLessThanOrEqual(1);
      }),
    );
  });
});
