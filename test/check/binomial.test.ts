import { describe, expect, it } from 'vitest';
import { binomialCdf, binomialPmf, binomialSurvival } from '../../src/check/binomial.js';

/*
 * Reference 1: exact rational arithmetic with BigInt, here in the test (independent of the
 * code under test): for p = a/b, P(X = i) = C(n, i) a^i (b − a)^(n − i) / b^n.
 * Reference 2: mpmath 1.3.0 at 50 digits, direct sums of the binomial terms, computed here.
 */

/** num/den as the nearest double (enough bits kept that rounding is the only error). */
function ratio(num: bigint, den: bigint): number {
  if (num === 0n) return 0;
  const shift = den.toString(2).length - num.toString(2).length + 64;
  const q = shift >= 0 ? (num << BigInt(shift)) / den : num / (den << BigInt(-shift));
  return Number(q) * 2 ** -shift;
}

function exactTerms(n: number, a: bigint, b: bigint): bigint[] {
  const terms: bigint[] = [];
  let binom = 1n;
  for (let i = 0; i <= n; i++) {
    terms.push(binom * a ** BigInt(i) * (b - a) ** BigInt(n - i));
    binom = (binom * BigInt(n - i)) / BigInt(i + 1);
  }
  return terms;
}

/**
 * A probability P computed as exp(sum of logarithms) carries an absolute error of a few units
 * of 1e-16 per unit of |ln P| in its exponent, i.e. a relative error of ~ε·|ln P| (measured:
 * ≤ 4e-16·max(1, |ln P|), e.g. 1e-13 for P(X = 3) ≈ e^-272 at n = 1000, p = 1/4). The tolerance
 * allows 25 times that; for the tails used by the bounds (P ≥ 1e-3) it is 1e-14 to 7e-14.
 */
const REL_TOL_PER_LOG = 1e-14;

function expectRel(actual: number, expected: number): void {
  const tol = REL_TOL_PER_LOG * Math.max(1, Math.abs(Math.log(expected)));
  expect(Math.abs(actual - expected) / expected).toBeLessThanOrEqual(tol);
}

describe('binomialPmf, binomialCdf, binomialSurvival', () => {
  it('match exact rational values for n = 60, p = 1/2 and n = 1000, p = 1/4', () => {
    for (const [n, a, b] of [[60, 1n, 2n], [1000, 1n, 4n]] as const) {
      const terms = exactTerms(n, a, b);
      const den = b ** BigInt(n);
      const p = Number(a) / Number(b);
      const ks = n === 60 ? [0, 1, 10, 29, 30, 31, 50, 60] : [0, 3, 150, 240, 250, 260, 400, 480];
      for (const k of ks) {
        expectRel(binomialPmf(k, n, p), ratio(terms[k]!, den));
        const below = terms.slice(0, k + 1).reduce((s, t) => s + t, 0n);
        const above = terms.slice(k).reduce((s, t) => s + t, 0n);
        expectRel(binomialCdf(k, n, p), ratio(below, den));
        expectRel(binomialSurvival(k, n, p), ratio(above, den));
      }
    }
  });

  it('stay accurate to ~1e-15 at n = 10^7, where log-gamma forms lose 1e-8', () => {
    // mpmath, 50 digits: Σ_{i ≤ k} C(n, i) p^i (1 − p)^(n − i)
    expectRel(binomialCdf(0, 1e7, 3e-7), 0.049787045963683744304);
    expectRel(binomialCdf(1, 1e7, 4e-7), 0.0915781504861356281);
    expectRel(binomialCdf(5, 1e7, 1e-6), 0.067085868295838488694);
    expectRel(binomialCdf(2, 3000, 0.002), 0.061790329391823579405);
  });

  it('handle the ends of the range', () => {
    expect(binomialCdf(10, 10, 0.3)).toBe(1);
    expect(binomialSurvival(0, 10, 0.3)).toBe(1);
    expect(binomialSurvival(3, 10, 0)).toBe(0);
    expect(binomialCdf(3, 10, 1)).toBe(0);
    expect(binomialPmf(0, 10, 0)).toBe(1);
  });
});
