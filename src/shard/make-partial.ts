import { createHash } from 'node:crypto';
import { ToolError } from '../errors.js';
import type { CheckedRule, Rule, RuleTable } from '../types.js';
import { toRulesJson } from '../report/index.js';
import { PARTIAL_FORMAT, PARTIAL_VERSION, type PartialFile, type PartialItem, type PartialRun } from './partial-file.js';

/** One work item given to a shard: its index in the whole run, its rule, and whether it yields results. */
export interface ShardItem {
  readonly index: number;
  readonly rule: Rule;
  /**
   * False for an item the command drops before working (e.g. a sub-rule of an earlier repair,
   * which proving re-derives from its parent): it yields no result rules.
   */
  readonly kept: boolean;
}

/** SHA-256 of a list of item ids, one a line: the whole run's work list, compared by `merge`. */
export function itemsSha256(ids: readonly string[]): string {
  return createHash('sha256').update(ids.join('\n')).digest('hex');
}

/**
 * Packs one shard's result table into a partial file. The table's rules come in item order, each
 * kept item's own rule first, followed by any sub-rules it produced; they are counted back to
 * their items here, so `merge` can put every item's results at the item's place in the whole run.
 * @param table the rule table the shard computed from its items
 * @param items the shard's items, ascending by index
 * @throws ToolError (`SHARD_RESULTS`) when the results do not follow the items (a defect)
 */
export function makePartial(table: RuleTable, run: PartialRun, k: number, items: readonly ShardItem[]): PartialFile {
  const counts = new Array<number>(items.length).fill(0);
  let current = -1;
  let next = 0;
  const startOf = (r: CheckedRule): number => {
    while (next < items.length && !items[next]!.kept) next++;
    return next < items.length && items[next]!.rule.id === r.rule.id ? next : -1;
  };
  for (const r of table.rules) {
    const start = startOf(r);
    if (start >= 0) {
      current = start;
      next = start + 1;
    } else if (current < 0) {
      throw new ToolError('SHARD_RESULTS', `shard ${k}: result rule ${r.rule.id} does not follow any work item`);
    }
    counts[current]!++;
  }
  items.forEach((it, i) => {
    if (it.kept && counts[i] === 0) throw new ToolError('SHARD_RESULTS', `shard ${k}: work item ${it.rule.id} has no result rule`);
  });
  const held: PartialItem[] = items.map((it, i) => ({ index: it.index, id: it.rule.id, results: counts[i]! }));
  return { format: PARTIAL_FORMAT, formatVersion: PARTIAL_VERSION, run, shard: k, items: held, table: toRulesJson(table) };
}
