import { describe, expect, it } from 'vitest';
import { clopperPearsonInterval, clopperPearsonLower, clopperPearsonUpper } from '../../src/check/clopper-pearson.js';

/**
 * The accuracy asked of the bounds: 1e-10 relative. The table values of CHECK-VALUES.md §1 are
 * printed to 11–12 significant digits, so their own rounding is at most 5e-12 / 1.1e-3 ≈ 2e-11
 * relative (0.0029912495451 has 11): 1e-10 tests our accuracy without failing on the printing.
 * Measured agreement: ≤ 2.1e-12.
 */
const TABLE_REL_TOL = 1e-10;
/** Reference values below printed to 20 digits: 1e-13 is the root finder's own stopping rule. */
const HIGH_PRECISION_REL_TOL = 1e-13;

function expectRel(actual: number, expected: number, rel: number): void {
  if (expected === 0) expect(actual).toBe(0);
  else expect(Math.abs(actual - expected) / Math.abs(expected)).toBeLessThanOrEqual(rel);
}

/*
 * CHECK-VALUES.md §1 table [C]: computed in two independent ways, bisection on the exact
 * binomial CDF in 50-digit arithmetic (mpmath) and scipy.stats.beta.ppf (scipy 1.17), which
 * agreed to 3.3e-16. Columns: n, k, one-sided 95 % upper, two-sided 95 % lower, two-sided 95 % upper.
 */
const TABLE: ReadonlyArray<readonly [number, number, number, number, number]> = [
  [10, 0, 0.258865550893, 0, 0.308497107819],
  [10, 5, 0.777558898992, 0.187086028447, 0.812913971553],
  [20, 0, 0.139108340668, 0, 0.168433470983],
  [20, 1, 0.216106164207, 0.00126508949795, 0.248732762772],
  [30, 0, 0.0950338528553, 0, 0.115703308222],
  [50, 5, 0.198833002516, 0.033275093589, 0.218135366434],
  [100, 0, 0.029513049607, 0, 0.0362166926452],
  [100, 1, 0.0465598114535, 0.000253146032977, 0.0544593853921],
  [100, 5, 0.102253377643, 0.0164318791821, 0.112834911105],
  [1000, 0, 0.0029912495451, 0, 0.00368208389687],
  [1000, 3, 0.00773524471848, 0.00061909993165, 0.00874202323848],
  [3000, 0, 0.000998079011997, 0, 0.00122887080383],
  [10000, 0, 0.000299528359777, 0, 0.000368819914619],
  [10, 10, 1, 0.691502892181, 1],
];

