import type { CheckedRule, RuleTable } from '../types.js';
import { fromRulesJson } from '../report/export/index.js';
import { provenCoverage } from '../repair/index.js';
import type { PartAt } from './check-parts.js';

/**
 * Assembles the rule table a single run would have written from the parts of a sharded run
 * (checked first with `checkParts`): every item's result rules at the item's place in the whole
 * run, the earliest date of the parts, the counts of `check` summed over the parts (`prove` keeps
 * the run's), the notes of all parts once each in order, and the proven coverage recomputed
 * over all rules (it is the volume of a union of boxes, so it does not add up over parts).
 * @param parts the complete, checked set of parts of one run, in any order
 */
export function mergeParts(parts: readonly PartAt[]): RuleTable {
  const sorted = [...parts].sort((a, b) => a.part.shard - b.part.shard);
  const base = fromRulesJson(sorted[0]!.part.table!, sorted[0]!.path);
  const total = sorted[0]!.part.run.items;
  const groups = new Array<CheckedRule[]>(total);
  const notes: string[] = [];
  const counts: Record<string, number> = {};
  let date = base.manifest.date;
  let withCoverage = false;
  for (const { path, part } of sorted) {
    const table = fromRulesJson(part.table!, path);
    let at = 0;
    for (const it of part.items) {
      groups[it.index] = table.rules.slice(at, at + it.results);
      at += it.results;
    }
    for (const note of table.notes ?? []) if (!notes.includes(note)) notes.push(note);
    for (const [key, v] of Object.entries(table.manifest.counts)) counts[key] = (counts[key] ?? 0) + v;
    if (table.manifest.date < date) date = table.manifest.date;
    if (table.coverage) withCoverage = true;
  }
  const rules = groups.flat();
  const { coverage: _partial, notes: _notes, ...rest } = base;
  const additive = sorted[0]!.part.run.command === 'check';
  return {
    ...rest,
    manifest: { ...base.manifest, date, counts: additive ? counts : base.manifest.counts },
    rules,
    ...(withCoverage ? { coverage: provenCoverage(rules, base.inputs, base.advisories) } : {}),
    ...(notes.length > 0 ? { notes } : {}),
  };
}
