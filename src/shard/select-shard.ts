import type { Rule } from '../types.js';
import type { ShardItem } from './make-partial.js';
import { shardIndices } from './shard-indices.js';
import type { ShardSpec } from './shard-spec.js';

/**
 * The work items of one shard from the whole run's rule list: the rules at the shard's indices
 * (`shardIndices`), each marked kept or not by `keep`.
 * @param rules every rule of the whole run, in the run's order (not changed)
 * @param keep false for rules the command drops before working (they yield no results)
 */
export function selectShard(rules: readonly Rule[], spec: ShardSpec, keep: (rule: Rule) => boolean): ShardItem[] {
  return shardIndices(rules.length, spec).map((index) => ({ index, rule: rules[index]!, kept: keep(rules[index]!) }));
}
