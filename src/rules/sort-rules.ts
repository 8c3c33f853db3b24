import type { Rule } from '../types.js';

/**
 * The canonical order of a rule table: by allowed advisories (lexicographic over the ascending
 * index lists, so all rules for advisory 0 come first), then by the box's lower corner
 * (lexicographic over the inputs in scenario order), then by its upper corner. Grouping by
 * advisory lets a reviewer read all the conditions for one advisory together; the corner order
 * puts neighbouring boxes next to each other. Ids are not compared, so the order depends only on
 * what the rules say.
 * @returns negative when `a` comes first, positive when `b` does, 0 for equal content
 */
export function compareRules(a: Rule, b: Rule): number {
  const k = Math.min(a.allowed.length, b.allowed.length);
  for (let i = 0; i < k; i++) {
    if (a.allowed[i] !== b.allowed[i]) return a.allowed[i]! - b.allowed[i]!;
  }
  if (a.allowed.length !== b.allowed.length) return a.allowed.length - b.allowed.length;
  for (let side = 0; side < 2; side++) {
    for (let f = 0; f < a.box.length; f++) {
      const u = a.box[f]![side]!;
      const v = b.box[f]![side]!;
      if (u !== v) return u < v ? -1 : 1;
    }
  }
  return 0;
}

/**
 * Rules in the canonical order of `compareRules` (a new array; the input is not changed). The
 * sort is stable, so rules with equal content keep their relative order.
 */
export function sortRules(rules: readonly Rule[]): Rule[] {
  return [...rules].sort(compareRules);
}
