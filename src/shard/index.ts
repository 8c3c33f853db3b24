/**
 * Sharding: `--shard K/N` splits the work items of `check`, `prove` and `diff` (the rules; for
 * diff also the change figures) over N
 * processes; each writes a partial result file, and `merge` assembles the run folder a single
 * run would have written (docs/sharding.md).
 */
export { shardSpec, MAX_SHARDS, type ShardSpec } from './shard-spec.js';
export { shardIndices } from './shard-indices.js';
export { makePartial, itemsSha256, type ShardItem } from './make-partial.js';
export {
  partialFileName,
  partialJsonText,
  PARTIAL_FORMAT,
  PARTIAL_VERSION,
  CHANGE_ITEM,
  type PartialFile,
  type PartialItem,
  type PartialRun,
  type ShardCommand,
} from './partial-file.js';
export { readPartial } from './read-partial.js';
export { checkParts, type PartAt } from './check-parts.js';
export { mergeParts } from './merge-parts.js';
export { selectShard } from './select-shard.js';
export { writePartial } from './write-partial.js';
export { makeDiffPartial } from './make-diff-partial.js';
export { mergeDiffParts } from './merge-diff-parts.js';
export { fileSha256 } from './file-sha256.js';
export { partialRun, type RunOfShard } from './partial-run.js';
