import { describe, expect, it } from 'vitest';
import { shardSpec } from '../../src/shard/index.js';
import { UsageError } from '../../src/errors.js';

describe('shardSpec', () => {
  it('reads K/N with 1 <= K <= N', () => {
    expect(shardSpec('2/4')).toEqual({ k: 2, n: 4 });
    expect(shardSpec('1/1')).toEqual({ k: 1, n: 1 });
    expect(shardSpec(' 4 / 4 ')).toEqual({ k: 4, n: 4 });
  });

  it('refuses K outside [1, N], N = 0, and text that is not K/N, naming what it found', () => {
    const message = (t: string): string => {
      try {
        shardSpec(t);
      } catch (e) {
        expect(e).toBeInstanceOf(UsageError);
        return (e as Error).message;
      }
      throw new Error(`accepted ${t}`);
    };
    expect(message('0/4')).toMatchInlineSnapshot(`"--shard 0/4: K must be in [1, 4], found 0"`);
    expect(message('5/4')).toMatchInlineSnapshot(`"--shard 5/4: K must be in [1, 4], found 5"`);
    expect(message('1/0')).toMatchInlineSnapshot(`"--shard 1/0: N must be in [1, 10000], found 0"`);
    expect(message('2')).toMatchInlineSnapshot(`"--shard: expected K/N with whole numbers 1 <= K <= N (e.g. 2/4), found "2""`);
    expect(message('1.5/4')).toMatch(/expected K\/N/);
    expect(message('-1/4')).toMatch(/expected K\/N/);
  });
});
