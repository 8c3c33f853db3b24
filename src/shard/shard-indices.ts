import type { ShardSpec } from './shard-spec.js';

/**
 * The work items of one shard: item i (0-based, in the whole run's order) goes to shard
 * (i mod N) + 1. Dealing round-robin rather than in contiguous blocks spreads the costly rules
 * over the shards when costs are correlated with position (mined tables are sorted, so rules of
 * one advisory and of similar size sit together); which item goes where depends only on the
 * item's index in the whole run and on N, never on anything a shard computes.
 * @param count number of work items in the whole run
 * @returns the ascending item indices of shard `spec.k`
 */
export function shardIndices(count: number, spec: ShardSpec): number[] {
  const out: number[] = [];
  for (let i = spec.k - 1; i < count; i += spec.n) out.push(i);
  return out;
}
