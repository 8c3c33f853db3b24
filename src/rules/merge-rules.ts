import type { Rule, RuleOrigin } from '../types.js';
import { sortRules } from './sort-rules.js';

export interface MergeRulesOptions {
  /** Prefix of the new ids (`R` gives R1, R2, …). */
  readonly idPrefix?: string;
}

/**
 * Merges rules with the same allowed advisories whose union is exactly a box, until no pair can
 * be merged. Two closed boxes have a box as their union when they agree on every interval but
 * one and, on that one, the two intervals meet: one's max equals the other's min (neighbours, as
 * tree leaves are) or they overlap. Boxes that touch only at a corner, or differ on two inputs,
 * are left alone: their union is not a box.
 *
 * Deterministic: rules are put in `sortRules` order, then scanned pair by pair (i < j); a merged
 * rule replaces rule i, rule j is removed, and i is compared again with every later rule; passes
 * repeat until one merges nothing. The result is sorted again and renumbered R1, R2, … (ids of
 * the inputs are not kept: this is meant for mined rules, whose ids carry no meaning yet).
 * A merged rule keeps the origin of the earlier rule.
 *
 * @param rules the rules to merge (not changed)
 * Cost: O(passes · r² · d) for r rules over d inputs; a few hundred rules take milliseconds.
 */
export function mergeRules(rules: readonly Rule[], options: MergeRulesOptions = {}): Rule[] {
  const list = sortRules(rules);
  let changed = true;
  while (changed) {
    changed = false;
    for (let i = 0; i < list.length; i++) {
      let j = i + 1;
      while (j < list.length) {
        const union = boxUnion(list[i]!, list[j]!);
        if (union === undefined) {
          j++;
          continue;
        }
        list[i] = union;
        list.splice(j, 1);
        changed = true;
        j = i + 1;
      }
    }
  }
  const prefix = options.idPrefix ?? 'R';
  return sortRules(list).map((r, i) => ({ ...r, id: `${prefix}${i + 1}` }));
}

/** The union of two rules when it is exactly a box with the same allowed set; else undefined. */
function boxUnion(a: Rule, b: Rule): Rule | undefined {
  if (a.allowed.length !== b.allowed.length) return undefined;
  for (let k = 0; k < a.allowed.length; k++) if (a.allowed[k] !== b.allowed[k]) return undefined;
  if (a.box.length !== b.box.length) return undefined;
  let differing = -1;
  for (let f = 0; f < a.box.length; f++) {
    if (a.box[f]![0] === b.box[f]![0] && a.box[f]![1] === b.box[f]![1]) continue;
    if (differing >= 0) return undefined;
    differing = f;
  }
  const origin: RuleOrigin = a.origin;
  if (differing < 0) return { ...a, origin };
  const [alo, ahi] = a.box[differing]!;
  const [blo, bhi] = b.box[differing]!;
  // closed intervals: their union is an interval exactly when they intersect (touching included)
  if (alo > bhi || blo > ahi) return undefined;
  const box = a.box.map((iv, f) => (f === differing ? ([Math.min(alo, blo), Math.max(ahi, bhi)] as const) : iv));
  return { ...a, box, origin };
}
