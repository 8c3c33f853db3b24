/**
 * Exact binomial tail probabilities in double precision, accurate to a few units in the last
 * place for n up to 10^7 and beyond.
 *
 * The smaller tail is summed term by term, starting at its end nearest the mode and moving away
 * from it with the ratio of consecutive probabilities, P(X = i − 1)/P(X = i) = i q/((n − i + 1) p):
 * every term is positive, so nothing cancels; the larger tail is one minus the smaller. The first
 * term comes from C. Loader's saddle-point form of the binomial probability ("Fast and accurate
 * computation of binomial probabilities", 2000; the method of R's dbinom), accurate to ~1e-15
 * relative for any n: a plain log-gamma form loses ~1e-8 at n = 10^7 because lnΓ(10^7) ≈ 1.5e8.
 *
 * Turned down: the continued fraction of the incomplete beta function (Numerical Recipes'
 * betacf), tried first; for x near 1 with a ≫ b (the lower tail for small k at large n, exactly
 * the checker's case) its terms 1 + a_m d cancel and it lost 2.5e-10 relative at n = 10^7, k = 1.
 *
 * p and q = 1 − p are passed separately so the smaller of the two is never recovered by a
 * subtraction from the larger (which would cost ~1e-16 / p relative accuracy for tiny p).
 */

const LN_SQRT_2PI = 0.5 * Math.log(2 * Math.PI);
/** Below this n the Stirling series is not accurate enough; the exact log-factorial is used. */
const STIRLING_SERIES_FROM = 16;
/**
 * A tail sum stops when what is left is below this share of it: a tenth of a unit in the last
 * place, so stopping costs nothing measurable.
 */
const TAIL_EPSILON = 1e-17;

/** δ(m) = ln m! − [(m + ½) ln m − m + ln √(2π)] for m = 1 … 15, from exact log-factorials. */
const STIRLING_ERROR_SMALL = (() => {
  const out = new Float64Array(STIRLING_SERIES_FROM);
  let lnFactorial = 0;
  for (let m = 1; m < STIRLING_SERIES_FROM; m++) {
    lnFactorial += Math.log(m);
    out[m] = lnFactorial - (m + 0.5) * Math.log(m) + m - LN_SQRT_2PI;
  }
  return out;
})();

/** Stirling's error term δ(m) for an integer m ≥ 1 (series 1/12m − 1/360m³ + … for m ≥ 16). */
function stirlingError(m: number): number {
  if (m < STIRLING_SERIES_FROM) return STIRLING_ERROR_SMALL[m]!;
  const mm = m * m;
  return (1 / 12 - (1 / 360 - (1 / 1260 - (1 / 1680 - 1 / (1188 * mm)) / mm) / mm) / mm) / m;
}

/** Loader's switch: the series is used when |x − μ| < 0.1·(x + μ), where it converges fast (v² < 0.01). */
const DEVIANCE_SERIES_RANGE = 0.1;
/** Ample for v² < 0.01: each term is 100 times smaller, so ~8 terms reach the last place. */
const DEVIANCE_SERIES_MAX_TERMS = 1000;

/** Loader's deviance term x ln(x / μ) + μ − x, by a series when x ≈ μ to avoid cancellation. */
function deviance(x: number, mu: number): number {
  if (Math.abs(x - mu) < DEVIANCE_SERIES_RANGE * (x + mu)) {
    let v = (x - mu) / (x + mu);
    let s = (x - mu) * v;
    let ej = 2 * x * v;
    v *= v;
    for (let j = 1; j < DEVIANCE_SERIES_MAX_TERMS; j++) {
      ej *= v;
      const s1 = s + ej / (2 * j + 1);
      if (s1 === s) return s1;
      s = s1;
    }
    return s;
  }
  return x * Math.log(x / mu) + mu - x;
}

/**
 * Binomial probability P(X = k) for X ~ Bin(n, p), with q = 1 − p given separately.
 * @param k successes, integer 0 ≤ k ≤ n
 * @param n trials, integer ≥ 1
 * @returns the probability, relative error ~1e-15
 */
export function binomialPmf(k: number, n: number, p: number, q: number = 1 - p): number {
  if (p === 0) return k === 0 ? 1 : 0;
  if (q === 0) return k === n ? 1 : 0;
  // ln q for q near 1 comes from log1p(−p), exact to the last place when p is small
  const lnQ = p < 0.5 ? Math.log1p(-p) : Math.log(q);
  const lnP = q < 0.5 ? Math.log1p(-q) : Math.log(p);
  if (k === 0) return Math.exp(n * lnQ);
  if (k === n) return Math.exp(n * lnP);
  const lc = stirlingError(n) - stirlingError(k) - stirlingError(n - k) - deviance(k, n * p) - deviance(n - k, n * q);
  return Math.exp(lc) * Math.sqrt(n / (2 * Math.PI * k * (n - k)));
}

/**
 * Sums pmf terms from `k` away from the mode (downwards when `down`), each from the last by the
 * ratio of consecutive binomial probabilities. Away from the mode the ratios only shrink, so
 * once the current ratio r makes the remaining geometric bound t·r/(1 − r) negligible the sum
 * is complete to TAIL_EPSILON relative.
 */
function tailSum(k: number, n: number, p: number, q: number, down: boolean): number {
  let t = binomialPmf(k, n, p, q);
  let sum = t;
  if (t === 0) return 0;
  for (let i = k; down ? i > 0 : i < n; down ? i-- : i++) {
    const r = down ? (i * q) / ((n - i + 1) * p) : ((n - i) * p) / ((i + 1) * q);
    t *= r;
    sum += t;
    if (r < 1 && (t * r) / (1 - r) < TAIL_EPSILON * sum) break;
  }
  return sum;
}

/**
 * Upper tail P(X ≥ k) for X ~ Bin(n, p).
 * @param k integer 0 ≤ k ≤ n
 * @param n integer ≥ 1
 * @param p success probability in [0, 1]
 * @param q 1 − p, if known more precisely than the subtraction gives
 * @returns the probability; the smaller tail is summed directly (relative error ~1e-14), the
 *   larger one is 1 minus the smaller (absolute error ~1e-16, and it is ≥ about ½)
 * Cost: O(min(k, n − k) + √(npq)) terms in the worst case, a few in the far tails.
 */
export function binomialSurvival(k: number, n: number, p: number, q: number = 1 - p): number {
  if (k <= 0) return 1;
  if (k > n) return 0;
  if (p === 0) return 0;
  if (q === 0) return 1;
  return k > n * p ? tailSum(k, n, p, q, false) : 1 - tailSum(k - 1, n, p, q, true);
}

/**
 * Lower tail P(X ≤ k) for X ~ Bin(n, p); arguments and accuracy as for binomialSurvival.
 */
export function binomialCdf(k: number, n: number, p: number, q: number = 1 - p): number {
  if (k >= n) return 1;
  if (k < 0) return 0;
  if (p === 0) return 1;
  if (q === 0) return 0;
  return k < n * p ? tailSum(k, n, p, q, true) : 1 - tailSum(k + 1, n, p, q, false);
}
