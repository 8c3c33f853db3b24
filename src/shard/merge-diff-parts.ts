import { FileError } from '../errors.js';
import type { Proportion } from '../types.js';
import { diffResultOf, type DiffChange, type DiffResult, type RuleRegression } from '../diff/index.js';
import type { PartAt } from './check-parts.js';

/** JSON writes NaN (a proportion of nothing) as null; read it back as NaN, as the single run holds it. */
function proportion(p: Proportion): Proportion {
  return { ...p, value: p.value ?? NaN };
}

function revived(c: DiffChange): DiffChange {
  return {
    ...c,
    changed: proportion(c.changed),
    changeRules: c.changeRules.map((r) => ({ ...r, changed: proportion(r.changed) })),
    capture: { recall: proportion(c.capture.recall), precision: proportion(c.capture.precision) },
  };
}

/**
 * Assembles the diff a single run would have given from the parts of a sharded diff (checked
 * first with `checkParts`): every rule's regression at its place in the accepted table, the
 * change figures from the part that holds them, the earliest date, the notes of all parts once
 * each in order, and the whole run's counts.
 * @throws FileError `SHARD_MISSING` when no part holds the change figures
 */
export function mergeDiffParts(parts: readonly PartAt[]): DiffResult {
  const sorted = [...parts].sort((a, b) => a.part.shard - b.part.shard);
  const total = sorted[0]!.part.run.items;
  const regressions = new Array<RuleRegression[]>(total);
  const notes: string[] = [];
  let change: DiffChange | undefined;
  const base = sorted[0]!.part.diff!;
  let date = base.manifest.date;
  for (const { part } of sorted) {
    const share = part.diff!;
    let at = 0;
    for (const it of part.items) {
      regressions[it.index] = share.rules.slice(at, at + it.results);
      at += it.results;
    }
    if (share.change) change = revived(share.change);
    for (const note of share.notes) if (!notes.includes(note)) notes.push(note);
    if (share.manifest.date < date) date = share.manifest.date;
  }
  if (!change) throw new FileError('SHARD_MISSING', `${sorted.map((p) => p.path).join(', ')}: no part holds the change figures of the diff`);
  const rules = regressions.flat();
  return diffResultOf({ ...base, manifest: { ...base.manifest, date, counts: { rules: rules.length } }, rules, notes }, change);
}
