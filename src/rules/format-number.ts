/**
 * Prints a bound the way rule files show it: the shortest decimal that reads back as the same
 * float64 (ECMAScript `Number::toString`, ECMA-262 §6.1.6.1.20), so `0.3` stays `0.3` and a
 * computed `0.30000000000000004` is shown in full rather than silently changed. Very small or
 * large magnitudes use exponent form (`1e-7`), which the rule parser reads. `-0` prints as `0`
 * (the same point).
 *
 * @param x a finite number
 */
export function formatNumber(x: number): string {
  return String(x);
}
