import type { Counterexample, InputSpec, Proportion } from '../types.js';

/** Percentage with `digits` decimals, e.g. 0.0123 → "1.23 %"; "n/a" when not finite. */
export function pct(x: number, digits = 2): string {
  return Number.isFinite(x) ? `${(100 * x).toFixed(digits)} %` : 'n/a';
}

/** A proportion with its interval: "5.62 % [5.48 %, 5.77 %]". */
export function pctInterval(p: Proportion, digits = 2): string {
  return `${pct(p.value, digits)} [${pct(p.lower, digits)}, ${pct(p.upper, digits)}]`;
}

/** Integer with grouping, e.g. 100000 → "100,000". */
export function count(x: number): string {
  return x.toLocaleString('en-US');
}

/** A counterexample's inputs in units: "cpa_nm = 1.1 nmi, tcpa_min = 3 min, …" (6 significant digits). */
export function pointText(x: readonly number[], inputs: readonly InputSpec[]): string {
  return inputs.map((inp, i) => `${inp.name} = ${Number(x[i]!.toPrecision(6))}${inp.unit ? ` ${inp.unit}` : ''}`).join(', ');
}

/** "at <point> the network gives <advisory> (ahead by <margin> in score)". */
export function counterexampleText(cx: Counterexample, inputs: readonly InputSpec[], advisories: readonly string[]): string {
  return `at ${pointText(cx.x, inputs)} the network gives ${advisories[cx.advisory]} (ahead by ${cx.margin.toPrecision(3)} in score)`;
}
