import { describe, expect, it } from 'vitest';
import { bracketingMultiples, readableSteps, stepMultiple } from '../../src/rules/readable-steps.js';

const sizes = (largest: number, smallest: number): number[] => readableSteps(largest, smallest).map((s) => s.size);

describe('readableSteps', () => {
  it('lists the 1-2-5 series between the limits, coarsest first', () => {
    // the 1, 2, 5 nice-number series (Heckbert, Graphics Gems 1990; from memory)
    expect(sizes(1, 0.01)).toEqual([1, 0.5, 0.2, 0.1, 0.05, 0.02, 0.01]);
    expect(sizes(360, 20)).toEqual([200, 100, 50, 20]);
  });

  it('includes a limit that is itself a 1-2-5 value, even at an exact power of ten', () => {
    expect(sizes(1000, 1000)).toEqual([1000]);
    expect(sizes(0.001, 0.001)).toEqual([0.001]);
  });

  it('is empty for limits that are not positive', () => {
    expect(sizes(0, 0.1)).toEqual([]);
    expect(sizes(1, 0)).toEqual([]);
  });
});

describe('stepMultiple', () => {
  it('gives the decimal value, not the float product', () => {
    // IEEE 754 binary64: 3 * 0.1 = 0.30000000000000004, while 3 / 10 rounds to the double printed 0.3
    expect(3 * 0.1).not.toBe(0.3);
    expect(stepMultiple({ mantissa: 1, exponent: -1, size: 0.1 }, 3)).toBe(0.3);
    expect(String(stepMultiple({ mantissa: 2, exponent: -3, size: 0.002 }, 7))).toBe('0.014');
    expect(stepMultiple({ mantissa: 5, exponent: 2, size: 500 }, -3)).toBe(-1500);
  });
});

describe('bracketingMultiples', () => {
  const half = { mantissa: 5, exponent: -1, size: 0.5 } as const;
  it('returns the multiples on each side of t, nearer first', () => {
    expect(bracketingMultiples(0.4873, half)).toEqual([0.5, 0]);
    expect(bracketingMultiples(0.2, half)).toEqual([0, 0.5]);
    expect(bracketingMultiples(-0.7, half)).toEqual([-0.5, -1]);
  });

  it('puts the lower one first on a tie', () => {
    expect(bracketingMultiples(0.25, half)).toEqual([0, 0.5]);
  });

  it('returns t alone when it is a multiple', () => {
    expect(bracketingMultiples(1.5, half)).toEqual([1.5]);
    expect(bracketingMultiples(0.3, { mantissa: 1, exponent: -1, size: 0.1 })).toEqual([0.3]);
  });
});
