import type { DiffPart } from '../diff/index.js';
import { PARTIAL_FORMAT, PARTIAL_VERSION, CHANGE_ITEM, type PartialFile, type PartialItem, type PartialRun } from './partial-file.js';

/**
 * Packs one shard's share of a diff into a partial file. Items 0 … R − 1 are the accepted
 * rules (one regression each, in item order); item R, if the shard holds it, is the change part
 * (`CHANGE_ITEM`), carried in `diff.change`.
 * @param indices the shard's item indices, ascending
 * @param ids the whole run's item ids (the rules' ids, then CHANGE_ITEM)
 */
export function makeDiffPartial(part: DiffPart, run: PartialRun, k: number, indices: readonly number[], ids: readonly string[]): PartialFile {
  const items: PartialItem[] = indices.map((index) => ({ index, id: ids[index]!, results: ids[index] === CHANGE_ITEM ? 0 : 1 }));
  return { format: PARTIAL_FORMAT, formatVersion: PARTIAL_VERSION, run, shard: k, items, diff: part };
}
