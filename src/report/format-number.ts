/** Percentage with `digits` decimals, e.g. 0.99123 → "99.12 %". */
export function pct(x: number, digits = 2): string {
  return Number.isFinite(x) ? `${(100 * x).toFixed(digits)} %` : 'n/a';
}

/** A small probability in readable form: 3 significant digits, exponent form below 1e-4. */
export function prob(x: number): string {
  if (!Number.isFinite(x)) return 'n/a';
  if (x === 0) return '0';
  return x < 1e-4 ? x.toExponential(2) : x.toPrecision(3);
}

/** Integer with thin grouping, e.g. 200000 → "200,000". */
export function count(x: number): string {
  return x.toLocaleString('en-US');
}
