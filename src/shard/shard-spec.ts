import { UsageError } from '../errors.js';

/** Shard K of N: this process does the work items i with i mod N = K − 1 (1 ≤ K ≤ N). */
export interface ShardSpec {
  readonly k: number;
  readonly n: number;
}

/**
 * Largest N accepted by `--shard K/N`: far more shards than any rule table has rules would only
 * make empty parts. A limit of this project, no source.
 */
export const MAX_SHARDS = 10_000;

/**
 * Reads `--shard K/N` (e.g. `2/4`): two whole numbers with 1 ≤ K ≤ N ≤ MAX_SHARDS.
 * @throws UsageError naming what was found and what is expected
 */
export function shardSpec(text: string): ShardSpec {
  const m = /^\s*(\d+)\s*\/\s*(\d+)\s*$/.exec(text);
  if (!m) throw new UsageError(`--shard: expected K/N with whole numbers 1 <= K <= N (e.g. 2/4), found "${text}"`);
  const k = Number(m[1]);
  const n = Number(m[2]);
  if (n < 1 || n > MAX_SHARDS) throw new UsageError(`--shard ${text}: N must be in [1, ${MAX_SHARDS}], found ${n}`);
  if (k < 1 || k > n) throw new UsageError(`--shard ${text}: K must be in [1, ${n}], found ${k}`);
  return { k, n };
}
