import { describe, expect, it } from 'vitest';
import { checkParts, makePartial, mergeParts, selectShard, type PartAt } from '../../src/shard/index.js';
import { fromRulesJson } from '../../src/report/export/index.js';
import { toRulesJson } from '../../src/report/index.js';
import { checked, run, table } from './helpers.js';

/** Coverage is a share of [0, 10]; sums of a few exact tenths need no more than a few ulps. */
const COVERAGE_ABS = 1e-12;

describe('mergeParts', () => {
  it('puts every item\'s results (with sub-rules) at the item\'s place, sums check counts, recomputes coverage as a union', () => {
    // R1 and R2 overlap on [2, 4]; proven union [0, 6] and [7, 8] = 0.7 of the domain (closed form)
    const whole = [
      checked('R1', 0, 4, 'proven'),
      checked('R2', 2, 6, 'proven'),
      checked('R3', 6, 10, 'refuted'),
      checked('R3.1', 7, 8, 'proven', 'R3'),
      checked('R4', 9, 10, 'sampled'),
    ];
    const own = whole.filter((c) => c.rule.origin.kind !== 'repaired');
    const ids = own.map((c) => c.rule.id);
    const n = 3;
    const parts: PartAt[] = [];
    for (let k = n; k >= 1; k--) {
      const items = selectShard(own.map((c) => c.rule), { k, n }, () => true);
      const results = items.flatMap((it) => whole.filter((c) => c.rule.id === it.rule.id || (c.rule.origin.kind === 'repaired' && c.rule.origin.from === it.rule.id)));
      const t = { ...table(results), coverage: { total: 0, perAdvisory: [0, 0] }, notes: ['same note'] };
      parts.push({ path: `p${k}.json`, part: makePartial({ ...t, manifest: { ...t.manifest, date: `2026-01-0${k}T00:00:00.000Z` } }, run(ids, n), k, items) });
    }
    checkParts(parts);
    const merged = mergeParts(parts);
    expect(merged.rules.map((r) => r.rule.id)).toEqual(['R1', 'R2', 'R3', 'R3.1', 'R4']);
    expect(toRulesJson(merged).rules).toEqual(toRulesJson(table(whole)).rules);
    expect(merged.manifest.counts).toEqual({ rules: 4 });
    expect(merged.manifest.date).toBe('2026-01-01T00:00:00.000Z');
    expect(merged.notes).toEqual(['same note']);
    expect(Math.abs(merged.coverage!.total - 0.7)).toBeLessThan(COVERAGE_ABS);
    expect(Math.abs(merged.coverage!.perAdvisory[0]! - 0.7)).toBeLessThan(COVERAGE_ABS);
    expect(merged.coverage!.perAdvisory[1]).toBe(0);
    // the merged table survives the rules.json round trip unchanged
    expect(fromRulesJson(toRulesJson(merged)).rules).toEqual(merged.rules);
  });
});
