/**
 * A "readable" step size m · 10^e with m in {1, 2, 5}: the 1-2-5 series of nice numbers used
 * for graph-axis ticks (P. S. Heckbert, "Nice numbers for graph labels", in A. S. Glassner (ed.),
 * Graphics Gems, Academic Press, 1990, pp. 61–63; from memory) and for instrument ranges.
 */
export interface ReadableStep {
  readonly mantissa: 1 | 2 | 5;
  readonly exponent: number;
  /** m · 10^e as a float64 (inexact for e < 0: use `stepMultiple` for exact multiples). */
  readonly size: number;
}

/** Powers of ten are exact in float64 up to 10^22, so multiples below are correctly rounded. */
const EXACT_POWER_MAX = 22;

/**
 * The 1-2-5 steps s with smallest <= s <= largest, coarsest first (…, 10, 5, 2, 1, 0.5, …).
 * Exponents are kept within ±22, where 10^e is exact.
 * @param largest upper limit on the step (> 0)
 * @param smallest lower limit on the step (> 0)
 */
export function readableSteps(largest: number, smallest: number): ReadableStep[] {
  const steps: ReadableStep[] = [];
  if (!(largest > 0) || !(smallest > 0) || !Number.isFinite(largest)) return steps;
  // log10 can be off by one near exact powers: start one decade high and filter by size
  const top = Math.min(EXACT_POWER_MAX, Math.floor(Math.log10(largest)) + 1);
  for (let e = top; e >= -EXACT_POWER_MAX; e--) {
    for (const mantissa of [5, 2, 1] as const) {
      const size = e >= 0 ? mantissa * 10 ** e : mantissa / 10 ** -e;
      if (size < smallest) return steps;
      if (size <= largest) steps.push({ mantissa, exponent: e, size });
    }
  }
  return steps;
}

/**
 * k · step as the float64 nearest to the exact decimal, so it prints short (`3 × 0.1` gives
 * 0.3, not 0.30000000000000004): k·m is an exact integer and dividing by an exact power of ten
 * is correctly rounded (IEEE 754). Returns NaN when k·m is too large to be exact (> 2^53).
 */
export function stepMultiple(step: ReadableStep, k: number): number {
  const km = k * step.mantissa;
  if (!Number.isSafeInteger(km)) return NaN;
  return step.exponent >= 0 ? km * 10 ** step.exponent : km / 10 ** -step.exponent;
}

/**
 * The multiples of `step` just below and just above t, nearer one first (the lower one on a
 * tie); a single value when t is itself a multiple. Values that cannot be made exact are left out.
 */
export function bracketingMultiples(t: number, step: ReadableStep): number[] {
  const k = Math.floor(t / step.size);
  const out: number[] = [];
  for (const c of [stepMultiple(step, k - 1), stepMultiple(step, k), stepMultiple(step, k + 1), stepMultiple(step, k + 2)]) {
    if (c === t) return [t];
    if (!Number.isNaN(c)) out.push(c);
  }
  // t / size can be off by one ulp of k: pick the neighbours of t among k-1 … k+2
  let below = -Infinity;
  let above = Infinity;
  for (const c of out) {
    if (c < t && c > below) below = c;
    if (c > t && c < above) above = c;
  }
  const pair = [below, above].filter(Number.isFinite);
  return pair.length === 2 && above - t < t - below ? [above, below] : pair;
}
