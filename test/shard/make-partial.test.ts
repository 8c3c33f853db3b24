import { describe, expect, it } from 'vitest';
import { makePartial, selectShard, shardIndices } from '../../src/shard/index.js';
import { checked, run, table } from './helpers.js';

describe('makePartial', () => {
  it('counts each kept item its own rule and the sub-rules after it; dropped items get none', () => {
    const whole = [checked('R1', 0, 4, 'refuted'), checked('R1.1', 0, 2, 'proven', 'R1'), checked('R2', 4, 6, 'proven'), checked('R3', 6, 10, 'refuted')];
    // shard 1 of 2 holds items 0 (R1) and 2 (R2); item R1.1 (index 1) is a sub-rule: not kept
    const rules = whole.map((c) => c.rule);
    const items = selectShard(rules, { k: 1, n: 2 }, (r) => r.origin.kind !== 'repaired');
    expect(items.map((i) => [i.index, i.rule.id, i.kept])).toEqual([[0, 'R1', true], [2, 'R2', true]]);
    // the shard's result: R1 re-derived its sub-rule R1.1, then R2
    const result = table([whole[0]!, whole[1]!, whole[2]!]);
    const part = makePartial(result, run(rules.map((r) => r.id), 2), 1, items);
    expect(part.items).toEqual([{ index: 0, id: 'R1', results: 2 }, { index: 2, id: 'R2', results: 1 }]);
    expect(part.table!.rules.map((r) => r.id)).toEqual(['R1', 'R1.1', 'R2']);
    const other = selectShard(rules, { k: 2, n: 2 }, (r) => r.origin.kind !== 'repaired');
    const part2 = makePartial(table([whole[3]!]), run(rules.map((r) => r.id), 2), 2, other);
    expect(part2.items).toEqual([{ index: 1, id: 'R1.1', results: 0 }, { index: 3, id: 'R3', results: 1 }]);
    expect(shardIndices(4, { k: 2, n: 2 })).toEqual(part2.items.map((i) => i.index));
  });

  it('refuses results that follow no item, and a kept item without its result (defects, not user errors)', () => {
    const rules = [checked('R1', 0, 4, 'sampled').rule, checked('R2', 4, 8, 'sampled').rule];
    const items = selectShard(rules, { k: 1, n: 1 }, () => true);
    expect(() => makePartial(table([checked('X', 0, 1, 'sampled')]), run(['R1', 'R2'], 1), 1, items)).toThrow(/X does not follow any work item/);
    expect(() => makePartial(table([checked('R1', 0, 4, 'sampled')]), run(['R1', 'R2'], 1), 1, items)).toThrow(/work item R2 has no result rule/);
  });
});