describe('clopperPearsonUpper and clopperPearsonInterval', () => {
  it.each(TABLE)('match the CHECK-VALUES table at n = %i, k = %i', (n, k, upper1, lower2, upper2) => {
    expectRel(clopperPearsonUpper(k, n, 0.95), upper1, TABLE_REL_TOL);
    const { lower, upper } = clopperPearsonInterval(k, n, 0.95);
    expectRel(lower, lower2, TABLE_REL_TOL);
    expectRel(upper, upper2, TABLE_REL_TOL);
  });

  it('match the extra one-sided values of CHECK-VALUES §1', () => {
    // printed to 8 decimals: rounding ≤ 5e-9 absolute, so compare absolutely at that level
    const ROUNDING_8_DECIMALS = 5e-9;
    const n100 = [0.02951305, 0.04655981, 0.0616192, 0.07571079, 0.08919625, 0.10225338];
    const n1000 = [0.00299125, 0.00473499, 0.00628228, 0.00773524, 0.00912995, 0.01048408];
    n100.forEach((v, k) => expect(Math.abs(clopperPearsonUpper(k, 100, 0.95) - v)).toBeLessThanOrEqual(ROUNDING_8_DECIMALS));
    n1000.forEach((v, k) => expect(Math.abs(clopperPearsonUpper(k, 1000, 0.95) - v)).toBeLessThanOrEqual(ROUNDING_8_DECIMALS));
    expectRel(clopperPearsonUpper(0, 1000, 0.99), 0.00459458264847, TABLE_REL_TOL);
    // one-sided 95 % lower bound on a pass rate after 20 of 20: 0.05^(1/20)
    expectRel(clopperPearsonLower(20, 20, 0.95), 0.860891659332, TABLE_REL_TOL);
  });

  it('match the published Conover and Newcombe intervals to their printed digits', () => {
    // Conover, Practical Nonparametric Statistics, 3rd ed. 1999, 5/25: 0.068 – 0.407 (3 dp, as
    // quoted in CHECK-VALUES §1 [S]); Newcombe, Stat. Med. 17:857–872, 1998, Table II "exact"
    // (4 dp; table entries from memory [M], matched by computation in CHECK-VALUES)
    const HALF_3DP = 5e-4; // the published values' own rounding
    const HALF_4DP = 5e-5;
    const c = clopperPearsonInterval(5, 25, 0.95);
    expect(Math.abs(c.lower - 0.068)).toBeLessThanOrEqual(HALF_3DP);
    expect(Math.abs(c.upper - 0.407)).toBeLessThanOrEqual(HALF_3DP);
    const cases: ReadonlyArray<readonly [number, number, number, number]> = [
      [0, 20, 0, 0.1684],
      [1, 29, 0.0009, 0.1776],
      [81, 263, 0.2527, 0.3676],
      [15, 148, 0.0578, 0.1617],
    ];
    for (const [k, n, lo, hi] of cases) {
      const iv = clopperPearsonInterval(k, n, 0.95);
      expect(Math.abs(iv.lower - lo)).toBeLessThanOrEqual(HALF_4DP);
      expect(Math.abs(iv.upper - hi)).toBeLessThanOrEqual(HALF_4DP);
    }
  });

  it('stay accurate at n = 10^7', () => {
    // mpmath 1.3.0 at 40 digits, computed here: bisection (200 steps) on the explicit sum
    // Σ_{i≤k} C(n,i) p^i (1−p)^(n−i) = 0.05 for the one-sided bounds; for k = n/2 a secant root
    // of the tail sums at 30 digits
    expectRel(clopperPearsonUpper(1, 1e7, 0.95), 4.7438636303713684267e-7, HIGH_PRECISION_REL_TOL);
    expectRel(clopperPearsonUpper(5, 1e7, 0.95), 1.0513032010805324372e-6, HIGH_PRECISION_REL_TOL);
    expectRel(clopperPearsonUpper(20, 1e7, 0.95), 2.9062005672403779676e-6, HIGH_PRECISION_REL_TOL);
    const mid = clopperPearsonInterval(5e6, 1e7, 0.95);
    expectRel(mid.lower, 0.49969005252137108938, HIGH_PRECISION_REL_TOL);
    expectRel(mid.upper, 0.50030994747862891062, HIGH_PRECISION_REL_TOL);
    // k = 0: 1 − 0.05^(1/n) loses ~1e-9 relative to cancellation if computed as written; mpmath
    // at 30 digits gives 2.995731824833443061e-7
    expectRel(clopperPearsonUpper(0, 1e7, 0.95), 2.995731824833443061e-7, HIGH_PRECISION_REL_TOL);
  });

  it('are symmetric: L(k, n) = 1 − U(n − k, n)', () => {
    // CHECK-VALUES §1, formula section; lower and upper are solved separately, so this checks both
    const SYMMETRY_ABS_TOL = 1e-13; // both ends are within ~1e-13 relative of the truth, and ≤ 1
    for (const [k, n] of [[1, 20], [5, 50], [3, 1000], [7, 10], [250, 1000], [12, 100000]] as const) {
      const { lower } = clopperPearsonInterval(k, n, 0.95);
      const { upper } = clopperPearsonInterval(n - k, n, 0.95);
      expect(Math.abs(lower - (1 - upper))).toBeLessThanOrEqual(SYMMETRY_ABS_TOL);
      expect(Math.abs(clopperPearsonLower(k, n, 0.9) - (1 - clopperPearsonUpper(n - k, n, 0.9)))).toBeLessThanOrEqual(SYMMETRY_ABS_TOL);
    }
  });

  it('follow the rule of three for zero events', () => {
    // Hanley & Lippman-Hand, "If nothing goes wrong, is everything all right?", JAMA
    // 249(13):1743–1745, 1983: with 0 events in n trials, 3/n approximates the upper 95 % bound.
    // The exact one-sided bound 1 − 0.05^(1/n) is below −ln(0.05)/n = 2.9957/n < 3/n for every
    // n (CHECK-VALUES §1 [C]), so 3/n is always conservative; the ratio table there is printed
    // to 4 decimals, hence the tolerance of half a unit in the 4th decimal.
    const RATIO_ROUNDING = 5e-5;
    const ratios: ReadonlyArray<readonly [number, number]> = [
      [10, 1.1589], [20, 1.0783], [30, 1.0523], [50, 1.0317], [100, 1.0165], [300, 1.0064], [1000, 1.0029], [10000, 1.0016],
    ];
    for (const [n, ratio] of ratios) {
      const u = clopperPearsonUpper(0, n, 0.95);
      expect(3 / n).toBeGreaterThan(u);
      expect(Math.abs(3 / n / u - ratio)).toBeLessThanOrEqual(RATIO_ROUNDING);
    }
    // Large n: the ratio tends to 3 / 2.9957 = 1.00143 with an O(1/n) excess of about 1.5/n, so
    // for n ≥ 100 it stays within 2 % (measured 1.65 % at n = 100): "≈ 3/n" in the paper's sense.
    const RULE_OF_THREE_RATIO_MAX = 1.02;
    for (const n of [100, 1000, 1e5, 1e7]) expect(3 / n / clopperPearsonUpper(0, n, 0.95)).toBeLessThan(RULE_OF_THREE_RATIO_MAX);
    // Hanley's examples 0/14, 0/112, 0/167 [C], printed to 6 decimals
    const ROUNDING_6_DECIMALS = 5e-7;
    const ROUNDING_7_DECIMALS = 5e-8;
    expect(Math.abs(clopperPearsonUpper(0, 14, 0.95) - 0.192636)).toBeLessThanOrEqual(ROUNDING_6_DECIMALS);
    expect(Math.abs(clopperPearsonUpper(0, 112, 0.95) - 0.026393)).toBeLessThanOrEqual(ROUNDING_6_DECIMALS);
    expect(Math.abs(clopperPearsonUpper(0, 167, 0.95) - 0.017779)).toBeLessThanOrEqual(ROUNDING_6_DECIMALS);
    // not a two-sided 95 % bound: that one is 1 − 0.025^(1/n) ≈ 3.689/n, 0.0362167 at n = 100
    expect(Math.abs(clopperPearsonInterval(0, 100, 0.95).upper - 0.0362167)).toBeLessThanOrEqual(ROUNDING_7_DECIMALS);
  });

  it('grow with k and shrink with n, and give the zero-failure sample sizes', () => {
    for (let k = 0; k < 10; k++) expect(clopperPearsonUpper(k + 1, 500, 0.95)).toBeGreaterThan(clopperPearsonUpper(k, 500, 0.95));
    for (const n of [10, 100, 1000]) expect(clopperPearsonUpper(2, n + 1, 0.95)).toBeLessThan(clopperPearsonUpper(2, n, 0.95));
    // CHECK-VALUES §1 [C]: smallest n with 0 failures and bound ≤ ε: 29, 59, 299, 2995
    for (const [eps, n] of [[0.1, 29], [0.05, 59], [0.01, 299], [0.001, 2995]] as const) {
      expect(clopperPearsonUpper(0, n, 0.95)).toBeLessThanOrEqual(eps);
      expect(clopperPearsonUpper(0, n - 1, 0.95)).toBeGreaterThan(eps);
    }
  });

  it('refuse arguments outside their ranges', () => {
    expect(() => clopperPearsonUpper(3, 2, 0.95)).toThrowErrorMatchingInlineSnapshot(`[ToolError: clopperPearsonUpper: k: expected a whole number in [0, 2], found 3]`);
    expect(() => clopperPearsonInterval(0, 0, 0.95)).toThrowErrorMatchingInlineSnapshot(`[ToolError: clopperPearsonInterval: n: expected a whole number >= 1, found 0]`);
    expect(() => clopperPearsonLower(1, 10, 1)).toThrowErrorMatchingInlineSnapshot(`[ToolError: clopperPearsonLower: confidence: expected a number in (0, 1), found 1]`);
  });
});
