/**
 * Exact (Clopper–Pearson) confidence bounds on a binomial proportion.
 *
 * C. J. Clopper & E. S. Pearson, "The use of confidence or fiducial limits illustrated in the
 * case of the binomial", Biometrika 26(4):404–413, 1934. With k events in n trials and
 * α = 1 − confidence, the one-sided upper bound U solves P(X ≤ k; n, U) = α and the one-sided
 * lower bound L solves P(X ≥ k; n, L) = α (X ~ Bin(n, p)); the two-sided interval uses α/2 at
 * each end. Equivalently U = Beta quantile B(1 − α; k + 1, n − k) and L = B(α; k, n − k + 1).
 * Closed forms: U = 1 − α^(1/n) for k = 0, L = α^(1/n) for k = n (computed with expm1/exp of
 * ln α / n, so no digits are lost for large n), U = 1 for k = n, L = 0 for k = 0.
 *
 * The equations are solved by a safeguarded Newton iteration (W. H. Press et al., *Numerical
 * Recipes*, 3rd ed., 2007, §9.4, `rtsafe`) on the exact binomial tails of ./binomial.ts, using
 * d/dp P(X ≤ k; n, p) = −n·P(X = k; n − 1, p) (the Beta density). See docs/statistics.md.
 */
import { ToolError } from '../errors.js';
import { binomialCdf, binomialPmf, binomialSurvival } from './binomial.js';

/**
 * The root finder stops when a step moves the root by less than this share of it: three orders
 * of magnitude below the 1e-10 relative accuracy asked of the bounds, and well above the ~1e-15
 * noise in the tails, so the last Newton step cannot chase rounding.
 */
export const ROOT_RELATIVE_TOLERANCE = 1e-13;
/** Newton and bisection steps allowed: bisection alone needs ~60 + log2(1/p) < 1100 steps. */
const MAX_STEPS = 1100;

/** Two-sided exact interval. */
export interface ClopperPearsonInterval {
  readonly lower: number;
  readonly upper: number;
}

function checkArguments(where: string, k: number, n: number, confidence: number): void {
  if (!Number.isSafeInteger(n) || n < 1) throw new ToolError('STATS_ARGUMENT', `${where}: n: expected a whole number >= 1, found ${n}`);
  if (!Number.isSafeInteger(k) || k < 0 || k > n) throw new ToolError('STATS_ARGUMENT', `${where}: k: expected a whole number in [0, ${n}], found ${k}`);
  if (!(confidence > 0 && confidence < 1)) throw new ToolError('STATS_ARGUMENT', `${where}: confidence: expected a number in (0, 1), found ${confidence}`);
}

/**
 * Root in (0, 1) of f(p) = target for a monotone f with derivative df, by Newton steps kept
 * inside a shrinking bracket, bisecting whenever a Newton step would leave the bracket or fails
 * to halve the step before last (rtsafe).
 */
function solve(f: (p: number) => number, df: (p: number) => number, target: number, increasing: boolean, start: number): number {
  let lo = 0;
  let hi = 1;
  let p = Math.min(Math.max(start, Number.MIN_VALUE), 1 - Number.EPSILON);
  let stepBefore = 1;
  let step = 1;
  for (let i = 0; i < MAX_STEPS; i++) {
    const g = f(p) - target;
    if (g === 0) return p;
    // g > 0 means p is past the root for an increasing f, short of it for a decreasing one
    if (g > 0 === increasing) hi = p;
    else lo = p;
    const slope = df(p);
    const newton = p - g / slope;
    // converged: the Newton correction is below tolerance (checked before the rtsafe test,
    // which would otherwise bisect away from a root found to rounding level)
    if (slope !== 0 && Math.abs(newton - p) <= ROOT_RELATIVE_TOLERANCE * p && newton >= lo && newton <= hi) return newton;
    const useNewton = slope !== 0 && newton > lo && newton < hi && Math.abs(2 * g) <= Math.abs(stepBefore * slope);
    stepBefore = step;
    const next = useNewton ? newton : 0.5 * (lo + hi);
    step = next - p;
    if (Math.abs(step) <= ROOT_RELATIVE_TOLERANCE * next || next === p) return next;
    p = next;
  }
  return p;
}

/** U solving P(X ≤ k; n, U) = α. */
function upper(k: number, n: number, alpha: number): number {
  if (k === n) return 1;
  if (k === 0) return -Math.expm1(Math.log(alpha) / n);
  return solve(
    (p) => binomialCdf(k, n, p),
    (p) => -n * binomialPmf(k, n - 1, p),
    alpha,
    false,
    (k + 1) / (n + 1),
  );
}

/** L solving P(X ≥ k; n, L) = α. */
function lower(k: number, n: number, alpha: number): number {
  if (k === 0) return 0;
  if (k === n) return Math.exp(Math.log(alpha) / n);
  return solve(
    (p) => binomialSurvival(k, n, p),
    (p) => n * binomialPmf(k - 1, n - 1, p),
    alpha,
    true,
    k / (n + 1),
  );
}

/**
 * One-sided exact upper confidence bound on a binomial proportion (e.g. a rule's violation
 * rate after k violations in n samples).
 * @param k events seen, whole number 0 ≤ k ≤ n
 * @param n trials, whole number ≥ 1
 * @param confidence one-sided confidence level in (0, 1), e.g. 0.95
 * @returns U with P(X ≤ k; n, U) = 1 − confidence; ~1e-13 relative accuracy for n ≤ 10^7
 * @throws ToolError (`STATS_ARGUMENT`) for k, n or confidence out of range
 * @example clopperPearsonUpper(0, 100, 0.95) // 0.029513049607 (CHECK-VALUES.md §1)
 * Cost: a handful of binomial tails, each O(k + √(npq)) terms at worst.
 */
export function clopperPearsonUpper(k: number, n: number, confidence: number): number {
  checkArguments('clopperPearsonUpper', k, n, confidence);
  return upper(k, n, 1 - confidence);
}

/**
 * One-sided exact lower confidence bound on a binomial proportion; arguments as for
 * clopperPearsonUpper. Returns L with P(X ≥ k; n, L) = 1 − confidence.
 */
export function clopperPearsonLower(k: number, n: number, confidence: number): number {
  checkArguments('clopperPearsonLower', k, n, confidence);
  return lower(k, n, 1 - confidence);
}

/**
 * Two-sided exact confidence interval: each end holds α/2 = (1 − confidence)/2.
 * @returns { lower, upper } with lower = 0 when k = 0 and upper = 1 when k = n
 * @throws ToolError (`STATS_ARGUMENT`) for k, n or confidence out of range
 * @example clopperPearsonInterval(5, 25, 0.95) // { lower: 0.068311…, upper: 0.407037… }
 */
export function clopperPearsonInterval(k: number, n: number, confidence: number): ClopperPearsonInterval {
  checkArguments('clopperPearsonInterval', k, n, confidence);
  const halfAlpha = (1 - confidence) / 2;
  return { lower: lower(k, n, halfAlpha), upper: upper(k, n, halfAlpha) };
}
