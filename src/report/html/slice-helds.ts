import type { RuleTable } from '../../types.js';

/** Default number of held points offered per pair: the centres of this many largest rules. */
export const HELD_RULES = 3;

/** Where the inputs outside a slice's pair are held. */
export interface HeldPoint {
  /** What the point is, for the page: `centre of R7 (largest rule)`, `centre of the domain`. */
  readonly label: string;
  /** The rule whose centre it is, if any. */
  readonly ruleId?: string;
  /** A full input vector in scenario units; the pair's own entries are ignored. */
  readonly x: readonly number[];
}

/**
 * Held points for slice plots: the centres of the `count` largest rules (by share of the
 * domain's volume, ties by id), which sit inside the regions the table covers most; the centre
 * of the domain when the table has no rules.
 */
export function sliceHelds(table: RuleTable, count = HELD_RULES): HeldPoint[] {
  const order = table.rules
    .map((r, i) => ({ i, v: r.evidence.volumeFraction, id: r.rule.id }))
    .sort((a, b) => b.v - a.v || (a.id < b.id ? -1 : a.id > b.id ? 1 : 0))
    .slice(0, Math.max(0, count));
  if (order.length === 0) return [{ label: 'centre of the domain', x: table.inputs.map((inp) => (inp.min + inp.max) / 2) }];
  const ranks = ['largest rule', '2nd largest rule', '3rd largest rule'];
  return order.map(({ i, id }, rank) => ({
    label: `centre of ${id} (${ranks[rank] ?? `${rank + 1}th largest rule`})`,
    ruleId: id,
    x: table.rules[i]!.rule.box.map(([lo, hi]) => (lo + hi) / 2),
  }));
}

/**
 * The held points that differ outside the pair (two centres that agree on every other input
 * give the same slice; the first is kept).
 */
export function distinctHelds(helds: readonly HeldPoint[], pair: readonly [number, number]): HeldPoint[] {
  const seen = new Set<string>();
  return helds.filter((h) => {
    const key = h.x.map((v, k) => (k === pair[0] || k === pair[1] ? '' : String(v))).join('|');
    if (seen.has(key)) return false;
    seen.add(key);
    return true;
  });
}
